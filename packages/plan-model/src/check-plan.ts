import type { PlanningData } from './planning-data';
import type { Plan } from './plan';
import { componentUsePerUnit } from './bom-graph';
import { availableHours, overtimeCapHours } from './capacity';
import { demandByWeek } from './demand';
import { loadHoursPerUnit } from './routing-load';
import { supplyCap } from './material-supply';

/**
 * Independent plan checker: re-verifies a plan's quantities against the planning data, never
 * against the LP it came from. It recomputes use in parents, load and material use from the
 * BOM and routings and checks every balance, capacity (with overtime caps), material stock
 * (receipts, purchases after their lead time, supply caps), bound and sign.
 */
export type PlanViolationKind =
  | 'missing_line'
  | 'negative_quantity'
  | 'product_balance'
  | 'firm_shipment'
  | 'forecast_exceeded'
  | 'capacity_exceeded'
  | 'overtime_cap_exceeded'
  | 'material_balance'
  | 'material_negative'
  | 'supply_cap_exceeded'
  | 'must_ship_late'
  | 'reported_value';

export interface PlanViolation {
  kind: PlanViolationKind;
  item: string;
  week: number;
  /** how far off, in the row's unit */
  amount: number;
  message: string;
}

export interface CheckOptions {
  /** tolerance relative to 1 + the size of the quantities in each check (default 1e-6) */
  tolerance?: number;
}

