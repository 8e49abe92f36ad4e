import type { PlanningData } from './planning-data';
import type { ProductWeekLine } from './plan';
import { componentUsePerUnit, lowLevelCodes } from './bom-graph';
import { netItem, type MrpRecord } from './mrp';

/** A purchase suggestion from the plan: order `qty` of a material in `releaseWeek` so it arrives in `receiptWeek`. */
export interface MaterialCall {
  material: string;
  releaseWeek: number;
  receiptWeek: number;
  qty: number;
  /** the release week falls before week 1: the order is already late */
  pastDue: boolean;
  cost: number;
}

export interface MaterialCallResult {
  calls: MaterialCall[];
  /** the MRP record behind the calls, per material */
  records: MrpRecord[];
}

/**
 * Material calls for a plan (material requirements planning, Orlicky; see mrp.ts). The plan
 * already fixes how many of every product, sub-assemblies included, are made in each week, so
 * the gross requirement of a material is its use by the week's production (quantity per,
 * scrap included); each material is then netted against on-hand stock and scheduled receipts,
 * lot-sized by its lot rule and offset by its lead time.
 */
export function materialCalls(data: PlanningData, horizonWeeks: number, products: ProductWeekLine[]): MaterialCallResult {
  const makeOf = new Map(products.map((l) => [`${l.product}|${l.week}`, l.make]));
  const calls: MaterialCall[] = [];
  const records: MrpRecord[] = [];
  const llc = lowLevelCodes(
    [...data.products.map((p) => p.code), ...data.materials.map((m) => m.code)],
    data.bom.map((b) => ({ parent: b.parent, component: (b.componentProduct ?? b.material)! })),
  );
  for (const m of data.materials) {
    const gross = new Array<number>(horizonWeeks).fill(0);
    for (const b of data.bom)
      if (b.material === m.code)
        for (let t = 1; t <= horizonWeeks; t++) gross[t - 1] += componentUsePerUnit(b) * (makeOf.get(`${b.parent}|${t}`) ?? 0);
    const sr = new Array<number>(horizonWeeks).fill(0);
    for (const r of m.scheduledReceipts) if (r.week >= 1 && r.week <= horizonWeeks) sr[r.week - 1] += r.qty;
    const rec = netItem(
      { code: m.code, onHand: m.onHand, leadTime: m.leadTimeWeeks, scheduledReceipts: sr, lotRule: m.lotRule, lotSize: m.lotSize },
      gross.map((g) => (Math.abs(g) < 1e-9 ? 0 : g)),
      horizonWeeks,
    );
    records.push({ ...rec, lowLevelCode: llc.get(m.code) ?? 0 });
    rec.plannedReceipts.forEach((q, i) => {
      if (q <= 1e-9) return;
      const receiptWeek = i + 1;
      const releaseWeek = receiptWeek - m.leadTimeWeeks;
      calls.push({ material: m.code, releaseWeek, receiptWeek, qty: q, pastDue: releaseWeek < 1, cost: q * m.unitCost });
    });
  }
  return { calls, records };
}
