import { hostname } from 'node:os';
import type { DataSource } from 'typeorm';
import type { CrossCheck, CrossCheckSolver } from '@millrace/contracts';
import { PollingLoop } from '../background/polling-loop';
import type { SolveJobKind } from '../db/entities/solve-job.entity';
import { findPlan, findPlanDetail, loadPlanInputs, loadPlanMps, setSolveStatus, storeCrossCheck, storeSolveOutcome } from '../plans/plans.repository';
import type { ComputeProgress } from './compute-plan';
import { chooseCrossCheckSolver, crossCheckSolverLabel, defaultCrossCheckSettings, type CrossCheckSettings } from './cross-check-plan';
import { SolverThread, type RunningTask } from './solver-thread';
import { cancelRequested, claimNextJob, enqueueJob, finishJob, requeueJob, writeProgress, type ClaimedJob } from './solve-jobs.repository';
import { readMps } from '@millrace/lp-core';
import { appendAudit } from '../sign-off/audit.repository';
import { solvedAuditComment } from './solved-audit-comment';
import { onJobQueued, signalJobQueued } from './job-queued-signal';

export interface SolverJobRunnerSettings {
  /** how often an idle runner looks for queued jobs (ms) */
  pollMs: number;
  /** progress is written to the job row at most this often (ms) */
  progressWriteMs: number;
  /** a running job whose heartbeat is older than this is taken over (ms) */
  staleMs: number;
  crossCheck: CrossCheckSettings;
}

export const defaultSolverJobRunnerSettings: SolverJobRunnerSettings = {
  pollMs: 200,
  progressWriteMs: 250,
  staleMs: 120_000,
  crossCheck: defaultCrossCheckSettings,
};

/**
 * Claims solver jobs from the `solve_job` table and runs each in a worker thread: the plan solve
 * (progress written at a throttled rate, cancellable) and, after it, the background cross-check.
 * One solve and one cross-check at a time per process; several API processes share the queue.
 */
export class SolverJobRunner {
  private readonly settings: SolverJobRunnerSettings;
  private readonly workerId = `${hostname()}:${process.pid}:${Math.random().toString(36).slice(2, 8)}`;
  private readonly kinds = ['solve', 'cross_check'] as const;
  /** one polling loop per kind of job, in the order of `kinds` */
  private readonly lanes: PollingLoop[];
  /** one long-lived worker thread per lane */
  private readonly threads: Record<SolveJobKind, SolverThread>;
  private stopping = false;
  private stopListening: (() => void) | null = null;

  constructor(
    private readonly ds: DataSource,
    settings: Partial<SolverJobRunnerSettings> = {},
  ) {
    this.settings = { ...defaultSolverJobRunnerSettings, ...settings };
    // Two lanes, so a long cross-check never holds up the next plan's solve.
    this.lanes = this.kinds.map(
      (kind) => new PollingLoop(async () => ((await this.claimAndRun(kind)) ? 'busy' : 'idle'), this.settings.pollMs, 'solver jobs: a round failed'),
    );
    this.threads = { solve: new SolverThread(), cross_check: new SolverThread() };
  }

  start(): void {
    for (const kind of this.kinds) this.threads[kind].warm(kind);
    for (const lane of this.lanes) lane.start();
    // a job queued in this process is claimed at once, not at the next poll
    this.stopListening ??= onJobQueued((kind) => this.lanes[this.kinds.indexOf(kind)].wake());
  }

  /**
   * Stops claiming and ends the solver threads; a job cut short is put back in the queue, so
   * this or another process takes it up again at once (not after the heartbeat goes stale).
   */
  async stop(): Promise<void> {
    this.stopping = true;
    this.stopListening?.();
    this.stopListening = null;
    try {
      const lanesStopped = this.lanes.map((lane) => lane.stop());
      await Promise.all(Object.values(this.threads).map((t) => t.close()));
      await Promise.all(lanesStopped);
    } finally {
      this.stopping = false;
    }
  }

