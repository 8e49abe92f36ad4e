import type { DataSource } from 'typeorm';
import type { Person, PersonCreate } from '@millrace/contracts';
import { assertPasswordAcceptable } from '../auth/password-policy';
import { hashPassword } from '../auth/password';
import { AppError } from '../http/app-error';
import { findPersonByEmail, insertPerson } from './people.repository';

/**
 * Creates a person with a role: the e-mail must be free, the initial password (if any) must meet
 * the policy. Without a password the person cannot sign in until one is set (invitations).
 * Also used by seeds (demo plant, tests).
 */
export async function createPerson(dataSource: DataSource, input: PersonCreate): Promise<Person> {
  const email = input.email.trim().toLowerCase();
  if (input.password !== undefined) assertPasswordAcceptable(input.password, { email, name: input.name }, 'password');
  return dataSource.transaction(async (db) => {
    if (await findPersonByEmail(db, email)) {
      throw new AppError(409, 'conflict', `A person with the e-mail ${email} already exists.`, {
        fields: [{ path: 'email', message: 'This e-mail is already in use.' }],
      });
    }
    const passwordHash = input.password === undefined ? null : await hashPassword(input.password);
    const person = await insertPerson(db, { email, name: input.name.trim(), role: input.role, passwordHash });
    return { ...person, workCenterIds: [] };
  });
}
