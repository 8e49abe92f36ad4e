/**
 * Seeded production-planning LPs of the shape in /work/shared/DESIGN.md ("The planning model in one
 * screen"), for the benchmark. Weeks t, products p (finished goods and two levels of
 * sub-assemblies), work centers w, purchased materials m.
 *
 * Columns: make[p,t], stock[p,t], late[p,t] (finished goods only), overtime[w,t] ≤ cap,
 *          buy[m,t] ≤ supply cap (ordered in t, arriving in t + lead), mstock[m,t].
 * Rows:    product balance   stock[t] − late[t] − stock[t−1] + late[t−1] − make[t] + Σ_parents bom·make_parent[t] = −demand[t]
 *          capacity          Σ_p hours[p,w]·make[p,t] − overtime[w,t] ≤ available[w,t]
 *          material balance  mstock[t] − mstock[t−1] − buy[t − lead] + Σ_p qty[p,m]·make[p,t] = 0 (+ opening stock in week 1)
 * Objective: minimise production, material, overtime, holding and late costs, with a high penalty
 * on backorders still open at the end of the horizon. Always feasible (late absorbs any shortfall)
 * and bounded (all costs positive). The data are invented for benchmarking only.
 */
import { cscFromTriplets } from '../src/sparse/csc';
import type { Problem } from '../src/problem/problem';
import { SeededRandom } from '../test/support/seeded-random';

export interface PlanningSize {
  products: number;
  weeks: number;
  workCenters: number;
  materials: number;
}

export const PLANNING_SIZES: Record<'S' | 'M' | 'L' | 'XL', PlanningSize> = {
  S: { products: 20, weeks: 8, workCenters: 6, materials: 15 },
  M: { products: 100, weeks: 13, workCenters: 20, materials: 60 },
  L: { products: 300, weeks: 26, workCenters: 40, materials: 150 },
  XL: { products: 1000, weeks: 52, workCenters: 60, materials: 400 },
};

interface Product {
  level: number;
  components: { product: number; qty: number }[];
  materials: { material: number; qty: number }[];
  routing: { workCenter: number; hours: number }[];
  makeCost: number;
  holdCost: number;
  latePenalty: number;
}

export function planningProblem(size: PlanningSize, seed: number, name = 'planning'): Problem {
  const rng = new SeededRandom(seed);
  const { products: P, weeks: T, workCenters: W, materials: M } = size;
  const products = buildProducts(rng, size);
  const finished = products.map((p) => p.level === 0);
  const demand = products.map((p) => Array.from({ length: T }, (_, t) => (p.level === 0 && rng.chance(0.8) ? Math.round(rng.uniform(5, 60) * (1 + 0.3 * Math.sin((2 * Math.PI * t) / 13))) : 0)));

  // average weekly gross requirement per product (BOM explosion, levels top-down) → loads
  const gross = products.map((_, p) => demand[p].reduce((s, v) => s + v, 0) / T);
  for (let level = 0; level < 3; level++) {
    products.forEach((prod, p) => {
      if (prod.level === level) for (const c of prod.components) gross[c.product] += c.qty * gross[p];
    });
  }
  const load = new Float64Array(W);
  const materialUse = new Float64Array(M);
  products.forEach((prod, p) => {
    for (const r of prod.routing) load[r.workCenter] += r.hours * gross[p];
    for (const m of prod.materials) materialUse[m.material] += m.qty * gross[p];
  });
  const available = Array.from({ length: W }, (_, w) => Array.from({ length: T }, () => Math.round(load[w] * (rng.chance(0.1) ? 0.6 : rng.uniform(0.85, 1.05)) * 10) / 10));
  const overtimeCap = Array.from({ length: W }, (_, w) => Math.round(0.25 * load[w] * 10) / 10);
  const overtimeCost = Array.from({ length: W }, () => rng.round2(30, 60));
  const lead = Array.from({ length: M }, () => rng.integer(1, 4));
  const price = Array.from({ length: M }, () => rng.round2(1, 20));
  const supplyCap = Array.from({ length: M }, (_, m) => Math.round(1.25 * materialUse[m] + 1));
  const openingMaterial = Array.from({ length: M }, (_, m) => Math.round(lead[m] * materialUse[m]));
  const materialHold = Array.from({ length: M }, () => rng.round2(0.02, 0.2));

  const b = new ProblemBuilder();
  const make = products.map((_, p) => Array.from({ length: T }, (_, t) => b.column(`make_${p}_${t}`, products[p].makeCost)));
  const stock = products.map((_, p) => Array.from({ length: T }, (_, t) => b.column(`stock_${p}_${t}`, products[p].holdCost)));
  const late = products.map((_, p) =>
    finished[p] ? Array.from({ length: T }, (_, t) => b.column(`late_${p}_${t}`, products[p].latePenalty * (t === T - 1 ? 10 : 1))) : null,
  );
  const overtime = Array.from({ length: W }, (_, w) => Array.from({ length: T }, (_, t) => b.column(`ot_${w}_${t}`, overtimeCost[w], overtimeCap[w])));
  const buy = Array.from({ length: M }, (_, m) => Array.from({ length: T }, (_, t) => (t + lead[m] < T ? b.column(`buy_${m}_${t}`, price[m], supplyCap[m]) : -1)));
  const mstock = Array.from({ length: M }, (_, m) => Array.from({ length: T }, (_, t) => b.column(`mstock_${m}_${t}`, materialHold[m])));

  const parents: { parent: number; qty: number }[][] = products.map(() => []);
  products.forEach((prod, q) => prod.components.forEach((c) => parents[c.product].push({ parent: q, qty: c.qty })));
  for (let p = 0; p < P; p++) {
    for (let t = 0; t < T; t++) {
      const row = b.row(`bal_${p}_${t}`, -demand[p][t], -demand[p][t]);
      b.entry(row, stock[p][t], 1);
      b.entry(row, make[p][t], -1);
      if (t > 0) b.entry(row, stock[p][t - 1], -1);
      const l = late[p];
      if (l) {
        b.entry(row, l[t], -1);
        if (t > 0) b.entry(row, l[t - 1], 1);
      }
      for (const { parent, qty } of parents[p]) b.entry(row, make[parent][t], qty);
    }
  }
  for (let w = 0; w < W; w++) {
    for (let t = 0; t < T; t++) {
      const row = b.row(`cap_${w}_${t}`, -Infinity, available[w][t]);
      b.entry(row, overtime[w][t], -1);
      products.forEach((prod, p) => prod.routing.forEach((r) => r.workCenter === w && b.entry(row, make[p][t], r.hours)));
    }
  }
  const usedBy: { product: number; qty: number }[][] = Array.from({ length: M }, () => []);
  products.forEach((prod, p) => prod.materials.forEach((m) => usedBy[m.material].push({ product: p, qty: m.qty })));
  for (let m = 0; m < M; m++) {
    for (let t = 0; t < T; t++) {
      const rhs = t === 0 ? openingMaterial[m] : 0;
      const row = b.row(`mat_${m}_${t}`, rhs, rhs);
      b.entry(row, mstock[m][t], 1);
      if (t > 0) b.entry(row, mstock[m][t - 1], -1);
      if (t - lead[m] >= 0) b.entry(row, buy[m][t - lead[m]], -1);
      for (const { product, qty } of usedBy[m]) b.entry(row, make[product][t], qty);
    }
  }
  return b.build(name);
}

