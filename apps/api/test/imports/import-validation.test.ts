import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importPreviewSchema, type ImportPreview } from '@millrace/contracts';
import { createMaterial, createProduct, createWorkCenter } from '../support/master-data';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { errorLines, tableCounts, upload } from './import-support';

/**
 * Issue 7, "Validation before anything is written": unknown codes with a suggestion, negative
 * and non-numeric quantities, units that differ from the item's, duplicate rows, and cycles of
 * the bill of materials across the file and the stored structure. Each file is previewed (exact
 * errors) and applied (422, nothing written).
 */
let ctx: TestContext;
let planner: TestAgent;
let before: Record<string, number>;

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  await createProduct(planner, { code: 'TABLE-1' });
  const leg = await createProduct(planner, { code: 'LEG-1', kind: 'subassembly' });
  const top = await createProduct(planner, { code: 'TOP-1', kind: 'subassembly' });
  await createMaterial(planner, { code: 'OAK-BOARD', unit: 'm2' });
  await createMaterial(planner, { code: 'SCREW', unit: 'pcs' });
  await createWorkCenter(planner, { code: 'SAW' });
  // Stored structure: TOP-1 contains LEG-1 (the cycle test closes it from the file).
  const res = await planner.put(`/api/products/${top.id}/bom`).send({ version: top.version, lines: [{ componentProductId: leg.id, qtyPer: 1 }] });
  expect(res.status).toBe(200);
  before = await tableCounts(ctx.dataSource);
});
afterAll(async () => ctx?.close());

