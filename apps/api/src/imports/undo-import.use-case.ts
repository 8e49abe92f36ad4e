import type { DataSource } from 'typeorm';
import type { ImportKind, ImportRun } from '@millrace/contracts';
import type { SignedInPerson } from '../auth/current-person';
import { AppError } from '../http/app-error';
import { findImportRun, lockImports, lockLatestApplied, markUndone } from './imports.repository';
import { ImportConflict } from './kinds/import-kind';
import { importKinds } from './kinds/import-kinds';

/**
 * A planner undoes the latest applied import of a kind: what it created is removed, what it
 * changed gets its earlier values back, in one transaction. If someone changed an affected row
 * since, the undo is refused (409 naming it) so their change is not lost.
 */
export async function undoLatestImport(dataSource: DataSource, kind: ImportKind, person: SignedInPerson): Promise<ImportRun> {
  try {
    const id = await dataSource.transaction(async (db) => {
      await lockImports(db);
      const latest = await lockLatestApplied(db, kind);
      if (!latest) throw AppError.notFound(`There is no applied ${kind} import to undo.`);
      await importKinds[kind].undo(db, latest.undo.entries);
      await markUndone(db, latest.id, person.id);
      return latest.id;
    });
    return (await findImportRun(dataSource.manager, id))!;
  } catch (err) {
    if (err instanceof ImportConflict) throw AppError.conflict(`The import cannot be undone: ${err.message}`);
    throw err;
  }
}
