import type { DataSource } from 'typeorm';
import type { PlanState } from '@millrace/contracts';

const copied = `horizon_weeks, first_week, last_week, scenario_id, scenario_name, smoothing_enabled, smoothing_weight,
  whole_units, currency, inputs, inputs_hash, objective, certificate, cross_check, results, results_hash, check_violations,
  rounding, infeasibility, solve_message, model_rows, model_columns, model_nonzeros, mps, created_by`;

/**
 * Test fixture: a copy of a solved plan version put straight into `state` (as if its earlier
 * sign-off steps had happened), so every state × action × role case starts from a known state.
 */
export async function copyPlanInState(ds: DataSource, sourceId: number, state: PlanState, submittedBy: number | null): Promise<number> {
  const now = new Date();
  const result: { insertId: number } = await ds.query(
    `INSERT INTO plan_version (name, state, solve_status, ${copied}, submitted_by, version, created_at, updated_at)
     SELECT CONCAT(name, ' (', ?, ')'), ?, solve_status, ${copied}, ?, 1, ?, ? FROM plan_version WHERE id = ?`,
    [state, state, submittedBy, now, now, sourceId],
  );
  return Number(result.insertId);
}

export async function planState(ds: DataSource, id: number): Promise<PlanState> {
  const rows: { state: PlanState }[] = await ds.query('SELECT state FROM plan_version WHERE id = ?', [id]);
  return rows[0].state;
}

export async function personId(ds: DataSource, email: string): Promise<number> {
  const rows: { id: number }[] = await ds.query('SELECT id FROM person WHERE email = ?', [email]);
  return rows[0].id;
}
