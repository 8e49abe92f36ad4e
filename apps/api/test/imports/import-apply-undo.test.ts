import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importRunSchema, type ImportRun } from '@millrace/contracts';
import { createMaterial, createProduct, createWorkCenter } from '../support/master-data';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { masterDataSnapshot } from './db-snapshot';
import { tableCounts, upload } from './import-support';

/**
 * Issue 7, "Apply": one transaction with a created / updated / unchanged summary, the history
 * with the original file, who and when, undo of the latest import of a kind back to the earlier
 * state, and the mapping saved per kind.
 */
let ctx: TestContext;
let planner: TestAgent;
let supervisor: TestAgent;

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  supervisor = await ctx.agentFor('supervisor');
  await createProduct(planner, { code: 'TABLE-1', name: 'Oak table', price: 300 });
  await createProduct(planner, { code: 'LEG-1', kind: 'subassembly' });
  await createProduct(planner, { code: 'TOP-1', kind: 'subassembly' });
  await createMaterial(planner, { code: 'OAK-BOARD', unit: 'm2' });
  await createMaterial(planner, { code: 'SCREW', unit: 'pcs' });
  await createWorkCenter(planner, { code: 'SAW' });
});
afterAll(async () => ctx?.close());

async function apply(kind: string, content: string | Buffer, name: string, options: Parameters<typeof upload>[4] = {}) {
  const res = await upload(planner, kind, content, name, { ...options, apply: true });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { run: ImportRun; summary: ImportRun['summary'] };
}

describe('apply', () => {
  const bomFile = 'parent,component,qty,scrap %\nTABLE-1,LEG-1,4,0\nTABLE-1,TOP-1,1,0\nTABLE-1,SCREW,16,2.5\n';

  it('when a clean BOM file is applied, then the lines are stored in file order and the summary counts them', async () => {
    const { run, summary } = await apply('bom', bomFile, 'table-bom.csv');
    expect(summary).toEqual({ created: 3, updated: 0, unchanged: 0, removed: 0 });
    expect(importRunSchema.parse(run)).toMatchObject({ kind: 'bom', fileName: 'table-bom.csv', format: 'csv', rows: 3, state: 'applied', undoable: true, appliedBy: { name: 'Test Planner' } });
    const product = (await planner.get('/api/products')).body.items.find((p: { code: string }) => p.code === 'TABLE-1');
    const detail = (await planner.get(`/api/products/${product.id}`)).body;
    expect(detail.bom.map((l: { componentProductCode: string | null; materialCode: string | null; qtyPer: number; scrapPct: number }) => [l.componentProductCode ?? l.materialCode, l.qtyPer, l.scrapPct])).toEqual([
      ['LEG-1', 4, 0],
      ['TOP-1', 1, 0],
      ['SCREW', 16, 2.5],
    ]);
  });

  it('when the same file is applied again, then every row is unchanged and no version moves', async () => {
    const before = await masterDataSnapshot(ctx.dataSource, { withVersions: true });
    const { summary } = await apply('bom', bomFile, 'table-bom.csv');
    expect(summary).toEqual({ created: 0, updated: 0, unchanged: 3, removed: 0 });
    expect(await masterDataSnapshot(ctx.dataSource, { withVersions: true })).toEqual(before);
  });

  it('when a changed file is applied, then updated, unchanged and removed lines are counted', async () => {
    const { summary } = await apply('bom', 'parent;component;qty\nTABLE-1;LEG-1;4\nTABLE-1;SCREW;"20"\nTABLE-1;OAK-BOARD;1,25\n', 'table-bom-v2.csv');
    // LEG-1 same; SCREW 16 → 20 (scrap column not mapped: the line is replaced with scrap 0); OAK-BOARD new; TOP-1 dropped.
    expect(summary).toEqual({ created: 1, updated: 1, unchanged: 1, removed: 1 });
  });

  it('when the history is read, then each import shows file, who and when, and only the latest of a kind can be undone', async () => {
    const res = await supervisor.get('/api/imports?kind=bom');
    expect(res.status).toBe(200);
    const runs = res.body.map((r: unknown) => importRunSchema.parse(r));
    expect(runs.map((r: ImportRun) => [r.fileName, r.state, r.undoable])).toEqual([
      ['table-bom-v2.csv', 'applied', true],
      ['table-bom.csv', 'applied', false],
      ['table-bom.csv', 'applied', false],
    ]);
    const file = await planner.get(`/api/imports/runs/${runs[0].id}/file`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(file.status).toBe(200);
    expect((file.body as Buffer).toString('utf8')).toBe('parent;component;qty\nTABLE-1;LEG-1;4\nTABLE-1;SCREW;"20"\nTABLE-1;OAK-BOARD;1,25\n');
    expect(file.headers['content-disposition']).toContain('table-bom-v2.csv');
  });

  it('when the latest import is undone, then the BOM is as the import before left it; a second undo goes one further back', async () => {
    const res = await planner.post('/api/imports/bom/undo');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ fileName: 'table-bom-v2.csv', state: 'undone', undoneBy: { name: 'Test Planner' } });
    const bom = (await masterDataSnapshot(ctx.dataSource)).bom;
    expect(bom.map((l: any) => [l.product ?? l.material, Number(l.qty_per), Number(l.scrap_pct)])).toEqual([
      ['LEG-1', 4, 0],
      ['TOP-1', 1, 0],
      ['SCREW', 16, 2.5],
    ]);
    // The second import changed nothing, so undoing it changes nothing; the third undo empties the BOM.
    expect((await planner.post('/api/imports/bom/undo')).status).toBe(200);
    expect((await masterDataSnapshot(ctx.dataSource)).bom).toHaveLength(3);
    expect((await planner.post('/api/imports/bom/undo')).status).toBe(200);
    expect((await masterDataSnapshot(ctx.dataSource)).bom).toHaveLength(0);
    const none = await planner.post('/api/imports/bom/undo');
    expect(none.status).toBe(404);
    expect(none.body.error.message).toBe('There is no applied bom import to undo.');
  });

  it('when someone changes a value the import set, then undo is refused naming the product and nothing changes', async () => {
    const { summary } = await apply('products', 'code,name,unit,kind,price\nTABLE-1,Oak table,pcs,finished,320\nCHAIR-1,Chair,pcs,finished,80\n', 'products.csv');
    expect(summary).toEqual({ created: 1, updated: 1, unchanged: 0, removed: 0 });
    const table = (await planner.get('/api/products?q=TABLE-1')).body.items[0];
    expect(table.price).toBe(320);
    expect((await planner.patch(`/api/products/${table.id}`).send({ version: table.version, price: 330 })).status).toBe(200);
    const before = await tableCounts(ctx.dataSource);
    const res = await planner.post('/api/imports/products/undo');
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('The import cannot be undone: The product TABLE-1 was changed after the import; undo would lose that change.');
    expect(await tableCounts(ctx.dataSource)).toEqual(before);
  });

  it('when products, demand and receipts imports are undone, then the earlier values come back exactly', async () => {
    const start = await masterDataSnapshot(ctx.dataSource, { withVersions: false });
    await apply('materials', 'code,name,unit,on hand,lead time weeks\nSCREW,Screw,pcs,500,2\nGLUE,Glue,kg,12.5,1\n', 'materials.csv');
    await apply('receipts', 'material,week start,quantity,reference\nSCREW,2026-03-02,1000,PO-1\nGLUE,2026-03-09,5,PO-2\n', 'receipts.csv');
    await apply('demand', 'product,week start,type,order reference,quantity\nTABLE-1,2026-03-02,firm,SO-1,5\nTABLE-1,2026-03-02,forecast,,12\n', 'demand.csv');
    await apply('demand', 'product,week start,type,order reference,quantity\nTABLE-1,2026-03-02,firm,SO-1,0\nTABLE-1,2026-03-02,forecast,,14\nCHAIR-1,2026-03-09,forecast,,3\n', 'demand-2.csv');
    const afterFirstDemand = await masterDataSnapshot(ctx.dataSource);
    for (const kind of ['demand']) expect((await planner.post(`/api/imports/${kind}/undo`)).status).toBe(200);
    const back = await masterDataSnapshot(ctx.dataSource);
    expect(back.firm).toEqual([{ code: 'TABLE-1', week: '2026-03-02', order_ref: 'SO-1', qty: '5.0000' }]);
    expect(back.forecast).toEqual([{ code: 'TABLE-1', week: '2026-03-02', qty: '12.0000' }]);
    expect(afterFirstDemand.forecast).toHaveLength(2);
    for (const kind of ['demand', 'receipts', 'materials']) {
      const res = await planner.post(`/api/imports/${kind}/undo`);
      expect(res.status, `${kind}: ${JSON.stringify(res.body)}`).toBe(200);
    }
    expect(await masterDataSnapshot(ctx.dataSource)).toEqual(start);
  });
});

