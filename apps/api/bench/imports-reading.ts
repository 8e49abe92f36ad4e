/**
 * Benchmark: reading spreadsheet uploads without a database — the counting pass and the full
 * read of CSV and XLSX files at the row limit, and the refusal of files over it. Prints the
 * time and the memory each takes (heap and resident set growth, sampled every 5 ms); it asserts
 * nothing. Run with --expose-gc so each case starts from a collected heap:
 *
 *   node --expose-gc --import tsx apps/api/bench/imports-reading.ts
 */
import { performance } from 'node:perf_hooks';
import ExcelJS from 'exceljs';
import { importFields, importMaxRows } from '@millrace/contracts';
import { findHeaderRow, columnTitles, suggestMapping } from '../src/imports/header-mapping';
import { readRows } from '../src/imports/import-row';
import { readSpreadsheet } from '../src/imports/read-spreadsheet';

function csvRows(rows: number, delimiter: string, decimal: string): Buffer {
  const lines = [['parent', 'component', 'qty per unit', 'unit', 'scrap %'].join(delimiter)];
  for (let i = 0; i < rows; i += 1) lines.push(['P-' + (i % 500), 'M-' + i, `0${decimal}25`, 'kg', `1${decimal}5`].join(delimiter));
  return Buffer.from(`\ufeff${lines.join('\r\n')}\r\n`, 'utf8');
}

async function xlsxRows(rows: number): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet('BOM');
  ws.addRow(['parent', 'component', 'qty per unit', 'unit', 'scrap %']);
  for (let i = 0; i < rows; i += 1) ws.addRow(['P-' + (i % 500), 'M-' + i, 0.25, 'kg', 1.5]);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** Reads the file as the import does (open, header, mapping, typed rows); returns rows read or the refusal. */
async function read(bytes: Buffer): Promise<string> {
  try {
    const opened = await readSpreadsheet(bytes, undefined);
    const fields = importFields.bom;
    const header = findHeaderRow(opened.file.grid, fields);
    const columns = columnTitles(opened.file.grid.rows[header], new Set());
    const rows = readRows(opened.file.grid, header, columns, fields, suggestMapping(columns, fields));
    return `${rows.length} rows read`;
  } catch (err) {
    return `refused: ${(err as Error).message.slice(0, 60)}…`;
  }
}

async function measure(name: string, bytes: Buffer): Promise<void> {
  (globalThis as { gc?: () => void }).gc?.();
  const heap0 = process.memoryUsage().heapUsed;
  const rss0 = process.memoryUsage().rss;
  let heapPeak = heap0;
  let rssPeak = rss0;
  const timer = setInterval(() => {
    const m = process.memoryUsage();
    heapPeak = Math.max(heapPeak, m.heapUsed);
    rssPeak = Math.max(rssPeak, m.rss);
  }, 5);
  const t0 = performance.now();
  const outcome = await read(bytes);
  const ms = performance.now() - t0;
  clearInterval(timer);
  const m = process.memoryUsage();
  heapPeak = Math.max(heapPeak, m.heapUsed);
  rssPeak = Math.max(rssPeak, m.rss);
  const mb = (n: number) => (n / 1024 / 1024).toFixed(0).padStart(5);
  console.log(`${name.padEnd(44)} ${mb(bytes.length)} MB file ${ms.toFixed(0).padStart(7)} ms  heap +${mb(heapPeak - heap0)} MB  rss +${mb(rssPeak - rss0)} MB  ${outcome}`);
}

async function main(): Promise<void> {
  console.log(`row limit ${importMaxRows.toLocaleString('en')}; gc between cases: ${typeof (globalThis as { gc?: unknown }).gc === 'function' ? 'yes' : 'no (run with --expose-gc)'}`);
  await measure('CSV, 50,000 rows, comma, decimal point', csvRows(importMaxRows, ',', '.'));
  await measure('CSV, 50,000 rows, semicolon, decimal comma', csvRows(importMaxRows, ';', ','));
  await measure('CSV, 100,000 rows (over the limit)', csvRows(100_000, ',', '.'));
  await measure('CSV, 400,000 rows, 9.9 MB (over the limit)', csvRows(400_000, ',', '.'));
  await measure('XLSX, 50,000 rows', await xlsxRows(importMaxRows));
  await measure('XLSX, 100,000 rows (over the limit)', await xlsxRows(100_000));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
