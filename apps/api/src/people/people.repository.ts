import type { EntityManager } from 'typeorm';
import type { Person, Role } from '@millrace/contracts';
import { PersonEntity, type PersonRow } from '../db/entities/person.entity';
import { workCenterIdsByPerson } from './person-work-centers.repository';

/** A person plus the stored hash: only for the auth use cases, never sent out. */
export interface PersonWithHash extends Person {
  passwordHash: string | null;
}

function toPerson(row: PersonRow): Person {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    active: Boolean(row.active),
    version: row.version,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** Everyone, by name, with their assigned work centers. */
export async function listPeople(db: EntityManager): Promise<Person[]> {
  const rows = await db.getRepository(PersonEntity).find({ order: { name: 'ASC', id: 'ASC' } });
  const assigned = await workCenterIdsByPerson(db);
  return rows.map((row) => ({ ...toPerson(row), workCenterIds: assigned.get(row.id) ?? [] }));
}

export async function findPersonById(db: EntityManager, id: number): Promise<PersonWithHash | null> {
  const row = await db.getRepository(PersonEntity).findOneBy({ id });
  return row ? { ...toPerson(row), passwordHash: row.passwordHash } : null;
}

export async function findPersonByEmail(db: EntityManager, email: string): Promise<PersonWithHash | null> {
  const row = await db.getRepository(PersonEntity).findOneBy({ email: email.toLowerCase() });
  return row ? { ...toPerson(row), passwordHash: row.passwordHash } : null;
}

export interface NewPersonRow {
  email: string;
  name: string;
  role: Role;
  passwordHash: string | null;
}

/** Inserts a person; the e-mail must be free (checked by the caller; the unique key backs it up). */
export async function insertPerson(db: EntityManager, input: NewPersonRow): Promise<Person> {
  const now = new Date();
  const repo = db.getRepository(PersonEntity);
  const saved = await repo.save(
    repo.create({
      email: input.email.toLowerCase(),
      name: input.name,
      role: input.role,
      passwordHash: input.passwordHash,
      active: true,
      version: 1,
      createdAt: now,
      updatedAt: now,
    }),
  );
  const row = await repo.findOneByOrFail({ id: saved.id });
  return toPerson(row);
}

export type PersonChanges = Partial<Pick<PersonRow, 'role' | 'active' | 'name' | 'passwordHash'>>;
export type VersionedUpdate = 'updated' | 'version_mismatch';

/** Applies changes only if the row still has `version`; bumps the version. */
export async function updatePersonIfVersion(
  db: EntityManager,
  id: number,
  version: number,
  changes: PersonChanges,
): Promise<VersionedUpdate> {
  const result = await db
    .createQueryBuilder()
    .update(PersonEntity)
    .set({ ...changes, version: () => 'version + 1', updatedAt: new Date() })
    .where('id = :id AND version = :version', { id, version })
    .execute();
  return result.affected === 1 ? 'updated' : 'version_mismatch';
}

/**
 * Counts active admins (the last one may not be demoted or deactivated). Inside a transaction
 * the rows are locked, so two admins demoting each other at once cannot both succeed.
 */
export async function countActiveAdmins(db: EntityManager): Promise<number> {
  const locked = db.queryRunner?.isTransactionActive === true;
  const rows = await db.getRepository(PersonEntity).find({
    select: { id: true },
    where: { role: 'admin', active: true },
    ...(locked && { lock: { mode: 'pessimistic_write' as const } }),
  });
  return rows.length;
}
