import Papa from 'papaparse';
import type { ExportTable } from './export-table';

/**
 * Text that a spreadsheet program would run as a formula (= + - @, tab, carriage return first)
 * gets a leading apostrophe, the usual guard against CSV injection (OWASP, "CSV Injection");
 * the import drops it again, so the round trip keeps the text.
 */
export function guardFormula(value: string): string {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

/**
 * CSV as spreadsheet programs open it: UTF-8 with a byte-order mark, comma delimiter, CRLF line
 * ends, decimal point, fields quoted only when needed; empty for no value.
 */
export function writeCsv(table: ExportTable): Buffer {
  const text = Papa.unparse({ fields: table.columns, data: table.rows.map((r) => r.map((v) => (v === null ? '' : typeof v === 'string' ? guardFormula(v) : v))) }, { newline: '\r\n' });
  return Buffer.from(`\ufeff${text}\r\n`, 'utf8');
}
