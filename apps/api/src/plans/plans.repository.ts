import type { EntityManager } from 'typeorm';
import type {
  Certificate,
  CheckViolation,
  CrossCheck,
  Infeasibility,
  PlanDetail,
  PlanResults,
  PlanState,
  PlanSummary,
  Rounding,
  SolveStatus,
} from '@millrace/contracts';
import type { Plan, PlanningData } from '@millrace/plan-model';
import { executePrepared } from '../db/execute-prepared';

/** Columns of a plan version without the large documents (inputs, results, MPS). */
const summaryColumns = `
  p.id, p.name, p.state, p.solve_status, p.horizon_weeks, p.first_week, p.last_week, p.scenario_id, p.scenario_name,
  p.smoothing_enabled, p.smoothing_weight, p.whole_units, p.objective, p.currency, p.inputs_hash, p.created_by,
  p.submitted_by, p.created_at, p.updated_at, p.version, p.latest_run_id, p.results_hash, per.name AS created_by_name`;

interface SummaryRow {
  id: number;
  name: string;
  state: PlanState;
  solve_status: SolveStatus;
  horizon_weeks: number;
  first_week: string;
  last_week: string;
  scenario_id: number | null;
  scenario_name: string | null;
  smoothing_enabled: number;
  smoothing_weight: number;
  whole_units: number;
  objective: number | null;
  currency: string;
  inputs_hash: string;
  created_by: number | null;
  submitted_by: number | null;
  created_at: Date;
  updated_at: Date;
  version: number;
  latest_run_id: number | null;
  results_hash: string | null;
  created_by_name: string | null;
}

/** A plan version as the use cases need it: the summary plus who submitted it and its results hash. */
export interface PlanRecord extends PlanSummary {
  submittedBy: number | null;
  resultsHash: string | null;
}

function toRecord(r: SummaryRow): PlanRecord {
  return {
    id: r.id,
    name: r.name,
    state: r.state,
    solveStatus: r.solve_status,
    horizonWeeks: r.horizon_weeks,
    firstWeek: r.first_week,
    lastWeek: r.last_week,
    scenarioId: r.scenario_id,
    scenarioName: r.scenario_name,
    smoothing: { enabled: Boolean(r.smoothing_enabled), weight: Number(r.smoothing_weight) },
    wholeUnits: Boolean(r.whole_units),
    objective: r.objective === null ? null : Number(r.objective),
    currency: r.currency,
    inputsHash: r.inputs_hash,
    createdBy: r.created_by === null ? null : { id: r.created_by, name: r.created_by_name ?? '' },
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
    version: r.version,
    latestRunId: r.latest_run_id,
    submittedBy: r.submitted_by,
    resultsHash: r.results_hash,
  };
}

export function toSummary(record: PlanRecord): PlanSummary {
  const { submittedBy: _s, resultsHash: _r, ...summary } = record;
  return summary;
}

export async function listPlans(db: EntityManager): Promise<PlanSummary[]> {
  const rows: SummaryRow[] = await db.query(
    `SELECT ${summaryColumns} FROM plan_version p LEFT JOIN person per ON per.id = p.created_by ORDER BY p.id DESC`,
  );
  return rows.map((r) => toSummary(toRecord(r)));
}

/** One plan version; `lock` takes a row lock for the rest of the transaction. */
export async function findPlan(db: EntityManager, id: number, lock: 'lock' | 'no_lock' = 'no_lock'): Promise<PlanRecord | null> {
  const rows: SummaryRow[] = await db.query(
    `SELECT ${summaryColumns} FROM plan_version p LEFT JOIN person per ON per.id = p.created_by WHERE p.id = ?${lock === 'lock' ? ' FOR UPDATE' : ''}`,
    [id],
  );
  return rows[0] ? toRecord(rows[0]) : null;
}

const parse = <T>(text: string | null): T | null => (text === null ? null : (JSON.parse(text) as T));

