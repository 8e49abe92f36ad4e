import type { EntityManager } from 'typeorm';
import { routingStepInputSchema, type Product, type RoutingStepInput } from '@millrace/contracts';
import { findProductById, listAllProducts, touchProductIfVersion } from '../../products/products.repository';
import { listAllRoutingSteps, listRoutingSteps, replaceRoutingSteps } from '../../products/routing.repository';
import { listAllWorkCenters } from '../../work-centers/work-centers.repository';
import { addError, hasErrors, type ImportRow } from '../import-row';
import { CodeIndex, FirstRows, sameQty } from './code-index';
import { ImportConflict, type ImportKindHandler } from './import-kind';
import { addIssues } from './record-kind';

/** Most steps one routing may have (the routing editor's limit). */
const maxStepsPerRouting = 100;
const fieldKeys = ['sequence', 'hoursPerUnit', 'setupHours'];

interface Entry {
  productId: number;
  code: string;
  before: RoutingStepInput[];
  after: RoutingStepInput[];
}

const stepList = (steps: RoutingStepInput[]) => steps.map((s) => `${s.sequence}:${s.workCenterId}=${s.hoursPerUnit}/${s.setupHours}`).join(';');

/** Routings: the rows of a product replace its routing (a product the file does not name keeps its routing). */
export const routingsImport: ImportKindHandler = {
  kind: 'routings',
  async check(db, rows) {
    const products = new CodeIndex('product', await listAllProducts(db));
    const workCenters = new CodeIndex('work center', await listAllWorkCenters(db));
    const firstRows = new FirstRows();
    const routings = new Map<number, { product: Product; rows: Array<{ row: ImportRow; step: RoutingStepInput }> }>();

    for (const row of rows) {
      const code = row.data.product as string | undefined;
      const product = code === undefined ? undefined : products.get(code);
      if (code !== undefined && !product) addError(row, 'product', products.unknown(code));
      const wcCode = row.data.workCenter as string | undefined;
      const workCenter = wcCode === undefined ? undefined : workCenters.get(wcCode);
      if (wcCode !== undefined && !workCenter) addError(row, 'workCenter', workCenters.unknown(wcCode));
      const parsed = routingStepInputSchema.safeParse({
        sequence: row.data.sequence ?? 1,
        workCenterId: workCenter?.id ?? 1,
        hoursPerUnit: row.data.hoursPerUnit ?? 0,
        setupHours: row.data.setupHours ?? 0,
      });
      if (!parsed.success) addIssues(row, parsed.error.issues, fieldKeys, 'workCenter');
      if (!product || !workCenter || !parsed.success) continue;
      const first = firstRows.seen(`${product.id}|${parsed.data.sequence}`, row.rowNumber);
      if (first !== null) addError(row, 'sequence', `Step ${parsed.data.sequence} of ${product.code} is already on row ${first}.`);
      const routing = routings.get(product.id) ?? { product, rows: [] };
      routings.set(product.id, routing);
      if (routing.rows.length >= maxStepsPerRouting) addError(row, 'product', `The routing of ${product.code} would have more than ${maxStepsPerRouting} steps.`);
      if (!hasErrors(row)) routing.rows.push({ row, step: parsed.data });
    }

    const existing = new Map<number, RoutingStepInput[]>();
    for (const s of await listAllRoutingSteps(db)) {
      if (!routings.has(s.productId)) continue;
      existing.set(s.productId, [...(existing.get(s.productId) ?? []), { sequence: s.sequence, workCenterId: s.workCenterId, hoursPerUnit: s.hoursPerUnit, setupHours: s.setupHours }]);
    }
    let removed = 0;
    const changed: Array<{ product: Product; before: RoutingStepInput[]; after: RoutingStepInput[] }> = [];
    for (const { product, rows: stepRows } of routings.values()) {
      const before = existing.get(product.id) ?? [];
      const bySequence = new Map(before.map((s) => [s.sequence, s]));
      let differs = false;
      for (const { row, step } of stepRows) {
        const old = bySequence.get(step.sequence);
        const same = old && old.workCenterId === step.workCenterId && sameQty(old.hoursPerUnit, step.hoursPerUnit) && sameQty(old.setupHours, step.setupHours);
        row.outcome = !old ? 'create' : same ? 'unchanged' : 'update';
        if (row.outcome !== 'unchanged') differs = true;
      }
      const sequences = new Set(stepRows.map((r) => r.step.sequence));
      const dropped = before.filter((s) => !sequences.has(s.sequence)).length;
      removed += dropped;
      if (differs || dropped > 0) changed.push({ product, before, after: stepRows.map((r) => r.step).sort((a, b) => a.sequence - b.sequence) });
    }

    return {
      removed,
      async write(wdb: EntityManager) {
        const entries: Entry[] = [];
        for (const { product, before, after } of changed) {
          if ((await touchProductIfVersion(wdb, product.id, product.version)) === 'version_mismatch') {
            throw new ImportConflict(`Someone else changed the product ${product.code} meanwhile; preview the file again.`);
          }
          await replaceRoutingSteps(wdb, product.id, after);
          entries.push({ productId: product.id, code: product.code, before, after });
        }
        return { kind: 'routings', entries };
      },
    };
  },
  async undo(db, raw) {
    for (const entry of raw as Entry[]) {
      const product = await findProductById(db, entry.productId);
      const current = product ? (await listRoutingSteps(db, entry.productId)).map((s) => ({ sequence: s.sequence, workCenterId: s.workCenterId, hoursPerUnit: s.hoursPerUnit, setupHours: s.setupHours })) : [];
      if (!product || stepList(current) !== stepList(entry.after) || (await touchProductIfVersion(db, product.id, product.version)) === 'version_mismatch') {
        throw new ImportConflict(`The routing of ${entry.code} was changed after the import; undo would lose that change.`);
      }
      await replaceRoutingSteps(db, entry.productId, entry.before);
    }
  },
};
