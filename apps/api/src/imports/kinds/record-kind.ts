import type { EntityManager } from 'typeorm';
import type { z } from 'zod';
import type { ImportFieldDef, ImportKind } from '@millrace/contracts';
import { isDuplicateKey } from '../../master-data/duplicate-key';
import type { VersionedWrite } from '../../master-data/versioned-update';
import { addError, hasErrors, type FieldValue, type ImportRow } from '../import-row';
import { ImportConflict, type ImportKindHandler } from './import-kind';

export type Flat = Record<string, unknown>;

export interface StoredRecord {
  id: number;
  code: string;
  version: number;
  /** the record's values under the import's field keys */
  flat: Flat;
}

/** How one kind of coded record (product, material, work center) is read, checked and written. */
export interface RecordKindConfig<Input> {
  kind: ImportKind;
  /** "product" */
  what: string;
  loadAll(db: EntityManager): Promise<StoredRecord[]>;
  /** the create schema of the contract (defaults for fields the file leaves out) */
  schema: z.ZodType<Input>;
  /** import fields → the schema's input shape */
  toInput(flat: Flat): unknown;
  /** a checked input → the import fields (to compare with what is stored) */
  fromInput(input: Input): Flat;
  insert(db: EntityManager, input: Input): Promise<{ id: number }>;
  /** writes the changed fields (merged holds every field, for nested groups) when the version still matches */
  update(db: EntityManager, id: number, version: number, changes: Flat, merged: Input): Promise<VersionedWrite>;
  remove(db: EntityManager, id: number): Promise<void>;
  /** fields where an empty cell in a mapped column means "none" (null) rather than "keep" */
  nullable: readonly string[];
}

/** The field a zod issue path points at: the last segment that is one of our field keys. */
export function fieldOfPath(path: readonly PropertyKey[], keys: readonly string[], fallback: string): string {
  for (let i = path.length - 1; i >= 0; i -= 1) {
    const segment = path[i];
    if (typeof segment === 'string' && keys.includes(segment)) return segment;
  }
  return fallback;
}

/** Adds a schema's issues to a row: the first issue of each field (one message per cell). */
export function addIssues(row: ImportRow, issues: ReadonlyArray<{ path: readonly PropertyKey[]; message: string }>, keys: readonly string[], fallback: string, only?: (field: string) => boolean): void {
  const done = new Set(row.errors.map((e) => e.field));
  for (const issue of issues) {
    const field = fieldOfPath(issue.path, keys, fallback);
    if (done.has(field) || (only && !only(field))) continue;
    done.add(field);
    addError(row, field, issue.message);
  }
}

function same(a: unknown, b: unknown): boolean {
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((x, i) => same(x, b[i]));
  return a === b;
}

interface CreatedEntry {
  op: 'created';
  id: number;
  code: string;
  /** the values it was created with (undo refuses when they have changed since) */
  after: Flat;
}
interface UpdatedEntry {
  op: 'updated';
  id: number;
  code: string;
  before: Flat;
  after: Flat;
}
type Entry = CreatedEntry | UpdatedEntry;

/**
 * Coded records: a row whose code exists updates that record (only the columns the file maps),
 * a new code creates one. Rows are checked with the contract's create schema on the merged
 * values, so an import obeys exactly the rules of the editor.
 */
