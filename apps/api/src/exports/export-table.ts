/** A table to write as CSV or XLSX: titles, then rows of plain values. */
export interface ExportTable {
  /** worksheet name */
  name: string;
  columns: string[];
  rows: Array<Array<string | number | null>>;
}
