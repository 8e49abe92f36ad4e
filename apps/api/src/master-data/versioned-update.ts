import type { EntityManager, EntitySchema, ObjectLiteral } from 'typeorm';

/** Outcome of an optimistic-locking write. */
export type VersionedWrite = 'updated' | 'version_mismatch';

/**
 * `UPDATE … SET changes, version = version + 1, updated_at = now WHERE id = ? AND version = ?`.
 * The row lock taken by the UPDATE serialises concurrent writers: the second one finds the
 * version moved on and gets `version_mismatch` (→ 409), in any number of API processes.
 */
export async function updateIfVersion<T extends ObjectLiteral>(
  db: EntityManager,
  entity: EntitySchema<T>,
  id: number,
  version: number,
  changes: Record<string, unknown>,
): Promise<VersionedWrite> {
  const result = await db
    .createQueryBuilder()
    .update(entity)
    .set({ ...changes, version: () => 'version + 1', updatedAt: new Date() } as never)
    .where('id = :id AND version = :version', { id, version })
    .execute();
  return result.affected === 1 ? 'updated' : 'version_mismatch';
}

/** Drops keys whose value is `undefined` (absent from a PATCH body). */
export function definedOnly<T extends object>(changes: T): Partial<T> {
  return Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined)) as Partial<T>;
}
