import { EntitySchema } from 'typeorm';
import type { RunState } from '@millrace/contracts';

/** What a job computes: the main solve of a plan, or the independent re-solve that checks it. */
export type SolveJobKind = 'solve' | 'cross_check';

/**
 * A queued or running piece of solver work. Table `solve_job`. Any API process claims the oldest
 * queued job with `SELECT … FOR UPDATE SKIP LOCKED`, keeps `heartbeat_at` fresh while it runs and
 * writes progress at a throttled rate; a job whose heartbeat went stale (its process died) can be
 * claimed again.
 */
export interface SolveJobRow {
  id: number;
  planId: number;
  kind: SolveJobKind;
  state: RunState;
  cancelRequested: boolean;
  iteration: number;
  relativeGap: number | null;
  primalObjective: number | null;
  elapsedSeconds: number;
  message: string | null;
  claimedBy: string | null;
  heartbeatAt: Date | null;
  createdAt: Date;
  startedAt: Date | null;
  finishedAt: Date | null;
}

export const SolveJobEntity = new EntitySchema<SolveJobRow>({
  name: 'SolveJob',
  tableName: 'solve_job',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    planId: { name: 'plan_id', type: 'int' },
    kind: { type: 'varchar', length: 20 },
    state: { type: 'varchar', length: 20 },
    cancelRequested: { name: 'cancel_requested', type: 'boolean', default: false },
    iteration: { type: 'int', default: 0 },
    relativeGap: { name: 'relative_gap', type: 'double', nullable: true },
    primalObjective: { name: 'primal_objective', type: 'double', nullable: true },
    elapsedSeconds: { name: 'elapsed_seconds', type: 'double', default: 0 },
    message: { type: 'text', nullable: true },
    claimedBy: { name: 'claimed_by', type: 'varchar', length: 100, nullable: true },
    heartbeatAt: { name: 'heartbeat_at', type: 'datetime', precision: 3, nullable: true },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
    startedAt: { name: 'started_at', type: 'datetime', precision: 3, nullable: true },
    finishedAt: { name: 'finished_at', type: 'datetime', precision: 3, nullable: true },
  },
});
