import type { DataSource } from 'typeorm';
import { importFields, type ImportKind, type ImportOptions, type ImportRun, type ImportSummary } from '@millrace/contracts';
import type { SignedInPerson } from '../auth/current-person';
import { AppError } from '../http/app-error';
import { findImportRun, insertImportRun, lockImports } from './imports.repository';
import { ImportConflict } from './kinds/import-kind';
import { importKinds } from './kinds/import-kinds';
import { summarise } from './preview-import.use-case';
import { readImportFile } from './read-import-file';
import type { Upload } from './read-upload';

/** Errors listed in a refused apply (the preview shows them all). */
const listedErrors = 100;

export interface AppliedImport {
  run: ImportRun;
  summary: ImportSummary;
}

/**
 * A planner applies a file: it is read and checked again inside one transaction; any row with
 * an error refuses the whole file (422 listing the errors, nothing written). Otherwise every
 * row is written, the import is recorded with its original file, and the summary returned.
 */
export async function applyImport(dataSource: DataSource, kind: ImportKind, upload: Upload, options: ImportOptions, person: SignedInPerson): Promise<AppliedImport> {
  const labels = new Map(importFields[kind].map((f) => [f.key, f.label]));
  try {
    // The file is read before the transaction, so a slow workbook holds no connection or lock.
    const read = await readImportFile(dataSource.manager, kind, upload, options);
    const id = await dataSource.transaction(async (db) => {
      if (read.fileErrors.length > 0) {
        throw AppError.unprocessable(`The mapping is not complete; nothing was imported. ${read.fileErrors[0]}`, read.fileErrors.map((message) => ({ item: 'mapping', message })));
      }
      await lockImports(db);
      const checked = await importKinds[kind].check(db, read.rows);
      const bad = read.rows.filter((r) => r.errors.length > 0);
      if (bad.length > 0) {
        const issues = bad.flatMap((r) => r.errors.map((e) => ({ item: `row ${r.rowNumber}`, message: `${labels.get(e.field) ?? e.field}: ${e.message}` }))).slice(0, listedErrors);
        throw AppError.unprocessable(`${bad.length === 1 ? '1 row has' : `${bad.length} rows have`} errors; nothing was imported. Fix them and upload the file again.`, issues);
      }
      const undo = await checked.write(db);
      return insertImportRun(db, {
        kind,
        fileName: upload.fileName,
        format: read.file.format,
        content: upload.bytes,
        sheet: read.file.sheet,
        headerRow: read.headerRow,
        mapping: read.mapping,
        rowCount: read.rows.length,
        summary: summarise(read.rows, checked.removed),
        undo,
        personId: person.id,
      });
    });
    const run = (await findImportRun(dataSource.manager, id))!;
    return { run, summary: run.summary };
  } catch (err) {
    if (err instanceof ImportConflict) throw AppError.conflict(err.message);
    throw err;
  }
}
