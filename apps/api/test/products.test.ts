import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { productDetailSchema, productPageSchema, productSchema } from '@millrace/contracts';
import { createTestContext, type TestContext } from './support/test-app';
import { countRows, createMaterial, createProduct, createWorkCenter } from './support/master-data';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

describe('products: create, read, update, delete', () => {
  it('when a planner creates a product, then 201 with defaults, and every reading role can get it; a floor lead cannot', async () => {
    const planner = await ctx.agentFor('planner');
    const res = await planner.post('/api/products').send({ code: 'CR-1', name: 'Crate', unit: 'pcs', kind: 'finished', price: 120.5 });
    expect(res.status).toBe(201);
    const product = productSchema.strict().parse(res.body);
    expect(product).toMatchObject({ code: 'CR-1', price: 120.5, batchMultiple: 1, holdingCostRatePct: 24, active: true, version: 1, family: null });
    for (const role of ['admin', 'planner', 'supervisor'] as const) {
      const agent = await ctx.agentFor(role);
      const got = await agent.get(`/api/products/${product.id}`);
      expect(got.status).toBe(200);
      expect(productDetailSchema.strict().parse(got.body)).toMatchObject({ code: 'CR-1', bom: [], routing: [] });
    }
    const floor = await ctx.agentFor('floor_lead');
    expect((await floor.get(`/api/products/${product.id}`)).status).toBe(403);
    expect((await floor.get('/api/products')).status).toBe(403);
  });

  it('when a supervisor or admin tries to write a product, then 403 and nothing is saved', async () => {
    const before = await countRows(ctx.dataSource, 'product');
    for (const role of ['admin', 'supervisor', 'floor_lead'] as const) {
      const agent = await ctx.agentFor(role);
      const res = await agent.post('/api/products').send({ code: `X-${role}`, name: 'X', unit: 'pcs', kind: 'finished' });
      expect(res.status).toBe(403);
    }
    expect(await countRows(ctx.dataSource, 'product')).toBe(before);
  });

  it('when the body has bad and unknown fields, then 400 naming each field path', async () => {
    const planner = await ctx.agentFor('planner');
    const res = await planner.post('/api/products').send({ code: 'has space', name: '', unit: 'pcs', kind: 'gadget', price: -1, colour: 'red' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    const paths = res.body.error.fields.map((f: { path: string }) => f.path).sort();
    expect(paths).toEqual(['code', 'colour', 'kind', 'name', 'price']);
  });

  it('when a code is already used, then 409 on the code field', async () => {
    const planner = await ctx.agentFor('planner');
    await createProduct(planner, { code: 'DUP-1' });
    const res = await planner.post('/api/products').send({ code: 'DUP-1', name: 'Twin', unit: 'pcs', kind: 'finished' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields).toEqual([{ path: 'code', message: expect.stringContaining('DUP-1') }]);
  });

  it('when two planners create the same code at the same moment, then one gets 201 and the other 409, never 500', async () => {
    const [a, b] = await Promise.all([ctx.agentFor('planner'), ctx.agentFor('planner')]);
    const results = await Promise.all([a, b].map((agent) => agent.post('/api/products').send({ code: 'RACE-1', name: 'Race', unit: 'pcs', kind: 'finished' })));
    expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
  });

  it('when two planners edit the same version, then the second gets 409 with the reload sentence and the first change stays', async () => {
    const planner = await ctx.agentFor('planner');
    const p = await createProduct(planner, { code: 'LOCK-1', price: 10 });
    const first = await planner.patch(`/api/products/${p.id}`).send({ price: 11, version: p.version });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ price: 11, version: p.version + 1 });
    const second = await planner.patch(`/api/products/${p.id}`).send({ price: 99, version: p.version });
    expect(second.status).toBe(409);
    expect(second.body.error).toMatchObject({
      code: 'conflict',
      message: 'Someone else changed product LOCK-1 since you opened it; reload to see their change.',
    });
    expect((await planner.get(`/api/products/${p.id}`)).body.price).toBe(11);
  });

  it('when a product id does not exist, then 404; when the id is not a number, then 400 on params.id', async () => {
    const planner = await ctx.agentFor('planner');
    expect((await planner.get('/api/products/999999')).status).toBe(404);
    const bad = await planner.get('/api/products/abc');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].path).toBe('params.id');
  });

  it('when a product is unused, then delete answers 204; a stale version on delete answers 409', async () => {
    const planner = await ctx.agentFor('planner');
    const p = await createProduct(planner, { code: 'DEL-1' });
    expect((await planner.delete(`/api/products/${p.id}?version=${p.version + 5}`)).status).toBe(409);
    expect((await planner.delete(`/api/products/${p.id}?version=${p.version}`)).status).toBe(204);
    expect((await planner.get(`/api/products/${p.id}`)).status).toBe(404);
  });
});

