import type { LotRule } from './planning-data';
import { lowLevelCodes } from './bom-graph';

/**
 * Material requirements planning after Orlicky, Material Requirements Planning, ch. 7–8
 * (DOMAIN.md §1). Items are processed in low-level-code order; for each item and period t:
 *
 *   gross      GR[t]  = independent demand[t] + Σ_parents qtyPer/(1 − scrap) · POR[parent, t]
 *   net        NR[t]  = max(0, GR[t] + SS − PA[t−1] − SR[t])
 *   receipt    PREC[t] from the lot rule applied to NR[t]
 *   projected  PA[t]  = PA[t−1] + SR[t] + PREC[t] − GR[t]
 *   release    POR[t − L] = PREC[t]; a release before period 1 is past due (flagged)
 *
 * Lot rules: lot-for-lot PREC = NR; fixed order quantity PREC = max(Q, NR) (Orlicky's
 * definition: raised to the net requirement when that is larger); minimum order quantity
 * PREC = max(MOQ, NR) (the same arithmetic, kept as its own rule because suppliers state it
 * so); period order quantity: one order covers the net requirements of the next P periods that
 * have one (periods without a requirement are skipped, as in the source's worked figure).
 * Periods are numbered 1..T; arrays are indexed period − 1.
 */

export interface MrpItemInput {
  code: string;
  onHand: number;
  leadTime: number;
  safetyStock?: number;
  /** scheduled receipts per period, index period − 1 */
  scheduledReceipts?: number[];
  lotRule?: LotRule;
  /** FOQ/MOQ quantity, or POQ number of periods */
  lotSize?: number;
}

export interface MrpLink {
  parent: string;
  component: string;
  qtyPer: number;
  scrapPct?: number;
}

export interface MrpInput {
  periods: number;
  items: MrpItemInput[];
  links: MrpLink[];
  /** independent (external) gross requirements per item, index period − 1 */
  independentDemand: Record<string, number[]>;
}

export interface PastDueRelease {
  /** period the receipt is needed in */
  needPeriod: number;
  /** period the order should have been released in (< 1) */
  releasePeriod: number;
  qty: number;
}

export interface MrpRecord {
  item: string;
  lowLevelCode: number;
  gross: number[];
  scheduledReceipts: number[];
  projectedAvailable: number[];
  net: number[];
  plannedReceipts: number[];
  plannedReleases: number[];
  pastDue: PastDueRelease[];
}

export function runMrp(input: MrpInput): Map<string, MrpRecord> {
  const T = input.periods;
  const codes = input.items.map((i) => i.code);
  const known = new Set(codes);
  for (const l of input.links) {
    if (!known.has(l.parent) || !known.has(l.component)) throw new Error(`MRP link ${l.parent} → ${l.component} names an unknown item`);
    if (!(l.qtyPer >= 0)) throw new Error(`MRP link ${l.parent} → ${l.component}: quantity per must be ≥ 0`);
  }
  for (const code of Object.keys(input.independentDemand))
    if (!known.has(code)) throw new Error(`MRP demand names an unknown item ${code}`);
  const llc = lowLevelCodes(codes, input.links);
  const order = [...input.items].sort((a, b) => llc.get(a.code)! - llc.get(b.code)! || a.code.localeCompare(b.code));
  const records = new Map<string, MrpRecord>();
  for (const item of order) {
    const gross = new Array<number>(T).fill(0);
    (input.independentDemand[item.code] ?? []).slice(0, T).forEach((q, i) => (gross[i] += q));
    for (const l of input.links) {
      if (l.component !== item.code) continue;
      const parent = records.get(l.parent)!; // parents have lower low-level codes: already planned
      const use = l.qtyPer / (1 - (l.scrapPct ?? 0) / 100);
      parent.plannedReleases.forEach((q, i) => (gross[i] += use * q));
    }
    records.set(item.code, { ...netItem(item, gross, T), lowLevelCode: llc.get(item.code)! });
  }
  return records;
}

