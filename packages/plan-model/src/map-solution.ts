import type { SolveResult } from '@millrace/lp-core';
import type { PlanningData } from './planning-data';
import type { BuiltModel } from './build-model';
import type { BottleneckValue, MaterialWeekLine, Plan, ProductMarginal, ProductWeekLine, WorkCenterWeekLine } from './plan';
import { availableHours, overtimeCapHours } from './capacity';
import { componentUsePerUnit } from './bom-graph';
import { demandByWeek } from './demand';
import { loadHoursPerUnit } from './routing-load';
import { supplyCap } from './material-supply';
import { planMargin } from './plan-margin';
import { explainUnmetOrders } from './explain-unmet';
import { materialCalls } from './material-calls';
import { explainInfeasibility } from './explain-infeasibility';
import { money, qty } from './format';
import { snap, TOLERANCES } from './tolerances';

/**
 * Solution of the planning model → plan. Quantities come from the columns; loads, use and
 * stocks are recomputed from the planning data; bottleneck values are the duals of the
 * capacity, material and supply rows with the sign turned so that a binding resource has a
 * positive value of one more unit (lp-core's convention: y ≤ 0 on a binding ≤ row of a
 * minimisation, and the model minimises −margin).
 */
export function mapSolution(data: PlanningData, built: BuiltModel, result: SolveResult): Plan {
  const { index } = built;
  const T = index.horizonWeeks;
  const empty: Plan = {
    horizonWeeks: T,
    currency: data.plant.currency,
    outcome: 'not_solved',
    objective: null,
    smoothingCost: 0,
    margin: { revenue: 0, materialSpend: 0, extraUnitCost: 0, overtimeCost: 0, holdingCost: 0, latePenalty: 0, endBackorderPenalty: 0, safetyShortfallPenalty: 0, margin: 0 },
    products: [],
    workCenters: [],
    materials: [],
    bottlenecks: [],
    productMarginals: [],
    unmetOrders: [],
    materialCalls: [],
    infeasibility: [],
  };
  if (result.status === 'infeasible') return { ...empty, outcome: 'infeasible', infeasibility: explainInfeasibility(data, built, result.ray) };
  if (result.status !== 'optimal')
    return { ...empty, infeasibility: [`The solver stopped with status ${result.status}${result.message ? `: ${result.message}` : ''}; no plan.`] };

  const x = (c: number) => (c >= 0 ? snap(result.x[c]) : 0);
  const dualValue = (r: number) => (r >= 0 ? snap(-result.rowDuals[r]) : 0);

  const products = productLines(data, built, x);
  const workCenters = workCenterLines(data, built, x, products, dualValue);
  const materials = materialLines(data, built, x, products, dualValue);
  const lines = { products, workCenters, materials };
  const margin = planMargin(data, T, lines);
  let smoothingCost = 0;
  for (const row of index.col.change) for (const c of row) if (c >= 0) smoothingCost += index.smoothingWeight * x(c) ** 2;

  return {
    ...empty,
    outcome: 'optimal',
    objective: result.objective,
    smoothingCost,
    margin,
    products,
    workCenters,
    materials,
    bottlenecks: bottleneckValues(data, workCenters, materials),
    productMarginals: productMarginals(data, built, result, products),
    unmetOrders: explainUnmetOrders(data, T, lines),
    materialCalls: materialCalls(data, T, products).calls,
  };
}

function productLines(data: PlanningData, built: BuiltModel, x: (c: number) => number): ProductWeekLine[] {
  const { index } = built;
  const T = index.horizonWeeks;
  const demand = demandByWeek(data, T);
  const pIdx = new Map(index.products.map((c, i) => [c, i]));
  const out: ProductWeekLine[] = [];
  data.products.forEach((p, i) => {
    const d = demand.get(p.code)!;
    const parents = data.bom.filter((b) => b.componentProduct === p.code);
    for (let t = 1; t <= T; t++) {
      const make = x(index.col.make[i][t - 1]);
      const late = x(index.col.late[i][t - 1]);
      const latePrev = t > 1 ? x(index.col.late[i][t - 2]) : 0;
      const stock = x(index.col.stock[i][t - 1]);
      const shipFirm = snap(d.firm[t - 1] + latePrev - late);
      const shipForecast = x(index.col.sell[i][t - 1]);
      const usedInParents = parents.reduce((a, b) => a + componentUsePerUnit(b) * x(index.col.make[pIdx.get(b.parent)!][t - 1]), 0);
      out.push({
        product: p.code,
        week: t,
        make,
        shipFirm,
        shipForecast,
        ship: shipFirm + shipForecast,
        usedInParents,
        stock,
        late,
        safetyShortfall: Math.max(0, p.safetyStock - stock),
      });
    }
  });
  return out;
}

