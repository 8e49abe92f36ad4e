import Papa from 'papaparse';
import type { ExportTable } from './export-table';

/**
 * CSV as spreadsheet programs open it: UTF-8 with a byte-order mark, comma delimiter, CRLF line
 * ends, decimal point, fields quoted only when needed; empty for no value.
 */
export function writeCsv(table: ExportTable): Buffer {
  const text = Papa.unparse({ fields: table.columns, data: table.rows.map((r) => r.map((v) => (v === null ? '' : v))) }, { newline: '\r\n' });
  return Buffer.from(`\ufeff${text}\r\n`, 'utf8');
}
