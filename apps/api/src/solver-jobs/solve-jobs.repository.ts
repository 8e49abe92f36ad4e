import type { DataSource, EntityManager } from 'typeorm';
import type { RunProgress, RunState } from '@millrace/contracts';
import type { SolveJobKind } from '../db/entities/solve-job.entity';

/** A job this process has claimed. */
export interface ClaimedJob {
  id: number;
  planId: number;
  kind: SolveJobKind;
}

interface JobRow {
  id: number;
  plan_id: number;
  kind: SolveJobKind;
  state: RunState;
  cancel_requested: number;
  iteration: number;
  relative_gap: number | null;
  primal_objective: number | null;
  elapsed_seconds: number;
  message: string | null;
  created_at: Date;
  started_at: Date | null;
  finished_at: Date | null;
}

export async function enqueueJob(db: EntityManager, planId: number, kind: SolveJobKind): Promise<number> {
  const result: { insertId: number } = await db.query(
    `INSERT INTO solve_job (plan_id, kind, state, created_at) VALUES (?, ?, 'queued', ?)`,
    [planId, kind, new Date()],
  );
  return Number(result.insertId);
}

/**
 * Claims the oldest job of `kind` that is queued, or running with a heartbeat older than `staleMs` (its
 * process died). `SELECT … FOR UPDATE SKIP LOCKED`: API processes sharing the database never claim
 * the same job.
 */
export async function claimNextJob(ds: DataSource, workerId: string, staleMs: number, kind: SolveJobKind): Promise<ClaimedJob | null> {
  return ds.transaction(async (db) => {
    const now = new Date();
    const rows: { id: number; plan_id: number; kind: SolveJobKind }[] = await db.query(
      `SELECT id, plan_id, kind FROM solve_job
        WHERE kind = ? AND (state = 'queued' OR (state = 'running' AND heartbeat_at < ?))
        ORDER BY id LIMIT 1 FOR UPDATE SKIP LOCKED`,
      [kind, new Date(now.getTime() - staleMs)],
    );
    const row = rows[0];
    if (!row) return null;
    await db.query(
      `UPDATE solve_job SET state = 'running', claimed_by = ?, heartbeat_at = ?, started_at = ?, iteration = 0, elapsed_seconds = 0 WHERE id = ?`,
      [workerId, now, now, row.id],
    );
    return { id: row.id, planId: row.plan_id, kind: row.kind };
  });
}

export interface ProgressUpdate {
  iteration: number;
  relativeGap: number | null;
  primalObjective: number | null;
  elapsedSeconds: number;
}

/** Writes progress and the heartbeat; answers whether someone asked to cancel the job. */
export async function writeProgress(ds: DataSource, jobId: number, p: ProgressUpdate): Promise<'cancel_requested' | 'continue'> {
  await ds.query(
    `UPDATE solve_job SET iteration = ?, relative_gap = ?, primal_objective = ?, elapsed_seconds = ?, heartbeat_at = ? WHERE id = ?`,
    [p.iteration, finiteOrNull(p.relativeGap), finiteOrNull(p.primalObjective), p.elapsedSeconds, new Date(), jobId],
  );
  return (await cancelRequested(ds, jobId)) ? 'cancel_requested' : 'continue';
}

export async function cancelRequested(ds: DataSource, jobId: number): Promise<boolean> {
  const rows: { cancel_requested: number }[] = await ds.query('SELECT cancel_requested FROM solve_job WHERE id = ?', [jobId]);
  return Boolean(rows[0]?.cancel_requested);
}

export async function finishJob(db: EntityManager, jobId: number, state: Exclude<RunState, 'queued' | 'running'>, message: string | null): Promise<void> {
  await db.query(`UPDATE solve_job SET state = ?, message = ?, finished_at = ?, heartbeat_at = ? WHERE id = ?`, [
    state,
    message?.slice(0, 4000) ?? null,
    new Date(),
    new Date(),
    jobId,
  ]);
}

/** Flags a job for cancelling; a queued job is cancelled at once. Returns its state afterwards. */
export async function requestCancel(db: EntityManager, jobId: number): Promise<RunState | null> {
  const rows: { state: RunState }[] = await db.query('SELECT state FROM solve_job WHERE id = ? FOR UPDATE', [jobId]);
  const state = rows[0]?.state;
  if (!state) return null;
  if (state === 'queued') {
    await db.query(`UPDATE solve_job SET state = 'cancelled', cancel_requested = 1, message = 'Cancelled before it started.', finished_at = ? WHERE id = ?`, [
      new Date(),
      jobId,
    ]);
    return 'cancelled';
  }
  if (state === 'running') await db.query('UPDATE solve_job SET cancel_requested = 1 WHERE id = ?', [jobId]);
  return state;
}

export async function findRun(db: EntityManager, planId: number, runId: number): Promise<(RunProgress & { kind: SolveJobKind }) | null> {
  const rows: JobRow[] = await db.query('SELECT * FROM solve_job WHERE id = ? AND plan_id = ?', [runId, planId]);
  const r = rows[0];
  if (!r) return null;
  return {
    runId: r.id,
    planId: r.plan_id,
    kind: r.kind,
    state: r.state,
    cancelRequested: Boolean(r.cancel_requested),
    iteration: r.iteration,
    relativeGap: r.relative_gap,
    primalObjective: r.primal_objective,
    elapsedSeconds: r.elapsed_seconds,
    message: r.message,
    createdAt: r.created_at.toISOString(),
    startedAt: r.started_at?.toISOString() ?? null,
    finishedAt: r.finished_at?.toISOString() ?? null,
  };
}

/** Unfinished jobs of a plan (queued or running) of one kind. */
export async function activeJobs(db: EntityManager, planId: number, kind: SolveJobKind): Promise<number[]> {
  const rows: { id: number }[] = await db.query(
    `SELECT id FROM solve_job WHERE plan_id = ? AND kind = ? AND state IN ('queued', 'running') ORDER BY id`,
    [planId, kind],
  );
  return rows.map((r) => r.id);
}

function finiteOrNull(v: number | null): number | null {
  return v !== null && Number.isFinite(v) ? v : null;
}

/** Puts a job this process could not finish (it is shutting down) back in the queue, and its plan with it. */
export async function requeueJob(ds: DataSource, job: ClaimedJob): Promise<void> {
  await ds.transaction(async (db) => {
    await db.query(`UPDATE solve_job SET state = 'queued', claimed_by = NULL, heartbeat_at = NULL, started_at = NULL WHERE id = ? AND state = 'running'`, [job.id]);
    if (job.kind === 'solve') await db.query(`UPDATE plan_version SET solve_status = 'queued' WHERE id = ? AND latest_run_id = ?`, [job.planId, job.id]);
  });
}
