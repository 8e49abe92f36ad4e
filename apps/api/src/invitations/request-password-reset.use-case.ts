import type { DataSource } from 'typeorm';
import { AppError } from '../http/app-error';
import { enqueueMail } from '../mail/outbox.repository';
import { findPersonByEmail } from '../people/people.repository';
import { accountLinks, accountMail } from './account-mail';
import { hashToken, newTokenSecret, tokenLifetimeMs } from './person-token';
import { checkPasswordResetAllowance, recordPasswordResetRequest } from './password-reset-rate-limit';
import { insertToken } from './person-tokens.repository';

/**
 * A reset link for an active person with that e-mail, by e-mail through the outbox. The caller
 * answers the same way whether or not the address is known, so it reveals nobody. Too many
 * requests for one e-mail from one address (or from one address at all) → 429 with Retry-After.
 */
export async function requestPasswordReset(ds: DataSource, email: string, ip: string, publicUrl: string): Promise<void> {
  const allowance = await checkPasswordResetAllowance(ds.manager, email, ip);
  if (allowance.outcome === 'limited') {
    const minutes = Math.ceil(allowance.retryAfterSeconds / 60);
    throw new AppError(429, 'rate_limited', `Too many requests for a reset link. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`, {
      headers: { 'Retry-After': String(allowance.retryAfterSeconds) },
    });
  }
  await recordPasswordResetRequest(ds.manager, email, ip);
  await ds.transaction(async (db) => {
    const person = await findPersonByEmail(db, email);
    if (!person || !person.active) return;
    const secret = newTokenSecret();
    const expiresAt = new Date(Date.now() + tokenLifetimeMs.password_reset);
    await insertToken(db, { personId: person.id, purpose: 'password_reset', tokenHash: hashToken(secret), expiresAt, createdBy: null });
    await enqueueMail(db, accountMail('password_reset', person, accountLinks.password_reset(publicUrl, secret), expiresAt));
  });
}
