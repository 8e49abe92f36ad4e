import type { DataSource } from 'typeorm';
import { enqueueMail } from '../mail/outbox.repository';
import { findPersonByEmail } from '../people/people.repository';
import { accountLinks, accountMail } from './account-mail';
import { hashToken, newTokenSecret, tokenLifetimeMs } from './person-token';
import { insertToken } from './person-tokens.repository';

/**
 * A reset link for an active person with that e-mail, by e-mail through the outbox. The caller
 * answers the same way whether or not the address is known, so it reveals nobody.
 */
export async function requestPasswordReset(ds: DataSource, email: string, publicUrl: string): Promise<void> {
  await ds.transaction(async (db) => {
    const person = await findPersonByEmail(db, email);
    if (!person || !person.active) return;
    const secret = newTokenSecret();
    const expiresAt = new Date(Date.now() + tokenLifetimeMs.password_reset);
    await insertToken(db, { personId: person.id, purpose: 'password_reset', tokenHash: hashToken(secret), expiresAt, createdBy: null });
    await enqueueMail(db, accountMail('password_reset', person, accountLinks.password_reset(publicUrl, secret), expiresAt));
  });
}
