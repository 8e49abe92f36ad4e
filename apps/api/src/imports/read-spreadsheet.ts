import { readCsv } from './read-csv';
import { readXlsx } from './read-xlsx';
import type { SpreadsheetFile } from './spreadsheet-grid';
import { unreadableFile } from './unreadable-file';

export interface OpenedFile {
  file: SpreadsheetFile;
  /** columns (0-based) of a sheet row that continue a merged cell (XLSX only) */
  mergedContinuations(rowNumber: number): Set<number>;
}

const zipSignature = Buffer.from([0x50, 0x4b, 0x03, 0x04]);
const oleSignature = Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]);

/** Opens an upload by its content (not its name): an XLSX workbook is a ZIP package, anything else must be CSV text. */
export async function readSpreadsheet(bytes: Buffer, sheet: string | undefined): Promise<OpenedFile> {
  if (bytes.length === 0) throw unreadableFile('The file is empty.');
  if (bytes.subarray(0, 4).equals(zipSignature)) return readXlsx(bytes, sheet);
  if (bytes.subarray(0, 8).equals(oleSignature)) {
    throw unreadableFile('This is an old-style .xls workbook (or another Office file); save it as XLSX or CSV and upload that.');
  }
  if (sheet !== undefined && sheet !== '') throw unreadableFile('A CSV file has no sheets; leave the sheet empty.');
  return { file: readCsv(bytes), mergedContinuations: () => new Set() };
}
