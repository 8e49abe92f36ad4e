import type { Role } from '@millrace/contracts';
import type { DataSource } from 'typeorm';
import { createPerson } from '../../src/people/create-person.use-case';

/** Password of every test person (tests only; meets the password policy). */
export const testPassword = 'millrace-test-password';

/** One person per role, as in the README's demo sign-ins but with the test password. */
export const testPeople: Record<Role, { email: string; name: string }> = {
  admin: { email: 'admin@millrace.test', name: 'Test Admin' },
  planner: { email: 'planner@millrace.test', name: 'Test Planner' },
  supervisor: { email: 'supervisor@millrace.test', name: 'Test Supervisor' },
  floor_lead: { email: 'floor@millrace.test', name: 'Test Floor Lead' },
};

/** Creates the four test people (through the real use case, so hashing and policy apply). */
export async function seedPeople(dataSource: DataSource): Promise<void> {
  for (const [role, person] of Object.entries(testPeople) as Array<[Role, { email: string; name: string }]>) {
    await createPerson(dataSource, { ...person, role, password: testPassword });
  }
}
