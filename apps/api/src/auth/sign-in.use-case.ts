import type { DataSource } from 'typeorm';
import type { Me, SignIn } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { findPersonByEmail } from '../people/people.repository';
import type { AppLucia } from './lucia';
import { verifyAgainstNothing, verifyPassword } from './password';
import { checkSignInAllowance, clearSignInFailures, recordSignInFailure } from './sign-in-rate-limit';

export interface SignInResult {
  me: Me;
  sessionCookie: string;
}

const invalidCredentials = 'The e-mail or password is not right, or this account is not active.';

/**
 * Sign-in: refuse when hammered (429) → check the password (same answer for an unknown e-mail,
 * a wrong password and a deactivated person) → count failures → start a new session.
 */
export async function signIn(
  deps: { dataSource: DataSource; lucia: AppLucia },
  input: SignIn & { ip: string; previousSessionId: string | null },
): Promise<SignInResult> {
  const db = deps.dataSource.manager;
  const allowance = await checkSignInAllowance(db, input.email, input.ip);
  if (allowance.outcome === 'limited') {
    throw new AppError(
      429,
      'rate_limited',
      `Too many failed sign-ins for this e-mail. Try again in ${describeWait(allowance.retryAfterSeconds)}.`,
      { headers: { 'Retry-After': String(allowance.retryAfterSeconds) } },
    );
  }

  const person = await findPersonByEmail(db, input.email);
  const passwordOk = person?.passwordHash
    ? await verifyPassword(person.passwordHash, input.password)
    : await verifyAgainstNothing(input.password);
  if (!person || !passwordOk || !person.active) {
    await recordSignInFailure(db, input.email, input.ip);
    throw new AppError(401, 'invalid_credentials', invalidCredentials);
  }

  await clearSignInFailures(db, input.email, input.ip);
  if (input.previousSessionId) await deps.lucia.invalidateSession(input.previousSessionId);
  const session = await deps.lucia.createSession(person.id, {});
  return {
    me: { email: person.email, name: person.name, role: person.role },
    sessionCookie: deps.lucia.createSessionCookie(session.id).serialize(),
  };
}

function describeWait(seconds: number): string {
  if (seconds < 90) return `${seconds} seconds`;
  return `${Math.ceil(seconds / 60)} minutes`;
}
