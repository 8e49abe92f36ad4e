import type { Problem } from '@millrace/lp-core';
import type { PlanningData } from './planning-data';
import { validatePlanningData, type ValidationIssue } from './validate-planning-data';
import { componentUsePerUnit } from './bom-graph';
import { availableHours, overtimeCapHours } from './capacity';
import { loadHoursPerUnit } from './routing-load';
import { holdingCostPerUnitWeek, standardCosts } from './standard-cost';
import { LpBuilder } from './model/lp-builder';
import { modelName, type ColInfo, type ColKind, type ModelIndex, type RowInfo, type RowKind } from './model/model-index';
import { demandByWeek } from './demand';
import { supplyCap } from './material-supply';

/**
 * The weekly planning LP/QP (DESIGN.md "The planning model"; DOMAIN.md §1, multi-period
 * aggregate plan after Bowman 1956, Hanssmann & Hess 1960, Johnson & Montgomery 1974).
 *
 * Columns per product p and week t: make, stock, late (firm backlog), sell (forecast served,
 * ≤ forecast), short (safety-stock shortfall); per work center: overtime (clock hours, capped);
 * per material: buy (released in week t, received in t + lead time), mstock.
 *
 * Rows:
 *  bal[p,t]   make + stock[t−1] − late[t−1] − stock[t] + late[t] − sell − Σ_parents use·make[parent,t]
 *             = firm[t]  (− opening stock in week 1)
 *  cap[w,t]   Σ_p hours[p,w]·make[p,t] − efficiency·overtime[w,t] ≤ available[w,t]·(1 − reserve)
 *  mat[m,t]   mstock[t] − mstock[t−1] − buy[t − lead] + Σ_p use[p,m]·make[p,t] = receipts[t] (+ on hand in week 1)
 *  sup[m,t]   buy[t] ≤ weekly supply cap
 *  bkl[p,t]   late[t] − late[t−1] ≤ firm[t] − mustShip[t]: the week's firm shipments cover at
 *             least its must-ship orders, and are never negative (the backlog grows only by new
 *             ordinary orders, so a forecast is never served with a firm order's goods). In a week
 *             with must-ship orders the row is named must[p,t]: the hard requirement.
 *  ss[p,t]    stock[t] + short[t] ≥ safety stock                         (soft floor)
 *  chg[p,t]   make[t] − make[t−1] − change[t] = 0                        (smoothing only)
 *
 * Objective: minimise −contribution margin =
 *   −price·(firm demand − late[T]) − price·sell + extra unit cost·make + material unit cost·buy
 *   + overtime cost + holding·stock + late penalty·late + end-of-horizon penalty·late[T]
 *   + shortfall penalty·short + λ·Σ change²  (Q diagonal: ½·2λ·change²).
 */

export interface BuildOptions {
  horizonWeeks: number;
  /** production smoothing λ·Σ(make[t] − make[t−1])², λ in currency per unit² */
  smoothing?: { enabled: boolean; weight: number };
  /** round the plan to whole units and batch multiples afterwards (round-plan) */
  wholeUnits?: boolean;
  /**
   * % of regular time held back on every work center (default 0): an LP otherwise fills
   * capacity to 100 % (DOMAIN.md §5, keep a capacity buffer)
   */
  capacityReservePct?: number;
}

export interface BuiltModel {
  problem: Problem;
  index: ModelIndex;
}

export class PlanningDataError extends Error {
  constructor(readonly issues: ValidationIssue[]) {
    super(`planning data has ${issues.length} issue(s): ${issues.map((i) => i.message).join('; ')}`);
    this.name = 'PlanningDataError';
  }
}

