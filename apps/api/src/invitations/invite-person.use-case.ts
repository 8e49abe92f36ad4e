import type { DataSource } from 'typeorm';
import type { InvitationCreate, InvitationSent } from '@millrace/contracts';
import type { SignedInPerson } from '../auth/current-person';
import { AppError } from '../http/app-error';
import { enqueueMail } from '../mail/outbox.repository';
import { findPersonByEmail, insertPerson } from '../people/people.repository';
import { accountLinks, accountMail } from './account-mail';
import { hashToken, newTokenSecret, tokenLifetimeMs } from './person-token';
import { insertToken } from './person-tokens.repository';

/**
 * An admin invites a person: the person is created without a password, a single-use link
 * (hash stored) is made, and the invitation e-mail goes into the outbox — all in one transaction.
 */
export async function invitePerson(ds: DataSource, input: InvitationCreate, admin: SignedInPerson, publicUrl: string): Promise<InvitationSent> {
  return ds.transaction(async (db) => {
    if (await findPersonByEmail(db, input.email)) {
      throw new AppError(409, 'conflict', `A person with the e-mail ${input.email} already exists.`, {
        fields: [{ path: 'email', message: 'This e-mail is already in use.' }],
      });
    }
    const person = await insertPerson(db, { email: input.email, name: input.name, role: input.role, passwordHash: null });
    const secret = newTokenSecret();
    const expiresAt = new Date(Date.now() + tokenLifetimeMs.invitation);
    await insertToken(db, { personId: person.id, purpose: 'invitation', tokenHash: hashToken(secret), expiresAt, createdBy: admin.id });
    await enqueueMail(db, accountMail('invitation', person, accountLinks.invitation(publicUrl, secret), expiresAt, admin.name));
    return { personId: person.id, email: person.email, expiresAt: expiresAt.toISOString() };
  });
}
