import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { FIRST_WEEK, seedSmallPlant } from '../support/small-plant';
import { waitForRun } from '../support/plan-runs';

/**
 * The solve queue is a MariaDB table claimed with SELECT … FOR UPDATE SKIP LOCKED, so several
 * API processes can share it (DESIGN.md "Past one machine"). Two runners on one database stand in
 * for two processes.
 */
let ctx: TestContext;
let planner: TestAgent;

async function newPlan(name: string): Promise<number> {
  const res = await planner.post('/api/plans').send({ name, horizonWeeks: 4, firstWeek: FIRST_WEEK, wholeUnits: false });
  expect(res.status).toBe(201);
  return res.body.id;
}

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  await seedSmallPlant(planner);
});

afterAll(async () => {
  await ctx?.close();
});

describe('the solve queue', () => {
  it('when two runners share the queue, then every queued solve runs exactly once', async () => {
    const plans = [await newPlan('Q1'), await newPlan('Q2'), await newPlan('Q3'), await newPlan('Q4')];
    const runs = [];
    for (const id of plans) runs.push((await planner.post(`/api/plans/${id}/solve`)).body.runId as number);
    const a = new SolverJobRunner(ctx.dataSource, { pollMs: 20 });
    const b = new SolverJobRunner(ctx.dataSource, { pollMs: 20 });
    a.start();
    b.start();
    try {
      for (let i = 0; i < plans.length; i++) expect((await waitForRun(planner, plans[i], runs[i])).state).toBe('finished');
    } finally {
      await Promise.all([a.stop(), b.stop()]);
    }
    const jobs: { plan_id: number; state: string; claimed_by: string }[] = await ctx.dataSource.query(
      `SELECT plan_id, state, claimed_by FROM solve_job WHERE kind = 'solve' AND plan_id IN (?) ORDER BY id`,
      [plans],
    );
    expect(jobs.map((j) => [j.plan_id, j.state])).toEqual(plans.map((id) => [id, 'finished']));
    for (const id of plans) expect((await planner.get(`/api/plans/${id}`)).body.solveStatus).toBe('solved');
  });

  it('when a process died while solving (its heartbeat went stale), then another runner takes the job over and finishes it', async () => {
    const id = await newPlan('Orphaned');
    const runId = (await planner.post(`/api/plans/${id}/solve`)).body.runId as number;
    const longAgo = new Date(Date.now() - 10 * 60_000);
    await ctx.dataSource.query(`UPDATE solve_job SET state = 'running', claimed_by = 'a-process-that-died', heartbeat_at = ?, started_at = ? WHERE id = ?`, [
      longAgo,
      longAgo,
      runId,
    ]);
    await ctx.dataSource.query(`UPDATE plan_version SET solve_status = 'solving' WHERE id = ?`, [id]);
    const runner = new SolverJobRunner(ctx.dataSource, { pollMs: 20, staleMs: 60_000 });
    runner.start();
    try {
      expect((await waitForRun(planner, id, runId)).state).toBe('finished');
    } finally {
      await runner.stop();
    }
    const [job]: { claimed_by: string }[] = await ctx.dataSource.query('SELECT claimed_by FROM solve_job WHERE id = ?', [runId]);
    expect(job.claimed_by).not.toBe('a-process-that-died');
    expect((await planner.get(`/api/plans/${id}`)).body.solveStatus).toBe('solved');
  });

  it('when a running job keeps its heartbeat fresh, then no other runner takes it', async () => {
    const id = await newPlan('Alive elsewhere');
    const runId = (await planner.post(`/api/plans/${id}/solve`)).body.runId as number;
    await ctx.dataSource.query(`UPDATE solve_job SET state = 'running', claimed_by = 'a-live-process', heartbeat_at = ? WHERE id = ?`, [new Date(), runId]);
    const runner = new SolverJobRunner(ctx.dataSource, { pollMs: 20, staleMs: 60_000 });
    runner.start();
    await new Promise((r) => setTimeout(r, 500));
    await runner.stop();
    const [job]: { claimed_by: string; state: string }[] = await ctx.dataSource.query('SELECT claimed_by, state FROM solve_job WHERE id = ?', [runId]);
    expect(job).toEqual({ claimed_by: 'a-live-process', state: 'running' });
  });
});

describe('shutting down', () => {
  it('when a runner stops in the middle of a solve, then the job goes back to the queue and the next runner finishes it', async () => {
    const id = await newPlan('Interrupted');
    const runId = (await planner.post(`/api/plans/${id}/solve`)).body.runId as number;
    const first = new SolverJobRunner(ctx.dataSource, { pollMs: 20 });
    first.start();
    const until = Date.now() + 30_000;
    let state = 'queued';
    while (state !== 'running' && Date.now() < until) {
      state = (await planner.get(`/api/plans/${id}/runs/${runId}`)).body.state;
      await new Promise((r) => setTimeout(r, 5));
    }
    expect(state).toBe('running');
    await first.stop();
    const after = (await planner.get(`/api/plans/${id}/runs/${runId}`)).body;
    // Stopped right after the claim (the solver thread is still loading): back in the queue, untouched.
    expect(after.state).toBe('queued');
    expect((await planner.get(`/api/plans/${id}`)).body.solveStatus).toBe('queued');
    const second = new SolverJobRunner(ctx.dataSource, { pollMs: 20 });
    second.start();
    try {
      expect((await waitForRun(planner, id, runId)).state).toBe('finished');
    } finally {
      await second.stop();
    }
    expect((await planner.get(`/api/plans/${id}`)).body.solveStatus).toBe('solved');
  });
});
