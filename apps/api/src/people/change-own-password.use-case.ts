import type { DataSource } from 'typeorm';
import type { PasswordChange } from '@millrace/contracts';
import type { SignedInPerson } from '../auth/current-person';
import type { AppLucia } from '../auth/lucia';
import { hashPassword, verifyPassword } from '../auth/password';
import { assertPasswordAcceptable } from '../auth/password-policy';
import { AppError } from '../http/app-error';
import { findPersonById, updatePersonIfVersion } from './people.repository';

/**
 * Self-service password change: the current password must be right, the new one must meet the
 * policy; every session of the person ends and a fresh one is returned for this browser.
 */
export async function changeOwnPassword(
  deps: { dataSource: DataSource; lucia: AppLucia },
  me: SignedInPerson,
  input: PasswordChange,
): Promise<{ sessionCookie: string }> {
  const db = deps.dataSource.manager;
  const person = await findPersonById(db, me.id);
  if (!person || !person.active) throw new AppError(401, 'unauthenticated', 'Sign in to continue.');
  if (!person.passwordHash || !(await verifyPassword(person.passwordHash, input.currentPassword))) {
    throw AppError.validation('The current password is not right.', [
      { path: 'currentPassword', message: 'This is not your current password.' },
    ]);
  }
  if (input.newPassword === input.currentPassword) {
    throw AppError.validation('Choose a new password.', [{ path: 'newPassword', message: 'The new password must differ from the current one.' }]);
  }
  assertPasswordAcceptable(input.newPassword, person, 'newPassword');
  const outcome = await updatePersonIfVersion(db, person.id, person.version, { passwordHash: await hashPassword(input.newPassword) });
  if (outcome === 'version_mismatch') throw AppError.conflict('Your account changed meanwhile; try again.');
  await deps.lucia.invalidateUserSessions(person.id);
  const session = await deps.lucia.createSession(person.id, {});
  return { sessionCookie: deps.lucia.createSessionCookie(session.id).serialize() };
}
