import type { EntityManager } from 'typeorm';
import type { PlanState, SheetPlan } from '@millrace/contracts';

/** Codes of the work centers that exist in the plant now (a plan's snapshot may name deleted ones). */
export async function currentWorkCenterCodes(db: EntityManager): Promise<Set<string>> {
  const rows: { code: string }[] = await db.query('SELECT code FROM work_center');
  return new Set(rows.map((r) => r.code));
}

/** Plan versions in `states`, newest first, with who approved them last and when. */
export async function listPlansInStates(db: EntityManager, states: readonly PlanState[]): Promise<SheetPlan[]> {
  const rows: { id: number; name: string; state: PlanState; first_week: string; last_week: string; actor_name: string | null; at: Date | null }[] = await db.query(
    `SELECT p.id, p.name, p.state, p.first_week, p.last_week, a.actor_name, a.at
       FROM plan_version p
       LEFT JOIN plan_audit a ON a.id = (SELECT MAX(x.id) FROM plan_audit x WHERE x.plan_id = p.id AND x.action = 'approve')
      WHERE p.state IN (?) ORDER BY p.id DESC`,
    [states],
  );
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    state: r.state,
    firstWeek: r.first_week,
    lastWeek: r.last_week,
    approvedBy: r.actor_name,
    approvedAt: r.at ? r.at.toISOString() : null,
  }));
}