  /** Claims and runs one job; false when the queue was empty. */
  async claimAndRun(kind: SolveJobKind): Promise<boolean> {
    const job = await claimNextJob(this.ds, this.workerId, this.settings.staleMs, kind);
    if (!job) return false;
    try {
      if (job.kind === 'solve') await this.runSolve(job);
      else await this.runCrossCheck(job);
    } catch (err) {
      if (this.stopping) {
        await requeueJob(this.ds, job);
        return true;
      }
      const message = err instanceof Error ? err.message : String(err);
      console.error(`solver jobs: job ${job.id} (${job.kind}, plan ${job.planId}) failed:`, message);
      await this.ds.transaction(async (db) => {
        await finishJob(db, job.id, 'failed', message);
        if (job.kind === 'solve') await setSolveStatus(db, job.planId, 'failed', `The solve failed: ${message}`);
        else await storeCrossCheck(db, job.planId, notFinished((await findPlanDetail(db, job.planId))?.certificate?.crossCheck?.solver ?? 'highs', message));
      });
    }
    return true;
  }

  private async runSolve(job: ClaimedJob): Promise<void> {
    const claimed = performance.now();
    const plan = await findPlan(this.ds.manager, job.planId);
    const data = await loadPlanInputs(this.ds.manager, job.planId);
    if (!plan || !data) return finishJob(this.ds.manager, job.id, 'failed', 'The plan version no longer exists.');
    await setSolveStatus(this.ds.manager, job.planId, 'solving');
    const started = performance.now();
    const worker = this.threads.solve.run(
      {
        kind: 'solve',
        request: { planId: plan.id, data, horizonWeeks: plan.horizonWeeks, smoothing: plan.smoothing, wholeUnits: plan.wholeUnits },
      },
      this.progressWriter(job, () => worker, started),
    );
    const watch = this.watchCancel(job, worker);
    try {
      const reply = await worker.done;
      if (reply.type === 'error') throw new Error(reply.message);
      if (reply.type !== 'solved') throw new Error('The solver thread answered with the wrong kind of result.');
      const outcome = reply.outcome;
      if (outcome.kind === 'cancelled') {
        await this.ds.transaction(async (db) => {
          await finishJob(db, job.id, 'cancelled', 'Cancelled on request.');
          await setSolveStatus(db, job.planId, 'cancelled', 'The solve was cancelled before it finished.');
        });
        return;
      }
      const record = outcome.record;
      // besides the thread's own stages: reading the job's inputs here, and the time to and from
      // the thread beyond its stages (passing the task and the outcome, loading code)
      const timings = {
        load: (started - claimed) / 1000,
        ...outcome.timings,
        thread: Math.max(0, (performance.now() - started) / 1000 - Object.values(outcome.timings).reduce((a, s) => a + s, 0)),
      };
      const checkable = record.solveStatus === 'solved' || record.solveStatus === 'check_failed';
      const crossCheck: CrossCheck | null =
        checkable && record.mps
          ? {
              solver: outcome.crossCheckSolver,
              status: 'running',
              objective: null,
              planObjective: record.objective,
              relativeDifference: null,
              seconds: null,
              message: 'The cross-check is waiting for a worker.',
            }
          : null;
      await this.ds.transaction(async (db) => {
        const storing = performance.now();
        await storeSolveOutcome(db, job.planId, { ...record, crossCheck });
        const stages = Object.entries({ ...timings, store: (performance.now() - storing) / 1000 })
          .map(([name, seconds]) => `${name} ${seconds.toFixed(2)} s`)
          .join(', ');
        await finishJob(db, job.id, 'finished', [record.message, `Stages: ${stages}.`].filter(Boolean).join(' '));
        await appendAudit(db, {
          planId: job.planId,
          actor: null,
          action: 'solved',
          fromState: plan.state,
          toState: plan.state,
          comment: solvedAuditComment(job.id, record.solveStatus, record.objective, plan.currency),
          inputsHash: plan.inputsHash,
          resultsHash: record.resultsHash,
        });
        await db.query('UPDATE solve_job SET elapsed_seconds = ?, iteration = ?, relative_gap = ? WHERE id = ?', [
          (performance.now() - started) / 1000,
          record.certificate?.iterations ?? 0,
          Number.isFinite(record.certificate?.relativeGap) ? record.certificate!.relativeGap : null,
          job.id,
        ]);
        if (crossCheck) await enqueueJob(db, job.planId, 'cross_check');
      });
      if (crossCheck) signalJobQueued('cross_check');
    } finally {
      clearInterval(watch);
    }
  }

