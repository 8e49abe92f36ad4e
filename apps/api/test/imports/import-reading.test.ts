import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importPreviewSchema, type ImportPreview } from '@millrace/contracts';
import { createMaterial, createProduct } from '../support/master-data';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { errorLines, tableCounts, upload, xlsx } from './import-support';

/**
 * Issue 7, "Reading real-world files": CSV dialects and XLSX layouts, each previewed through the
 * real endpoint. Fixtures are written here: CSV strings, XLSX by exceljs, and (when the machine
 * has it) XLSX converted from CSV by LibreOffice in headless mode, a producer that is not ours.
 * A preview never writes: the row counts stay as they were.
 */
let ctx: TestContext;
let planner: TestAgent;
let before: Record<string, number>;

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  await createProduct(planner, { code: 'TABLE-1', name: 'Oak table' });
  await createProduct(planner, { code: 'LEG-1', name: 'Table leg', kind: 'subassembly' });
  await createProduct(planner, { code: 'TOP-1', name: 'Table top', kind: 'subassembly' });
  await createMaterial(planner, { code: 'OAK-BOARD', unit: 'm2' });
  await createMaterial(planner, { code: 'SCREW', unit: 'pcs' });
  before = await tableCounts(ctx.dataSource);
});
afterAll(async () => {
  if (ctx) expect(await tableCounts(ctx.dataSource)).toEqual(before);
  await ctx?.close();
});

async function preview(kind: string, content: string | Buffer, name: string, options: Parameters<typeof upload>[4] = {}): Promise<ImportPreview> {
  const res = await upload(planner, kind, content, name, options);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return importPreviewSchema.parse(res.body);
}

const values = (p: ImportPreview) => p.rows.map((r) => r.values);

describe('CSV files', () => {
  it('when a file is comma-delimited with a byte-order mark and a quoted name holding a comma and a line break, then the fields come out whole', async () => {
    const p = await preview('products', '\ufeffcode,name,unit,kind,price\r\nCHAIR-1,"Chair, oak\nwith arms",pcs,finished,49.9\r\n', 'products.csv');
    expect(p.delimiter).toBe(',');
    expect(p.columns).toEqual(['code', 'name', 'unit', 'kind', 'price']);
    expect(values(p)).toEqual([{ code: 'CHAIR-1', name: 'Chair, oak\nwith arms', unit: 'pcs', kind: 'finished', price: '49.9' }]);
    expect(errorLines(p)).toEqual([]);
    expect(p.summary).toEqual({ created: 1, updated: 0, unchanged: 0, removed: 0 });
  });

  it('when a file is semicolon-delimited with decimal commas and German-style dates, then every quantity and week reads right', async () => {
    const csv = 'Artikel;Week;Type;Order;Menge\nTABLE-1;2026-03-02;firm;SO-1;1,5\nTABLE-1;02.03.2026;forecast;;1.234,5\nLEG-1;09.03.2026;Forecast;;"2,25"\n';
    const p = await preview('demand', csv, 'demand.csv');
    expect(p.delimiter).toBe(';');
    expect(p.mapping).toEqual({ product: 'Artikel', weekStart: 'Week', type: 'Type', orderRef: 'Order', qty: 'Menge', unit: null });
    expect(errorLines(p)).toEqual([]);
    expect(p.rows.map((r) => r.outcome)).toEqual(['create', 'create', 'create']);
  });

  it('when a title line and an empty line stand above the table, then the header row is found below them', async () => {
    const p = await preview('bom', 'Bill of materials, exported 2026-03-01\n\nparent,component,qty per unit\nTABLE-1,LEG-1,4\n', 'bom.csv');
    expect(p.headerRow).toBe(3);
    expect(values(p)).toEqual([{ parent: 'TABLE-1', component: 'LEG-1', qtyPer: '4' }]);
  });

  it('when the header row is given, then that row is used even if another looks more like a header', async () => {
    const p = await preview('bom', 'parent,component,qty\nA,B,C\nTABLE-1,LEG-1,4\n', 'bom.csv', { headerRow: 2, mapping: { parent: 'A', component: 'B', qtyPer: 'C' } });
    expect(p.headerRow).toBe(2);
    expect(p.mappingSource).toBe('sent');
    expect(values(p)).toEqual([{ parent: 'TABLE-1', component: 'LEG-1', qtyPer: '4' }]);
  });

  it('when the file is Windows-1252 text (an older export), then accented names read right', async () => {
    const bytes = Buffer.from('code;name;unit;kind\nCHAIR-2;Fauteuil tress\xe9;pcs;finished\n', 'latin1');
    const p = await preview('products', bytes, 'products.csv');
    expect(values(p)[0].name).toBe('Fauteuil tressé');
  });
});

