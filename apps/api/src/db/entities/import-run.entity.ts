import { EntitySchema } from 'typeorm';
import type { FileFormat, ImportKind, ImportRunState } from '@millrace/contracts';

/** One applied import with its original file. Table `import_run`. */
export interface ImportRunRow {
  id: number;
  kind: ImportKind;
  fileName: string;
  fileFormat: FileFormat;
  fileBytes: number;
  fileContent: Buffer;
  sheet: string | null;
  headerRow: number;
  /** JSON of the mapping used */
  mapping: string;
  rowCount: number;
  /** JSON of the summary */
  summary: string;
  /** JSON of what undo restores */
  undoData: string;
  state: ImportRunState;
  appliedBy: number | null;
  appliedAt: Date;
  undoneBy: number | null;
  undoneAt: Date | null;
}

export const ImportRunEntity = new EntitySchema<ImportRunRow>({
  name: 'ImportRun',
  tableName: 'import_run',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    kind: { type: 'varchar', length: 20 },
    fileName: { name: 'file_name', type: 'varchar', length: 200 },
    fileFormat: { name: 'file_format', type: 'varchar', length: 4 },
    fileBytes: { name: 'file_bytes', type: 'int' },
    fileContent: { name: 'file_content', type: 'longblob' },
    sheet: { type: 'varchar', length: 100, nullable: true },
    headerRow: { name: 'header_row', type: 'int' },
    mapping: { type: 'text' },
    rowCount: { name: 'row_count', type: 'int' },
    summary: { type: 'varchar', length: 400 },
    undoData: { name: 'undo_data', type: 'longtext' },
    state: { type: 'varchar', length: 10 },
    appliedBy: { name: 'applied_by', type: 'int', nullable: true },
    appliedAt: { name: 'applied_at', type: 'datetime', precision: 3 },
    undoneBy: { name: 'undone_by', type: 'int', nullable: true },
    undoneAt: { name: 'undone_at', type: 'datetime', precision: 3, nullable: true },
  },
  indices: [{ name: 'ix_import_run_kind', columns: ['kind', 'id'] }],
});
