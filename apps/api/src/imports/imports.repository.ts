import type { EntityManager } from 'typeorm';
import { importMappingSchema, type FileFormat, type ImportKind, type ImportMapping, type ImportRun, type ImportSummary, type SavedMapping } from '@millrace/contracts';
import { ImportMappingEntity } from '../db/entities/import-mapping.entity';
import { ImportRunEntity } from '../db/entities/import-run.entity';
import type { UndoData } from './kinds/import-kind';

export interface NewImportRun {
  kind: ImportKind;
  fileName: string;
  format: FileFormat;
  content: Buffer;
  sheet: string | null;
  headerRow: number;
  mapping: ImportMapping;
  rowCount: number;
  summary: ImportSummary;
  undo: UndoData;
  personId: number;
}

export async function insertImportRun(db: EntityManager, run: NewImportRun): Promise<number> {
  const result = await db.getRepository(ImportRunEntity).insert({
    kind: run.kind,
    fileName: run.fileName,
    fileFormat: run.format,
    fileBytes: run.content.length,
    fileContent: run.content,
    sheet: run.sheet,
    headerRow: run.headerRow,
    mapping: JSON.stringify(run.mapping),
    rowCount: run.rowCount,
    summary: JSON.stringify(run.summary),
    undoData: JSON.stringify(run.undo),
    state: 'applied',
    appliedBy: run.personId,
    appliedAt: new Date(),
    undoneBy: null,
    undoneAt: null,
  });
  return Number(result.identifiers[0].id);
}

interface RawRun {
  id: number;
  kind: ImportKind;
  file_name: string;
  file_format: FileFormat;
  file_bytes: number;
  sheet: string | null;
  row_count: number;
  summary: string;
  state: 'applied' | 'undone';
  applied_by: number | null;
  applied_by_name: string | null;
  applied_at: Date;
  undone_by: number | null;
  undone_by_name: string | null;
  undone_at: Date | null;
  latest_applied: number | null;
}

/** Applied imports, newest first (without their files), with who applied and undid them. */
export async function listImportRuns(db: EntityManager, filter: { kind?: ImportKind; id?: number } = {}, limit = 200): Promise<ImportRun[]> {
  const where: string[] = [];
  const params: unknown[] = [];
  if (filter.kind) {
    where.push('r.kind = ?');
    params.push(filter.kind);
  }
  if (filter.id !== undefined) {
    where.push('r.id = ?');
    params.push(filter.id);
  }
  const rows = (await db.query(
    `SELECT r.id, r.kind, r.file_name, r.file_format, r.file_bytes, r.sheet, r.row_count, r.summary, r.state,
            r.applied_by, a.name AS applied_by_name, r.applied_at, r.undone_by, u.name AS undone_by_name, r.undone_at,
            (SELECT MAX(l.id) FROM import_run l WHERE l.kind = r.kind AND l.state = 'applied') AS latest_applied
       FROM import_run r
       LEFT JOIN person a ON a.id = r.applied_by
       LEFT JOIN person u ON u.id = r.undone_by
      ${where.length > 0 ? `WHERE ${where.join(' AND ')}` : ''}
      ORDER BY r.id DESC LIMIT ?`,
    [...params, limit],
  )) as RawRun[];
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    fileName: r.file_name,
    format: r.file_format,
    fileBytes: r.file_bytes,
    sheet: r.sheet,
    rows: r.row_count,
    summary: JSON.parse(r.summary) as ImportSummary,
    state: r.state,
    appliedBy: r.applied_by === null ? null : { id: r.applied_by, name: r.applied_by_name ?? '' },
    appliedAt: new Date(r.applied_at).toISOString(),
    undoneBy: r.undone_by === null ? null : { id: r.undone_by, name: r.undone_by_name ?? '' },
    undoneAt: r.undone_at ? new Date(r.undone_at).toISOString() : null,
    undoable: r.state === 'applied' && Number(r.latest_applied) === r.id,
  }));
}

export async function findImportRun(db: EntityManager, id: number): Promise<ImportRun | null> {
  return (await listImportRuns(db, { id }, 1))[0] ?? null;
}

/** The original file of an import. */
export async function findImportFile(db: EntityManager, id: number): Promise<{ fileName: string; format: FileFormat; content: Buffer } | null> {
  const row = await db.getRepository(ImportRunEntity).findOne({ where: { id }, select: { id: true, fileName: true, fileFormat: true, fileContent: true } });
  return row ? { fileName: row.fileName, format: row.fileFormat, content: row.fileContent } : null;
}

/** The latest applied import of a kind, locked until the transaction ends, with its undo data. */
export async function lockLatestApplied(db: EntityManager, kind: ImportKind): Promise<{ id: number; fileName: string; undo: UndoData } | null> {
  const [row] = (await db.query(
    `SELECT id, file_name, undo_data FROM import_run WHERE kind = ? AND state = 'applied' ORDER BY id DESC LIMIT 1 FOR UPDATE`,
    [kind],
  )) as Array<{ id: number; file_name: string; undo_data: string }>;
  return row ? { id: row.id, fileName: row.file_name, undo: JSON.parse(row.undo_data) as UndoData } : null;
}

/**
 * Serialises imports and undos (in any number of API processes): the plant settings row (one
 * row, always present) is locked until the transaction ends, so checks and writes of two
 * imports never interleave and no gap locks can deadlock.
 */
export async function lockImports(db: EntityManager): Promise<void> {
  await db.query('SELECT id FROM plant_settings WHERE id = 1 FOR UPDATE');
}

export async function markUndone(db: EntityManager, id: number, personId: number): Promise<void> {
  await db.getRepository(ImportRunEntity).update({ id }, { state: 'undone', undoneBy: personId, undoneAt: new Date() });
}

export async function findSavedMapping(db: EntityManager, kind: ImportKind): Promise<SavedMapping> {
  const row = await db.getRepository(ImportMappingEntity).findOneBy({ kind });
  if (!row) return { kind, mapping: null, updatedAt: null };
  const parsed = importMappingSchema.safeParse(JSON.parse(row.mapping));
  return { kind, mapping: parsed.success ? parsed.data : null, updatedAt: row.updatedAt.toISOString() };
}

export async function saveMapping(db: EntityManager, kind: ImportKind, mapping: ImportMapping, personId: number): Promise<void> {
  await db.getRepository(ImportMappingEntity).upsert({ kind, mapping: JSON.stringify(mapping), updatedBy: personId, updatedAt: new Date() }, ['kind']);
}