describe('XLSX files written by exceljs', () => {
  it('when the table is on the second sheet, then the first sheet with data is read unless the sheet is chosen', async () => {
    const file = await xlsx((wb) => {
      const notes = wb.addWorksheet('Notes');
      notes.addRow(['These are my notes']);
      notes.addRow(['Ask purchasing about oak prices']);
      const bom = wb.addWorksheet('BOM');
      bom.addRow(['parent', 'component', 'qty']);
      bom.addRow(['TABLE-1', 'LEG-1', 4]);
    });
    const first = await preview('bom', file, 'bom.xlsx');
    expect(first.sheets).toEqual(['Notes', 'BOM']);
    expect(first.sheet).toBe('Notes');
    expect(first.fileErrors).toEqual(['Choose the column that holds parent (it is required).', 'Choose the column that holds component (it is required).', 'Choose the column that holds quantity per (it is required).']);
    const chosen = await preview('bom', file, 'bom.xlsx', { sheet: 'BOM' });
    expect(chosen.sheet).toBe('BOM');
    expect(chosen.fileErrors).toEqual([]);
    expect(values(chosen)).toEqual([{ parent: 'TABLE-1', component: 'LEG-1', qtyPer: '4' }]);
  });

  it('when a merged title sits above a merged header, formulas give quantities, a parent is merged down its lines and empty rows trail, then the rows read as meant', async () => {
    const file = await xlsx((wb) => {
      const ws = wb.addWorksheet('Structure');
      ws.getCell('A1').value = 'Bill of materials — oak table';
      ws.mergeCells('A1:D1');
      ws.getCell('A3').value = 'parent';
      ws.getCell('B3').value = 'component';
      ws.getCell('C3').value = 'quantity per';
      ws.mergeCells('C3:D3'); // the quantity title spans the value and a note column
      ws.getCell('A4').value = 'TABLE-1';
      ws.mergeCells('A4:A6');
      ws.getCell('B4').value = 'LEG-1';
      ws.getCell('C4').value = { formula: '2*2', result: 4 };
      ws.getCell('B5').value = 'TOP-1';
      ws.getCell('C5').value = 1;
      ws.getCell('B6').value = 'SCREW';
      ws.getCell('C6').value = { formula: 'C4*4', result: 16 };
      ws.getCell('D6').value = 'four per leg';
      for (let r = 7; r <= 40; r += 1) ws.getRow(r).getCell(1).style = { font: { bold: true } }; // formatted, empty
      ws.getCell('B41').value = '   ';
    });
    const p = await preview('bom', file, 'bom.xlsx');
    expect(p.headerRow).toBe(3);
    expect(p.columns).toEqual(['parent', 'component', 'quantity per', 'quantity per (2)']);
    expect(values(p)).toEqual([
      { parent: 'TABLE-1', component: 'LEG-1', qtyPer: '4' },
      { parent: 'TABLE-1', component: 'TOP-1', qtyPer: '1' },
      { parent: 'TABLE-1', component: 'SCREW', qtyPer: '16' },
    ]);
    expect(p.rows.map((r) => r.rowNumber)).toEqual([4, 5, 6]);
    expect(errorLines(p)).toEqual([]);
  });

  it('when weeks are real dates, serial numbers and text, then all read as the same kind of date', async () => {
    const file = await xlsx((wb) => {
      const ws = wb.addWorksheet('Demand');
      ws.addRow(['product', 'week start', 'type', 'order reference', 'quantity']);
      ws.addRow(['TABLE-1', new Date(Date.UTC(2026, 2, 2)), 'firm', 'SO-7', 3]);
      ws.addRow(['TABLE-1', 46090, 'forecast', null, 5]); // serial 46090 = 2026-03-09 (1900 date system)
      ws.addRow(['LEG-1', '2026-03-16', 'forecast', null, 2.5]);
      ws.addRow(['LEG-1', '23.03.2026', 'forecast', null, '1,5']);
    });
    const p = await preview('demand', file, 'demand.xlsx');
    expect(values(p).map((v) => v.weekStart)).toEqual(['2026-03-02', '46090', '2026-03-16', '23.03.2026']);
    expect(errorLines(p)).toEqual([]);
    expect(p.summary.created).toBe(4);
  });

  it('when a formula has no saved result or shows an error, then that cell is flagged', async () => {
    const file = await xlsx((wb) => {
      const ws = wb.addWorksheet('BOM');
      ws.addRow(['parent', 'component', 'qty']);
      ws.addRow(['TABLE-1', 'LEG-1', { formula: '1/0', result: { error: '#DIV/0!' } }]);
      ws.addRow(['TABLE-1', 'TOP-1', { formula: 'Z99*2' }]);
    });
    const p = await preview('bom', file, 'bom.xlsx');
    expect(errorLines(p)).toEqual([
      'row 2 qtyPer: The spreadsheet shows #DIV/0! here instead of a value.',
      'row 3 qtyPer: The spreadsheet shows a formula without a saved result (open and save the file in a spreadsheet program) here instead of a value.',
    ]);
  });
});

