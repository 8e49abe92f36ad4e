import { Readable } from 'node:stream';
import ExcelJS from 'exceljs';
import { importLimits } from './import-limits';
import type { RawCell, SpreadsheetFile } from './spreadsheet-grid';
import { isBlank } from './spreadsheet-grid';
import { tooLarge, unreadableFile } from './unreadable-file';

const notWorkbook = 'The file could not be read as an XLSX workbook. Save it from your spreadsheet program as XLSX or CSV.';

/**
 * Counts the rows with data of every worksheet with exceljs's streaming reader, which keeps no
 * rows in memory: a workbook over the limits is refused before it is loaded in full.
 */
async function countRows(bytes: Buffer): Promise<void> {
  const reader = new ExcelJS.stream.xlsx.WorkbookReader(Readable.from([bytes]), {
    entries: 'emit',
    sharedStrings: 'ignore',
    hyperlinks: 'ignore',
    styles: 'ignore',
    worksheets: 'emit',
  } as ExcelJS.stream.xlsx.WorkbookStreamReaderOptions);
  let total = 0;
  for await (const worksheet of reader) {
    let rows = 0;
    for await (const row of worksheet as AsyncIterable<ExcelJS.Row>) {
      if (!row.hasValues) continue;
      rows += 1;
      total += 1;
      if (row.cellCount > importLimits.maxColumns) {
        throw tooLarge(`Row ${row.number} of a worksheet has ${row.cellCount} columns; an import takes at most ${importLimits.maxColumns}.`);
      }
      if (rows > importLimits.maxRows + importLimits.headerSearchRows) {
        throw tooLarge(
          `A worksheet of the file has more than ${importLimits.maxRows.toLocaleString('en')} rows; an import takes at most ${importLimits.maxRows.toLocaleString('en')}. Split it into several files.`,
        );
      }
      if (total > importLimits.maxWorkbookRows) {
        throw tooLarge(`The workbook has more than ${importLimits.maxWorkbookRows.toLocaleString('en')} rows over all its sheets; keep only the sheet to import.`);
      }
    }
  }
}

/** A cell's value as our reader sees it: formulas give their cached result, rich text its plain text. */
export function rawCell(value: ExcelJS.CellValue): RawCell {
  if (value === null || value === undefined) return null;
  if (typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean') return value;
  if (value instanceof Date) return value;
  if (typeof value === 'object') {
    if ('richText' in value) return value.richText.map((r) => r.text).join('');
    if ('formula' in value || 'sharedFormula' in value) {
      const result = (value as ExcelJS.CellFormulaValue).result;
      if (result === undefined || result === null) return { error: 'a formula without a saved result (open and save the file in a spreadsheet program)' };
      return rawCell(result as ExcelJS.CellValue);
    }
    if ('error' in value) return { error: String((value as ExcelJS.CellErrorValue).error) };
    if ('text' in value) return rawCell((value as ExcelJS.CellHyperlinkValue).text);
  }
  return String(value);
}

function sheetGrid(worksheet: ExcelJS.Worksheet): SpreadsheetFile['grid'] {
  const rows: RawCell[][] = [];
  const rowNumbers: number[] = [];
  const width = Math.min(worksheet.columnCount, importLimits.maxColumns);
  worksheet.eachRow({ includeEmpty: false }, (row, rowNumber) => {
    const cells: RawCell[] = [];
    for (let c = 1; c <= width; c += 1) {
      // A merged cell reads as its master's value (a parent code merged down its BOM lines).
      cells.push(rawCell(row.getCell(c).value));
    }
    if (cells.every(isBlank)) return; // rows that only carry formatting
    rows.push(cells);
    rowNumbers.push(rowNumber);
  });
  return { rows, rowNumbers };
}

/** Merged header cells: a title spanning several columns names the first; the others get "(2)", "(3)". */
export function mergedSlaves(worksheet: ExcelJS.Worksheet, rowNumber: number): Set<number> {
  const slaves = new Set<number>();
  const width = Math.min(worksheet.columnCount, importLimits.maxColumns);
  const row = worksheet.getRow(rowNumber);
  for (let c = 1; c <= width; c += 1) {
    const cell = row.getCell(c);
    if (cell.isMerged && cell.master.address !== cell.address && cell.master.row === cell.row) slaves.add(c - 1);
  }
  return slaves;
}

export interface XlsxWorkbook {
  file: SpreadsheetFile;
  /** columns (0-based) of a row that continue a merged cell to their left */
  mergedContinuations(rowNumber: number): Set<number>;
}

/**
 * Reads one worksheet of an XLSX workbook: the one named, else the first with data. Formula
 * cells give their cached results, dates come as dates, merged cells repeat their value, rows
 * that hold nothing (trailing formatted rows) are dropped.
 */
export async function readXlsx(bytes: Buffer, sheetName: string | undefined): Promise<XlsxWorkbook> {
  try {
    await countRows(bytes);
  } catch (err) {
    if ((err as { status?: number }).status) throw err;
    throw unreadableFile(notWorkbook);
  }
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(bytes as unknown as ArrayBuffer);
  } catch {
    throw unreadableFile(notWorkbook);
  }
  const sheets = workbook.worksheets.filter((w) => w.state !== 'veryHidden');
  const names = sheets.map((w) => w.name);
  if (sheets.length === 0) throw unreadableFile('The workbook has no worksheets.');
  let worksheet: ExcelJS.Worksheet | undefined;
  if (sheetName !== undefined) {
    worksheet = sheets.find((w) => w.name === sheetName) ?? sheets.find((w) => w.name.toLowerCase() === sheetName.trim().toLowerCase());
    if (!worksheet) throw unreadableFile(`The workbook has no sheet named "${sheetName}"; its sheets are ${names.map((n) => `"${n}"`).join(', ')}.`);
  } else {
    worksheet = sheets.find((w) => w.actualRowCount > 0) ?? sheets[0];
  }
  const chosen = worksheet;
  return {
    file: { format: 'xlsx', sheetNames: names, sheet: chosen.name, delimiter: null, grid: sheetGrid(chosen) },
    mergedContinuations: (rowNumber) => mergedSlaves(chosen, rowNumber),
  };
}
