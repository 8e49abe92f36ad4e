import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importMaxFileBytes, importMaxRows } from '@millrace/contracts';
import { createProduct } from '../support/master-data';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { tableCounts, upload, xlsx } from './import-support';

/**
 * Issue 7, "Bad input": every bad upload gets one clear message naming what is wrong, both for
 * the preview and for apply; nothing is written (row counts unchanged) and the server keeps
 * answering afterwards.
 */
let ctx: TestContext;
let planner: TestAgent;
let before: Record<string, number>;

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  await createProduct(planner, { code: 'TABLE-1' });
  await createProduct(planner, { code: 'LEG-1', kind: 'subassembly' });
  before = await tableCounts(ctx.dataSource);
});
afterAll(async () => ctx?.close());

/** Previews and applies the file; both must fail with `status` and `message`; nothing may change. */
async function refused(content: string | Buffer, fileName: string, status: number, message: string, options: Parameters<typeof upload>[4] = {}) {
  for (const apply of [false, true]) {
    const res = await upload(planner, 'bom', content, fileName, { ...options, apply });
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    expect(res.body.error.message).toBe(message);
  }
  expect(await tableCounts(ctx.dataSource)).toEqual(before);
}

/** A fixed pseudo-random byte stream (xorshift32), so the garbage is the same on every run. */
function garbage(length: number): Buffer {
  const bytes = Buffer.alloc(length);
  let x = 2463534242;
  for (let i = 0; i < length; i += 1) {
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    bytes[i] = x & 0xff;
  }
  return bytes;
}

describe('bad uploads', () => {
  it('when the file is binary garbage, then it is refused as neither CSV nor XLSX', async () => {
    await refused(garbage(4096), 'bom.csv', 400, 'The file is neither a CSV text file nor an XLSX workbook: it holds binary data. Save it from your spreadsheet program as CSV or XLSX.');
  });

  it('when garbage starts like a ZIP package, then it is refused as not an XLSX workbook', async () => {
    await refused(Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), garbage(2000)]), 'bom.xlsx', 400, 'The file could not be read as an XLSX workbook. Save it from your spreadsheet program as XLSX or CSV.');
  });

  it('when the file is empty, then it says so', async () => {
    await refused(Buffer.alloc(0), 'bom.csv', 400, 'The file is empty.');
    await refused(' \r\n\r\n', 'bom.csv', 400, 'The file is empty.');
  });

  it('when the file has only a header row, then it says there are no data rows', async () => {
    await refused('parent,component,qty\r\n', 'bom.csv', 400, 'The file has a header row (row 1) but no data rows below it.');
    const book = await xlsx((wb) => wb.addWorksheet('BOM').addRow(['parent', 'component', 'qty']));
    await refused(book, 'bom.xlsx', 400, 'The sheet "BOM" has a header row (row 1) but no data rows below it.');
  });

  it('when the sheet named does not exist, then the sheets of the workbook are listed', async () => {
    const book = await xlsx((wb) => {
      const ws = wb.addWorksheet('BOM');
      ws.addRow(['parent', 'component', 'qty']);
      ws.addRow(['TABLE-1', 'LEG-1', 4]);
      wb.addWorksheet('Notes').addRow(['x']);
    });
    await refused(book, 'bom.xlsx', 400, 'The workbook has no sheet named "Parts"; its sheets are "BOM", "Notes".', { sheet: 'Parts' });
  });

  it('when the wrong sheet is chosen, then applying it is refused for the missing columns', async () => {
    const book = await xlsx((wb) => {
      const ws = wb.addWorksheet('Prices');
      ws.addRow(['item', 'price']);
      ws.addRow(['TABLE-1', 120]);
    });
    const res = await upload(planner, 'bom', book, 'bom.xlsx', { apply: true });
    expect(res.status).toBe(422);
    // "item" is a usual title of a component, so only parent and quantity are missing.
    expect(res.body.error.message).toBe('The mapping is not complete; nothing was imported. Choose the column that holds parent (it is required).');
    expect(res.body.error.issues).toEqual([
      { item: 'mapping', message: 'Choose the column that holds parent (it is required).' },
      { item: 'mapping', message: 'Choose the column that holds quantity per (it is required).' },
    ]);
    expect(await tableCounts(ctx.dataSource)).toEqual(before);
  });

  it('when the file has 100,000 rows, then it is refused for its size before being read in full', async () => {
    const lines = ['parent,component,qty'];
    for (let i = 0; i < 100_000; i += 1) lines.push(`TABLE-1,LEG-${i},1`);
    const csv = `${lines.join('\n')}\n`;
    expect(csv.length).toBeLessThan(importMaxFileBytes); // refused for its rows, not its bytes
    const rowsMessage = `The file has more than ${importMaxRows.toLocaleString('en')} rows; an import takes at most ${importMaxRows.toLocaleString('en')}. Split it into several files.`;
    expect(rowsMessage).toBe('The file has more than 50,000 rows; an import takes at most 50,000. Split it into several files.');
    await refused(csv, 'bom.csv', 413, rowsMessage);
  });

  it('when an XLSX sheet has 100,000 rows, then it is refused by the counting pass', async () => {
    const book = await xlsx((wb) => {
      const ws = wb.addWorksheet('BOM');
      ws.addRow(['parent', 'component', 'qty']);
      for (let i = 0; i < 100_000; i += 1) ws.addRow(['TABLE-1', `LEG-${i}`, 1]);
    });
    await refused(book, 'bom.xlsx', 413, 'A worksheet of the file has more than 50,000 rows; an import takes at most 50,000. Split it into several files.');
  });

  it('when the file is over 10 MB, then 413 names the limit', async () => {
    const big = Buffer.alloc(importMaxFileBytes + 1, 'a');
    await refused(big, 'bom.csv', 413, 'The file is larger than the 10 MB limit; split it or remove unused sheets.');
  });

  it('when the file name has path characters, then it is refused naming them', async () => {
    await refused('parent,component,qty\nTABLE-1,LEG-1,4\n', '../../etc/bom.csv', 400, 'The file name "../../etc/bom.csv" contains path characters (/, \\, .. or a drive); upload it under a plain name such as bom.xlsx.');
    await refused('parent,component,qty\nTABLE-1,LEG-1,4\n', 'C:bom.csv', 400, 'The file name "C:bom.csv" contains path characters (/, \\, .. or a drive); upload it under a plain name such as bom.xlsx.');
  });

  it('when no file is attached, then it asks for one', async () => {
    const res = await planner.post('/api/imports/bom').field('sheet', '');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe('Attach a CSV or XLSX file in the form field "file".');
  });

  it('when the kind is unknown, then 400 lists the kinds', async () => {
    const res = await upload(planner, 'prices', 'a,b\n1,2\n', 'x.csv');
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('params.kind');
  });

  it('when a quoted field is never closed, then the row is named', async () => {
    await refused('parent,component,qty\nTABLE-1,"LEG-1,4\n', 'bom.csv', 400, 'Row 2 opens a quoted field that is never closed; check the quotation marks in the file.');
  });

  it('after all of that, then the server still answers and a good file still previews', async () => {
    expect((await planner.get('/api/health')).status).toBe(200);
    const res = await upload(planner, 'bom', 'parent,component,qty\nTABLE-1,LEG-1,4\n', 'bom.csv');
    expect(res.status).toBe(200);
    expect(res.body.summary).toEqual({ created: 1, updated: 0, unchanged: 0, removed: 0 });
  });
});
