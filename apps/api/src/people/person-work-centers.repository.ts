import type { EntityManager } from 'typeorm';

/** A work center a person is assigned to, as the shift sheets and the release e-mail name it. */
export interface AssignedWorkCenter {
  id: number;
  code: string;
  name: string;
}

/** Assigned work-center ids per person (ascending), for the given people or everyone; people without any are absent. */
export async function workCenterIdsByPerson(db: EntityManager, personIds?: readonly number[]): Promise<Map<number, number[]>> {
  if (personIds && personIds.length === 0) return new Map();
  const rows: { person_id: number; work_center_id: number }[] = personIds
    ? await db.query('SELECT person_id, work_center_id FROM person_work_center WHERE person_id IN (?) ORDER BY person_id, work_center_id', [personIds])
    : await db.query('SELECT person_id, work_center_id FROM person_work_center ORDER BY person_id, work_center_id');
  const byPerson = new Map<number, number[]>();
  for (const r of rows) {
    const list = byPerson.get(Number(r.person_id)) ?? [];
    list.push(Number(r.work_center_id));
    byPerson.set(Number(r.person_id), list);
  }
  return byPerson;
}

/** The work centers a person is assigned to, by code. */
export async function assignedWorkCenters(db: EntityManager, personId: number): Promise<AssignedWorkCenter[]> {
  const rows: { id: number; code: string; name: string }[] = await db.query(
    `SELECT w.id, w.code, w.name FROM person_work_center l JOIN work_center w ON w.id = l.work_center_id
      WHERE l.person_id = ? ORDER BY w.code`,
    [personId],
  );
  return rows.map((r) => ({ id: Number(r.id), code: r.code, name: r.name }));
}

/** Of `ids`, those no work center has (in the order given). Inside a transaction the found rows are share-locked, so they cannot be deleted before the commit. */
export async function missingWorkCenterIds(db: EntityManager, ids: readonly number[]): Promise<number[]> {
  if (ids.length === 0) return [];
  const locked = db.queryRunner?.isTransactionActive === true;
  const rows: { id: number }[] = await db.query(`SELECT id FROM work_center WHERE id IN (?)${locked ? ' LOCK IN SHARE MODE' : ''}`, [ids]);
  const found = new Set(rows.map((r) => Number(r.id)));
  return ids.filter((id) => !found.has(id));
}

/** Replaces a person's assignments with `ids` (which must exist; checked by the caller, backed by the foreign key). */
export async function replacePersonWorkCenters(db: EntityManager, personId: number, ids: readonly number[]): Promise<void> {
  await db.query('DELETE FROM person_work_center WHERE person_id = ?', [personId]);
  if (ids.length > 0) await db.query('INSERT INTO person_work_center (person_id, work_center_id) VALUES ?', [ids.map((id) => [personId, id])]);
}