const soffice = ['soffice', 'libreoffice'].find((cmd) => spawnSync('which', [cmd]).status === 0);

describe('XLSX converted from CSV by LibreOffice (headless)', () => {
  it.skipIf(!soffice)('when LibreOffice writes the workbook, then its dates, numbers and text read back as the CSV said', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'millrace-lo-'));
    try {
      writeFileSync(join(dir, 'demand.csv'), 'product,week start,type,order reference,quantity\nTABLE-1,2026-03-02,firm,SO-9,12.5\nLEG-1,2024-01-01,forecast,,7\n');
      // A private profile directory, so a running LibreOffice (or another test) is not disturbed.
      execFileSync(soffice!, [`-env:UserInstallation=file://${dir}/profile`, '--headless', '--convert-to', 'xlsx', '--outdir', dir, join(dir, 'demand.csv')], { timeout: 120_000, stdio: 'pipe' });
      const file = readFileSync(join(dir, 'demand.xlsx'));
      const p = await preview('demand', file, 'demand.xlsx');
      expect(p.format).toBe('xlsx');
      expect(p.columns).toEqual(['product', 'week start', 'type', 'order reference', 'quantity']);
      // LibreOffice stores the dates as date serials; 2024-01-01 is serial 45292 in its own arithmetic.
      expect(values(p)).toEqual([
        { product: 'TABLE-1', weekStart: '2026-03-02', type: 'firm', orderRef: 'SO-9', qty: '12.5', unit: null },
        { product: 'LEG-1', weekStart: '2024-01-01', type: 'forecast', orderRef: null, qty: '7', unit: null },
      ].map(({ unit: _u, ...v }) => v));
      expect(errorLines(p)).toEqual([]);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
  if (!soffice) console.log('LibreOffice (soffice) is not installed: the third-party XLSX test is skipped.');
});