describe('two imports at once', () => {
  it('when two planners apply demand files at the same moment, then both are applied one after the other and each summary is right', async () => {
    const a = 'product,week start,type,order reference,quantity\nTABLE-1,2026-04-06,forecast,,7\n';
    const b = 'product,week start,type,order reference,quantity\nTABLE-1,2026-04-06,forecast,,9\n';
    const [ra, rb] = await Promise.all([upload(planner, 'demand', a, 'a.csv', { apply: true }), upload(planner, 'demand', b, 'b.csv', { apply: true })]);
    expect([ra.status, rb.status]).toEqual([201, 201]);
    // Whichever came second found the first one's forecast and changed it.
    const summaries = [ra.body.summary, rb.body.summary].sort((x, y) => x.created - y.created);
    expect(summaries).toEqual([
      { created: 0, updated: 1, unchanged: 0, removed: 0 },
      { created: 1, updated: 0, unchanged: 0, removed: 0 },
    ]);
    const second = ra.body.summary.updated === 1 ? '7' : '9';
    const [row] = (await ctx.dataSource.query("SELECT qty FROM demand_forecast WHERE week_start = '2026-04-06'")) as Array<{ qty: string }>;
    expect(Number(row.qty)).toBe(Number(second));
  });
});

describe('saved mapping', () => {
  it('when a mapping is saved for a kind, then the next file with those titles uses it', async () => {
    const mapping = { product: 'Teil', weekStart: 'KW-Start', type: 'Art', orderRef: 'Auftrag', qty: 'Stück', unit: null };
    const saved = await planner.put('/api/imports/demand/mapping').send({ mapping });
    expect(saved.status).toBe(200);
    expect(saved.body.mapping).toEqual(mapping);
    const res = await upload(planner, 'demand', 'Teil;KW-Start;Art;Auftrag;Stück\nTABLE-1;2026-03-16;forecast;;4\n', 'plan.csv');
    expect(res.body.mappingSource).toBe('saved');
    expect(res.body.mapping).toEqual(mapping);
    expect(res.body.rows[0].errors).toEqual([]);
  });

  it('when a saved mapping names fields of another kind, then it is refused', async () => {
    const res = await planner.put('/api/imports/demand/mapping').send({ mapping: { colour: 'Farbe' } });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe('The mapping names a field "colour" that a demand import does not have.');
  });

  it('when a supervisor tries to import, then 403', async () => {
    const res = await upload(supervisor, 'bom', 'parent,component,qty\nTABLE-1,LEG-1,4\n', 'bom.csv');
    expect(res.status).toBe(403);
  });
});
