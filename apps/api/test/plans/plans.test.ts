import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  certificateSchema,
  planDetailSchema,
  planResultsSchema,
  planSummarySchema,
  type PlanDetail,
} from '@millrace/contracts';
import { readMps, solveWithHighs } from '@millrace/lp-core';
import { buildModel, type PlanningData } from '@millrace/plan-model';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { FIRST_WEEK, seedSmallPlant } from '../support/small-plant';
import { waitForRun } from '../support/plan-runs';

let ctx: TestContext;
let planner: TestAgent;
let supervisor: TestAgent;
let runner: SolverJobRunner;

async function planDetail(id: number): Promise<PlanDetail> {
  const res = await planner.get(`/api/plans/${id}`);
  expect(res.status).toBe(200);
  return planDetailSchema.parse(res.body);
}

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  supervisor = await ctx.agentFor('supervisor');
  await seedSmallPlant(planner);
  runner = new SolverJobRunner(ctx.dataSource, { pollMs: 100, progressWriteMs: 50 });
  runner.start();
});

afterAll(async () => {
  await runner?.stop();
  await ctx?.close();
});

describe('plan versions', () => {
  let planId: number;

  it('when a planner creates a plan over 4 weeks, then it is a draft with its inputs snapshot hashed', async () => {
    const res = await planner.post('/api/plans').send({ name: 'January', horizonWeeks: 4, firstWeek: FIRST_WEEK, wholeUnits: false });
    expect(res.status).toBe(201);
    const plan = planDetailSchema.parse(res.body);
    expect(plan).toMatchObject({ name: 'January', state: 'draft', solveStatus: 'not_solved', horizonWeeks: 4, firstWeek: FIRST_WEEK, lastWeek: '2027-01-25' });
    expect(plan.inputsHash).toMatch(/^[0-9a-f]{64}$/);
    expect(plan.certificate).toBeNull();
    planId = plan.id;

    const list = await supervisor.get('/api/plans');
    expect(list.status).toBe(200);
    expect(list.body.map((p: unknown) => planSummarySchema.parse(p).id)).toContain(planId);
  });

  it('when the plan is solved, then 202 with a run id comes back at once and the run finishes with a checked plan', async () => {
    const res = await planner.post(`/api/plans/${planId}/solve`);
    expect(res.status).toBe(202);
    expect(res.body).toEqual({ runId: expect.any(Number) });
    const run = await waitForRun(planner, planId, res.body.runId);
    expect(run.state).toBe('finished');
    const plan = await planDetail(planId);
    expect(plan.solveStatus).toBe('solved');
    expect(plan.checkViolations).toEqual([]);
    expect(plan.objective).not.toBeNull();
    expect(plan.certificate!.relativeGap).toBeLessThan(1e-6);
  });

  it('when the exported MPS is solved by HiGHS, then its optimum is minus the plan objective to 1e-6', async () => {
    // Reference: HiGHS (npm package highs, HiGHS compiled to WebAssembly) on the exact MPS we export.
    const res = await planner.get(`/api/plans/${planId}/model.mps`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/plain/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?plan-\d+\.mps"?$/);
    const highs = await solveWithHighs(readMps(res.text));
    expect(highs.status).toBe('optimal');
    const plan = await planDetail(planId);
    expect(Math.abs(-highs.objective - plan.objective!) / Math.max(1, Math.abs(highs.objective))).toBeLessThan(1e-6);
  });

  it('when model.mps is read back, then it is the same problem the plan-model builds from the stored snapshot', async () => {
    const mps = (await planner.get(`/api/plans/${planId}/model.mps`)).text;
    const [row]: { inputs: string }[] = await ctx.dataSource.query('SELECT inputs FROM plan_version WHERE id = ?', [planId]);
    const built = buildModel(JSON.parse(row.inputs) as PlanningData, { horizonWeeks: 4, smoothing: { enabled: false, weight: 0 }, wholeUnits: false }).problem;
    const read = readMps(mps);
    expect(read.colNames).toEqual(built.colNames);
    expect(read.rowNames).toEqual(built.rowNames);
    expect(Array.from(read.c)).toEqual(Array.from(built.c));
    expect(Array.from(read.rowLower)).toEqual(Array.from(built.rowLower));
    expect(Array.from(read.rowUpper)).toEqual(Array.from(built.rowUpper));
    expect(Array.from(read.colLower)).toEqual(Array.from(built.colLower));
    expect(Array.from(read.colUpper)).toEqual(Array.from(built.colUpper));
    expect(Array.from(read.A.colPtr)).toEqual(Array.from(built.A.colPtr));
    expect(Array.from(read.A.rowIdx)).toEqual(Array.from(built.A.rowIdx));
    expect(Array.from(read.A.values)).toEqual(Array.from(built.A.values));
    expect(read.c0).toBeCloseTo(built.c0, 9);
  });

  it('when the results are read, then every part is typed by the contracts and consistent with the plan', async () => {
    const all = planResultsSchema.parse((await supervisor.get(`/api/plans/${planId}/results`)).body);
    expect(all.lines).toHaveLength(3 * 4); // 3 products × 4 weeks
    expect(all.load).toHaveLength(2 * 4); // 2 work centers × 4 weeks
    expect(all.objective).toBeCloseTo((await planDetail(planId)).objective!, 6);
    for (const part of ['lines', 'load', 'material-calls', 'unmet'] as const) {
      const res = await supervisor.get(`/api/plans/${planId}/${part}`);
      expect(res.status).toBe(200);
      expect(Array.isArray(res.body)).toBe(true);
    }
    const bottlenecks = await supervisor.get(`/api/plans/${planId}/bottlenecks`);
    expect(bottlenecks.status).toBe(200);
    expect(Object.keys(bottlenecks.body).sort()).toEqual(['bottlenecks', 'reducedCosts']);
    const certificate = certificateSchema.parse((await supervisor.get(`/api/plans/${planId}/certificate`)).body);
    expect(certificate.primalResidual).toBeLessThan(1e-6);
    // The firm table orders are shipped or carried late: shipped + late − earlier late = firm demand each week
    // (product balance, DOMAIN.md §1 after Bowman 1956).
    const tbl = all.lines.filter((l) => l.product === 'TBL');
    expect(tbl.map((l) => l.demand)).toEqual([15, 20, 25, 20]);
  });

  it('when a plan is solved, then the plan-model plan it shows is stored with it (for shift sheets)', async () => {
    const { loadPlanModelPlan } = await import('../../src/plans/plans.repository');
    const stored = await loadPlanModelPlan(ctx.dataSource.manager, planId);
    const results = planResultsSchema.parse((await planner.get(`/api/plans/${planId}/results`)).body);
    expect(stored?.outcome).toBe('optimal');
    expect(stored!.products.map((l) => [l.product, l.week, l.make])).toEqual(results.lines.map((l) => [l.product, l.week, l.make]));
  });

  it('when lines.csv is read, then it is a CSV attachment with one row per product and week', async () => {
    const res = await planner.get(`/api/plans/${planId}/lines.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const rows = res.text.trim().split('\r\n');
    expect(rows[0]).toBe('product,product_name,week,week_start,demand,make,ship,stock,late');
    expect(rows).toHaveLength(1 + 12);
  });

  it('when the background cross-check ends, then the certificate names the checking solver and it verified the objective', async () => {
    const until = Date.now() + 60_000;
    let plan = await planDetail(planId);
    while (plan.certificate?.crossCheck?.status === 'running' && Date.now() < until) {
      await new Promise((r) => setTimeout(r, 200));
      plan = await planDetail(planId);
    }
    const check = plan.certificate!.crossCheck!;
    // A small model (≤ 400 rows and columns) is checked by the simplex library javascript-lp-solver.
    expect(check.solver).toBe('javascript-lp-solver');
    expect(check.status).toBe('verified');
    expect(check.seconds).toBeGreaterThan(0);
    expect(Math.abs(check.objective! - plan.objective!) / Math.max(1, Math.abs(plan.objective!))).toBeLessThanOrEqual(1e-6);
  });

  it('when a floor lead asks for plans, then 403; without a session, 401', async () => {
    const floor = await ctx.agentFor('floor_lead');
    expect((await floor.get(`/api/plans/${planId}`)).status).toBe(403);
    expect((await ctx.anonymous().get('/api/plans')).status).toBe(401);
  });

  it('when a plan asks for whole units, then quantities are whole and the gap to the LP bound is shown', async () => {
    const created = await planner.post('/api/plans').send({ name: 'January whole', horizonWeeks: 4, firstWeek: FIRST_WEEK, wholeUnits: true });
    expect(created.status).toBe(201);
    const run = await planner.post(`/api/plans/${created.body.id}/solve`);
    expect((await waitForRun(planner, created.body.id, run.body.runId)).state).toBe('finished');
    const plan = await planDetail(created.body.id);
    expect(plan.solveStatus).toBe('solved');
    expect(plan.rounding).not.toBeNull();
    // Rounding can only lose margin against the LP optimum (an LP relaxation bounds its integer plans).
    expect(plan.rounding!.gap).toBeGreaterThanOrEqual(-1e-6);
    const lines = planResultsSchema.parse((await planner.get(`/api/plans/${created.body.id}/results`)).body).lines;
    for (const l of lines) expect(Math.abs(l.make - Math.round(l.make))).toBeLessThan(1e-9);
  });
});
