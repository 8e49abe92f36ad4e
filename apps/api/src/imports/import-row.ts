import type { ImportCellError, ImportFieldDef, ImportMapping, ImportRowOutcome } from '@millrace/contracts';
import { readCell } from './cell-values';
import { cellText, type SheetGrid } from './spreadsheet-grid';

export type FieldValue = string | number | boolean;

/** One data row of a file, read through the mapping. */
export interface ImportRow {
  rowNumber: number;
  /** the cell text per field (for the preview) */
  values: Record<string, string | null>;
  /** the typed value per field; a field that is not mapped, or empty, is absent */
  data: Record<string, FieldValue>;
  errors: ImportCellError[];
  outcome: ImportRowOutcome;
}

export function addError(row: ImportRow, field: string, message: string): void {
  row.errors.push({ field, message });
  row.outcome = 'error';
}

export function hasErrors(row: ImportRow): boolean {
  return row.errors.length > 0;
}

/** The data rows below the header, each cell read as its field's type; empty required cells are errors. */
export function readRows(grid: SheetGrid, headerIndex: number, columns: string[], fields: readonly ImportFieldDef[], mapping: ImportMapping): ImportRow[] {
  const columnIndex = new Map(columns.map((c, i) => [c, i]));
  const rows: ImportRow[] = [];
  for (let r = headerIndex + 1; r < grid.rows.length; r += 1) {
    const cells = grid.rows[r];
    const row: ImportRow = { rowNumber: grid.rowNumbers[r], values: {}, data: {}, errors: [], outcome: 'create' };
    for (const field of fields) {
      const column = mapping[field.key];
      if (!column) continue;
      const cell = cells[columnIndex.get(column) ?? -1] ?? null;
      row.values[field.key] = cellText(cell);
      const reading = readCell(field, cell);
      if (reading.outcome === 'value') row.data[field.key] = reading.value;
      else if (reading.outcome === 'invalid') addError(row, field.key, reading.message);
      else if (field.required) addError(row, field.key, `Enter the ${field.label}.`);
    }
    rows.push(row);
  }
  return rows;
}