export function checkPlan(data: PlanningData, plan: Plan, options: CheckOptions = {}): PlanViolation[] {
  const tol = options.tolerance ?? 1e-6;
  const T = plan.horizonWeeks;
  const out: PlanViolation[] = [];
  const off = (diff: number, scale: number) => Math.abs(diff) > tol * (1 + Math.abs(scale));
  const add = (kind: PlanViolationKind, item: string, week: number, amount: number, message: string) =>
    out.push({ kind, item, week, amount, message });

  const pl = new Map(plan.products.map((l) => [`${l.product}|${l.week}`, l]));
  const wl = new Map(plan.workCenters.map((l) => [`${l.workCenter}|${l.week}`, l]));
  const ml = new Map(plan.materials.map((l) => [`${l.material}|${l.week}`, l]));
  // production per product and week (index week − 1), read once from the plan's lines
  const makeByProduct = new Map<string, number[]>();
  for (const l of plan.products) {
    if (l.week < 1 || l.week > T) continue;
    let row = makeByProduct.get(l.product);
    if (!row) makeByProduct.set(l.product, (row = new Array<number>(T).fill(0)));
    row[l.week - 1] = l.make;
  }
  const make = (p: string, t: number) => makeByProduct.get(p)?.[t - 1] ?? 0;

  // completeness and signs
  for (const p of data.products)
    for (let t = 1; t <= T; t++) {
      const l = pl.get(`${p.code}|${t}`);
      if (!l) {
        add('missing_line', p.code, t, 0, `product ${p.code} has no plan line for week ${t}`);
        continue;
      }
      const size = Math.max(Math.abs(l.make), Math.abs(l.stock), Math.abs(l.late), Math.abs(l.ship), Math.abs(l.usedInParents));
      for (const f of ['make', 'stock', 'late', 'shipFirm', 'shipForecast'] as const)
        if (l[f] < -tol * (1 + size)) add('negative_quantity', p.code, t, l[f], `product ${p.code} week ${t}: ${f} is negative (${l[f]})`);
    }
  for (const w of data.workCenters)
    for (let t = 1; t <= T; t++) {
      const l = wl.get(`${w.code}|${t}`);
      if (!l) add('missing_line', w.code, t, 0, `work center ${w.code} has no plan line for week ${t}`);
      else if (l.overtimeHours < -tol) add('negative_quantity', w.code, t, l.overtimeHours, `work center ${w.code} week ${t}: negative overtime`);
    }
  for (const m of data.materials)
    for (let t = 1; t <= T; t++) {
      const l = ml.get(`${m.code}|${t}`);
      if (!l) add('missing_line', m.code, t, 0, `material ${m.code} has no plan line for week ${t}`);
      else if (l.buy < -tol) add('negative_quantity', m.code, t, l.buy, `material ${m.code} week ${t}: negative purchase`);
    }

  // product balances
  const demand = demandByWeek(data, T);
  for (const p of data.products) {
    const d = demand.get(p.code)!;
    const parents = data.bom.filter((b) => b.componentProduct === p.code);
    let stockPrev = p.openingStock;
    let latePrev = 0;
    for (let t = 1; t <= T; t++) {
      const l = pl.get(`${p.code}|${t}`);
      if (!l) continue;
      const used = parents.reduce((a, b) => a + componentUsePerUnit(b) * make(b.parent, t), 0);
      const lhs = l.stock - l.late;
      const rhs = stockPrev - latePrev + l.make - d.firm[t - 1] - l.shipForecast - used;
      if (off(lhs - rhs, Math.max(Math.abs(l.make), d.firm[t - 1], used, Math.abs(l.stock), l.late, stockPrev, latePrev)))
        add('product_balance', p.code, t, lhs - rhs, `product ${p.code} week ${t}: stock − backlog is ${lhs} but production, demand and use give ${rhs}`);
      const shipFirm = d.firm[t - 1] + latePrev - l.late;
      if (off(l.shipFirm - shipFirm, d.firm[t - 1] + latePrev + l.late))
        add('firm_shipment', p.code, t, l.shipFirm - shipFirm, `product ${p.code} week ${t}: firm shipment ${l.shipFirm} does not match orders and backlog (${shipFirm})`);
      if (l.shipForecast > d.forecast[t - 1] + tol * (1 + d.forecast[t - 1]))
        add('forecast_exceeded', p.code, t, l.shipForecast - d.forecast[t - 1], `product ${p.code} week ${t}: ships ${l.shipForecast} against a forecast of ${d.forecast[t - 1]}`);
      if (off(l.usedInParents - used, used))
        add('reported_value', p.code, t, l.usedInParents - used, `product ${p.code} week ${t}: use in parents reported ${l.usedInParents}, BOM gives ${used}`);
      if (d.mustShip[t - 1] > 0 && l.shipFirm < d.mustShip[t - 1] - tol * (1 + d.mustShip[t - 1]))
        add('must_ship_late', p.code, t, d.mustShip[t - 1] - l.shipFirm, `product ${p.code} week ${t}: ships ${l.shipFirm} of firm orders, less than the ${d.mustShip[t - 1]} that must ship`);
      stockPrev = l.stock;
      latePrev = l.late;
    }
  }

  // capacity
  const load = loadHoursPerUnit(data);
  for (const w of data.workCenters) {
    const loaders = [...load].filter(([, perWc]) => perWc.has(w.code)).map(([p, perWc]) => ({ hours: perWc.get(w.code)!, make: makeByProduct.get(p) }));
    for (let t = 1; t <= T; t++) {
      const l = wl.get(`${w.code}|${t}`);
      if (!l) continue;
      let hours = 0;
      for (const x of loaders) hours += x.hours * (x.make?.[t - 1] ?? 0);
      const avail = availableHours(w, t);
      const cap = overtimeCapHours(w, t);
      if (l.overtimeHours > cap + tol * (1 + cap))
        add('overtime_cap_exceeded', w.code, t, l.overtimeHours - cap, `work center ${w.code} week ${t}: ${l.overtimeHours} h overtime above the cap of ${cap} h`);
      const excess = hours - avail - w.efficiency * l.overtimeHours;
      if (excess > tol * (1 + avail + hours))
        add('capacity_exceeded', w.code, t, excess, `work center ${w.code} week ${t}: load ${hours} h exceeds ${avail} h regular time plus overtime`);
      if (off(l.loadHours - hours, hours))
        add('reported_value', w.code, t, l.loadHours - hours, `work center ${w.code} week ${t}: load reported ${l.loadHours} h, routings give ${hours} h`);
    }
  }

  // materials
  for (const m of data.materials) {
    const users = data.bom.filter((b) => b.material === m.code);
    let stock = m.onHand;
    // the stock is walked forward from on hand, so rounding in the plan's numbers adds up over
    // the weeks: tolerances scale with the largest flow seen so far
    let scale = m.onHand;
    for (let t = 1; t <= T; t++) {
      const l = ml.get(`${m.code}|${t}`);
      if (!l) continue;
      const use = users.reduce((a, b) => a + componentUsePerUnit(b) * make(b.parent, t), 0);
      const receipts = m.scheduledReceipts.filter((r) => r.week === t).reduce((a, r) => a + r.qty, 0);
      const release = t - m.leadTimeWeeks;
      const arriving = release >= 1 ? (ml.get(`${m.code}|${release}`)?.buy ?? 0) : 0;
      scale = Math.max(scale, use, receipts, arriving, Math.abs(stock), Math.abs(l.stock));
      stock = stock + receipts + arriving - use;
      if (stock < -tol * (1 + scale))
        add('material_negative', m.code, t, stock, `material ${m.code} week ${t}: use ${use} exceeds what is on hand (short ${-stock})`);
      if (off(l.stock - stock, scale))
        add('material_balance', m.code, t, l.stock - stock, `material ${m.code} week ${t}: stock reported ${l.stock}, receipts, purchases and use give ${stock}`);
      const cap = supplyCap(m, t);
      if (cap !== null && l.buy > cap + tol * (1 + cap))
        add('supply_cap_exceeded', m.code, t, l.buy - cap, `material ${m.code} week ${t}: buys ${l.buy} above the supply cap of ${cap}`);
      if (off(l.use - use, use))
        add('reported_value', m.code, t, l.use - use, `material ${m.code} week ${t}: use reported ${l.use}, BOM gives ${use}`);
    }
  }
  return out;
}
