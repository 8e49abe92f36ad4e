import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import type { ImportKind } from '@millrace/contracts';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { waitForRun } from '../support/plan-runs';
import { FIRST_WEEK, seedSmallPlant } from '../support/small-plant';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { masterDataSnapshot } from './db-snapshot';
import { upload } from './import-support';

/**
 * Issue 7, "Exports … which import back unchanged" and "Round trip: export → import gives
 * identical database state": the small plant is exported kind by kind, as CSV and as XLSX, and
 * imported into an empty database in dependency order; both databases then hold the same rows.
 * Importing the exports into the source database changes nothing (every row unchanged). Plan
 * lines and material calls are exported from a solved plan and compared with the stored results.
 */
const order: ImportKind[] = ['work-centers', 'materials', 'products', 'receipts', 'bom', 'routings', 'demand'];

let source: TestContext;
let planner: TestAgent;
let runner: SolverJobRunner;

function binary(req: ReturnType<TestAgent['get']>) {
  return req.buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
}

async function exportOf(agent: TestAgent, kind: string, format: 'csv' | 'xlsx', plan?: number): Promise<Buffer> {
  const res = await binary(agent.get(`/api/exports/${kind}?format=${format}${plan ? `&plan=${plan}` : ''}`));
  expect(res.status, String(res.body)).toBe(200);
  return res.body as Buffer;
}

beforeAll(async () => {
  source = await createTestContext();
  planner = await source.agentFor('planner');
  await seedSmallPlant(planner);
  // Values the small plant leaves at defaults: a receipt, a family, a lot rule, a decimal with many places.
  const imported = await upload(planner, 'receipts', 'material,week start,quantity,reference\nOAK,2027-01-11,40,PO-77\nFIT,2027-01-18,25.5,\n', 'receipts.csv', { apply: true });
  expect(imported.status, JSON.stringify(imported.body)).toBe(201);
  // A name a spreadsheet would run as a formula (it must come back as text, see the CSV guard).
  const products = await upload(planner, 'products', 'code,family,safety stock,name\nBEN,seating,2.125,=1+2 bench\n', 'products.csv', { apply: true });
  expect(products.status, JSON.stringify(products.body)).toBe(201);
  const materials = await upload(planner, 'materials', 'code,lot rule,lot size,weekly supply cap\nFIT,fixed_order_quantity,50,\n', 'materials.csv', { apply: true });
  expect(materials.status, JSON.stringify(materials.body)).toBe(201);
  runner = new SolverJobRunner(source.dataSource, { pollMs: 100, progressWriteMs: 50 });
  runner.start();
});
afterAll(async () => {
  await runner?.stop();
  await source?.close();
});

describe.each(['csv', 'xlsx'] as const)('round trip through %s', (format) => {
  it(`when every kind is exported as ${format} and imported into an empty database, then both databases hold the same master data and demand`, async () => {
    const target = await createTestContext();
    try {
      const targetPlanner = await target.agentFor('planner');
      for (const kind of order) {
        const file = await exportOf(planner, kind, format);
        const res = await upload(targetPlanner, kind, file, `${kind}.${format}`, { apply: true });
        expect(res.status, `${kind}: ${JSON.stringify(res.body).slice(0, 600)}`).toBe(201);
        expect(res.body.summary.updated + res.body.summary.unchanged, kind).toBe(0);
      }
      const [a, b] = [await masterDataSnapshot(source.dataSource), await masterDataSnapshot(target.dataSource)];
      expect(a.bom.length).toBeGreaterThan(0);
      expect(a.receipts.length).toBe(2);
      expect(b).toEqual(a);
    } finally {
      await target.close();
    }
  });

  it(`when the ${format} exports are imported back into their own database, then every row is unchanged and no version moves`, async () => {
    const before = await masterDataSnapshot(source.dataSource, { withVersions: true });
    for (const kind of order) {
      const file = await exportOf(planner, kind, format);
      const res = await upload(planner, kind, file, `${kind}.${format}`, { apply: true });
      expect(res.status, kind).toBe(201);
      expect(res.body.summary, kind).toEqual({ created: 0, updated: 0, unchanged: res.body.run.rows, removed: 0 });
    }
    expect(await masterDataSnapshot(source.dataSource, { withVersions: true })).toEqual(before);
  });
});

