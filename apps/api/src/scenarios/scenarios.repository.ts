import type { EntityManager } from 'typeorm';
import type { PlanState, Scenario, ScenarioOverride } from '@millrace/contracts';
import { isImmutable } from '../sign-off/plan-state-machine';

interface ScenarioDbRow {
  id: number;
  name: string;
  description: string;
  overrides: string;
  version: number;
  created_at: Date;
  updated_at: Date;
}

async function usage(db: EntityManager, ids: number[]): Promise<Map<number, { id: number; state: PlanState }[]>> {
  const out = new Map<number, { id: number; state: PlanState }[]>();
  if (ids.length === 0) return out;
  const rows: { id: number; state: PlanState; scenario_id: number }[] = await db.query(
    `SELECT id, state, scenario_id FROM plan_version WHERE scenario_id IN (${ids.map(() => '?').join(',')}) ORDER BY id`,
    ids,
  );
  for (const r of rows) out.set(r.scenario_id, [...(out.get(r.scenario_id) ?? []), { id: r.id, state: r.state }]);
  return out;
}

function toScenario(r: ScenarioDbRow, plans: { id: number; state: PlanState }[]): Scenario {
  return {
    id: r.id,
    name: r.name,
    description: r.description,
    overrides: JSON.parse(r.overrides) as ScenarioOverride[],
    version: r.version,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
    usedByPlanIds: plans.map((p) => p.id),
    locked: plans.some((p) => isImmutable(p.state)),
  };
}

export async function listScenarios(db: EntityManager): Promise<Scenario[]> {
  const rows: ScenarioDbRow[] = await db.query('SELECT * FROM scenario ORDER BY name, id');
  const used = await usage(db, rows.map((r) => r.id));
  return rows.map((r) => toScenario(r, used.get(r.id) ?? []));
}

export async function findScenario(db: EntityManager, id: number, lock: 'lock' | 'no_lock' = 'no_lock'): Promise<Scenario | null> {
  const rows: ScenarioDbRow[] = await db.query(`SELECT * FROM scenario WHERE id = ?${lock === 'lock' ? ' FOR UPDATE' : ''}`, [id]);
  if (!rows[0]) return null;
  const used = await usage(db, [id]);
  return toScenario(rows[0], used.get(id) ?? []);
}

export async function scenarioNameTaken(db: EntityManager, name: string, exceptId: number | null): Promise<boolean> {
  const rows: unknown[] = await db.query('SELECT id FROM scenario WHERE name = ? AND id <> ?', [name, exceptId ?? 0]);
  return rows.length > 0;
}

export async function insertScenario(
  db: EntityManager,
  s: { name: string; description: string; overrides: ScenarioOverride[]; createdBy: number },
): Promise<number> {
  const now = new Date();
  const result: { insertId: number } = await db.query(
    'INSERT INTO scenario (name, description, overrides, version, created_by, created_at, updated_at) VALUES (?, ?, ?, 1, ?, ?, ?)',
    [s.name, s.description, JSON.stringify(s.overrides), s.createdBy, now, now],
  );
  return Number(result.insertId);
}

export async function updateScenarioIfVersion(
  db: EntityManager,
  id: number,
  version: number,
  changes: { name?: string; description?: string; overrides?: ScenarioOverride[] },
): Promise<'updated' | 'version_mismatch'> {
  const sets: string[] = [];
  const values: unknown[] = [];
  if (changes.name !== undefined) sets.push('name = ?'), values.push(changes.name);
  if (changes.description !== undefined) sets.push('description = ?'), values.push(changes.description);
  if (changes.overrides !== undefined) sets.push('overrides = ?'), values.push(JSON.stringify(changes.overrides));
  const result: { affectedRows: number } = await db.query(
    `UPDATE scenario SET ${[...sets, 'version = version + 1', 'updated_at = ?'].join(', ')} WHERE id = ? AND version = ?`,
    [...values, new Date(), id, version],
  );
  return result.affectedRows === 1 ? 'updated' : 'version_mismatch';
}

export async function deleteScenario(db: EntityManager, id: number): Promise<void> {
  await db.query('DELETE FROM scenario WHERE id = ?', [id]);
}
