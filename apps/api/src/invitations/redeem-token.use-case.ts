import type { DataSource, EntityManager } from 'typeorm';
import type { PersonTokenInfo, PersonTokenPurpose } from '@millrace/contracts';
import type { AppLucia } from '../auth/lucia';
import { assertPasswordAcceptable } from '../auth/password-policy';
import { hashPassword } from '../auth/password';
import { AppError } from '../http/app-error';
import { updatePasswordHash } from './set-password';
import { hashToken } from './person-token';
import { findToken, useToken, type StoredToken } from './person-tokens.repository';

const invalid = () =>
  AppError.validation('This link is not valid any more.', [{ path: 'token', message: 'This link is not valid, was already used or has expired; ask for a new one.' }]);

/** A token that exists, is for `purpose`, unused, unexpired, of an active person — else 400 on `token`. */
async function usableToken(db: EntityManager, secret: string, purpose: PersonTokenPurpose, lock: 'lock' | 'no_lock'): Promise<StoredToken> {
  const token = await findToken(db, hashToken(secret), lock);
  if (!token || token.purpose !== purpose || token.usedAt || token.expiresAt.getTime() <= Date.now() || !token.active) throw invalid();
  return token;
}

/** What an open link is for (the page shows whose password is being set). */
export async function describeToken(db: EntityManager, secret: string, purpose: PersonTokenPurpose): Promise<PersonTokenInfo> {
  const t = await usableToken(db, secret, purpose, 'no_lock');
  return { purpose: t.purpose, email: t.email, name: t.name, role: t.role, expiresAt: t.expiresAt.toISOString() };
}

/**
 * Sets a password through a single-use link (invitation or reset): the token is checked and used
 * in the same transaction as the password change, and every session of the person ends.
 */
export async function setPasswordWithToken(
  ds: DataSource,
  lucia: AppLucia,
  purpose: PersonTokenPurpose,
  secret: string,
  password: string,
): Promise<{ email: string }> {
  const person = await ds.transaction(async (db) => {
    const token = await usableToken(db, secret, purpose, 'lock');
    assertPasswordAcceptable(password, { email: token.email, name: token.name }, 'password');
    await updatePasswordHash(db, token.personId, await hashPassword(password));
    await useToken(db, token);
    return token;
  });
  await lucia.invalidateUserSessions(person.personId);
  return { email: person.email };
}
