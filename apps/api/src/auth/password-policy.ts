import { createRequire } from 'node:module';
import { passwordMinLength } from '@millrace/contracts';
import { AppError } from '../http/app-error';

const require = createRequire(import.meta.url);
/** Mozilla's list of the 50 000 most common passwords of 8+ characters (fxa-common-password-list). */
const commonPasswords = require('fxa-common-password-list') as { test(password: string): boolean };

export type PasswordVerdict = { outcome: 'acceptable' } | { outcome: 'rejected'; reason: string };

/**
 * The password policy (issue 6): at least 12 characters, not on a common-password list, and not
 * the person's own e-mail or name.
 */
export function judgePassword(password: string, person: { email: string; name?: string }): PasswordVerdict {
  if ([...password].length < passwordMinLength) {
    return { outcome: 'rejected', reason: `Use at least ${passwordMinLength} characters.` };
  }
  const lower = password.toLowerCase();
  if (commonPasswords.test(password) || commonPasswords.test(lower)) {
    return { outcome: 'rejected', reason: 'This password is on a list of commonly used passwords; choose another.' };
  }
  const email = person.email.toLowerCase();
  const local = email.split('@')[0];
  const name = person.name?.trim().toLowerCase();
  if (lower === email || lower === local || (name && lower.replace(/\s+/g, '') === name.replace(/\s+/g, ''))) {
    return { outcome: 'rejected', reason: 'Do not use your e-mail address or name as the password.' };
  }
  return { outcome: 'acceptable' };
}

/** Throws 400 validation_failed on the given field path when the policy rejects the password. */
export function assertPasswordAcceptable(password: string, person: { email: string; name?: string }, fieldPath: string): void {
  const verdict = judgePassword(password, person);
  if (verdict.outcome === 'rejected') {
    throw AppError.validation('The password does not meet the policy.', [{ path: fieldPath, message: verdict.reason }]);
  }
}