describe('CSV guard', () => {
  it('when a text starts like a formula, then the CSV export writes it behind an apostrophe and the import reads it without', async () => {
    // CSV injection: OWASP, "CSV Injection" (cells starting with = + - @ run as formulas).
    const csv = (await exportOf(planner, 'products', 'csv')).toString('utf8');
    expect(csv).toContain(",'=1+2 bench,");
    const res = await upload(planner, 'products', Buffer.from(csv), 'products.csv');
    expect(res.body.rows.find((r: { values: { code: string } }) => r.values.code === 'BEN').outcome).toBe('unchanged');
  });
});

describe('plan exports', () => {
  let planId: number;

  beforeAll(async () => {
    const created = await planner.post('/api/plans').send({ name: 'Export check', horizonWeeks: 4, firstWeek: FIRST_WEEK, wholeUnits: false });
    expect(created.status).toBe(201);
    planId = created.body.id;
    const solve = await planner.post(`/api/plans/${planId}/solve`);
    expect(solve.status).toBe(202);
    expect((await waitForRun(planner, planId, solve.body.runId)).state).toBe('finished');
  });

  it('when plan lines are exported as CSV and XLSX, then both hold exactly the stored lines', async () => {
    const lines = (await planner.get(`/api/plans/${planId}/lines`)).body as Array<Record<string, unknown>>;
    expect(lines.length).toBeGreaterThan(0);
    const expected = lines.map((l) => [l.product, l.productName, l.week, l.weekStart, l.demand, l.make, l.ship, l.stock, l.late]);

    const csv = Papa.parse<string[]>((await exportOf(planner, 'plan-lines', 'csv', planId)).toString('utf8').replace(/^\ufeff/, ''), { skipEmptyLines: true }).data;
    expect(csv[0]).toEqual(['product', 'product name', 'week', 'week start', 'demand', 'make', 'ship', 'stock', 'late']);
    // Texts that start like a formula carry the CSV guard's apostrophe (BEN is named "=1+2 bench").
    const unguard = (cell: string) => cell.replace(/^'(?=[=+\-@])/, '');
    expect(csv.slice(1).map((r) => r.map(unguard))).toEqual(expected.map((r) => r.map(String)));
    expect(csv.some((r) => r[1] === "'=1+2 bench")).toBe(true);

    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await exportOf(planner, 'plan-lines', 'xlsx', planId)) as unknown as ArrayBuffer);
    const rows: unknown[][] = [];
    wb.worksheets[0].eachRow((row) => rows.push((row.values as unknown[]).slice(1)));
    expect(rows.slice(1)).toEqual(expected);
  });

  it('when material calls are exported, then they hold the stored calls', async () => {
    const calls = (await planner.get(`/api/plans/${planId}/material-calls`)).body as Array<Record<string, unknown>>;
    const csv = Papa.parse<string[]>((await exportOf(planner, 'material-calls', 'csv', planId)).toString('utf8').replace(/^\ufeff/, ''), { skipEmptyLines: true }).data;
    expect(csv.length - 1).toBe(calls.length);
    expect(csv.slice(1).map((r) => [r[0], r[4], Number(r[9])])).toEqual(calls.map((c) => [c.material, c.weekStart, c.plannedReceipt]));
  });

  it('when a plan export names no plan or an unsolved plan, then it says why', async () => {
    const none = await planner.get('/api/exports/plan-lines?format=csv');
    expect(none.status).toBe(400);
    expect(none.body.error.message).toBe('Say which plan version to export.');
    const draft = await planner.post('/api/plans').send({ name: 'Unsolved', horizonWeeks: 4, firstWeek: FIRST_WEEK });
    const res = await planner.get(`/api/exports/material-calls?format=xlsx&plan=${draft.body.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(`Plan version ${draft.body.id} has no results to show: its solve status is not_solved.`);
  });
});