function buildProducts(rng: SeededRandom, size: PlanningSize): Product[] {
  const { products: P, workCenters: W, materials: M } = size;
  const levelOf = (p: number) => (p < 0.4 * P ? 0 : p < 0.75 * P ? 1 : 2);
  const byLevel = [0, 1, 2].map((level) => [...Array(P).keys()].filter((p) => levelOf(p) === level));
  return Array.from({ length: P }, (_, p) => {
    const level = levelOf(p);
    const components =
      level < 2 && byLevel[level + 1].length > 0
        ? distinct(rng, byLevel[level + 1], rng.integer(1, 3)).map((product) => ({ product, qty: rng.integer(1, 3) }))
        : [];
    const materials = distinct(rng, [...Array(M).keys()], rng.integer(1, 3)).map((material) => ({ material, qty: rng.round2(0.5, 4) }));
    const routing = distinct(rng, [...Array(W).keys()], rng.integer(1, 2)).map((workCenter) => ({ workCenter, hours: rng.round2(0.05, 1.5) }));
    return {
      level,
      components,
      materials,
      routing,
      makeCost: rng.round2(0.5, 3),
      holdCost: rng.round2(0.2, 1),
      latePenalty: level === 0 ? rng.round2(5, 20) : 0,
    };
  });
}

function distinct(rng: SeededRandom, from: number[], count: number): number[] {
  const picked = new Set<number>();
  while (picked.size < Math.min(count, from.length)) picked.add(rng.pick(from));
  return [...picked];
}

/** Collects named columns, rows and triplets, then builds the Problem (CSC matrix). */
class ProblemBuilder {
  private colNames: string[] = [];
  private cost: number[] = [];
  private upper: number[] = [];
  private rowNames: string[] = [];
  private lower: number[] = [];
  private rowUpperBound: number[] = [];
  private ti: number[] = [];
  private tj: number[] = [];
  private tv: number[] = [];

  column(name: string, cost: number, upper = Infinity): number {
    this.colNames.push(name);
    this.cost.push(cost);
    this.upper.push(upper);
    return this.colNames.length - 1;
  }

  row(name: string, lower: number, upper: number): number {
    this.rowNames.push(name);
    this.lower.push(lower);
    this.rowUpperBound.push(upper);
    return this.rowNames.length - 1;
  }

  entry(row: number, col: number, value: number): void {
    this.ti.push(row);
    this.tj.push(col);
    this.tv.push(value);
  }

  build(name: string): Problem {
    const m = this.rowNames.length;
    const n = this.colNames.length;
    return {
      name,
      colNames: this.colNames,
      rowNames: this.rowNames,
      c: Float64Array.from(this.cost),
      c0: 0,
      A: cscFromTriplets(m, n, this.ti, this.tj, this.tv),
      rowLower: Float64Array.from(this.lower),
      rowUpper: Float64Array.from(this.rowUpperBound),
      colLower: new Float64Array(n),
      colUpper: Float64Array.from(this.upper),
    };
  }
}
