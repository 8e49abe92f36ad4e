import type { Plan } from './plan';

/**
 * Side-by-side comparison of two plans (e.g. the approved plan and a scenario), as plain JSON
 * for the UI: margin and its parts, overtime, load per work center, unmet orders, material
 * spend and the quantities that differ. Differences are `b − a`.
 */
export interface NumberPair {
  a: number;
  b: number;
  diff: number;
}

export interface WorkCenterComparison {
  workCenter: string;
  loadHours: NumberPair;
  overtimeHours: NumberPair;
  /** weeks in which the work center binds in each plan */
  bindingWeeksA: number[];
  bindingWeeksB: number[];
}

export interface QuantityDifference {
  product: string;
  week: number;
  makeA: number;
  makeB: number;
  shipA: number;
  shipB: number;
  lateA: number;
  lateB: number;
}

export interface UnmetOrderComparison {
  orderRef: string;
  product: string;
  week: number;
  /** short quantity in each plan; 0 when the order is met */
  shortA: number;
  shortB: number;
}

export interface PlanComparison {
  horizonWeeks: NumberPair;
  margin: NumberPair;
  revenue: NumberPair;
  materialSpend: NumberPair;
  overtimeCost: NumberPair;
  overtimeHours: NumberPair;
  holdingCost: NumberPair;
  latePenalties: NumberPair;
  unmetOrderCount: NumberPair;
  shortUnits: NumberPair;
  workCenters: WorkCenterComparison[];
  unmetOrders: UnmetOrderComparison[];
  quantityDifferences: QuantityDifference[];
}

const pair = (a: number, b: number): NumberPair => ({ a, b, diff: b - a });
const sum = <T,>(xs: T[], f: (x: T) => number) => xs.reduce((s, x) => s + f(x), 0);

export function comparePlans(a: Plan, b: Plan, options: { quantityTolerance?: number } = {}): PlanComparison {
  const tol = options.quantityTolerance ?? 1e-6;
  const wcCodes = [...new Set([...a.workCenters, ...b.workCenters].map((l) => l.workCenter))].sort();
  const workCenters = wcCodes.map((code) => {
    const la = a.workCenters.filter((l) => l.workCenter === code);
    const lb = b.workCenters.filter((l) => l.workCenter === code);
    return {
      workCenter: code,
      loadHours: pair(sum(la, (l) => l.loadHours), sum(lb, (l) => l.loadHours)),
      overtimeHours: pair(sum(la, (l) => l.overtimeHours), sum(lb, (l) => l.overtimeHours)),
      bindingWeeksA: la.filter((l) => l.binding).map((l) => l.week),
      bindingWeeksB: lb.filter((l) => l.binding).map((l) => l.week),
    };
  });

  const orders = new Map<string, UnmetOrderComparison>();
  const key = (u: { orderRef: string; product: string; week: number }) => `${u.product}|${u.week}|${u.orderRef}`;
  for (const u of a.unmetOrders) orders.set(key(u), { orderRef: u.orderRef, product: u.product, week: u.week, shortA: u.shortQty, shortB: 0 });
  for (const u of b.unmetOrders) {
    const known = orders.get(key(u));
    if (known) known.shortB = u.shortQty;
    else orders.set(key(u), { orderRef: u.orderRef, product: u.product, week: u.week, shortA: 0, shortB: u.shortQty });
  }

  const lineB = new Map(b.products.map((l) => [`${l.product}|${l.week}`, l]));
  const lineA = new Map(a.products.map((l) => [`${l.product}|${l.week}`, l]));
  const allKeys = [...new Set([...lineA.keys(), ...lineB.keys()])];
  const quantityDifferences: QuantityDifference[] = [];
  for (const k of allKeys) {
    const x = lineA.get(k);
    const y = lineB.get(k);
    const [product, week] = [(x ?? y)!.product, (x ?? y)!.week];
    const d: QuantityDifference = {
      product, week,
      makeA: x?.make ?? 0, makeB: y?.make ?? 0,
      shipA: x?.ship ?? 0, shipB: y?.ship ?? 0,
      lateA: x?.late ?? 0, lateB: y?.late ?? 0,
    };
    if (Math.abs(d.makeA - d.makeB) > tol || Math.abs(d.shipA - d.shipB) > tol || Math.abs(d.lateA - d.lateB) > tol) quantityDifferences.push(d);
  }
  quantityDifferences.sort((p, q) => p.product.localeCompare(q.product) || p.week - q.week);

  return {
    horizonWeeks: pair(a.horizonWeeks, b.horizonWeeks),
    margin: pair(a.margin.margin, b.margin.margin),
    revenue: pair(a.margin.revenue, b.margin.revenue),
    materialSpend: pair(a.margin.materialSpend, b.margin.materialSpend),
    overtimeCost: pair(a.margin.overtimeCost, b.margin.overtimeCost),
    overtimeHours: pair(sum(a.workCenters, (l) => l.overtimeHours), sum(b.workCenters, (l) => l.overtimeHours)),
    holdingCost: pair(a.margin.holdingCost, b.margin.holdingCost),
    latePenalties: pair(a.margin.latePenalty + a.margin.endBackorderPenalty, b.margin.latePenalty + b.margin.endBackorderPenalty),
    unmetOrderCount: pair(a.unmetOrders.length, b.unmetOrders.length),
    shortUnits: pair(sum(a.unmetOrders, (u) => u.shortQty), sum(b.unmetOrders, (u) => u.shortQty)),
    workCenters,
    unmetOrders: [...orders.values()].sort((p, q) => p.week - q.week || p.orderRef.localeCompare(q.orderRef)),
    quantityDifferences,
  };
}
