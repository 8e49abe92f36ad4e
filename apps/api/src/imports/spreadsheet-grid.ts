import type { FileFormat } from '@millrace/contracts';

/** A cell as read from a file: text from CSV; typed values from XLSX (formula cells give their cached result). */
export type RawCell = string | number | boolean | Date | { error: string } | null;

/** One worksheet (or the one table of a CSV file) as rows of cells. */
export interface SheetGrid {
  /** rows with at least one filled cell, in file order */
  rows: RawCell[][];
  /** the 1-based row number of each row as a spreadsheet program shows it */
  rowNumbers: number[];
}

/** A file read into grids: one for CSV, one per worksheet for XLSX. */
export interface SpreadsheetFile {
  format: FileFormat;
  /** worksheet names (XLSX), empty for CSV */
  sheetNames: string[];
  /** the sheet read */
  sheet: string | null;
  /** CSV only */
  delimiter: string | null;
  grid: SheetGrid;
}

/** True when a cell holds nothing (empty or blank text). */
export function isBlank(cell: RawCell): boolean {
  return cell === null || (typeof cell === 'string' && cell.trim() === '');
}

/** The cell as the text shown in the preview. */
export function cellText(cell: RawCell): string | null {
  if (cell === null) return null;
  if (typeof cell === 'string') return cell;
  if (typeof cell === 'number') return String(cell);
  if (typeof cell === 'boolean') return cell ? 'TRUE' : 'FALSE';
  if (cell instanceof Date) return Number.isNaN(cell.getTime()) ? null : cell.toISOString().slice(0, 10);
  return cell.error;
}
