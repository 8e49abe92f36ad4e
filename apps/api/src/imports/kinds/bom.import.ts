import type { EntityManager } from 'typeorm';
import { bomLineInputSchema, type BomLineInput, type Material, type Product } from '@millrace/contracts';
import { listAllMaterials } from '../../materials/materials.repository';
import { findBomCycle } from '../../products/bom-cycle';
import { listAllBomLines, listBomLines, listProductEdges, lockBomStructure, replaceBomLines } from '../../products/bom.repository';
import { findProductById, listAllProducts, touchProductIfVersion } from '../../products/products.repository';
import { addError, hasErrors, type ImportRow } from '../import-row';
import { CodeIndex, FirstRows, sameQty, unitMismatch } from './code-index';
import { ImportConflict, type ImportKindHandler } from './import-kind';
import { addIssues } from './record-kind';

/** Most lines one bill of materials may have (the BOM editor's limit). */
const maxLinesPerBom = 500;
const fieldKeys = ['qtyPer', 'scrapPct'];

interface Entry {
  productId: number;
  code: string;
  before: BomLineInput[];
  after: BomLineInput[];
}

const lineList = (lines: BomLineInput[]) => lines.map((l) => `${componentKey(l)}=${l.qtyPer}/${l.scrapPct}`).join(';');

type Component = { kind: 'product'; item: Product } | { kind: 'material'; item: Material };
const componentKey = (l: { componentProductId: number | null; materialId: number | null }) => (l.componentProductId !== null ? `p${l.componentProductId}` : `m${l.materialId}`);

/**
 * Bills of materials: the rows of a parent replace its BOM, in file order (a parent the file
 * does not name keeps its BOM). A component code is looked up among products and materials.
 * The structure the file and the database make together must have no cycle.
 */
