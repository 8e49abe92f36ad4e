import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demandGridSchema, planDetailSchema } from '@millrace/contracts';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { waitForRun } from '../support/plan-runs';
import { FIRST_WEEK, seedSmallPlant, type SmallPlant } from '../support/small-plant';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';

/**
 * Must-ship firm orders (issue 4 "Bad input"): a planner marks an order must-ship; when no plan
 * can ship it complete in its week, the solve ends infeasible and the plan names the conflict.
 *
 * The impossibility is plain capacity arithmetic, checkable by hand: the dining table (TBL) takes
 * 1.5 h per unit on the assembly bench, which has one 8 h shift on 5 days (40 h) plus at most 8 h
 * overtime at 90 % efficiency — at most (40 + 8) × 0.9 / 1.5 = 28.8 tables in the first week, and
 * nothing is in stock. 200 tables cannot ship in week 1.
 */
let ctx: TestContext;
let planner: TestAgent;
let plant: SmallPlant;
let runner: SolverJobRunner;
const bigOrder = { kind: 'firm', weekStart: FIRST_WEEK, orderRef: 'SO-900', qty: 200 } as const;

async function storedOrder() {
  const grid = demandGridSchema.parse((await planner.get('/api/demand').query({ from: FIRST_WEEK, weeks: 1, q: 'TBL' })).body);
  return grid.rows[0].cells[0].firmOrders.find((o) => o.orderRef === 'SO-900')!;
}

async function solveNewPlan(name: string) {
  const created = await planner.post('/api/plans').send({ name, horizonWeeks: 4, firstWeek: FIRST_WEEK, wholeUnits: false });
  expect(created.status).toBe(201);
  const { runId } = (await planner.post(`/api/plans/${created.body.id}/solve`)).body;
  expect((await waitForRun(planner, created.body.id, runId)).state).toBe('finished');
  const detail = await planner.get(`/api/plans/${created.body.id}`);
  expect(detail.status).toBe(200);
  return planDetailSchema.parse(detail.body);
}

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  plant = await seedSmallPlant(planner);
  runner = new SolverJobRunner(ctx.dataSource, { pollMs: 50, progressWriteMs: 50 });
  runner.start();
});

afterAll(async () => {
  await runner?.stop();
  await ctx?.close();
});

describe('must-ship firm orders', () => {
  it('when a firm order is saved with mustShip, then the grid shows the mark; a quantity change without it keeps it; an order without it is not must-ship', async () => {
    const put = await planner.put('/api/demand').send({ changes: [{ ...bigOrder, productId: plant.products.TBL, mustShip: true, version: null }] });
    expect(put.status).toBe(200);
    const saved = await storedOrder();
    expect(saved.mustShip).toBe(true);

    const qtyOnly = await planner.put('/api/demand').send({ changes: [{ ...bigOrder, productId: plant.products.TBL, qty: 210, version: saved.version }] });
    expect(qtyOnly.body).toMatchObject({ updated: 1 });
    const afterQty = await storedOrder();
    expect(afterQty).toMatchObject({ qty: 210, mustShip: true });

    const back = await planner.put('/api/demand').send({ changes: [{ ...bigOrder, productId: plant.products.TBL, version: afterQty.version }] });
    expect(back.body).toMatchObject({ updated: 1 });
    expect(await storedOrder()).toMatchObject({ qty: 200, mustShip: true });

    const grid = demandGridSchema.parse((await planner.get('/api/demand').query({ from: FIRST_WEEK, weeks: 1, q: 'TBL' })).body);
    const plain = grid.rows[0].cells[0].firmOrders.find((o) => o.orderRef === 'SO-101')!;
    expect(plain.mustShip).toBe(false);

    const bad = await planner.put('/api/demand').send({ changes: [{ ...bigOrder, productId: plant.products.TBL, mustShip: 'yes', version: null }] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].path).toBe('changes.0.mustShip');
  });

  it('when a must-ship order cannot be made in its week, then the solve ends infeasible and the plan names the order and the bottleneck in words', async () => {
    expect((await storedOrder()).mustShip).toBe(true);
    const plan = await solveNewPlan('Must ship 200 tables');
    expect(plan.solveStatus).toBe('infeasible');
    expect(plan.objective).toBeNull();
    expect(plan.infeasibility).not.toBeNull();
    const words = [plan.infeasibility!.summary, ...plan.infeasibility!.conflicts].join(' ');
    expect(words).toContain('SO-900');
    expect(words).toMatch(/Assembly bench|ASM/);
  });

  it('when the same order is no longer must-ship, then the plan is solved with the order partly late', async () => {
    const order = await storedOrder();
    const unmark = await planner.put('/api/demand').send({ changes: [{ ...bigOrder, productId: plant.products.TBL, mustShip: false, version: order.version }] });
    expect(unmark.body).toMatchObject({ updated: 1 });
    const plan = await solveNewPlan('Same order, not must-ship');
    expect(plan.solveStatus).toBe('solved');
    expect(plan.infeasibility).toBeNull();
  });
});