/** Netting, lot sizing and offsetting for one item with known gross requirements. */
export function netItem(item: MrpItemInput, gross: number[], periods: number): Omit<MrpRecord, 'lowLevelCode'> {
  const T = periods;
  const sr = Array.from({ length: T }, (_, i) => item.scheduledReceipts?.[i] ?? 0);
  const ss = item.safetyStock ?? 0;
  const rule = item.lotRule ?? 'lot_for_lot';
  if (rule !== 'lot_for_lot' && !(item.lotSize !== undefined && item.lotSize > 0))
    throw new Error(`MRP item ${item.code}: lot rule ${rule} needs a positive lot size`);
  const pa = new Array<number>(T).fill(0);
  const net = new Array<number>(T).fill(0);
  const prec = new Array<number>(T).fill(0);
  let prev = item.onHand;
  for (let t = 0; t < T; t++) {
    net[t] = Math.max(0, gross[t] + ss - prev - sr[t]);
    if (net[t] > 0) prec[t] = lotSize(rule, item.lotSize ?? 0, net[t], t, gross, sr, ss, prev);
    pa[t] = prev + sr[t] + prec[t] - gross[t];
    prev = pa[t];
  }
  const releases = new Array<number>(T).fill(0);
  const pastDue: PastDueRelease[] = [];
  for (let t = 0; t < T; t++) {
    if (prec[t] <= 0) continue;
    const r = t - item.leadTime;
    if (r >= 0) releases[r] += prec[t];
    else pastDue.push({ needPeriod: t + 1, releasePeriod: r + 1, qty: prec[t] });
  }
  return { item: item.code, gross, scheduledReceipts: sr, projectedAvailable: pa, net, plannedReceipts: prec, plannedReleases: releases, pastDue };
}

function lotSize(rule: LotRule, size: number, nr: number, t: number, gross: number[], sr: number[], ss: number, prevPa: number): number {
  switch (rule) {
    case 'lot_for_lot':
      return nr;
    case 'fixed_order_quantity':
    case 'minimum_order_quantity':
      return Math.max(size, nr);
    case 'period_order_quantity': {
      // lot-for-lot net requirements from t on, then the sum of the first P that are positive
      let pa = prevPa;
      let covered = 0;
      let total = 0;
      for (let j = t; j < gross.length && covered < size; j++) {
        const n = Math.max(0, gross[j] + ss - pa - sr[j]);
        pa = pa + sr[j] + n - gross[j];
        if (n > 0) {
          covered++;
          total += n;
        }
      }
      return total;
    }
  }
}

/** Economic order quantity √(2·D·S/H) with D demand per period, S cost per order, H holding per unit and period. */
export function economicOrderQuantity(demandPerPeriod: number, orderCost: number, holdingPerUnitPeriod: number): number {
  if (!(holdingPerUnitPeriod > 0)) throw new Error('EOQ needs a positive holding cost');
  return Math.sqrt((2 * demandPerPeriod * orderCost) / holdingPerUnitPeriod);
}

/** Periods a period order quantity covers: EOQ ÷ average demand per period, rounded, at least 1. */
export function periodOrderQuantityPeriods(eoq: number, averageDemandPerPeriod: number): number {
  return Math.max(1, Math.round(eoq / averageDemandPerPeriod));
}

/**
 * Cost of a lot-sizing pattern: orders × cost per order + holding per unit and period × Σ end-of-
 * period stock, for planned receipts against requirements (both per period, no opening stock).
 */
export function lotSizingCost(receipts: number[], requirements: number[], orderCost: number, holdingPerUnitPeriod: number): number {
  let stock = 0;
  let cost = 0;
  receipts.forEach((q, t) => {
    if (q > 0) cost += orderCost;
    stock += q - (requirements[t] ?? 0);
    if (stock < -1e-9) throw new Error(`lot-sizing pattern runs short in period ${t + 1}`);
    cost += holdingPerUnitPeriod * stock;
  });
  return cost;
}
