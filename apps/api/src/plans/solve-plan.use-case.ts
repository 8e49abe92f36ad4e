import type { DataSource } from 'typeorm';
import type { RunProgress, SolveAccepted } from '@millrace/contracts';
import type { SignedInPerson } from '../auth/current-person';
import { AppError } from '../http/app-error';
import { appendAudit } from '../sign-off/audit.repository';
import { isEditable } from '../sign-off/plan-state-machine';
import { signalJobQueued } from '../solver-jobs/job-queued-signal';
import { activeJobs, enqueueJob, findRun, requestCancel } from '../solver-jobs/solve-jobs.repository';
import { findPlan, markPlanQueued } from './plans.repository';

/**
 * Queues a solve of a draft or returned plan version and answers at once with the run id; a
 * worker claims it from the job table. Submitted, approved, released and superseded versions
 * cannot be solved again (409), nor can a plan that is already being solved. Once queued, a runner
 * in this process is told at once (runners elsewhere find the job at their next poll).
 */
export async function solvePlan(ds: DataSource, planId: number, person: SignedInPerson): Promise<SolveAccepted> {
  const accepted = await ds.transaction(async (db) => {
    const plan = await findPlan(db, planId, 'lock');
    if (!plan) throw AppError.notFound(`Plan version ${planId} does not exist.`);
    if (!isEditable(plan.state))
      throw AppError.conflict(`Plan version ${planId} is ${plan.state}; only a draft or returned version can be solved again. Create a new version instead.`);
    const running = await activeJobs(db, planId, 'solve');
    if (running.length > 0) throw AppError.conflict(`Plan version ${planId} is already being solved (run ${running[0]}); wait for it or cancel it.`);
    const runId = await enqueueJob(db, planId, 'solve');
    await markPlanQueued(db, planId, runId);
    await appendAudit(db, {
      planId,
      actor: person,
      action: 'solve',
      fromState: plan.state,
      toState: plan.state,
      comment: `Run ${runId} queued.`,
      inputsHash: plan.inputsHash,
      resultsHash: null,
    });
    return { runId };
  });
  signalJobQueued('solve');
  return accepted;
}

/** Asks a run to stop: a queued run is cancelled at once, a running one at its next iteration. */
export async function cancelRun(ds: DataSource, planId: number, runId: number): Promise<RunProgress> {
  await ds.transaction(async (db) => {
    const run = await findRun(db, planId, runId);
    if (!run) throw AppError.notFound(`Run ${runId} of plan version ${planId} does not exist.`);
    if (run.state !== 'queued' && run.state !== 'running') throw AppError.conflict(`Run ${runId} has already ended (${run.state}); there is nothing to cancel.`);
    await requestCancel(db, runId);
    if (run.state === 'queued' && run.kind === 'solve')
      await db.query(`UPDATE plan_version SET solve_status = 'cancelled', solve_message = ? WHERE id = ? AND latest_run_id = ?`, [
        'The solve was cancelled before it started.',
        planId,
        runId,
      ]);
  });
  const { kind: _kind, ...progress } = (await findRun(ds.manager, planId, runId))!;
  return progress;
}
