import type { DataSource } from 'typeorm';
import type { Person, PersonUpdate } from '@millrace/contracts';
import type { AppLucia } from '../auth/lucia';
import { AppError } from '../http/app-error';
import { countActiveAdmins, findPersonById, updatePersonIfVersion } from './people.repository';
import { missingWorkCenterIds, replacePersonWorkCenters, workCenterIdsByPerson } from './person-work-centers.repository';

/**
 * An admin re-roles, renames, deactivates or reactivates a person, or replaces the work centers
 * they are assigned to: the person must exist, the version must match (409 otherwise), the last
 * active admin stays an active admin, every assigned work center must exist (400 naming each
 * unknown id), and deactivation ends every session of that person at once. The person and the
 * assignments change in one transaction under the one version check.
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
    if (input.workCenterIds !== undefined) {
      const missing = await missingWorkCenterIds(db, input.workCenterIds);
      if (missing.length > 0) {
        throw AppError.validation(
          `${missing.length === 1 ? `There is no work center with id ${missing[0]}` : `There are no work centers with the ids ${missing.join(', ')}`}; ${person.email} was not changed.`,
          missing.map((id) => ({ path: `workCenterIds.${input.workCenterIds!.indexOf(id)}`, message: `There is no work center with id ${id}.` })),
        );
      }
    }
    const outcome = await updatePersonIfVersion(db, id, input.version, {
      ...(input.role !== undefined && { role: input.role }),
      ...(input.active !== undefined && { active: input.active }),
      ...(input.name !== undefined && { name: input.name }),
    });
    if (outcome === 'version_mismatch') {
      throw AppError.conflict(`Someone else changed ${person.email} since you opened it; reload to see their change.`);
    }
    if (input.workCenterIds !== undefined) await replacePersonWorkCenters(db, id, input.workCenterIds);
    const after = await findPersonById(db, id);
    if (!after) throw AppError.notFound(`There is no person with id ${id}.`);
    const { passwordHash: _omit, ...plain } = after;
    return { ...plain, workCenterIds: (await workCenterIdsByPerson(db, [id])).get(id) ?? [] };
  });
  if (!updated.active) await deps.lucia.invalidateUserSessions(updated.id);
  return updated;
}
