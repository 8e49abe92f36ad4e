import { EntitySchema } from 'typeorm';
import type { PlanState, SolveStatus } from '@millrace/contracts';

/**
 * A plan version. Table `plan_version`. The planning data it was built from is kept as a JSON
 * snapshot (`inputs`, with its SHA-256 `inputsHash`) so the plan can be rebuilt exactly; results,
 * certificate, cross-check and the exact MPS of the solved LP are stored with it after a solve.
 * JSON documents are LONGTEXT columns parsed by the repository.
 */
export interface PlanVersionRow {
  id: number;
  name: string;
  state: PlanState;
  solveStatus: SolveStatus;
  horizonWeeks: number;
  firstWeek: string;
  lastWeek: string;
  scenarioId: number | null;
  scenarioName: string | null;
  smoothingEnabled: boolean;
  smoothingWeight: number;
  wholeUnits: boolean;
  currency: string;
  inputs: string;
  inputsHash: string;
  objective: number | null;
  certificate: string | null;
  crossCheck: string | null;
  results: string | null;
  resultsHash: string | null;
  /** plan-model's Plan shown (JSON) */
  plan: string | null;
  checkViolations: string | null;
  rounding: string | null;
  infeasibility: string | null;
  solveMessage: string | null;
  modelRows: number | null;
  modelColumns: number | null;
  modelNonzeros: number | null;
  mps: string | null;
  latestRunId: number | null;
  createdBy: number | null;
  submittedBy: number | null;
  version: number;
  createdAt: Date;
  updatedAt: Date;
}

export const PlanVersionEntity = new EntitySchema<PlanVersionRow>({
  name: 'PlanVersion',
  tableName: 'plan_version',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    name: { type: 'varchar', length: 120 },
    state: { type: 'varchar', length: 20 },
    solveStatus: { name: 'solve_status', type: 'varchar', length: 20 },
    horizonWeeks: { name: 'horizon_weeks', type: 'int' },
    firstWeek: { name: 'first_week', type: 'char', length: 10 },
    lastWeek: { name: 'last_week', type: 'char', length: 10 },
    scenarioId: { name: 'scenario_id', type: 'int', nullable: true },
    scenarioName: { name: 'scenario_name', type: 'varchar', length: 120, nullable: true },
    smoothingEnabled: { name: 'smoothing_enabled', type: 'boolean' },
    smoothingWeight: { name: 'smoothing_weight', type: 'double' },
    wholeUnits: { name: 'whole_units', type: 'boolean' },
    currency: { type: 'varchar', length: 3 },
    inputs: { type: 'longtext' },
    inputsHash: { name: 'inputs_hash', type: 'char', length: 64 },
    objective: { type: 'double', nullable: true },
    certificate: { type: 'longtext', nullable: true },
    crossCheck: { name: 'cross_check', type: 'longtext', nullable: true },
    results: { type: 'longtext', nullable: true },
    resultsHash: { name: 'results_hash', type: 'char', length: 64, nullable: true },
    plan: { type: 'longtext', nullable: true },
    checkViolations: { name: 'check_violations', type: 'longtext', nullable: true },
    rounding: { type: 'longtext', nullable: true },
    infeasibility: { type: 'longtext', nullable: true },
    solveMessage: { name: 'solve_message', type: 'text', nullable: true },
    modelRows: { name: 'model_rows', type: 'int', nullable: true },
    modelColumns: { name: 'model_columns', type: 'int', nullable: true },
    modelNonzeros: { name: 'model_nonzeros', type: 'int', nullable: true },
    mps: { type: 'longtext', nullable: true },
    latestRunId: { name: 'latest_run_id', type: 'int', nullable: true },
    createdBy: { name: 'created_by', type: 'int', nullable: true },
    submittedBy: { name: 'submitted_by', type: 'int', nullable: true },
    version: { type: 'int', default: 1 },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
    updatedAt: { name: 'updated_at', type: 'datetime', precision: 3 },
  },
});
