import type { EntityManager } from 'typeorm';

/** Stores a new password hash and moves the person's version on. */
export async function updatePasswordHash(db: EntityManager, personId: number, passwordHash: string): Promise<void> {
  await db.query('UPDATE person SET password_hash = ?, version = version + 1, updated_at = ? WHERE id = ?', [passwordHash, new Date(), personId]);
}
