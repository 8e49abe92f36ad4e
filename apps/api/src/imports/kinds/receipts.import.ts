import type { EntityManager } from 'typeorm';
import { scheduledReceiptInputSchema, type Material, type ScheduledReceiptInput } from '@millrace/contracts';
import { findMaterialById, listAllMaterials, listAllReceipts, listReceipts, replaceReceipts, touchMaterialIfVersion } from '../../materials/materials.repository';
import { plantWeekStart, weekStartErrors } from '../../master-data/week-alignment';
import { addError, hasErrors, type ImportRow } from '../import-row';
import { CodeIndex, FirstRows, sameQty, unitMismatch } from './code-index';
import { ImportConflict, type ImportKindHandler } from './import-kind';
import { addIssues } from './record-kind';

/** Most receipts one material may have (the receipts editor's limit). */
const maxReceiptsPerMaterial = 1000;
const fieldKeys = ['weekStart', 'qty', 'reference'];

interface Entry {
  materialId: number;
  code: string;
  before: ScheduledReceiptInput[];
  after: ScheduledReceiptInput[];
}

const receiptList = (list: ScheduledReceiptInput[]) =>
  list
    .map((r) => `${receiptKey(r.weekStart, r.reference)}=${r.qty}`)
    .sort()
    .join(';');

const receiptKey = (weekStart: string, reference: string | null) => `${weekStart}|${(reference ?? '').toLowerCase()}`;

/**
 * Scheduled receipts: the rows of a material replace its list of receipts (a material the file
 * does not name keeps its receipts). Each receipt's week must start on the plant's week day.
 */
export const receiptsImport: ImportKindHandler = {
  kind: 'receipts',
  async check(db, rows) {
    const materials = new CodeIndex('material', await listAllMaterials(db));
    const weekStart = await plantWeekStart(db);
    const firstRows = new FirstRows();
    const lists = new Map<number, { material: Material; rows: Array<{ row: ImportRow; receipt: ScheduledReceiptInput }> }>();

    for (const row of rows) {
      const code = row.data.material as string | undefined;
      const material = code === undefined ? undefined : materials.get(code);
      if (code !== undefined && !material) addError(row, 'material', materials.unknown(code));
      const date = row.data.weekStart as string | undefined;
      if (date !== undefined) for (const e of weekStartErrors(weekStart, [{ path: 'weekStart', date }])) addError(row, 'weekStart', e.message);
      if (material && typeof row.data.unit === 'string') {
        const mismatch = unitMismatch(row.data.unit, material.code, material.unit);
        if (mismatch) addError(row, 'unit', mismatch);
      }
      const parsed = scheduledReceiptInputSchema.safeParse({ weekStart: date ?? '', qty: row.data.qty ?? 0, reference: row.data.reference ?? null });
      if (!parsed.success) {
        addIssues(row, parsed.error.issues, fieldKeys, 'qty', (field) => row.data[field] !== undefined);
      }
      if (!material || !parsed.success) continue;
      const first = firstRows.seen(`${material.id}|${receiptKey(parsed.data.weekStart, parsed.data.reference)}`, row.rowNumber);
      if (first !== null) addError(row, 'weekStart', `The same receipt of ${material.code} (week and reference) is already on row ${first}; combine the quantities.`);
      const list = lists.get(material.id) ?? { material, rows: [] };
      lists.set(material.id, list);
      if (list.rows.length >= maxReceiptsPerMaterial) addError(row, 'material', `${material.code} would have more than ${maxReceiptsPerMaterial} receipts; at most ${maxReceiptsPerMaterial}.`);
      if (!hasErrors(row)) list.rows.push({ row, receipt: parsed.data });
    }

    const existing = new Map<number, ScheduledReceiptInput[]>();
    for (const r of await listAllReceipts(db)) {
      if (!lists.has(r.materialId)) continue;
      existing.set(r.materialId, [...(existing.get(r.materialId) ?? []), { weekStart: r.weekStart, qty: r.qty, reference: r.reference }]);
    }
    let removed = 0;
    const changed: Array<{ material: Material; before: ScheduledReceiptInput[]; after: ScheduledReceiptInput[] }> = [];
    for (const { material, rows: listRows } of lists.values()) {
      const before = existing.get(material.id) ?? [];
      const byKey = new Map(before.map((r) => [receiptKey(r.weekStart, r.reference), r]));
      const matched = new Set<string>();
      let differs = false;
      for (const { row, receipt } of listRows) {
        const key = receiptKey(receipt.weekStart, receipt.reference);
        const old = byKey.get(key);
        matched.add(key);
        row.outcome = !old ? 'create' : sameQty(old.qty, receipt.qty) && old.reference === receipt.reference ? 'unchanged' : 'update';
        if (row.outcome !== 'unchanged') differs = true;
      }
      const dropped = before.filter((r) => !matched.has(receiptKey(r.weekStart, r.reference))).length;
      removed += dropped;
      if (differs || dropped > 0) changed.push({ material, before, after: listRows.map((l) => l.receipt) });
    }

    return {
      removed,
      async write(wdb: EntityManager) {
        const entries: Entry[] = [];
        for (const { material, before, after } of changed) {
          if ((await touchMaterialIfVersion(wdb, material.id, material.version)) === 'version_mismatch') {
            throw new ImportConflict(`Someone else changed the material ${material.code} meanwhile; preview the file again.`);
          }
          await replaceReceipts(wdb, material.id, after);
          entries.push({ materialId: material.id, code: material.code, before, after });
        }
        return { kind: 'receipts', entries };
      },
    };
  },
  async undo(db, raw) {
    for (const entry of raw as Entry[]) {
      const material = await findMaterialById(db, entry.materialId);
      const current = material ? (await listReceipts(db, entry.materialId)).map((r) => ({ weekStart: r.weekStart, qty: r.qty, reference: r.reference })) : [];
      if (!material || receiptList(current) !== receiptList(entry.after) || (await touchMaterialIfVersion(db, material.id, material.version)) === 'version_mismatch') {
        throw new ImportConflict(`The receipts of material ${entry.code} were changed after the import; undo would lose that change.`);
      }
      await replaceReceipts(db, entry.materialId, entry.before);
    }
  },
};