export async function findPlanDetail(db: EntityManager, id: number): Promise<PlanDetail | null> {
  const record = await findPlan(db, id);
  if (!record) return null;
  const [extra]: {
    certificate: string | null;
    cross_check: string | null;
    check_violations: string | null;
    rounding: string | null;
    infeasibility: string | null;
    solve_message: string | null;
    model_rows: number | null;
    model_columns: number | null;
    model_nonzeros: number | null;
  }[] = await db.query(
    `SELECT certificate, cross_check, check_violations, rounding, infeasibility, solve_message, model_rows, model_columns, model_nonzeros
       FROM plan_version WHERE id = ?`,
    [id],
  );
  const certificate = parse<Omit<Certificate, 'crossCheck'>>(extra.certificate);
  return {
    ...toSummary(record),
    certificate: certificate ? { ...certificate, crossCheck: parse<CrossCheck>(extra.cross_check) } : null,
    solveMessage: extra.solve_message,
    checkViolations: parse<CheckViolation[]>(extra.check_violations) ?? [],
    rounding: parse<Rounding>(extra.rounding),
    infeasibility: parse<Infeasibility>(extra.infeasibility),
    resultsHash: record.resultsHash,
    modelSize:
      extra.model_rows === null
        ? null
        : { rows: extra.model_rows, columns: extra.model_columns ?? 0, nonzeros: extra.model_nonzeros ?? 0 },
  };
}

export async function loadPlanInputs(db: EntityManager, id: number): Promise<PlanningData | null> {
  const rows: { inputs: string }[] = await db.query('SELECT inputs FROM plan_version WHERE id = ?', [id]);
  return rows[0] ? (JSON.parse(rows[0].inputs) as PlanningData) : null;
}

export async function loadPlanResults(db: EntityManager, id: number): Promise<PlanResults | null> {
  const rows: { results: string | null }[] = await db.query('SELECT results FROM plan_version WHERE id = ?', [id]);
  return rows[0] ? parse<PlanResults>(rows[0].results) : null;
}

/** plan-model's Plan the version shows (for shift sheets and comparisons); null before a valid solve. */
export async function loadPlanModelPlan(db: EntityManager, id: number): Promise<Plan | null> {
  const rows: { plan: string | null }[] = await db.query('SELECT plan FROM plan_version WHERE id = ?', [id]);
  return rows[0] ? parse<Plan>(rows[0].plan) : null;
}

export async function loadPlanMps(db: EntityManager, id: number): Promise<string | null> {
  const rows: { mps: string | null }[] = await db.query('SELECT mps FROM plan_version WHERE id = ?', [id]);
  return rows[0]?.mps ?? null;
}

export interface NewPlan {
  name: string;
  horizonWeeks: number;
  firstWeek: string;
  lastWeek: string;
  scenarioId: number | null;
  scenarioName: string | null;
  smoothing: { enabled: boolean; weight: number };
  wholeUnits: boolean;
  currency: string;
  inputs: string;
  inputsHash: string;
  createdBy: number;
}

export async function insertPlan(db: EntityManager, plan: NewPlan): Promise<number> {
  const now = new Date();
  const result: { insertId: number } = await db.query(
    `INSERT INTO plan_version (name, state, solve_status, horizon_weeks, first_week, last_week, scenario_id, scenario_name,
       smoothing_enabled, smoothing_weight, whole_units, currency, inputs, inputs_hash, created_by, version, created_at, updated_at)
     VALUES (?, 'draft', 'not_solved', ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, 1, ?, ?)`,
    [
      plan.name,
      plan.horizonWeeks,
      plan.firstWeek,
      plan.lastWeek,
      plan.scenarioId,
      plan.scenarioName,
      plan.smoothing.enabled,
      plan.smoothing.weight,
      plan.wholeUnits,
      plan.currency,
      plan.inputs,
      plan.inputsHash,
      plan.createdBy,
      now,
      now,
    ],
  );
  return Number(result.insertId);
}

export type VersionedUpdate = 'updated' | 'version_mismatch';

export async function renamePlanIfVersion(db: EntityManager, id: number, version: number, name: string): Promise<VersionedUpdate> {
  const result: { affectedRows: number } = await db.query(
    'UPDATE plan_version SET name = ?, version = version + 1, updated_at = ? WHERE id = ? AND version = ?',
    [name, new Date(), id, version],
  );
  return result.affectedRows === 1 ? 'updated' : 'version_mismatch';
}

export async function setPlanState(db: EntityManager, id: number, state: PlanState, submittedBy?: number): Promise<void> {
  await db.query(
    `UPDATE plan_version SET state = ?, ${submittedBy !== undefined ? 'submitted_by = ?, ' : ''}version = version + 1, updated_at = ? WHERE id = ?`,
    submittedBy !== undefined ? [state, submittedBy, new Date(), id] : [state, new Date(), id],
  );
}