  private async runCrossCheck(job: ClaimedJob): Promise<void> {
    const plan = await findPlan(this.ds.manager, job.planId);
    const mps = await loadPlanMps(this.ds.manager, job.planId);
    if (!plan || !mps || plan.objective === null) {
      return finishJob(this.ds.manager, job.id, 'failed', 'The plan has no solved model to check.');
    }
    // the solve chose the solver when it queued this check; reading a large MPS here would hold up
    // the request thread (200 × 26: 0.2 s), so it is read only for a plan stored without that choice
    const solver = (await findPlanDetail(this.ds.manager, job.planId))?.certificate?.crossCheck?.solver ?? chooseCrossCheckSolver(readMps(mps));
    await storeCrossCheck(this.ds.manager, job.planId, {
      solver,
      status: 'running',
      objective: null,
      planObjective: plan.objective,
      relativeDifference: null,
      seconds: null,
      message: `${crossCheckSolverLabel(solver)} is re-solving the exported model.`,
    });
    const worker = this.threads.cross_check.run({ kind: 'cross_check', request: { mps, planObjective: plan.objective }, settings: this.settings.crossCheck }, () => {});
    const heartbeat = setInterval(() => {
      void writeProgress(this.ds, job.id, { iteration: 0, relativeGap: null, primalObjective: null, elapsedSeconds: 0 }).catch(() => {});
    }, Math.min(30_000, this.settings.staleMs / 4));
    try {
      const reply = await worker.done;
      if (reply.type === 'error') throw new Error(reply.message);
      if (reply.type !== 'cross_checked') throw new Error('The cross-check thread answered with the wrong kind of result.');
      await this.ds.transaction(async (db) => {
        // A newer solve may have replaced the plan's results meanwhile: only record a check of the current model.
        const current = await findPlan(db, job.planId, 'lock');
        if (current && current.objective === plan.objective) await storeCrossCheck(db, job.planId, reply.crossCheck);
        await finishJob(db, job.id, 'finished', reply.crossCheck.message);
      });
    } finally {
      clearInterval(heartbeat);
    }
  }

  /** Writes progress to the job row at most every `progressWriteMs`; stops the worker when a cancel was asked. */
  private progressWriter(job: ClaimedJob, worker: () => RunningTask, started: number): (p: ComputeProgress) => void {
    let lastWrite = 0;
    let writing = false;
    return (p) => {
      const now = performance.now();
      if (writing || now - lastWrite < this.settings.progressWriteMs) return;
      lastWrite = now;
      writing = true;
      writeProgress(this.ds, job.id, {
        iteration: p.iteration,
        relativeGap: p.relativeGap,
        primalObjective: p.primalObjective,
        elapsedSeconds: (now - started) / 1000,
      })
        .then((answer) => {
          if (answer === 'cancel_requested') worker().stop();
        })
        .catch((err: unknown) => console.error('solver jobs: progress not written:', err instanceof Error ? err.message : err))
        .finally(() => {
          writing = false;
        });
    };
  }

  /** Polls the cancel flag while the worker runs (also between progress reports) and keeps the heartbeat. */
  private watchCancel(job: ClaimedJob, worker: RunningTask): NodeJS.Timeout {
    return setInterval(() => {
      cancelRequested(this.ds, job.id)
        .then((asked) => {
          if (asked) worker.stop();
          return this.ds.query('UPDATE solve_job SET heartbeat_at = ? WHERE id = ?', [new Date(), job.id]);
        })
        .catch(() => {});
    }, Math.max(200, this.settings.progressWriteMs));
  }
}

function notFinished(solver: CrossCheckSolver, message: string): CrossCheck {
  return {
    solver,
    status: 'not_finished',
    objective: null,
    planObjective: null,
    relativeDifference: null,
    seconds: null,
    message: `The cross-check could not finish: ${message}`,
  };
}
