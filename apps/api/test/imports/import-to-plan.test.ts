import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { waitForRun } from '../support/plan-runs';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { errorLines, tableCounts, upload, xlsx } from './import-support';

/**
 * Issue 7, "Done when", as a new planner would do it on an empty plant: work centers,
 * materials and products from CSV, a 200-line BOM from an XLSX workbook, routings, and a demand
 * CSV with semicolons and decimal commas. The flagged rows are fixed and the files applied; a
 * plan version over the imported data then solves. (Invented demo-style data; the plan's demand
 * is compared with the file's own quantities.)
 */
let ctx: TestContext;
let planner: TestAgent;
let runner: SolverJobRunner;
const weeks = ['2027-01-04', '2027-01-11', '2027-01-18', '2027-01-25']; // Mondays (the default plant week start)
const pad = (n: number, w: number) => String(n).padStart(w, '0');

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  runner = new SolverJobRunner(ctx.dataSource, { pollMs: 100, progressWriteMs: 50 });
  runner.start();
});
afterAll(async () => {
  await runner?.stop();
  await ctx?.close();
});

async function apply(kind: string, content: string | Buffer, name: string) {
  const res = await upload(planner, kind, content, name, { apply: true });
  expect(res.status, JSON.stringify(res.body).slice(0, 800)).toBe(201);
  return res.body.summary;
}

function bomWorkbook(typos: boolean) {
  return xlsx((wb) => {
    const ws = wb.addWorksheet('BOM');
    ws.addRow(['Parent item', 'Part number', 'Qty per unit', 'UoM']);
    for (let p = 1; p <= 10; p += 1) {
      for (let i = 1; i <= 20; i += 1) {
        const m = (p - 1) * 20 + i;
        const code = typos && m === 7 ? 'M-0O7' : `M-${pad(m, 3)}`;
        ws.addRow([`P-${pad(p, 2)}`, code, typos && m === 150 ? -0.1 : 0.1, 'kg']);
      }
    }
  });
}

describe('from files to a plan', () => {
  it('when the master data, a 200-line BOM workbook and a semicolon demand file are imported and their flagged rows fixed, then a plan solves with the data', async () => {
    expect(await apply('work-centers', 'code,name,shifts per day,hours per shift,days per week,shift starts\nASM,Assembly,1,8,5,07:00\n', 'work-centers.csv')).toEqual({ created: 1, updated: 0, unchanged: 0, removed: 0 });
    const materials = ['code,name,unit,unit cost,on hand,lead time weeks', ...Array.from({ length: 200 }, (_, i) => `M-${pad(i + 1, 3)},Material ${i + 1},kg,1.5,1000,0`)].join('\n');
    expect((await apply('materials', materials, 'materials.csv')).created).toBe(200);
    const products = ['code,name,unit,kind,price', ...Array.from({ length: 10 }, (_, i) => `P-${pad(i + 1, 2)},Product ${i + 1},pcs,finished,100`)].join('\n');
    expect((await apply('products', products, 'products.csv')).created).toBe(10);

    // The BOM workbook: two flagged rows first (a letter O for a zero, a negative quantity).
    const before = await tableCounts(ctx.dataSource);
    const flagged = await upload(planner, 'bom', await bomWorkbook(true), 'bom.xlsx');
    expect(flagged.status).toBe(200);
    expect(flagged.body.counts).toEqual({ rows: 200, errorRows: 2 });
    expect(errorLines(flagged.body)).toEqual([
      'row 8 component: There is no product or material with the code M-0O7. Did you mean M-007?',
      'row 151 qtyPer: The quantity per unit must be more than 0.',
    ]);
    expect((await upload(planner, 'bom', await bomWorkbook(true), 'bom.xlsx', { apply: true })).status).toBe(422);
    expect(await tableCounts(ctx.dataSource)).toEqual(before);
    expect(await apply('bom', await bomWorkbook(false), 'bom.xlsx')).toEqual({ created: 200, updated: 0, unchanged: 0, removed: 0 });

    const routings = ['product,sequence,work center,hours per unit', ...Array.from({ length: 10 }, (_, i) => `P-${pad(i + 1, 2)},10,ASM,0.5`)].join('\n');
    expect((await apply('routings', routings, 'routings.csv')).created).toBe(10);

    // Demand with semicolons and decimal commas; one week typed on a Tuesday is flagged, then fixed.
    const demand = (bad: boolean) =>
      [
        'Artikel;Woche;Typ;Auftrag;Menge',
        ...Array.from({ length: 10 }, (_, i) => weeks.map((w, k) => `P-${pad(i + 1, 2)};${bad && i === 0 && k === 0 ? '2027-01-05' : w};forecast;;${i + 1},5`)).flat(),
        `P-01;${weeks[1]};firm;SO-1;3,25`,
      ].join('\n');
    const flaggedDemand = await upload(planner, 'demand', demand(true), 'demand.csv');
    expect(flaggedDemand.body.mapping).toEqual({ product: 'Artikel', weekStart: 'Woche', type: 'Typ', orderRef: 'Auftrag', qty: 'Menge', unit: null });
    expect(errorLines(flaggedDemand.body)).toEqual(['row 2 weekStart: 2027-01-05 is a Tuesday; weeks start on Monday.']);
    expect(await apply('demand', demand(false), 'demand.csv')).toEqual({ created: 41, updated: 0, unchanged: 0, removed: 0 });

    const created = await planner.post('/api/plans').send({ name: 'From spreadsheets', horizonWeeks: 4, firstWeek: weeks[0], wholeUnits: false });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const solve = await planner.post(`/api/plans/${created.body.id}/solve`);
    expect(solve.status).toBe(202);
    expect((await waitForRun(planner, created.body.id, solve.body.runId)).state).toBe('finished');
    const plan = await planner.get(`/api/plans/${created.body.id}`);
    expect(plan.body.solveStatus).toBe('solved');
    const lines = (await planner.get(`/api/plans/${created.body.id}/lines`)).body as Array<{ product: string; weekStart: string; demand: number }>;
    // The plan's demand is the file's: forecast 1,5 for P-01 each week, plus the firm 3,25 in week 2.
    expect(lines.filter((l) => l.product === 'P-01').map((l) => [l.weekStart, l.demand])).toEqual([
      [weeks[0], 1.5],
      [weeks[1], 4.75],
      [weeks[2], 1.5],
      [weeks[3], 1.5],
    ]);
  });
});
