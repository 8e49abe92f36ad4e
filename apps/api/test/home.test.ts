import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { homeSummarySchema, weekStartOf } from '@millrace/contracts';
import { createTestContext, type TestContext } from './support/test-app';
import { createProduct, createWorkCenter } from './support/master-data';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

describe('home summary (GET /api/home)', () => {
  it('when firm demand needs 50 h on a 1 × 8 h × 5 day work center, then the current week shows 40 h available and over-loaded, for every role', async () => {
    const planner = await ctx.agentFor('planner');
    const thisWeek = weekStartOf(new Date().toISOString().slice(0, 10), 'monday');
    // 1 shift × 8 h × 5 days = 40 h (DOMAIN.md §3, common practice, no source)
    const wc = await createWorkCenter(planner, { code: 'H-BENCH', efficiency: 1, shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] } });
    const p = await createProduct(planner, { code: 'H-STOOL' });
    expect((await planner.put(`/api/products/${p.id}/routing`).send({ version: p.version, steps: [{ sequence: 10, workCenterId: wc.id, hoursPerUnit: 0.5 }] })).status).toBe(200);
    expect(
      (await planner.put('/api/demand').send({ changes: [{ kind: 'firm', productId: p.id, weekStart: thisWeek, orderRef: 'SO-H1', qty: 100, version: null }] })).status,
    ).toBe(200);

    for (const role of ['admin', 'planner', 'supervisor', 'floor_lead'] as const) {
      const agent = await ctx.agentFor(role);
      const res = await agent.get('/api/home?weeks=3');
      expect(res.status).toBe(200);
      const summary = homeSummarySchema.parse(res.body);
      expect(summary.weeks[0]).toBe(thisWeek);
      const cells = summary.workCenters.find((w) => w.code === 'H-BENCH')!.cells;
      expect(cells[0]).toMatchObject({ availableHours: 40, requiredHours: 50, loadPct: 125, status: 'over_loaded' });
      expect(cells[1]).toMatchObject({ availableHours: 40, requiredHours: 0, status: 'within_capacity' });
      expect(summary.firmDemand).toEqual([{ productCode: 'H-STOOL', productName: 'Product H-STOOL', unit: 'pcs', qtyByWeek: [100, 0, 0] }]);
    }
  });

  it('when the calendar gives the current week one holiday and 2 h downtime, then 1 × 8 × 4 − 2 = 30 h are available', async () => {
    const planner = await ctx.agentFor('planner');
    const thisWeek = weekStartOf(new Date().toISOString().slice(0, 10), 'monday');
    const list = await planner.get('/api/work-centers?q=H-BENCH');
    const wc = list.body.items[0];
    const res = await planner.put(`/api/work-centers/${wc.id}/calendar`).send({ version: wc.version, weeks: [{ weekStart: thisWeek, holidayDays: 1, downtimeHours: 2 }] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const summary = homeSummarySchema.parse((await planner.get('/api/home?weeks=1')).body);
    expect(summary.workCenters.find((w) => w.code === 'H-BENCH')!.cells[0]).toMatchObject({ availableHours: 30, requiredHours: 50 });
  });

  it('when weeks is out of range, then 400 on query.weeks', async () => {
    const planner = await ctx.agentFor('planner');
    const res = await planner.get('/api/home?weeks=99');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual([{ path: 'query.weeks', message: 'At most 26 weeks.' }]);
  });
});