/** Marks a plan queued for a new run and forgets the results of the previous one. */
export async function markPlanQueued(db: EntityManager, id: number, runId: number): Promise<void> {
  await db.query(
    `UPDATE plan_version SET solve_status = 'queued', latest_run_id = ?, objective = NULL, certificate = NULL, cross_check = NULL,
       results = NULL, results_hash = NULL, plan = NULL, check_violations = NULL, rounding = NULL, infeasibility = NULL, solve_message = NULL,
       model_rows = NULL, model_columns = NULL, model_nonzeros = NULL, mps = NULL, version = version + 1, updated_at = ?
     WHERE id = ?`,
    [runId, new Date(), id],
  );
}

export async function setSolveStatus(db: EntityManager, id: number, status: SolveStatus, message: string | null = null): Promise<void> {
  await db.query('UPDATE plan_version SET solve_status = ?, solve_message = ?, updated_at = ? WHERE id = ?', [status, message, new Date(), id]);
}

/** Everything a finished solve leaves on the plan version. */
export interface SolveOutcomeRecord {
  solveStatus: SolveStatus;
  objective: number | null;
  certificate: Omit<Certificate, 'crossCheck'> | null;
  results: PlanResults | null;
  resultsHash: string | null;
  /** plan-model's Plan shown (rounded when asked) */
  plan: Plan | null;
  checkViolations: CheckViolation[];
  rounding: Rounding | null;
  infeasibility: Infeasibility | null;
  message: string | null;
  modelSize: { rows: number; columns: number; nonzeros: number } | null;
  mps: string | null;
  crossCheck: CrossCheck | null;
}

/** Stores a finished solve; a prepared statement, since the MPS and the plan run to megabytes (200 × 26: 6 MB). */
export async function storeSolveOutcome(db: EntityManager, id: number, o: SolveOutcomeRecord): Promise<void> {
  const json = (v: unknown) => (v === null ? null : JSON.stringify(v));
  await executePrepared(
    db,
    `UPDATE plan_version SET solve_status = ?, objective = ?, certificate = ?, results = ?, results_hash = ?, plan = ?, check_violations = ?,
       rounding = ?, infeasibility = ?, solve_message = ?, model_rows = ?, model_columns = ?, model_nonzeros = ?, mps = ?, cross_check = ?,
       version = version + 1, updated_at = ?
     WHERE id = ?`,
    [
      o.solveStatus,
      o.objective,
      json(o.certificate),
      json(o.results),
      o.resultsHash,
      json(o.plan),
      JSON.stringify(o.checkViolations),
      json(o.rounding),
      json(o.infeasibility),
      o.message,
      o.modelSize?.rows ?? null,
      o.modelSize?.columns ?? null,
      o.modelSize?.nonzeros ?? null,
      o.mps,
      json(o.crossCheck),
      new Date(),
      id,
    ],
  );
}

export async function storeCrossCheck(db: EntityManager, id: number, crossCheck: CrossCheck): Promise<void> {
  await db.query('UPDATE plan_version SET cross_check = ?, updated_at = ? WHERE id = ?', [JSON.stringify(crossCheck), new Date(), id]);
}

/** Released plan versions other than `exceptId` that share at least one week with [firstWeek, lastWeek], locked. */
export async function findReleasedOverlapping(db: EntityManager, exceptId: number, firstWeek: string, lastWeek: string): Promise<PlanRecord[]> {
  const rows: SummaryRow[] = await db.query(
    `SELECT ${summaryColumns} FROM plan_version p LEFT JOIN person per ON per.id = p.created_by
      WHERE p.state = 'released' AND p.id <> ? AND p.first_week <= ? AND p.last_week >= ? ORDER BY p.id FOR UPDATE`,
    [exceptId, lastWeek, firstWeek],
  );
  return rows.map(toRecord);
}

/** Plan versions built from a scenario, with their states. */
export async function plansOfScenario(db: EntityManager, scenarioId: number): Promise<{ id: number; state: PlanState }[]> {
  return db.query('SELECT id, state FROM plan_version WHERE scenario_id = ? ORDER BY id', [scenarioId]);
}