async function check(kind: string, csv: string): Promise<{ preview: ImportPreview; applyErrors: Array<{ item: string; message: string }> }> {
  const res = await upload(planner, kind, csv, `${kind}.csv`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  const applied = await upload(planner, kind, csv, `${kind}.csv`, { apply: true });
  expect(applied.status, JSON.stringify(applied.body)).toBe(422);
  expect(await tableCounts(ctx.dataSource)).toEqual(before);
  return { preview: importPreviewSchema.parse(res.body), applyErrors: applied.body.error.issues };
}

describe('row checks', () => {
  it('when a demand file has no type column, then rows with an order reference are firm orders and the others forecasts', async () => {
    const res = await upload(planner, 'demand', 'product,week start,order reference,quantity\nTABLE-1,2026-03-02,SO-9,5\nTABLE-1,2026-03-02,,8\n', 'demand.csv');
    expect(res.status).toBe(200);
    expect(res.body.fileErrors).toEqual([]);
    expect(errorLines(res.body)).toEqual([]);
    const applied = await upload(planner, 'demand', 'product,week start,order reference,quantity\nTABLE-1,2026-03-02,SO-9,5\nTABLE-1,2026-03-02,,8\n', 'demand.csv', { apply: true });
    expect(applied.status).toBe(201);
    expect(await ctx.dataSource.query("SELECT order_ref, qty FROM firm_order WHERE week_start = '2026-03-02'")).toEqual([{ order_ref: 'SO-9', qty: '5.0000' }]);
    expect(await ctx.dataSource.query("SELECT qty FROM demand_forecast WHERE week_start = '2026-03-02'")).toEqual([{ qty: '8.0000' }]);
    // Back as it was, so the row counts the other checks compare with hold.
    expect((await planner.post('/api/imports/demand/undo')).status).toBe(200);
    expect(await tableCounts(ctx.dataSource)).toEqual({ ...before, import_run: before.import_run + 1 });
    before = await tableCounts(ctx.dataSource);
  });


  it('when codes are unknown, then each row says so and suggests the nearest code', async () => {
    const { preview, applyErrors } = await check('bom', 'parent,component,qty\nTABEL-1,LEG-1,4\nTABLE-1,OAK-BORD,1.5\nTABLE-1,XYZ-99,1\n');
    expect(errorLines(preview)).toEqual([
      'row 2 parent: There is no product with the code TABEL-1. Did you mean TABLE-1?',
      'row 3 component: There is no product or material with the code OAK-BORD. Did you mean OAK-BOARD?',
      'row 4 component: There is no product or material with the code XYZ-99.',
    ]);
    expect(applyErrors).toEqual([
      { item: 'row 2', message: 'parent: There is no product with the code TABEL-1. Did you mean TABLE-1?' },
      { item: 'row 3', message: 'component: There is no product or material with the code OAK-BORD. Did you mean OAK-BOARD?' },
      { item: 'row 4', message: 'component: There is no product or material with the code XYZ-99.' },
    ]);
  });

  it('when quantities are negative or not numbers, then the cells are flagged', async () => {
    const { preview } = await check('bom', 'parent,component,qty,scrap %\nTABLE-1,LEG-1,-4,0\nTABLE-1,SCREW,four,0\nTABLE-1,OAK-BOARD,1.5,-2\n');
    expect(errorLines(preview)).toEqual([
      'row 2 qtyPer: The quantity per unit must be more than 0.',
      'row 3 qtyPer: four is not a number.',
      'row 4 scrapPct: Scrap cannot be negative.',
    ]);
  });

  it('when a demand or receipt quantity is negative, then the contract message is shown', async () => {
    const demand = await check('demand', 'product;week start;type;order reference;quantity\nTABLE-1;2026-03-02;firm;SO-1;-5\nTABLE-1;2026-03-02;forecast;;abc\n');
    expect(errorLines(demand.preview)).toEqual(['row 2 qty: A quantity cannot be negative.', 'row 3 qty: abc is not a number.']);
    const receipts = await check('receipts', 'material,week start,quantity\nSCREW,2026-03-02,-10\nSCREW,2026-03-09,0\n');
    expect(errorLines(receipts.preview)).toEqual(['row 2 qty: A quantity cannot be negative.', 'row 3 qty: A receipt quantity must be more than 0.']);
  });

  it("when a unit differs from the item's unit, then the row names both", async () => {
    const { preview } = await check('bom', 'parent,component,qty,unit\nTABLE-1,OAK-BOARD,1.5,kg\nTABLE-1,SCREW,8,PCS\n');
    // Units compare without case: PCS = pcs (common practice, no source).
    expect(errorLines(preview)).toEqual(['row 2 unit: The unit kg does not match the unit of OAK-BOARD (m2).']);
    expect(preview.rows[1].outcome).toBe('create');
  });

  it('when a row repeats another, then the later row points at the first', async () => {
    const bom = await check('bom', 'parent,component,qty\nTABLE-1,LEG-1,4\nTABLE-1,SCREW,8\ntable-1,leg-1,2\n');
    expect(errorLines(bom.preview)).toEqual(['row 4 component: LEG-1 is already in the bill of materials of TABLE-1 on row 2; combine the quantities.']);
    const products = await check('products', 'code,name,unit,kind\nCHAIR-1,Chair,pcs,finished\nCHAIR-1,Chair again,pcs,finished\n');
    expect(errorLines(products.preview)).toEqual(['row 3 code: The product CHAIR-1 is already on row 2; keep one row per product.']);
    const demand = await check('demand', 'product,week start,type,order reference,quantity\nTABLE-1,2026-03-02,firm,SO-1,5\nTABLE-1,2026-03-02,firm,so-1,6\n');
    expect(errorLines(demand.preview)).toEqual(['row 3 orderRef: The same firm order of TABLE-1 for the week of 2026-03-02 is already on row 2.']);
    const routing = await check('routings', 'product,sequence,work center,hours per unit\nTABLE-1,10,SAW,0.5\nTABLE-1,10,SAW,0.7\n');
    expect(errorLines(routing.preview)).toEqual(['row 3 sequence: Step 10 of TABLE-1 is already on row 2.']);
  });

  it('when the file closes a cycle with the stored structure, then the rows on the cycle name it', async () => {
    // Stored: TOP-1 → LEG-1. The file adds LEG-1 → TOP-1.
    const { preview } = await check('bom', 'parent,component,qty\nLEG-1,TOP-1,1\nLEG-1,SCREW,2\n');
    expect(errorLines(preview)).toEqual(['row 2 component: Cycle in the bill of materials: LEG-1 → TOP-1 → LEG-1.']);
  });

  it('when the file alone has a cycle, then each of its rows on the cycle is flagged', async () => {
    const { preview } = await check('bom', 'parent,component,qty\nTABLE-1,LEG-1,4\nLEG-1,TABLE-1,1\n');
    expect(errorLines(preview)).toEqual([
      'row 2 component: Cycle in the bill of materials: TABLE-1 → LEG-1 → TABLE-1.',
      'row 3 component: Cycle in the bill of materials: TABLE-1 → LEG-1 → TABLE-1.',
      'row 3 component: Cycle in the bill of materials: LEG-1 → TABLE-1 → LEG-1.',
      'row 2 component: Cycle in the bill of materials: LEG-1 → TABLE-1 → LEG-1.',
    ].sort((a, b) => Number(a.split(' ')[1]) - Number(b.split(' ')[1])));
  });

  it('when a product replaces the stored parent lines, then the stored cycle edge no longer counts', async () => {
    // TOP-1's stored lines are replaced by the file (SCREW only), so LEG-1 → TOP-1 is no cycle.
    const res = await upload(planner, 'bom', 'parent,component,qty\nTOP-1,SCREW,4\nLEG-1,TOP-1,1\n', 'bom.csv');
    expect(errorLines(res.body)).toEqual([]);
    expect(res.body.summary).toEqual({ created: 2, updated: 0, unchanged: 0, removed: 1 });
  });

  it('when a week does not start on the plant week day or a firm order has no reference, then both are flagged', async () => {
    const { preview } = await check('demand', 'product,week start,type,order reference,quantity\nTABLE-1,2026-03-03,forecast,,5\nTABLE-1,2026-03-02,firm,,5\nTABLE-1,2026-03-02,forecast,SO-3,5\n');
    // 2026-03-03 is a Tuesday; the plant's weeks start on Monday (the settings default).
    expect(errorLines(preview)).toEqual([
      'row 2 weekStart: 2026-03-03 is a Tuesday; weeks start on Monday.',
      'row 3 orderRef: A firm order needs its customer order reference.',
      'row 4 orderRef: A forecast has no order reference; leave it empty or make the row firm.',
    ]);
  });

  it('when master-data rows break the editor rules, then the contract messages are shown', async () => {
    const products = await check('products', 'code,name,unit,kind,batch multiple\nBAD CODE,Chair,pcs,finished,1\nCHAIR-2,Chair,pcs,finished,0\nCHAIR-3,Chair,pcs,raw,1\n');
    expect(errorLines(products.preview)).toEqual([
      'row 2 code: A code cannot contain spaces.',
      'row 3 batchMultiple: The batch multiple must be more than 0.',
      'row 4 kind: raw is not one of finished, subassembly.',
    ]);
    const materials = await check('materials', 'code,name,unit,lot rule,lot size\nGLUE,Glue,kg,fixed_order_quantity,\nPAINT,Paint,l,lot_for_lot,5\n');
    expect(errorLines(materials.preview)).toEqual(['row 2 lotSize: This lot rule needs a lot size above 0.', 'row 3 lotSize: Lot-for-lot has no lot size; leave it empty.']);
    const wcs = await check('work-centers', 'code,name,shifts per day,hours per shift,days per week,shift starts\nPRESS,Press,2,8,5,06:00\n');
    expect(errorLines(wcs.preview)).toEqual(['row 2 shiftStarts: Give one start time per shift (2).']);
  });
});
