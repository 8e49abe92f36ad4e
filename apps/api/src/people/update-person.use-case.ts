import type { DataSource } from 'typeorm';
import type { Person, PersonUpdate } from '@millrace/contracts';
import type { AppLucia } from '../auth/lucia';
import { AppError } from '../http/app-error';
import { countActiveAdmins, findPersonById, updatePersonIfVersion } from './people.repository';

/**
 * An admin re-roles, renames, deactivates or reactivates a person: the person must exist, the
 * version must match (409 otherwise), the last active admin stays an active admin, and
 * deactivation ends every session of that person at once.
 */
export async function updatePerson(
  deps: { dataSource: DataSource; lucia: AppLucia },
  id: number,
  input: PersonUpdate,
): Promise<Person> {
  const updated = await deps.dataSource.transaction(async (db) => {
    const person = await findPersonById(db, id);
    if (!person) throw AppError.notFound(`There is no person with id ${id}.`);
    if (person.version !== input.version) {
      throw AppError.conflict(`Someone else changed ${person.email} since you opened it; reload to see their change.`);
    }
    const losesAdmin = person.role === 'admin' && person.active && (input.active === false || (input.role !== undefined && input.role !== 'admin'));
    if (losesAdmin && (await countActiveAdmins(db)) <= 1) {
      throw AppError.conflict(`${person.email} is the last active admin; make someone else admin first.`);
    }
    const outcome = await updatePersonIfVersion(db, id, input.version, {
      ...(input.role !== undefined && { role: input.role }),
      ...(input.active !== undefined && { active: input.active }),
      ...(input.name !== undefined && { name: input.name }),
    });
    if (outcome === 'version_mismatch') {
      throw AppError.conflict(`Someone else changed ${person.email} since you opened it; reload to see their change.`);
    }
    const after = await findPersonById(db, id);
    if (!after) throw AppError.notFound(`There is no person with id ${id}.`);
    const { passwordHash: _omit, ...plain } = after;
    return plain;
  });
  if (!updated.active) await deps.lucia.invalidateUserSessions(updated.id);
  return updated;
}