function workCenterLines(
  data: PlanningData,
  built: BuiltModel,
  x: (c: number) => number,
  products: ProductWeekLine[],
  dualValue: (r: number) => number,
): WorkCenterWeekLine[] {
  const { index } = built;
  const load = loadHoursPerUnit(data);
  // production per product and week (index week − 1)
  const makeOf = new Map<string, number[]>();
  for (const l of products) {
    let row = makeOf.get(l.product);
    if (!row) makeOf.set(l.product, (row = new Array<number>(index.horizonWeeks).fill(0)));
    row[l.week - 1] = l.make;
  }
  const out: WorkCenterWeekLine[] = [];
  data.workCenters.forEach((w, k) => {
    // only the products routed through this work center add load
    const loaders = [...load].filter(([, perWc]) => perWc.has(w.code)).map(([p, perWc]) => ({ hours: perWc.get(w.code)!, make: makeOf.get(p) }));
    for (let t = 1; t <= index.horizonWeeks; t++) {
      let loadHours = 0;
      for (const l of loaders) loadHours += l.hours * (l.make?.[t - 1] ?? 0);
      const available = availableHours(w, t);
      const overtimeHours = x(index.col.overtime[k][t - 1]);
      const cap = overtimeCapHours(w, t);
      const r = index.row.capacity[k][t - 1];
      const value = dualValue(r);
      const slack = available + w.efficiency * overtimeHours - loadHours;
      const tight = r >= 0 && slack <= TOLERANCES.tightRelative * (1 + available) * 10;
      out.push({
        workCenter: w.code,
        week: t,
        loadHours,
        availableHours: available,
        overtimeHours,
        overtimeCapHours: cap === Infinity ? null : cap,
        loadPct: available > 0 ? (100 * loadHours) / available : null,
        binding: tight && value > TOLERANCES.value,
        bottleneckValue: value,
      });
    }
  });
  return out;
}

function materialLines(
  data: PlanningData,
  built: BuiltModel,
  x: (c: number) => number,
  products: ProductWeekLine[],
  dualValue: (r: number) => number,
): MaterialWeekLine[] {
  const { index } = built;
  const makeOf = new Map(products.map((l) => [`${l.product}|${l.week}`, l.make]));
  const out: MaterialWeekLine[] = [];
  data.materials.forEach((m, j) => {
    const users = data.bom.filter((b) => b.material === m.code);
    for (let t = 1; t <= index.horizonWeeks; t++) {
      const release = t - m.leadTimeWeeks;
      const arriving = release >= 1 ? x(index.col.buy[j][release - 1]) : 0;
      out.push({
        material: m.code,
        week: t,
        buy: x(index.col.buy[j][t - 1]),
        arriving,
        scheduledReceipt: m.scheduledReceipts.filter((r) => r.week === t).reduce((a, r) => a + r.qty, 0),
        use: users.reduce((a, b) => a + componentUsePerUnit(b) * (makeOf.get(`${b.parent}|${t}`) ?? 0), 0),
        stock: x(index.col.mstock[j][t - 1]),
        supplyCap: supplyCap(m, t),
        bottleneckValue: dualValue(index.row.material[j][t - 1]),
        supplyCapValue: dualValue(index.row.supply[j][t - 1]),
      });
    }
  });
  return out;
}

function bottleneckValues(data: PlanningData, workCenters: WorkCenterWeekLine[], materials: MaterialWeekLine[]): BottleneckValue[] {
  const out: BottleneckValue[] = [];
  const describe = (v: number[], w: number[]) => w.map((wk, i) => `${money(v[i])} in week ${wk}`).join(', ');
  for (const w of data.workCenters) {
    const b = workCenters.filter((l) => l.workCenter === w.code && l.binding);
    if (b.length === 0) continue;
    const weeks = b.map((l) => l.week);
    const values = b.map((l) => l.bottleneckValue);
    out.push({ kind: 'capacity', item: w.code, name: w.name, weeks, values, unit: 'per_hour', text: `${w.name}: one more hour is worth ${describe(values, weeks)}` });
  }
  for (const m of data.materials) {
    const scarce = materials.filter((l) => l.material === m.code && l.bottleneckValue > m.unitCost + TOLERANCES.value);
    if (scarce.length > 0) {
      const weeks = scarce.map((l) => l.week);
      const values = scarce.map((l) => l.bottleneckValue);
      out.push({
        kind: 'material', item: m.code, name: m.name, weeks, values, unit: 'per_unit',
        text: `${m.name}: one more unit in stock is worth ${describe(values, weeks)} (purchase cost ${money(m.unitCost)})`,
      });
    }
    const capped = materials.filter((l) => l.material === m.code && l.supplyCapValue > TOLERANCES.value);
    if (capped.length > 0) {
      const weeks = capped.map((l) => l.week);
      const values = capped.map((l) => l.supplyCapValue);
      out.push({
        kind: 'supply_cap', item: m.code, name: m.name, weeks, values, unit: 'per_unit',
        text: `${m.name}: one more unit of weekly supply is worth ${describe(values, weeks)}`,
      });
    }
  }
  return out;
}

function productMarginals(data: PlanningData, built: BuiltModel, result: SolveResult, products: ProductWeekLine[]): ProductMarginal[] {
  const { index } = built;
  return data.products.map((p, i) => {
    const made = products.filter((l) => l.product === p.code).reduce((a, l) => a + l.make, 0);
    // make one more unit in week t and sell it to that week's forecast when there is one: the
    // balance row's dual cancels, so the value is unique even when stock and sales sit at bounds
    const reducedCostByWeek = index.col.make[i].map((c, k) => {
      const sell = index.col.sell[i][k];
      return snap(result.reducedCosts[c] + (sell >= 0 ? result.reducedCosts[sell] : 0));
    });
    const worst = Math.min(...reducedCostByWeek);
    if (made > TOLERANCES.quantity)
      return { product: p.code, made, reducedCostByWeek, outcome: 'made' as const, text: `${p.name}: ${qty(made)} ${p.unit} made` };
    if (worst > TOLERANCES.value)
      return {
        product: p.code, made, reducedCostByWeek, outcome: 'not_worth_making' as const,
        text: `${p.name}: not worth making — each unit made would lower the margin by at least ${money(worst)}`,
      };
    return { product: p.code, made, reducedCostByWeek, outcome: 'not_needed' as const, text: `${p.name}: nothing to make` };
  });
}