export function buildModel(data: PlanningData, options: BuildOptions): BuiltModel {
  const issues = validatePlanningData(data, options.horizonWeeks);
  if (issues.length > 0) throw new PlanningDataError(issues);
  const smoothingWeight = options.smoothing?.enabled ? options.smoothing.weight : 0;
  if (!(smoothingWeight >= 0)) throw new Error(`smoothing weight must be ≥ 0, got ${options.smoothing?.weight}`);

  const reserve = options.capacityReservePct ?? 0;
  if (!(reserve >= 0 && reserve < 100)) throw new Error(`capacity reserve must be at least 0 % and below 100 %, got ${reserve}`);
  const T = options.horizonWeeks;
  const weeks = Array.from({ length: T }, (_, i) => i + 1);
  const lp = new LpBuilder();
  const colInfo: ColInfo[] = [];
  const rowInfo: RowInfo[] = [];
  const none = () => weeks.map(() => -1);
  const products = data.products.map((p) => p.code);
  const workCenters = data.workCenters.map((w) => w.code);
  const materials = data.materials.map((m) => m.code);
  const col = {} as Record<ColKind, number[][]>;
  const row = {} as Record<RowKind, number[][]>;
  for (const k of ['make', 'stock', 'late', 'sell', 'short', 'change'] as const) col[k] = products.map(none);
  col.overtime = workCenters.map(none);
  for (const k of ['buy', 'mstock'] as const) col[k] = materials.map(none);
  for (const k of ['balance', 'backlog', 'safety_stock', 'must_ship', 'smoothing'] as const) row[k] = products.map(none);
  row.capacity = workCenters.map(none);
  for (const k of ['material', 'supply'] as const) row[k] = materials.map(none);

  const addCol = (kind: ColKind, item: string, week: number, lower: number, upper: number, cost: number) => {
    colInfo.push({ kind, item, week });
    return lp.addColumn(modelName(kind, item, week), lower, upper, cost);
  };
  const addRow = (kind: RowKind, prefix: string, item: string, week: number, lower: number, upper: number, terms: [number, number][]) => {
    rowInfo.push({ kind, item, week });
    return lp.addRow(modelName(prefix, item, week), lower, upper, terms);
  };

  const demand = demandByWeek(data, T);
  const stdCost = standardCosts(data);
  const plant = data.plant;

  // product columns
  let firmRevenueConstant = 0;
  data.products.forEach((p, i) => {
    const d = demand.get(p.code)!;
    const holding = holdingCostPerUnitWeek(p, stdCost.get(p.code) ?? 0);
    const endPenalty = plant.endBackorderPenaltyPerUnit ?? p.latePenalty * T;
    const shortPenalty = plant.safetyShortfallPenaltyPerUnitWeek ?? p.latePenalty / 2;
    const firstFirm = d.firm.findIndex((q) => q > 0);
    firmRevenueConstant -= p.price * d.firm.reduce((a, q) => a + q, 0);
    for (const t of weeks) {
      col.make[i][t - 1] = addCol('make', p.code, t, 0, Infinity, p.extraUnitCost ?? 0);
      col.stock[i][t - 1] = addCol('stock', p.code, t, 0, Infinity, holding);
      if (firstFirm >= 0 && t - 1 >= firstFirm) {
        const cost = p.latePenalty + (t === T ? p.price + endPenalty : 0);
        col.late[i][t - 1] = addCol('late', p.code, t, 0, Infinity, cost);
      }
      if (d.forecast[t - 1] > 0) col.sell[i][t - 1] = addCol('sell', p.code, t, 0, d.forecast[t - 1], -p.price);
      if (p.safetyStock > 0) col.short[i][t - 1] = addCol('short', p.code, t, 0, p.safetyStock, shortPenalty);
      if (smoothingWeight > 0 && t > 1) {
        const c = addCol('change', p.code, t, -Infinity, Infinity, 0);
        lp.addQuadratic(c, 2 * smoothingWeight);
        col.change[i][t - 1] = c;
      }
    }
  });
  lp.addConstant(firmRevenueConstant);

  // work center columns
  data.workCenters.forEach((w, k) => {
    for (const t of weeks) col.overtime[k][t - 1] = addCol('overtime', w.code, t, 0, overtimeCapHours(w, t), w.overtimeCostPerHour);
  });

  // material columns: buy released in t arrives in t + lead, so only releases with t + lead ≤ T
  data.materials.forEach((m, j) => {
    for (const t of weeks) {
      if (t + m.leadTimeWeeks <= T) col.buy[j][t - 1] = addCol('buy', m.code, t, 0, Infinity, m.unitCost);
      col.mstock[j][t - 1] = addCol('mstock', m.code, t, 0, Infinity, m.holdingCostPerUnitWeek ?? 0);
    }
  });

  const pIdx = new Map(products.map((c, i) => [c, i]));

  // product balance
  data.products.forEach((p, i) => {
    const d = demand.get(p.code)!;
    const usedBy = data.bom.filter((b) => b.componentProduct === p.code);
    for (const t of weeks) {
      const terms: [number, number][] = [[col.make[i][t - 1], 1], [col.stock[i][t - 1], -1]];
      if (t > 1) terms.push([col.stock[i][t - 2], 1]);
      if (col.late[i][t - 1] >= 0) terms.push([col.late[i][t - 1], 1]);
      if (t > 1 && col.late[i][t - 2] >= 0) terms.push([col.late[i][t - 2], -1]);
      if (col.sell[i][t - 1] >= 0) terms.push([col.sell[i][t - 1], -1]);
      for (const b of usedBy) terms.push([col.make[pIdx.get(b.parent)!][t - 1], -componentUsePerUnit(b)]);
      const rhs = d.firm[t - 1] - (t === 1 ? p.openingStock : 0);
      row.balance[i][t - 1] = addRow('balance', 'bal', p.code, t, rhs, rhs, terms);
    }
  });

  // capacity
  const load = loadHoursPerUnit(data);
  data.workCenters.forEach((w, k) => {
    const loaders = data.products
      .map((p, i) => [i, load.get(p.code)?.get(w.code) ?? 0] as const)
      .filter(([, h]) => h > 0);
    if (loaders.length === 0) return;
    for (const t of weeks) {
      const terms: [number, number][] = loaders.map(([i, h]) => [col.make[i][t - 1], h]);
      terms.push([col.overtime[k][t - 1], -w.efficiency]);
      row.capacity[k][t - 1] = addRow('capacity', 'cap', w.code, t, -Infinity, availableHours(w, t) * (1 - reserve / 100), terms);
    }
  });

  // materials
  data.materials.forEach((m, j) => {
    const users = data.bom.filter((b) => b.material === m.code);
    for (const t of weeks) {
      const terms: [number, number][] = [[col.mstock[j][t - 1], 1]];
      if (t > 1) terms.push([col.mstock[j][t - 2], -1]);
      const release = t - m.leadTimeWeeks;
      if (release >= 1 && col.buy[j][release - 1] >= 0) terms.push([col.buy[j][release - 1], -1]);
      for (const b of users) terms.push([col.make[pIdx.get(b.parent)!][t - 1], componentUsePerUnit(b)]);
      const receipts = m.scheduledReceipts.filter((r) => r.week === t).reduce((a, r) => a + r.qty, 0);
      const rhs = receipts + (t === 1 ? m.onHand : 0);
      row.material[j][t - 1] = addRow('material', 'mat', m.code, t, rhs, rhs, terms);
    }
    for (const t of weeks) {
      const b = col.buy[j][t - 1];
      const cap = supplyCap(m, t);
      if (b >= 0 && cap !== null) row.supply[j][t - 1] = addRow('supply', 'sup', m.code, t, -Infinity, cap, [[b, 1]]);
    }
  });

  // backlog and must-ship, safety stock, smoothing
  data.products.forEach((p, i) => {
    const d = demand.get(p.code)!;
    for (const t of weeks) {
      if (col.late[i][t - 1] >= 0) {
        const terms: [number, number][] = [[col.late[i][t - 1], 1]];
        if (t > 1 && col.late[i][t - 2] >= 0) terms.push([col.late[i][t - 2], -1]);
        const ordinary = d.firm[t - 1] - d.mustShip[t - 1];
        if (d.mustShip[t - 1] > 0) row.must_ship[i][t - 1] = addRow('must_ship', 'must', p.code, t, -Infinity, ordinary, terms);
        else row.backlog[i][t - 1] = addRow('backlog', 'bkl', p.code, t, -Infinity, ordinary, terms);
      }
      if (col.short[i][t - 1] >= 0)
        row.safety_stock[i][t - 1] = addRow('safety_stock', 'ss', p.code, t, p.safetyStock, Infinity, [
          [col.stock[i][t - 1], 1],
          [col.short[i][t - 1], 1],
        ]);
      if (col.change[i][t - 1] >= 0)
        row.smoothing[i][t - 1] = addRow('smoothing', 'chg', p.code, t, 0, 0, [
          [col.make[i][t - 1], 1],
          [col.make[i][t - 2], -1],
          [col.change[i][t - 1], -1],
        ]);
    }
  });

  const problem = lp.build(`millrace-plan-${T}w`);
  return {
    problem,
    index: {
      horizonWeeks: T,
      products,
      workCenters,
      materials,
      col,
      row,
      rowInfo,
      colInfo,
      firmRevenueConstant,
      smoothingWeight,
      wholeUnits: options.wholeUnits ?? false,
    },
  };
}
