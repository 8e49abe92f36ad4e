import type { EntityManager } from 'typeorm';
import { importFields, type ExportKind, type ImportKind } from '@millrace/contracts';
import { listDemandBetween } from '../demand/demand.repository';
import { listAllMaterials, listAllReceipts } from '../materials/materials.repository';
import { readPlanResults } from '../plans/plan-results.use-case';
import { listAllBomLines } from '../products/bom.repository';
import { listAllProducts } from '../products/products.repository';
import { listAllRoutingSteps } from '../products/routing.repository';
import { listAllWorkCenters } from '../work-centers/work-centers.repository';
import { AppError } from '../http/app-error';
import { materialFlat } from '../imports/kinds/materials.import';
import { productFlat } from '../imports/kinds/products.import';
import { workCenterFlat } from '../imports/kinds/work-centers.import';
import type { ExportTable } from './export-table';

type Value = string | number | null;
const yesNo = (b: boolean) => (b ? 'yes' : 'no');

function cell(value: unknown): Value {
  if (value === null || value === undefined) return null;
  if (typeof value === 'boolean') return yesNo(value);
  if (Array.isArray(value)) return value.join(' ');
  if (typeof value === 'number' || typeof value === 'string') return value;
  return String(value);
}

/** The columns of an import kind, titled as the import recognises them. */
function importTable(kind: ImportKind, records: Array<Record<string, unknown>>): ExportTable {
  const fields = importFields[kind];
  return { name: kind, columns: fields.map((f) => f.label), rows: records.map((r) => fields.map((f) => cell(r[f.key]))) };
}

/**
 * The table of an export. Master data and demand come out in exactly the columns their import
 * reads (so a file exported and imported again changes nothing); plan lines and material calls
 * come from a solved plan version's stored results.
 */
export async function exportTable(db: EntityManager, kind: ExportKind, planId: number | undefined): Promise<ExportTable> {
  switch (kind) {
    case 'products':
      return importTable(kind, (await listAllProducts(db)).map(productFlat));
    case 'work-centers':
      return importTable(kind, (await listAllWorkCenters(db)).map(workCenterFlat));
    case 'materials':
      return importTable(kind, (await listAllMaterials(db)).map(materialFlat));
    case 'receipts': {
      const codes = new Map((await listAllMaterials(db)).map((m) => [m.id, m]));
      const receipts = (await listAllReceipts(db)).sort((a, b) => codes.get(a.materialId)!.code.localeCompare(codes.get(b.materialId)!.code) || a.weekStart.localeCompare(b.weekStart) || a.id - b.id);
      return importTable(kind, receipts.map((r) => ({ material: codes.get(r.materialId)!.code, weekStart: r.weekStart, qty: r.qty, unit: codes.get(r.materialId)!.unit, reference: r.reference })));
    }
    case 'bom':
      return importTable(
        kind,
        (await listAllBomLines(db)).map((l) => ({ parent: l.parentCode, component: l.componentProductCode ?? l.materialCode, qtyPer: l.qtyPer, unit: l.unit, scrapPct: l.scrapPct })),
      );
    case 'routings':
      return importTable(
        kind,
        (await listAllRoutingSteps(db)).map((s) => ({ product: s.productCode, sequence: s.sequence, workCenter: s.workCenterCode, hoursPerUnit: s.hoursPerUnit, setupHours: s.setupHours })),
      );
    case 'demand': {
      const products = new Map((await listAllProducts(db)).map((p) => [p.id, p]));
      const { firm, forecast } = await listDemandBetween(db, '1000-01-01', '9999-12-31');
      const rows = [
        ...firm.filter((f) => f.qty > 0).map((f) => ({ product: products.get(f.productId)!.code, weekStart: f.weekStart, type: 'firm', orderRef: f.orderRef, qty: f.qty, unit: products.get(f.productId)!.unit })),
        ...forecast.filter((f) => f.qty > 0).map((f) => ({ product: products.get(f.productId)!.code, weekStart: f.weekStart, type: 'forecast', orderRef: null, qty: f.qty, unit: products.get(f.productId)!.unit })),
      ].sort((a, b) => a.product.localeCompare(b.product) || a.weekStart.localeCompare(b.weekStart) || a.type.localeCompare(b.type) || (a.orderRef ?? '').localeCompare(b.orderRef ?? ''));
      return importTable(kind, rows);
    }
    case 'plan-lines': {
      const results = await readPlanResults(db, requirePlan(planId));
      return {
        name: 'plan lines',
        columns: ['product', 'product name', 'week', 'week start', 'demand', 'make', 'ship', 'stock', 'late'],
        rows: results.lines.map((l) => [l.product, l.productName, l.week, l.weekStart, l.demand, l.make, l.ship, l.stock, l.late]),
      };
    }
    case 'material-calls': {
      const results = await readPlanResults(db, requirePlan(planId));
      return {
        name: 'material calls',
        columns: ['material', 'material name', 'unit', 'week', 'week start', 'gross requirement', 'scheduled receipt', 'projected available', 'net requirement', 'planned receipt', 'release week', 'past due', 'spend'],
        rows: results.materialCalls.map((c) => [
          c.material,
          c.materialName,
          c.unit,
          c.week,
          c.weekStart,
          c.grossRequirement,
          c.scheduledReceipt,
          c.projectedAvailable,
          c.netRequirement,
          c.plannedReceipt,
          c.releaseWeek,
          yesNo(c.pastDue),
          c.spend,
        ]),
      };
    }
  }
}

function requirePlan(planId: number | undefined): number {
  if (planId === undefined) throw AppError.validation('Say which plan version to export.', [{ path: 'query.plan', message: 'Give the plan id.' }]);
  return planId;
}
