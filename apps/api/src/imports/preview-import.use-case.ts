import type { EntityManager } from 'typeorm';
import type { ImportKind, ImportOptions, ImportPreview, ImportSummary } from '@millrace/contracts';
import { importKinds } from './kinds/import-kinds';
import { readImportFile, type ReadImport } from './read-import-file';
import type { Upload } from './read-upload';
import type { ImportRow } from './import-row';

/** Created / updated / unchanged rows, and lines the replaced lists lose. */
export function summarise(rows: ImportRow[], removed: number): ImportSummary {
  const count = (o: ImportRow['outcome']) => rows.filter((r) => r.outcome === o).length;
  return { created: count('create'), updated: count('update'), unchanged: count('unchanged'), removed };
}

/**
 * A planner uploads a file to see what it would do: the columns found, the mapping, and every
 * row checked against the database and the other rows, with its errors. Nothing is written.
 */
export async function previewImport(db: EntityManager, kind: ImportKind, upload: Upload, options: ImportOptions): Promise<ImportPreview> {
  const read = await readImportFile(db, kind, upload, options);
  let removed = 0;
  if (read.fileErrors.length === 0) removed = (await importKinds[kind].check(db, read.rows)).removed;
  else for (const row of read.rows) row.outcome = 'error';
  return toPreview(kind, upload, read, removed);
}

export function toPreview(kind: ImportKind, upload: Upload, read: ReadImport, removed: number): ImportPreview {
  const errorRows = read.rows.filter((r) => r.errors.length > 0).length;
  return {
    kind,
    fileName: upload.fileName,
    format: read.file.format,
    sheets: read.file.sheetNames,
    sheet: read.file.sheet,
    delimiter: read.file.delimiter,
    headerRow: read.headerRow,
    columns: read.columns,
    mapping: read.mapping,
    mappingSource: read.mappingSource,
    suggestedMapping: read.suggestedMapping,
    rows: read.rows.map((r) => ({ rowNumber: r.rowNumber, values: r.values, errors: r.errors, outcome: r.outcome })),
    fileErrors: read.fileErrors,
    counts: { rows: read.rows.length, errorRows },
    summary: read.fileErrors.length === 0 ? summarise(read.rows, removed) : { created: 0, updated: 0, unchanged: 0, removed: 0 },
  };
}
