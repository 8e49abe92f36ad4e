import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, materialDetailSchema, materialSchema, weekStartOf } from '@millrace/contracts';
import { createTestContext, type TestContext } from './support/test-app';
import { countRows, createMaterial, createProduct } from './support/master-data';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());
const thisWeek = weekStartOf(new Date().toISOString().slice(0, 10), 'monday');

describe('materials', () => {
  it('when a planner creates a material with a fixed order quantity, then 201; others read it, floor leads do not', async () => {
    const planner = await ctx.agentFor('planner');
    const res = await planner.post('/api/materials').send({
      code: 'MAT-PLY',
      name: 'Plywood 18 mm',
      unit: 'm2',
      unitCost: 27.5,
      onHand: 40,
      leadTimeWeeks: 2,
      weeklySupplyCap: 100,
      lotRule: 'fixed_order_quantity',
      lotSize: 60,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(materialSchema.strict().parse(res.body)).toMatchObject({ code: 'MAT-PLY', lotRule: 'fixed_order_quantity', lotSize: 60, weeklySupplyCap: 100 });
    expect((await (await ctx.agentFor('admin')).get(`/api/materials/${res.body.id}`)).status).toBe(200);
    expect((await (await ctx.agentFor('floor_lead')).get(`/api/materials/${res.body.id}`)).status).toBe(403);
  });

  it('when the lot rule and lot size do not fit together, then 400 on lotSize, also when a PATCH changes only one of them', async () => {
    const planner = await ctx.agentFor('planner');
    const create = await planner.post('/api/materials').send({ code: 'MAT-LOT', name: 'Lot', unit: 'pcs', lotRule: 'lot_for_lot', lotSize: 10 });
    expect(create.status).toBe(400);
    expect(create.body.error.fields).toEqual([{ path: 'lotSize', message: 'Lot-for-lot has no lot size; leave it empty.' }]);
    const m = await createMaterial(planner, { code: 'MAT-LOT' });
    const patch = await planner.patch(`/api/materials/${m.id}`).send({ version: m.version, lotRule: 'minimum_order_quantity' });
    expect(patch.status).toBe(400);
    expect(patch.body.error.fields).toEqual([{ path: 'lotSize', message: 'This lot rule needs a lot size above 0.' }]);
    const ok = await planner.patch(`/api/materials/${m.id}`).send({ version: m.version, lotRule: 'minimum_order_quantity', lotSize: 25 });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ lotRule: 'minimum_order_quantity', lotSize: 25, version: m.version + 1 });
  });

  it('when a planner saves scheduled receipts, then they come back by week; a stale version or a misaligned week changes nothing', async () => {
    const planner = await ctx.agentFor('planner');
    const m = await createMaterial(planner, { code: 'MAT-REC' });
    const res = await planner.put(`/api/materials/${m.id}/receipts`).send({
      version: m.version,
      receipts: [
        { weekStart: addDays(thisWeek, 7), qty: 50, reference: 'PO-2' },
        { weekStart: thisWeek, qty: 25.5 },
      ],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const detail = materialDetailSchema.strict().parse(res.body);
    expect(detail.receipts.map((r) => [r.weekStart, r.qty, r.reference])).toEqual([
      [thisWeek, 25.5, null],
      [addDays(thisWeek, 7), 50, 'PO-2'],
    ]);
    const before = await countRows(ctx.dataSource, 'scheduled_receipt');
    const stale = await planner.put(`/api/materials/${m.id}/receipts`).send({ version: m.version, receipts: [] });
    expect(stale.status).toBe(409);
    const friday = addDays(thisWeek, 4);
    const misaligned = await planner.put(`/api/materials/${m.id}/receipts`).send({ version: detail.version, receipts: [{ weekStart: friday, qty: 1 }] });
    expect(misaligned.status).toBe(400);
    expect(misaligned.body.error.fields).toEqual([{ path: 'receipts.0.weekStart', message: `${friday} is a Friday; weeks start on Monday.` }]);
    const zero = await planner.put(`/api/materials/${m.id}/receipts`).send({ version: detail.version, receipts: [{ weekStart: thisWeek, qty: 0 }] });
    expect(zero.status).toBe(400);
    expect(zero.body.error.fields).toEqual([{ path: 'receipts.0.qty', message: 'A receipt quantity must be more than 0.' }]);
    expect(await countRows(ctx.dataSource, 'scheduled_receipt')).toBe(before);
  });

  it('when a bill of materials still uses the material, then delete answers 409 naming the product', async () => {
    const planner = await ctx.agentFor('planner');
    const m = await createMaterial(planner, { code: 'MAT-USED' });
    const p = await createProduct(planner, { code: 'P-USES-MAT' });
    await planner.put(`/api/products/${p.id}/bom`).send({ version: p.version, lines: [{ materialId: m.id, qtyPer: 2 }] });
    const res = await planner.delete(`/api/materials/${m.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('Material MAT-USED cannot be deleted: it is still used by the bill of materials of P-USES-MAT. Remove those first.');
    const unused = await createMaterial(planner, { code: 'MAT-FREE' });
    expect((await planner.delete(`/api/materials/${unused.id}`)).status).toBe(204);
  });

  it('when a list is sorted by lead time descending, then the longest lead time comes first', async () => {
    const planner = await ctx.agentFor('planner');
    await createMaterial(planner, { code: 'MAT-S1', leadTimeWeeks: 1 });
    await createMaterial(planner, { code: 'MAT-S9', leadTimeWeeks: 9 });
    const res = await planner.get('/api/materials?q=MAT-S&sort=leadTimeWeeks&dir=desc');
    expect(res.body.items.map((m: { code: string }) => m.code)).toEqual(['MAT-S9', 'MAT-S1']);
  });
});
