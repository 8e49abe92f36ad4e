import type { EntityManager } from 'typeorm';
import type { ImportKind } from '@millrace/contracts';
import type { ImportRow } from '../import-row';

/** What one kind of import does with its rows. */
export interface ImportKindHandler {
  kind: ImportKind;
  /**
   * Checks every row against the database and the other rows: adds cell errors, sets each
   * row's outcome (create, update, unchanged, error), and returns what a write needs.
   */
  check(db: EntityManager, rows: ImportRow[]): Promise<CheckedImport>;
  /** Puts back what `write` changed; throws ImportConflict when a row was changed since the import. */
  undo(db: EntityManager, entries: unknown[]): Promise<void>;
}

export interface CheckedImport {
  /** lines that lists replaced by the file lose */
  removed: number;
  /** writes the checked rows (inside the caller's transaction); returns what undo needs, as JSON */
  write(db: EntityManager): Promise<UndoData>;
}

/** Restores what an import changed; kept as JSON with the import. */
export type UndoData = { kind: ImportKind; entries: unknown[] };

/** A write or undo that would overwrite someone else's change: its message names the row (→ 409). */
export class ImportConflict extends Error {}

/** "Row 7" / "rows 7, 9" of the file, for messages. */
export function rowRef(rowNumber: number): string {
  return `row ${rowNumber}`;
}
