import type { EntityManager } from 'typeorm';
import type { AuditEntry, PlanState, Role } from '@millrace/contracts';

export interface NewAuditEntry {
  planId: number;
  actor: { id: number; name: string; role: Role } | null;
  action: AuditEntry['action'];
  fromState: PlanState | null;
  toState: PlanState;
  comment: string | null;
  inputsHash: string;
  resultsHash: string | null;
}

/** Appends one row to the audit trail (the table refuses UPDATE and DELETE). */
export async function appendAudit(db: EntityManager, e: NewAuditEntry): Promise<void> {
  await db.query(
    `INSERT INTO plan_audit (plan_id, at, actor_id, actor_name, actor_role, action, from_state, to_state, comment, inputs_hash, results_hash)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    [e.planId, new Date(), e.actor?.id ?? null, e.actor?.name ?? 'Millrace', e.actor?.role ?? null, e.action, e.fromState, e.toState, e.comment, e.inputsHash, e.resultsHash],
  );
}

export async function listAudit(db: EntityManager, planId: number): Promise<AuditEntry[]> {
  const rows: {
    id: number | string;
    plan_id: number;
    at: Date;
    actor_id: number | null;
    actor_name: string;
    actor_role: Role | null;
    action: AuditEntry['action'];
    from_state: PlanState | null;
    to_state: PlanState;
    comment: string | null;
    inputs_hash: string;
    results_hash: string | null;
  }[] = await db.query('SELECT * FROM plan_audit WHERE plan_id = ? ORDER BY id', [planId]);
  return rows.map((r) => ({
    id: Number(r.id),
    planId: r.plan_id,
    at: r.at.toISOString(),
    actor: { id: r.actor_id, name: r.actor_name, role: r.actor_role },
    action: r.action,
    fromState: r.from_state,
    toState: r.to_state,
    comment: r.comment,
    inputsHash: r.inputs_hash,
    resultsHash: r.results_hash,
  }));
}

/** The plan most recently approved other than `exceptId` (the baseline of a review), if any. */
export async function lastApprovedPlanId(db: EntityManager, exceptId: number): Promise<number | null> {
  const rows: { plan_id: number }[] = await db.query(
    `SELECT plan_id FROM plan_audit WHERE action = 'approve' AND plan_id <> ? ORDER BY id DESC LIMIT 1`,
    [exceptId],
  );
  return rows[0]?.plan_id ?? null;
}

/** Who approved a plan version and when (the latest approval), for shift-sheet headers; null if never approved. */
export async function findApproval(db: EntityManager, planId: number): Promise<{ by: string; at: string } | null> {
  const rows: { actor_name: string; at: Date }[] = await db.query(
    `SELECT actor_name, at FROM plan_audit WHERE plan_id = ? AND action = 'approve' ORDER BY id DESC LIMIT 1`,
    [planId],
  );
  return rows[0] ? { by: rows[0].actor_name, at: rows[0].at.toISOString() } : null;
}
