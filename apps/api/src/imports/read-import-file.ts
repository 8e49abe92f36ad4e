import type { EntityManager } from 'typeorm';
import { importFields, importMappingSchema, type ImportKind, type ImportMapping, type ImportOptions, type MappingSource } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { columnTitles, findHeaderRow, mappingProblems, resolveMapping } from './header-mapping';
import { readRows, type ImportRow } from './import-row';
import { findSavedMapping } from './imports.repository';
import { readSpreadsheet } from './read-spreadsheet';
import type { Upload } from './read-upload';
import type { SpreadsheetFile } from './spreadsheet-grid';
import { unreadableFile } from './unreadable-file';

/** A file read through its mapping, before any check against the database. */
export interface ReadImport {
  file: SpreadsheetFile;
  headerRow: number;
  columns: string[];
  mapping: ImportMapping;
  mappingSource: MappingSource;
  suggestedMapping: ImportMapping;
  /** problems of the mapping as a whole; rows are not checked while there are any */
  fileErrors: string[];
  rows: ImportRow[];
}

function sentMapping(text: string | undefined): ImportMapping | null {
  if (text === undefined || text === '') return null;
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw AppError.validation('The mapping is not valid JSON.', [{ path: 'mapping', message: 'Send the mapping as JSON: {"field": "column title"}.' }]);
  }
  const parsed = importMappingSchema.safeParse(json);
  if (!parsed.success) throw AppError.validation('The mapping must name a column title (or null) per field.', [{ path: 'mapping', message: 'Send {"field": "column title" or null}.' }]);
  return parsed.data;
}

/**
 * Opens the upload, finds the header row (or takes the one given), names the columns, chooses
 * the mapping (sent, saved for the kind, or suggested) and reads every data row as its fields'
 * types. Fails with a 400 naming the problem for files that hold no table.
 */
export async function readImportFile(db: EntityManager, kind: ImportKind, upload: Upload, options: ImportOptions): Promise<ReadImport> {
  const fields = importFields[kind];
  const sent = sentMapping(options.mapping);
  const opened = await readSpreadsheet(upload.bytes, options.sheet === '' ? undefined : options.sheet);
  const { grid } = opened.file;
  const where = opened.file.sheet ? `The sheet "${opened.file.sheet}"` : 'The file';
  if (grid.rows.length === 0) throw unreadableFile(`${where} has no rows with data.`);

  let headerIndex: number;
  if (options.headerRow !== undefined) {
    headerIndex = grid.rowNumbers.indexOf(options.headerRow);
    if (headerIndex < 0) throw unreadableFile(`Row ${options.headerRow} of ${where.toLowerCase().replace(/^the /, 'the ')} is empty; the data starts on row ${grid.rowNumbers[0]}.`);
  } else {
    headerIndex = findHeaderRow(grid, fields);
  }
  const headerRow = grid.rowNumbers[headerIndex];
  if (headerIndex === grid.rows.length - 1) throw unreadableFile(`${where} has a header row (row ${headerRow}) but no data rows below it.`);

  const columns = columnTitles(grid.rows[headerIndex], opened.mergedContinuations(headerRow));
  const saved = sent ? null : (await findSavedMapping(db, kind)).mapping;
  const resolved = resolveMapping(fields, columns, sent, saved);
  const fileErrors = [...resolved.problems, ...mappingProblems(fields, resolved.mapping)];
  const rows = readRows(grid, headerIndex, columns, fields, resolved.mapping);
  return {
    file: opened.file,
    headerRow,
    columns,
    mapping: resolved.mapping,
    mappingSource: resolved.source,
    suggestedMapping: resolved.suggested,
    fileErrors,
    rows,
  };
}
