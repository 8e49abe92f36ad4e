import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorBodySchema } from '@millrace/contracts';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { FIRST_WEEK, seedSmallPlant, type SmallPlant } from '../support/small-plant';

/**
 * Bad planning data at plan creation (issue 4, "Bad input"): 422 naming each item, nothing
 * written. Data the master-data API would refuse (a BOM cycle, negative hours, a work center
 * without shifts) is put into the tables directly, as an older import or a hand edit would.
 */
let ctx: TestContext;
let planner: TestAgent;
let plant: SmallPlant;

async function counts(): Promise<{ plans: number; audit: number; jobs: number }> {
  const [row]: { plans: number | string; audit: number | string; jobs: number | string }[] = await ctx.dataSource.query(
    'SELECT (SELECT COUNT(*) FROM plan_version) AS plans, (SELECT COUNT(*) FROM plan_audit) AS audit, (SELECT COUNT(*) FROM solve_job) AS jobs',
  );
  return { plans: Number(row.plans), audit: Number(row.audit), jobs: Number(row.jobs) };
}

/** Posts a plan and expects 422 with an issue for `item` matching `message`; nothing may be written. */
async function expectRefused(body: Record<string, unknown>, item: string, message: RegExp): Promise<void> {
  const before = await counts();
  const res = await planner.post('/api/plans').send(body);
  expect(res.status).toBe(422);
  const error = errorBodySchema.parse(res.body).error;
  expect(error.code).toBe('unprocessable');
  expect(error.issues).toContainEqual({ item, message: expect.stringMatching(message) });
  expect(await counts()).toEqual(before);
}

const plan = (horizonWeeks = 4) => ({ name: 'Bad data', horizonWeeks, firstWeek: FIRST_WEEK });

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  plant = await seedSmallPlant(planner);
});

afterAll(async () => {
  await ctx?.close();
});

describe('creating a plan from bad planning data', () => {
  it('when the good data is used, then the plan is created (the cases below differ only by their fault)', async () => {
    const res = await planner.post('/api/plans').send(plan());
    expect(res.status).toBe(201);
  });

  it('when a bill of materials contains its own parent through a sub-assembly, then 422 names the cycle', async () => {
    // Table top ← Dining table already; adding Dining table under Table top closes TOP → TBL → TOP.
    await ctx.dataSource.query('INSERT INTO bom_line (parent_product_id, position, component_product_id, qty_per, scrap_pct) VALUES (?, 99, ?, 1, 0)', [
      plant.products.TOP,
      plant.products.TBL,
    ]);
    try {
      await expectRefused(plan(), 'product TBL', /contains itself: TBL → TOP → TBL/);
    } finally {
      await ctx.dataSource.query('DELETE FROM bom_line WHERE parent_product_id = ? AND position = 99', [plant.products.TOP]);
    }
  });

  it('when a product has demand but no routing, then 422 names the product', async () => {
    const chair = await planner.post('/api/products').send({ code: 'CHR', name: 'Chair', unit: 'pcs', kind: 'finished', price: 90 });
    expect(chair.status).toBe(201);
    const demand = await planner
      .put('/api/demand')
      .send({ changes: [{ kind: 'firm', productId: chair.body.id, weekStart: FIRST_WEEK, orderRef: 'SO-301', qty: 4, version: null }] });
    expect(demand.status).toBe(200);
    try {
      await expectRefused(plan(), 'product CHR', /has demand but no routing/);
    } finally {
      await ctx.dataSource.query('DELETE FROM firm_order WHERE product_id = ?', [chair.body.id]);
      await ctx.dataSource.query('DELETE FROM product WHERE id = ?', [chair.body.id]);
    }
  });

  it('when a routing step has negative hours, then 422 names the step', async () => {
    await ctx.dataSource.query('UPDATE routing_step SET hours_per_unit = -0.8 WHERE product_id = ? AND sequence = 20', [plant.products.BEN]);
    try {
      await expectRefused(plan(), 'routing BEN step 20', /hoursPerUnit is negative/);
    } finally {
      await ctx.dataSource.query('UPDATE routing_step SET hours_per_unit = 0.8 WHERE product_id = ? AND sequence = 20', [plant.products.BEN]);
    }
  });

  it('when a work center has no shift calendar, then 422 names the work center', async () => {
    await ctx.dataSource.query('UPDATE work_center SET shifts_per_day = 0 WHERE id = ?', [plant.workCenters.ASM]);
    try {
      await expectRefused(plan(), 'work center ASM', /no shift pattern/);
    } finally {
      await ctx.dataSource.query('UPDATE work_center SET shifts_per_day = 1 WHERE id = ?', [plant.workCenters.ASM]);
    }
  });

  it('when the horizon reaches past the known demand, then 422 names the horizon', async () => {
    await expectRefused(plan(6), 'horizon', /demand is known only up to week 4/);
  });

  it('when the scenario named does not exist, then 422 names it', async () => {
    await expectRefused({ ...plan(), scenarioId: 999 }, 'scenario 999', /does not exist/);
  });

  it('when the horizon is shorter than 4 weeks or a field is unknown, then 400 names the field', async () => {
    const short = await planner.post('/api/plans').send(plan(3));
    expect(short.status).toBe(400);
    expect(short.body.error.fields).toContainEqual({ path: 'horizonWeeks', message: 'Plan at least 4 weeks.' });
    const unknown = await planner.post('/api/plans').send({ ...plan(), colour: 'red' });
    expect(unknown.status).toBe(400);
  });

  it('when the first week is not a plant week start, then 400 names firstWeek', async () => {
    const res = await planner.post('/api/plans').send({ ...plan(), firstWeek: '2027-01-05' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('firstWeek');
  });
});