export const bomImport: ImportKindHandler = {
  kind: 'bom',
  async check(db, rows) {
    await lockBomStructure(db); // inside an apply's transaction: no other BOM change until it ends
    const products = new CodeIndex('product', await listAllProducts(db));
    const materials = new CodeIndex('material', await listAllMaterials(db));
    const firstRows = new FirstRows();
    const boms = new Map<number, { parent: Product; rows: Array<{ row: ImportRow; line: BomLineInput; component: Component }> }>();

    for (const row of rows) {
      const parentCode = row.data.parent as string | undefined;
      const parent = parentCode === undefined ? undefined : products.get(parentCode);
      if (parentCode !== undefined && !parent) addError(row, 'parent', products.unknown(parentCode));
      const code = row.data.component as string | undefined;
      let component: Component | undefined;
      if (code !== undefined) {
        const p = products.get(code);
        const m = materials.get(code);
        if (p && m) addError(row, 'component', `${code} is the code of a product and of a material; give one of them another code.`);
        else if (p) component = { kind: 'product', item: p };
        else if (m) component = { kind: 'material', item: m };
        else addError(row, 'component', new CodeIndex('product or material', []).unknown(code, [...products.codes(), ...materials.codes()]));
      }
      if (parent && component?.kind === 'product' && component.item.id === parent.id) addError(row, 'component', `${parent.code} cannot be a component of itself.`);
      if (component && typeof row.data.unit === 'string') {
        const mismatch = unitMismatch(row.data.unit, component.item.code, component.item.unit);
        if (mismatch) addError(row, 'unit', mismatch);
      }
      const parsed = bomLineInputSchema.safeParse({
        componentProductId: component?.kind === 'product' ? component.item.id : null,
        materialId: component?.kind === 'material' ? component.item.id : component ? null : 1,
        qtyPer: row.data.qtyPer ?? 1,
        scrapPct: row.data.scrapPct ?? 0,
      });
      if (!parsed.success) addIssues(row, parsed.error.issues, fieldKeys, 'component');
      if (!parent || !component || !parsed.success) continue;
      const first = firstRows.seen(`${parent.id}|${component.kind}${component.item.id}`, row.rowNumber);
      if (first !== null) addError(row, 'component', `${component.item.code} is already in the bill of materials of ${parent.code} on row ${first}; combine the quantities.`);
      const bom = boms.get(parent.id) ?? { parent, rows: [] };
      boms.set(parent.id, bom);
      if (bom.rows.length >= maxLinesPerBom) addError(row, 'parent', `The bill of materials of ${parent.code} would have more than ${maxLinesPerBom} lines.`);
      if (!hasErrors(row)) bom.rows.push({ row, line: parsed.data, component });
    }

    // Cycles over the file's structure and the database's together (file parents' old lines are replaced).
    const fileParents = new Set([...boms.values()].map((b) => b.parent.code));
    const edges = (await listProductEdges(db)).filter((e) => !fileParents.has(e.parent));
    for (const bom of boms.values()) {
      for (const r of bom.rows) if (r.component.kind === 'product') edges.push({ parent: bom.parent.code, child: r.component.item.code });
    }
    for (const bom of boms.values()) {
      const children = bom.rows.filter((r) => r.component.kind === 'product').map((r) => r.component.item.code);
      const cycle = findBomCycle(edges, bom.parent.code, children);
      if (!cycle) continue;
      const message = `Cycle in the bill of materials: ${cycle.join(' → ')}.`;
      for (let i = 0; i + 1 < cycle.length; i += 1) {
        const on = boms.get(products.get(cycle[i])!.id);
        for (const r of on?.rows ?? []) {
          if (r.component.item.code === cycle[i + 1] && r.component.kind === 'product' && !r.row.errors.some((e) => e.message === message)) addError(r.row, 'component', message);
        }
      }
    }

    const existing = new Map<number, BomLineInput[]>();
    for (const l of await listAllBomLines(db)) {
      if (!boms.has(l.parentProductId)) continue;
      existing.set(l.parentProductId, [...(existing.get(l.parentProductId) ?? []), { componentProductId: l.componentProductId, materialId: l.materialId, qtyPer: l.qtyPer, scrapPct: l.scrapPct }]);
    }
    let removed = 0;
    const changed: Array<{ parent: Product; before: BomLineInput[]; after: BomLineInput[] }> = [];
    for (const { parent, rows: bomRows } of boms.values()) {
      const valid = bomRows.filter((r) => !hasErrors(r.row));
      const before = existing.get(parent.id) ?? [];
      const byKey = new Map(before.map((l) => [componentKey(l), l]));
      let differs = valid.map((r) => componentKey(r.line)).join() !== before.map(componentKey).join();
      for (const { row, line } of valid) {
        const old = byKey.get(componentKey(line));
        row.outcome = !old ? 'create' : sameQty(old.qtyPer, line.qtyPer) && sameQty(old.scrapPct, line.scrapPct) ? 'unchanged' : 'update';
        if (row.outcome !== 'unchanged') differs = true;
      }
      const keys = new Set(valid.map((r) => componentKey(r.line)));
      removed += before.filter((l) => !keys.has(componentKey(l))).length;
      if (differs) changed.push({ parent, before, after: valid.map((r) => r.line) });
    }

    return {
      removed,
      async write(wdb: EntityManager) {
        const entries: Entry[] = [];
        for (const { parent, before, after } of changed) {
          if ((await touchProductIfVersion(wdb, parent.id, parent.version)) === 'version_mismatch') {
            throw new ImportConflict(`Someone else changed the product ${parent.code} meanwhile; preview the file again.`);
          }
          await replaceBomLines(wdb, parent.id, after);
          entries.push({ productId: parent.id, code: parent.code, before, after });
        }
        return { kind: 'bom', entries };
      },
    };
  },
  async undo(db, raw) {
    await lockBomStructure(db);
    for (const entry of raw as Entry[]) {
      const product = await findProductById(db, entry.productId);
      const current = product ? (await listBomLines(db, entry.productId)).map((l) => ({ componentProductId: l.componentProductId, materialId: l.materialId, qtyPer: l.qtyPer, scrapPct: l.scrapPct })) : [];
      if (!product || lineList(current) !== lineList(entry.after) || (await touchProductIfVersion(db, product.id, product.version)) === 'version_mismatch') {
        throw new ImportConflict(`The bill of materials of ${entry.code} was changed after the import; undo would lose that change.`);
      }
      await replaceBomLines(db, entry.productId, entry.before);
    }
    // Lines restored next to BOMs edited since could close a cycle: check the whole structure again.
    const edges = await listProductEdges(db);
    for (const entry of raw as Entry[]) {
      const children = edges.filter((e) => e.parent === entry.code).map((e) => e.child);
      const cycle = findBomCycle(edges, entry.code, children);
      if (cycle) throw new ImportConflict(`Undo would make ${entry.code} contain itself (${cycle.join(' → ')}), because other bills of materials changed since the import.`);
    }
  },
};
