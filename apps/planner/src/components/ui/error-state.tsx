import { isApiError } from '@/lib/api-client';
import { Button } from './button';

function describe(error: unknown): { title: string; detail: string } {
  if (isApiError(error)) {
    if (error.status === 403) return { title: 'Not available for your role', detail: error.message };
    if (error.status === 404) return { title: 'Not found', detail: error.message };
    if (error.status === 503) return { title: 'The database is not answering', detail: error.message };
    if (error.status === 0) return { title: 'No connection', detail: error.message };
    return { title: 'Something went wrong', detail: error.message };
  }
  if (error instanceof Error) return { title: 'Something went wrong', detail: error.message };
  return { title: 'Something went wrong', detail: 'An unexpected error happened.' };
}

/** A failed load, said in words, with a way to try again. */
export function ErrorState({ error, onRetry, title }: { error: unknown; onRetry?: () => void; title?: string }) {
  const text = describe(error);
  return (
    <div role="alert" className="rounded border border-fault-700 bg-fault-50 p-4">
      <p className="font-semibold text-fault-700">
        <span aria-hidden="true">✕ </span>
        {title ?? text.title}
      </p>
      <p className="mt-1">{text.detail}</p>
      {onRetry ? (
        <Button className="mt-3" size="sm" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}
