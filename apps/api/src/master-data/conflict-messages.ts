import { AppError } from '../http/app-error';

/** 409 for an optimistic-lock mismatch, in the wording every area uses. */
export function changedSinceOpened(what: string): AppError {
  return AppError.conflict(`Someone else changed ${what} since you opened it; reload to see their change.`);
}

/** 409 for a delete of a row other rows still point at, naming the referrers. */
export function stillReferenced(what: string, referrers: string[]): AppError {
  return AppError.conflict(`${what} cannot be deleted: it is still used by ${referrers.join('; ')}. Remove those first.`);
}

/** 409 for a code that another row already has. */
export function codeTaken(kind: string, code: string): AppError {
  return new AppError(409, 'conflict', `Another ${kind} already has the code ${code}.`, {
    fields: [{ path: 'code', message: `The code ${code} is already used.` }],
  });
}

/** Names at most `limit` items and says how many more there are. */
export function listSome(items: string[], limit = 5): string {
  const shown = items.slice(0, limit).join(', ');
  return items.length > limit ? `${shown} and ${items.length - limit} more` : shown;
}
