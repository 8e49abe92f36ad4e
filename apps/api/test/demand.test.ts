import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, demandGridSchema, weekStartOf } from '@millrace/contracts';
import { createTestContext, type TestContext, type TestAgent } from './support/test-app';
import { countRows, createProduct } from './support/master-data';

let ctx: TestContext;
let planner: TestAgent;
let chair: { id: number; code: string };
let table: { id: number; code: string };
const thisWeek = weekStartOf(new Date().toISOString().slice(0, 10), 'monday');
const nextWeek = addDays(thisWeek, 7);

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  chair = await createProduct(planner, { code: 'D-CHAIR' });
  table = await createProduct(planner, { code: 'D-TABLE' });
});
afterAll(async () => ctx?.close());

async function grid(agent: TestAgent = planner, query = '') {
  const res = await agent.get(`/api/demand?q=D-&weeks=2${query}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return demandGridSchema.parse(res.body);
}

describe('demand grid and batch save', () => {
  it('when a planner saves firm orders and forecasts in one batch, then the grid shows them per cell with totals and versions', async () => {
    const res = await planner.put('/api/demand').send({
      changes: [
        { kind: 'firm', productId: chair.id, weekStart: thisWeek, orderRef: 'SO-1', qty: 10, version: null },
        { kind: 'firm', productId: chair.id, weekStart: thisWeek, orderRef: 'SO-2', qty: 5.5, version: null },
        { kind: 'forecast', productId: chair.id, weekStart: nextWeek, qty: 20, version: null },
        { kind: 'forecast', productId: table.id, weekStart: thisWeek, qty: 3, version: null },
      ],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({ created: 4, updated: 0, deleted: 0, unchanged: 0 });

    const g = await grid();
    expect(g.weeks).toEqual([thisWeek, nextWeek]);
    const chairRow = g.rows.find((r) => r.productCode === 'D-CHAIR')!;
    expect(chairRow.cells[0]).toMatchObject({ weekStart: thisWeek, firmQty: 15.5, forecastQty: 0, forecastVersion: null });
    expect(chairRow.cells[0].firmOrders.map((o) => [o.orderRef, o.qty, o.version])).toEqual([
      ['SO-1', 10, 1],
      ['SO-2', 5.5, 1],
    ]);
    expect(chairRow.cells[1]).toMatchObject({ firmQty: 0, forecastQty: 20, forecastVersion: 1 });
    expect(g.weekTotals).toEqual([
      { weekStart: thisWeek, firmQty: 15.5, forecastQty: 3 },
      { weekStart: nextWeek, firmQty: 0, forecastQty: 20 },
    ]);
    const supervisor = await ctx.agentFor('supervisor');
    expect((await supervisor.get('/api/demand')).status).toBe(200);
    expect((await supervisor.put('/api/demand').send({ changes: [{ kind: 'forecast', productId: chair.id, weekStart: thisWeek, qty: 1, version: null }] })).status).toBe(403);
    expect((await (await ctx.agentFor('floor_lead')).get('/api/demand')).status).toBe(403);
  });

  it('when a batch updates, removes (qty 0) and leaves cells as they were, then the counts say so and versions move on', async () => {
    const before = (await grid()).rows.find((r) => r.productCode === 'D-CHAIR')!;
    const [so1, so2] = before.cells[0].firmOrders;
    const res = await planner.put('/api/demand').send({
      changes: [
        { kind: 'firm', productId: chair.id, weekStart: thisWeek, orderRef: 'SO-1', qty: 12, version: so1.version },
        { kind: 'firm', productId: chair.id, weekStart: thisWeek, orderRef: 'SO-2', qty: 0, version: so2.version },
        { kind: 'forecast', productId: chair.id, weekStart: nextWeek, qty: 20, version: before.cells[1].forecastVersion },
      ],
    });
    expect(res.body).toEqual({ created: 0, updated: 1, deleted: 1, unchanged: 1 });
    const after = (await grid()).rows.find((r) => r.productCode === 'D-CHAIR')!;
    expect(after.cells[0].firmOrders.map((o) => [o.orderRef, o.qty, o.version])).toEqual([['SO-1', 12, 2]]);
  });

  it('when one cell of a batch is bad, then 400 names it and nothing of the batch is written', async () => {
    const firmBefore = await countRows(ctx.dataSource, 'firm_order');
    const forecastBefore = await countRows(ctx.dataSource, 'demand_forecast');
    const res = await planner.put('/api/demand').send({
      changes: [
        { kind: 'forecast', productId: table.id, weekStart: nextWeek, qty: 7, version: null },
        { kind: 'firm', productId: table.id, weekStart: nextWeek, orderRef: 'SO-9', qty: -4, version: null },
        { kind: 'firm', productId: 999999, weekStart: nextWeek, orderRef: 'SO-10', qty: 1, version: null },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual([{ path: 'changes.1.qty', message: 'A quantity cannot be negative.' }]);
    const unknown = await planner.put('/api/demand').send({
      changes: [
        { kind: 'forecast', productId: table.id, weekStart: nextWeek, qty: 7, version: null },
        { kind: 'firm', productId: 999999, weekStart: nextWeek, orderRef: 'SO-10', qty: 1, version: null },
      ],
    });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields).toEqual([{ path: 'changes.1.productId', message: 'There is no product with id 999999.' }]);
    const tuesday = addDays(nextWeek, 1);
    const misaligned = await planner.put('/api/demand').send({
      changes: [
        { kind: 'forecast', productId: table.id, weekStart: nextWeek, qty: 7, version: null },
        { kind: 'forecast', productId: chair.id, weekStart: tuesday, qty: 7, version: null },
      ],
    });
    expect(misaligned.status).toBe(400);
    expect(misaligned.body.error.fields).toEqual([{ path: 'changes.1.weekStart', message: `${tuesday} is a Tuesday; weeks start on Monday.` }]);
    expect(await countRows(ctx.dataSource, 'firm_order')).toBe(firmBefore);
    expect(await countRows(ctx.dataSource, 'demand_forecast')).toBe(forecastBefore);
  });

  it('when one cell was changed by someone else since it was read, then 409 names that cell and nothing of the batch is written', async () => {
    const g = await grid();
    const chairRow = g.rows.find((r) => r.productCode === 'D-CHAIR')!;
    const so1 = chairRow.cells[0].firmOrders[0];
    // someone else moves SO-1 on
    expect((await planner.put('/api/demand').send({ changes: [{ kind: 'firm', productId: chair.id, weekStart: thisWeek, orderRef: 'SO-1', qty: 13, version: so1.version }] })).status).toBe(200);
    const firmBefore = await countRows(ctx.dataSource, 'firm_order');
    const forecastBefore = await countRows(ctx.dataSource, 'demand_forecast');
    const res = await planner.put('/api/demand').send({
      changes: [
        { kind: 'forecast', productId: table.id, weekStart: nextWeek, qty: 9, version: null },
        { kind: 'firm', productId: chair.id, weekStart: thisWeek, orderRef: 'SO-1', qty: 99, version: so1.version },
        // a cell read as empty that someone has filled since
        { kind: 'forecast', productId: chair.id, weekStart: nextWeek, qty: 1, version: null },
      ],
    });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(
      `Someone else changed firm order SO-1 of D-CHAIR in the week of ${thisWeek} and 1 more cell since you opened it; reload to see their change.`,
    );
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toEqual(['changes.1', 'changes.2']);
    expect(await countRows(ctx.dataSource, 'firm_order')).toBe(firmBefore);
    expect(await countRows(ctx.dataSource, 'demand_forecast')).toBe(forecastBefore);
    const after = (await grid()).rows.find((r) => r.productCode === 'D-CHAIR')!;
    expect(after.cells[0].firmOrders[0].qty).toBe(13);
  });

  it('when two planners fill the same empty cell at the same moment, then one save lands and the other gets 409', async () => {
    const [a, b] = await Promise.all([ctx.agentFor('planner'), ctx.agentFor('planner')]);
    const week = addDays(thisWeek, 21);
    const results = await Promise.all(
      [a, b].map((agent, i) => agent.put('/api/demand').send({ changes: [{ kind: 'forecast', productId: table.id, weekStart: week, qty: 10 + i, version: null }] })),
    );
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    const rows = (await ctx.dataSource.query('SELECT COUNT(*) AS n FROM demand_forecast WHERE product_id = ? AND week_start = ?', [table.id, week])) as Array<{ n: string }>;
    expect(Number(rows[0].n)).toBe(1);
  });

  it('when the same cell appears twice in a batch, or the batch is empty, then 400', async () => {
    const twice = await planner.put('/api/demand').send({
      changes: [
        { kind: 'firm', productId: table.id, weekStart: nextWeek, orderRef: 'so-77', qty: 1, version: null },
        { kind: 'firm', productId: table.id, weekStart: nextWeek, orderRef: 'SO-77', qty: 2, version: null },
      ],
    });
    expect(twice.status).toBe(400);
    expect(twice.body.error.fields).toEqual([{ path: 'changes.1', message: 'The same cell is changed twice (also at changes.0).' }]);
    const empty = await planner.put('/api/demand').send({ changes: [] });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields[0].path).toBe('changes');
  });

  it('when the grid is asked from a date that is not a week start, then 400 on query.from', async () => {
    const res = await planner.get(`/api/demand?from=${addDays(thisWeek, 2)}`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('query.from');
  });

  it('when a product has demand, then deleting it answers 409 naming the firm orders and forecasts', async () => {
    const res = await planner.delete(`/api/products/${chair.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('Product D-CHAIR cannot be deleted: it is still used by 1 firm order; 1 forecast week. Remove those first.');
  });
});
