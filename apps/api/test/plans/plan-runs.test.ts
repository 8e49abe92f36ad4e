import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runProgressSchema, type RunProgress } from '@millrace/contracts';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { seedGeneratedPlant } from '../support/generated-plant';
import { FIRST_WEEK } from '../support/small-plant';
import { waitForRun } from '../support/plan-runs';

/** Solves run off the request thread, report progress, and can be cancelled (issue 4 item 5). */
let ctx: TestContext;
let planner: TestAgent;
let runner: SolverJobRunner;
const horizonWeeks = 12;

async function newPlan(name: string): Promise<number> {
  const res = await planner.post('/api/plans').send({ name, horizonWeeks, firstWeek: FIRST_WEEK, wholeUnits: false });
  expect(res.status).toBe(201);
  return res.body.id;
}

async function runOf(planId: number, runId: number): Promise<RunProgress> {
  return runProgressSchema.parse((await planner.get(`/api/plans/${planId}/runs/${runId}`)).body);
}

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  await seedGeneratedPlant(planner, 80, horizonWeeks);
  runner = new SolverJobRunner(ctx.dataSource, { pollMs: 50, progressWriteMs: 50 });
  runner.start();
});

afterAll(async () => {
  await runner?.stop();
  await ctx?.close();
});

describe('solve runs', () => {
  it('when a solve is running, then health and other requests keep answering and progress is readable', async () => {
    const planId = await newPlan('Concurrency');
    const { runId } = (await planner.post(`/api/plans/${planId}/solve`)).body;
    let answeredWhileRunning = 0;
    let sawProgress = false;
    for (let i = 0; i < 600; i++) {
      const run = await runOf(planId, runId);
      if (run.state !== 'queued' && run.state !== 'running') break;
      if (run.state === 'running') {
        const health = await ctx.anonymous().get('/api/health');
        const list = await planner.get('/api/plans');
        const still = await runOf(planId, runId);
        expect(health.status).toBe(200);
        expect(list.status).toBe(200);
        if (still.state === 'running') answeredWhileRunning++;
        if (still.state === 'running' && still.iteration > 0 && still.relativeGap !== null) sawProgress = true;
      }
      await new Promise((r) => setTimeout(r, 20));
    }
    expect(answeredWhileRunning).toBeGreaterThan(0);
    expect(sawProgress).toBe(true);
    expect((await waitForRun(planner, planId, runId)).state).toBe('finished');
    expect((await planner.get(`/api/plans/${planId}`)).body.solveStatus).toBe('solved');
  });

  it('when a running solve is cancelled, then it stops and the plan says cancelled', async () => {
    const planId = await newPlan('Cancel while running');
    const { runId } = (await planner.post(`/api/plans/${planId}/solve`)).body;
    for (let i = 0; i < 600; i++) {
      const run = await runOf(planId, runId);
      if (run.state === 'running' && run.iteration > 0) break;
      await new Promise((r) => setTimeout(r, 10));
    }
    const cancel = await planner.post(`/api/plans/${planId}/runs/${runId}/cancel`);
    expect(cancel.status).toBe(202);
    expect(cancel.body.cancelRequested).toBe(true);
    const run = await waitForRun(planner, planId, runId);
    expect(run.state).toBe('cancelled');
    const plan = (await planner.get(`/api/plans/${planId}`)).body;
    expect(plan.solveStatus).toBe('cancelled');
    expect(plan.objective).toBeNull();
    expect((await planner.post(`/api/plans/${planId}/runs/${runId}/cancel`)).status).toBe(409);
  });

  it('when a queued solve is cancelled before a worker takes it, then it never runs', async () => {
    await runner.stop();
    try {
      const planId = await newPlan('Cancel while queued');
      const { runId } = (await planner.post(`/api/plans/${planId}/solve`)).body;
      expect((await runOf(planId, runId)).state).toBe('queued');
      expect((await planner.post(`/api/plans/${planId}/solve`)).status).toBe(409); // one run at a time
      const cancel = await planner.post(`/api/plans/${planId}/runs/${runId}/cancel`);
      expect(cancel.status).toBe(202);
      expect(cancel.body.state).toBe('cancelled');
      runner.start();
      await new Promise((r) => setTimeout(r, 300));
      const run = await runOf(planId, runId);
      expect(run.state).toBe('cancelled');
      expect(run.startedAt).toBeNull();
      expect((await planner.get(`/api/plans/${planId}`)).body.solveStatus).toBe('cancelled');
    } finally {
      runner.start();
    }
  });
});