describe('products: list with paging, filter and sort', () => {
  it('when listing with q, kind, sort and page size, then the page, the total and the order follow the query', async () => {
    const planner = await ctx.agentFor('planner');
    for (const code of ['LST-C', 'LST-A', 'LST-B']) await createProduct(planner, { code, kind: 'subassembly', name: `Listed ${code}` });
    const res = await planner.get('/api/products?q=LST-&kind=subassembly&sort=code&dir=desc&pageSize=2&page=1');
    expect(res.status).toBe(200);
    const page = productPageSchema.parse(res.body);
    expect(page.total).toBe(3);
    expect(page.items.map((p) => p.code)).toEqual(['LST-C', 'LST-B']);
    const next = productPageSchema.parse((await planner.get('/api/products?q=LST-&kind=subassembly&sort=code&dir=desc&pageSize=2&page=2')).body);
    expect(next.items.map((p) => p.code)).toEqual(['LST-A']);
  });

  it('when the list query has an unknown sort or field, then 400 naming query.sort and query.colour', async () => {
    const planner = await ctx.agentFor('planner');
    const res = await planner.get('/api/products?sort=colour&colour=red&pageSize=0');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual(['query.colour', 'query.pageSize', 'query.sort']);
  });
});

describe('products: bill of materials and routing', () => {
  it('when a planner saves a BOM and a routing, then the detail shows them in order and each save moves the version on', async () => {
    const planner = await ctx.agentFor('planner');
    const wc = await createWorkCenter(planner, { code: 'SAW-T' });
    const board = await createMaterial(planner, { code: 'BOARD-T', unit: 'm2' });
    const frame = await createProduct(planner, { code: 'FRAME-T', kind: 'subassembly' });
    const box = await createProduct(planner, { code: 'BOX-T' });

    const bom = await planner.put(`/api/products/${box.id}/bom`).send({
      version: box.version,
      lines: [
        { componentProductId: frame.id, qtyPer: 2 },
        { materialId: board.id, qtyPer: 0.75, scrapPct: 5 },
      ],
    });
    expect(bom.status, JSON.stringify(bom.body)).toBe(200);
    const afterBom = productDetailSchema.parse(bom.body);
    expect(afterBom.version).toBe(box.version + 1);
    expect(afterBom.bom.map((l) => [l.componentProductCode ?? l.materialCode, l.qtyPer, l.scrapPct, l.unit])).toEqual([
      ['FRAME-T', 2, 0, 'pcs'],
      ['BOARD-T', 0.75, 5, 'm2'],
    ]);

    const routing = await planner.put(`/api/products/${box.id}/routing`).send({
      version: afterBom.version,
      steps: [
        { sequence: 20, workCenterId: wc.id, hoursPerUnit: 0.25, setupHours: 1 },
        { sequence: 10, workCenterId: wc.id, hoursPerUnit: 0.5 },
      ],
    });
    expect(routing.status, JSON.stringify(routing.body)).toBe(200);
    const afterRouting = productDetailSchema.parse(routing.body);
    expect(afterRouting.routing.map((s) => [s.sequence, s.workCenterCode, s.hoursPerUnit, s.setupHours])).toEqual([
      [10, 'SAW-T', 0.5, 0],
      [20, 'SAW-T', 0.25, 1],
    ]);

    const stale = await planner.put(`/api/products/${box.id}/bom`).send({ version: afterBom.version, lines: [] });
    expect(stale.status).toBe(409);
    expect((await planner.get(`/api/products/${box.id}`)).body.bom).toHaveLength(2);
  });

  it('when a BOM line names both or neither component, an unknown id, or the parent itself, then 400 with each line path and nothing changes', async () => {
    const planner = await ctx.agentFor('planner');
    const m = await createMaterial(planner, { code: 'M-BAD' });
    const p = await createProduct(planner, { code: 'P-BAD' });
    const before = await countRows(ctx.dataSource, 'bom_line');
    const shape = await planner.put(`/api/products/${p.id}/bom`).send({
      version: p.version,
      lines: [{ componentProductId: p.id, materialId: m.id, qtyPer: 1 }, { qtyPer: 1 }, { materialId: m.id, qtyPer: 0 }],
    });
    expect(shape.status).toBe(400);
    expect(shape.body.error.fields.map((f: { path: string }) => f.path)).toEqual(
      expect.arrayContaining(['lines.0.componentProductId', 'lines.1.componentProductId', 'lines.2.qtyPer']),
    );
    const refs = await planner.put(`/api/products/${p.id}/bom`).send({
      version: p.version,
      lines: [{ componentProductId: p.id, qtyPer: 1 }, { materialId: 987654, qtyPer: 1 }],
    });
    expect(refs.status).toBe(400);
    expect(refs.body.error.fields).toEqual([
      { path: 'lines.0.componentProductId', message: 'P-BAD cannot be a component of itself.' },
      { path: 'lines.1.materialId', message: 'There is no material with id 987654.' },
    ]);
    expect(await countRows(ctx.dataSource, 'bom_line')).toBe(before);
  });

  it('when a BOM would close a cycle through other products in the database, then 422 naming the cycle path and nothing changes', async () => {
    const planner = await ctx.agentFor('planner');
    const a = await createProduct(planner, { code: 'CYC-A' });
    const b = await createProduct(planner, { code: 'CYC-B', kind: 'subassembly' });
    const c = await createProduct(planner, { code: 'CYC-C', kind: 'subassembly' });
    expect((await planner.put(`/api/products/${a.id}/bom`).send({ version: a.version, lines: [{ componentProductId: b.id, qtyPer: 1 }] })).status).toBe(200);
    expect((await planner.put(`/api/products/${b.id}/bom`).send({ version: b.version, lines: [{ componentProductId: c.id, qtyPer: 1 }] })).status).toBe(200);
    const before = await countRows(ctx.dataSource, 'bom_line');
    const res = await planner.put(`/api/products/${c.id}/bom`).send({ version: c.version, lines: [{ componentProductId: a.id, qtyPer: 1 }] });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('unprocessable');
    expect(res.body.error.message).toContain('CYC-C → CYC-A → CYC-B → CYC-C');
    expect(res.body.error.issues).toEqual([{ item: 'CYC-C', message: 'Cycle in the bill of materials: CYC-C → CYC-A → CYC-B → CYC-C.' }]);
    expect(await countRows(ctx.dataSource, 'bom_line')).toBe(before);
    expect((await planner.get(`/api/products/${c.id}`)).body.version).toBe(c.version);
  });

  it('when a routing repeats a sequence or names an unknown work center, then 400 on those steps', async () => {
    const planner = await ctx.agentFor('planner');
    const wc = await createWorkCenter(planner, { code: 'RT-WC' });
    const p = await createProduct(planner, { code: 'RT-P' });
    const dup = await planner.put(`/api/products/${p.id}/routing`).send({
      version: p.version,
      steps: [{ sequence: 10, workCenterId: wc.id, hoursPerUnit: 1 }, { sequence: 10, workCenterId: wc.id, hoursPerUnit: 1 }],
    });
    expect(dup.status).toBe(400);
    expect(dup.body.error.fields).toEqual([{ path: 'steps.1.sequence', message: 'Sequence 10 is used twice.' }]);
    const unknown = await planner.put(`/api/products/${p.id}/routing`).send({ version: p.version, steps: [{ sequence: 10, workCenterId: 424242, hoursPerUnit: 1 }] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields).toEqual([{ path: 'steps.0.workCenterId', message: 'There is no work center with id 424242.' }]);
  });

  it('when a product is still a component of another BOM or has demand, then delete answers 409 naming the referrers', async () => {
    const planner = await ctx.agentFor('planner');
    const part = await createProduct(planner, { code: 'USED-PART', kind: 'subassembly' });
    const parent = await createProduct(planner, { code: 'USED-PARENT' });
    await planner.put(`/api/products/${parent.id}/bom`).send({ version: parent.version, lines: [{ componentProductId: part.id, qtyPer: 1 }] });
    const res = await planner.delete(`/api/products/${part.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(
      'Product USED-PART cannot be deleted: it is still used by the bill of materials of USED-PARENT. Remove those first.',
    );
    expect((await planner.get(`/api/products/${part.id}`)).status).toBe(200);
  });
});
