import type { EntityManager } from 'typeorm';
import type { PersonTokenPurpose, Role } from '@millrace/contracts';

export interface StoredToken {
  id: number;
  personId: number;
  purpose: PersonTokenPurpose;
  expiresAt: Date;
  usedAt: Date | null;
  email: string;
  name: string;
  role: Role;
  active: boolean;
}

export async function insertToken(
  db: EntityManager,
  t: { personId: number; purpose: PersonTokenPurpose; tokenHash: string; expiresAt: Date; createdBy: number | null },
): Promise<void> {
  await db.query('INSERT INTO person_token (person_id, purpose, token_hash, expires_at, created_by, created_at) VALUES (?, ?, ?, ?, ?, ?)', [
    t.personId,
    t.purpose,
    t.tokenHash,
    t.expiresAt,
    t.createdBy,
    new Date(),
  ]);
}

/** The token with that hash and its person; `lock` holds the row until the transaction ends. */
export async function findToken(db: EntityManager, tokenHash: string, lock: 'lock' | 'no_lock' = 'no_lock'): Promise<StoredToken | null> {
  const rows: { id: number | string; person_id: number; purpose: PersonTokenPurpose; expires_at: Date; used_at: Date | null; email: string; name: string; role: Role; active: number }[] =
    await db.query(
      `SELECT t.id, t.person_id, t.purpose, t.expires_at, t.used_at, p.email, p.name, p.role, p.active
         FROM person_token t JOIN person p ON p.id = t.person_id WHERE t.token_hash = ?${lock === 'lock' ? ' FOR UPDATE' : ''}`,
      [tokenHash],
    );
  const r = rows[0];
  return r
    ? { id: Number(r.id), personId: r.person_id, purpose: r.purpose, expiresAt: r.expires_at, usedAt: r.used_at, email: r.email, name: r.name, role: r.role, active: Boolean(r.active) }
    : null;
}

/** Marks this token used and retires every other open token of the same person and purpose. */
export async function useToken(db: EntityManager, token: StoredToken): Promise<void> {
  await db.query('UPDATE person_token SET used_at = ? WHERE person_id = ? AND purpose = ? AND used_at IS NULL', [new Date(), token.personId, token.purpose]);
}