export function recordKind<Input>(config: RecordKindConfig<Input>, fields: readonly ImportFieldDef[]): ImportKindHandler {
  const fieldKeys = fields.map((f) => f.key);
  const neededToCreate = fields.filter((f) => f.requiredToCreate);
  return {
    kind: config.kind,
    async check(db, rows) {
      const stored = await config.loadAll(db);
      const byCode = new Map(stored.map((s) => [s.code.toLowerCase(), s]));
      const firstRow = new Map<string, number>();
      const creates: Array<{ row: ImportRow; input: Input }> = [];
      const updates: Array<{ row: ImportRow; record: StoredRecord; changes: Flat; merged: Input }> = [];

      for (const row of rows) {
        const code = row.data.code as string | undefined;
        if (code !== undefined) {
          const key = code.toLowerCase();
          const first = firstRow.get(key);
          if (first !== undefined) addError(row, 'code', `The ${config.what} ${code} is already on row ${first}; keep one row per ${config.what}.`);
          else firstRow.set(key, row.rowNumber);
        }
        if (hasErrors(row)) continue;
        const record = byCode.get(code!.toLowerCase());
        const fileValues: Flat = { ...row.data };
        for (const key of config.nullable) if (key in row.values && !(key in row.data)) fileValues[key] = null;
        if (record) fileValues.code = record.code; // codes compare without case, as the database does
        else {
          for (const f of neededToCreate) if (fileValues[f.key] === undefined) addError(row, f.key, `Enter the ${f.label} to create the new ${config.what} ${code}.`);
          if (hasErrors(row)) continue;
        }
        const parsed = config.schema.safeParse(config.toInput(record ? { ...record.flat, ...fileValues } : fileValues));
        if (!parsed.success) {
          addIssues(row, parsed.error.issues, fieldKeys, 'code');
          continue;
        }
        if (!record) {
          row.outcome = 'create';
          creates.push({ row, input: parsed.data });
          continue;
        }
        const checked = config.fromInput(parsed.data);
        const changes: Flat = {};
        for (const key of Object.keys(fileValues)) if (!same(checked[key], record.flat[key])) changes[key] = checked[key];
        row.outcome = Object.keys(changes).length === 0 ? 'unchanged' : 'update';
        if (row.outcome === 'update') updates.push({ row, record, changes, merged: parsed.data });
      }

      return {
        removed: 0,
        async write(wdb) {
          const entries: Entry[] = [];
          for (const { row, input } of creates) {
            try {
              const { id } = await config.insert(wdb, input);
              entries.push({ op: 'created', id, code: String(row.data.code), after: config.fromInput(input) });
            } catch (err) {
              if (isDuplicateKey(err)) throw new ImportConflict(`Someone else created the ${config.what} ${String(row.data.code)} meanwhile; preview the file again.`);
              throw err;
            }
          }
          for (const { record, changes, merged } of updates) {
            if ((await config.update(wdb, record.id, record.version, changes, merged)) === 'version_mismatch') {
              throw new ImportConflict(`Someone else changed the ${config.what} ${record.code} meanwhile; preview the file again.`);
            }
            const before = Object.fromEntries(Object.keys(changes).map((k) => [k, record.flat[k]]));
            entries.push({ op: 'updated', id: record.id, code: record.code, before, after: changes });
          }
          return { kind: config.kind, entries };
        },
      };
    },
    async undo(db, rawEntries) {
      const entries = rawEntries as Entry[];
      const storedById = new Map((await config.loadAll(db)).map((s) => [s.id, s]));
      const changedSince = (code: string) => new ImportConflict(`The ${config.what} ${code} was changed after the import; undo would lose that change.`);
      for (const entry of entries) {
        const stored = storedById.get(entry.id);
        // Undo goes by values, not versions: an undo chain (and changes to other fields) stays possible.
        if (!stored || Object.entries(entry.after).some(([k, v]) => !same(stored.flat[k], v))) {
          if (entry.op === 'created' && !stored) continue;
          throw changedSince(entry.code);
        }
        if (entry.op === 'created') {
          try {
            await config.remove(db, entry.id);
          } catch (err) {
            const code = (err as { code?: string; driverError?: { code?: string } }).driverError?.code ?? (err as { code?: string }).code ?? '';
            if (code.startsWith('ER_ROW_IS_REFERENCED')) {
              throw new ImportConflict(`The ${config.what} ${entry.code} that the import created is now used elsewhere (a bill of materials, routing or demand); remove that use first.`);
            }
            throw err;
          }
        } else {
          const merged = config.schema.parse(config.toInput({ ...stored.flat, ...entry.before }));
          if ((await config.update(db, entry.id, stored.version, entry.before, merged)) === 'version_mismatch') throw changedSince(entry.code);
        }
      }
    },
  };
}

export type { FieldValue };
