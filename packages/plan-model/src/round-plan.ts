import type { PlanningData } from './planning-data';
import type { MaterialWeekLine, Plan, ProductWeekLine, WorkCenterWeekLine } from './plan';
import { bomDescendants, lowLevelCodes } from './bom-graph';
import { supplyCap } from './material-supply';
import { PlanRecompute, type PlanDecisions } from './plan-recompute';
import { planMargin } from './plan-margin';
import { standardCosts } from './standard-cost';
import { explainUnmetOrders } from './explain-unmet';
import { materialCalls } from './material-calls';
import { checkPlan, type PlanViolation } from './check-plan';

/**
 * Whole units and batch multiples by a repair pass (issue 4 item 3):
 *
 *  1. round every product's production down to a multiple of its batch (1 = whole units) and
 *     the forecast served down to whole units; purchases stay as solved (materials are bought
 *     by measure);
 *  2. where a sub-assembly no longer covers its parents' use in a week, take batches off the
 *     parents in that week, deepest items first, until every balance holds;
 *  3. add batches back greedily — largest rounding loss first, repeated while something was
 *     added — wherever capacity (regular time + capped overtime), material stock, sub-assembly
 *     stock and every balance still hold and the margin goes up (or a must-ship order needs it);
 *  4. recompute stock, backlog and overtime, check the result with the independent checker and
 *     report the gap to the LP's margin, which bounds every whole-unit plan from above when the
 *     model has no smoothing term.
 */

export type RoundingOutcome = 'repaired' | 'violations_remain';

export interface RoundingReport {
  outcome: RoundingOutcome;
  /** margin of the LP plan: an upper bound for any whole-unit plan (without smoothing) */
  lpMargin: number;
  roundedMargin: number;
  /** lpMargin − roundedMargin */
  gap: number;
  /** gap as % of |lpMargin|; null when the LP margin is 0 */
  gapPct: number | null;
  batchesRemoved: number;
  batchesAdded: number;
  violations: PlanViolation[];
}

const EPS = 1e-7;

/** one change of a decision, with the value before it so it can be taken back exactly */
type Change = { kind: 'make' | 'buy'; item: string; week: number; qty: number; before: number };

export function roundPlan(data: PlanningData, lpPlan: Plan): { plan: Plan; report: RoundingReport } {
  if (lpPlan.outcome !== 'optimal') throw new Error(`only a solved plan can be rounded (this one is ${lpPlan.outcome})`);
  const T = lpPlan.horizonWeeks;
  const std = standardCosts(data);
  const rc = new PlanRecompute(data, T, std);
  const batch = new Map(data.products.map((p) => [p.code, p.batchMultiple]));
  const lpMake = new Map<string, number[]>(data.products.map((p) => [p.code, new Array<number>(T).fill(0)]));
  const d: PlanDecisions = { make: new Map(), sell: new Map(), buy: new Map() };
  for (const p of data.products) {
    d.make.set(p.code, new Array<number>(T).fill(0));
    d.sell.set(p.code, new Array<number>(T).fill(0));
  }
  for (const l of lpPlan.products) {
    const b = batch.get(l.product) ?? 1;
    lpMake.get(l.product)![l.week - 1] = l.make;
    d.make.get(l.product)![l.week - 1] = Math.floor(l.make / b + 1e-6) * b;
    d.sell.get(l.product)![l.week - 1] = Math.floor(l.shipForecast + 1e-6);
  }
  for (const m of data.materials) d.buy.set(m.code, new Array<number>(T).fill(0));
  for (const l of lpPlan.materials) d.buy.get(l.material)![l.week - 1] = l.buy;
  // from here on every change of make goes through setMake, which keeps rc's sums up to date
  rc.track(d);
  const setMake = (product: string, week: number, qty: number) => {
    d.make.get(product)![week - 1] = qty;
    rc.makeChanged(product, week);
  };

  const demand = rc.demand;
  /** first week in which a product's backlog grows by more than its ordinary firm orders */
  const balanceBreak = (product: string): { week: number; excess: number } | null => {
    const dem = demand.get(product)!;
    const late = rc.lateByWeek(product, d);
    let latePrev = 0;
    for (let t = 1; t <= T; t++) {
      const excess = late[t - 1] - latePrev - (dem.firm[t - 1] - dem.mustShip[t - 1]);
      if (excess > EPS) return { week: t, excess };
      latePrev = late[t - 1];
    }
    return null;
  };
  /** products that use a product as a component, in bill-of-materials order */
  const parentsOf = new Map<string, string[]>();
  for (const b of data.bom) {
    if (b.componentProduct === undefined) continue;
    const list = parentsOf.get(b.componentProduct);
    if (list) list.push(b.parent);
    else parentsOf.set(b.componentProduct, [b.parent]);
  }

  // 2. sub-assembly shortages: take batches off parents, deepest items first
  const llc = lowLevelCodes(
    data.products.map((p) => p.code),
    data.bom.filter((b) => b.componentProduct !== undefined).map((b) => ({ parent: b.parent, component: b.componentProduct! })),
  );
  const byDepth = [...data.products].sort((a, b) => llc.get(b.code)! - llc.get(a.code)!);
  let batchesRemoved = 0;
  for (const p of byDepth) {
    if (!parentsOf.has(p.code)) continue;
    for (let guard = 0; guard < 10_000; guard++) {
      const br = balanceBreak(p.code);
      if (!br) break;
      const parents = parentsOf
        .get(p.code)!
        .filter((q) => d.make.get(q)![br.week - 1] > EPS)
        .sort((a, b) => d.make.get(b)![br.week - 1] - d.make.get(a)![br.week - 1]);
      if (parents.length === 0) break;
      const q = parents[0];
      setMake(q, br.week, Math.max(0, d.make.get(q)![br.week - 1] - (batch.get(q) ?? 1)));
      batchesRemoved++;
    }
  }

  // 3. add batches back where everything still holds and the margin improves
  type Affected = { products: string[]; materials: string[]; workCenters: string[] };
  const affectedMemo = new Map<string, Affected>();
  /** a product and everything below it in the bill of materials (fixed data: worked out once per product) */
  const affected = (product: string): Affected => {
    const known = affectedMemo.get(product);
    if (known) return known;
    const products = [product, ...bomDescendants(data.bom, product).products];
    const a = {
      products,
      materials: [...new Set(products.flatMap((p) => rc.materialsOf(p)))],
      workCenters: [...new Set(products.flatMap((p) => rc.workCentersOf(p)))],
    };
    affectedMemo.set(product, a);
    return a;
  };
  const localMargin = (a: Affected, week: number) => rc.partialMargin(a.products, a.workCenters, week, a.materials, d);
  const fits = (a: Affected, week: number) =>
    a.workCenters.every((w) => rc.loadHours(w, week, d) <= rc.maxHours(w, week) * (1 + 1e-9) + EPS) &&
    a.materials.every((m) => rc.materialStock(m, d).every((stock) => stock >= -EPS)) &&
    a.products.slice(1).every((c) => balanceBreak(c) === null);
  /**
   * one more batch of a product in a week, plus the batches of its sub-assemblies (all levels)
   * that the same week then needs; returns what was added so it can be taken back
   */
  const componentSets = new Map(data.products.map((p) => [p.code, [...new Set(rc.componentsOf(p.code))]]));
  const materialSets = new Map(data.products.map((p) => [p.code, [...new Set(rc.materialsOf(p.code))]]));
  const addWithComponents = (product: string, week: number): Change[] => {
    const b = batch.get(product) ?? 1;
    const before = d.make.get(product)![week - 1];
    setMake(product, week, before + b);
    const added: Change[] = [{ kind: 'make', item: product, week, qty: b, before }];
    for (const c of componentSets.get(product)!) {
      for (let guard = 0; guard < 1000 && balanceBreak(c) !== null; guard++) added.push(...addWithComponents(c, week));
    }
    for (const m of materialSets.get(product)!) added.push(...buyFor(m));
    return added;
  };
  /** buy more of a material, as late as its lead time and supply cap allow, until no week runs short */
  const buyFor = (material: string): Change[] => {
    const m = rc.material(material);
    const buys = d.buy.get(material)!;
    const out: Change[] = [];
    for (;;) {
      const stock = rc.materialStock(material, d);
      const shortIndex = stock.findIndex((s) => s < -EPS);
      if (shortIndex < 0) return out;
      let need = -stock[shortIndex];
      for (let r = shortIndex + 1 - m.leadTimeWeeks; r >= 1 && need > EPS; r--) {
        const cap = supplyCap(m, r);
        const room = cap === null ? need : Math.max(0, cap - buys[r - 1]);
        const q = Math.min(room, need);
        if (q <= EPS) continue;
        out.push({ kind: 'buy', item: material, week: r, qty: q, before: buys[r - 1] });
        buys[r - 1] += q;
        need -= q;
      }
      if (need > EPS) return out; // cannot be covered: the caller's feasibility check rejects the change
    }
  };
  /** takes changes back, last first, restoring each value exactly */
  const undoChanges = (changes: Change[]) => {
    for (let k = changes.length - 1; k >= 0; k--) {
      const c = changes[k];
      if (c.kind === 'make') setMake(c.item, c.week, c.before);
      else d.buy.get(c.item)![c.week - 1] = c.before;
    }
  };
  const lpLinesOf = new Map<string, ProductWeekLine[]>();
  for (const l of lpPlan.products) {
    const list = lpLinesOf.get(l.product);
    if (list) list.push(l);
    else lpLinesOf.set(l.product, [l]);
  }
  // A candidate that was tried and taken back is tried again only when something it reads has
  // changed since: the make of its products (it and its sub-assemblies) or of their parents, the
  // use or purchases of their materials, the load of their work centers in its week. Rejected
  // tries leave every value exactly as it was, so skipping gives the same plan, with far fewer tries.
  let stamp = 0;
  const changedAt = new Map<string, number>();
  const parentsOfProduct = (code: string) => parentsOf.get(code) ?? [];
  const readKeys = new Map<string, string[]>();
  const keysRead = (product: string): string[] => {
    let keys = readKeys.get(product);
    if (!keys) {
      const a = affected(product);
      keys = [...new Set([...a.products, ...a.products.flatMap(parentsOfProduct)])].map((q) => `p:${q}`).concat(a.materials.map((m) => `m:${m}`));
      readKeys.set(product, keys);
    }
    return keys;
  };
  const workCentersOfProduct = new Map(data.products.map((p) => [p.code, rc.workCentersOf(p.code)]));
  const markKept = (changes: Change[]) => {
    stamp++;
    for (const c of changes) {
      if (c.kind === 'buy') {
        changedAt.set(`m:${c.item}`, stamp);
        continue;
      }
      changedAt.set(`p:${c.item}`, stamp);
      for (const m of materialSets.get(c.item)!) changedAt.set(`m:${m}`, stamp);
      for (const w of workCentersOfProduct.get(c.item)!) changedAt.set(`w:${w}|${c.week}`, stamp);
    }
  };
  const rejectedAt = new Map<string, number>();
  const unchangedSinceRejected = (product: string, week: number): boolean => {
    const at = rejectedAt.get(`${product}|${week}`);
    if (at === undefined) return false;
    const unchanged = (key: string) => (changedAt.get(key) ?? -1) <= at;
    return keysRead(product).every(unchanged) && affected(product).workCenters.every((w) => unchanged(`w:${w}|${week}`));
  };
  let batchesAdded = 0;
  for (let pass = 0; pass < 5; pass++) {
    // where rounding took units away, and — for products now short of orders — every week up to
    // the last short one, so lost units can also be made earlier where capacity is free
    const candidates: { product: string; week: number; loss: number }[] = [];
    for (const p of data.products) {
      const lines = rc.productLines(p.code, d);
      const lpLines = lpLinesOf.get(p.code) ?? [];
      const worse = (l: ProductWeekLine) => {
        const o = lpLines[l.week - 1];
        return o !== undefined && (l.late > o.late + EPS || l.shipForecast < Math.floor(o.shipForecast + 1e-6) - EPS);
      };
      const lastShort = Math.max(0, ...lines.filter(worse).map((l) => l.week));
      for (let t = 1; t <= T; t++) {
        const loss = lpMake.get(p.code)![t - 1] - d.make.get(p.code)![t - 1];
        if (loss > EPS || t <= lastShort) candidates.push({ product: p.code, week: t, loss });
      }
    }
    candidates.sort((a, b) => b.loss - a.loss || b.week - a.week);
    let added = 0;
    for (const c of candidates) {
      if (unchangedSinceRejected(c.product, c.week)) continue;
      const a = affected(c.product);
      const before = localMargin(a, c.week);
      const brokenBefore = balanceBreak(c.product) !== null;
      const undo = addWithComponents(c.product, c.week);
      const all = undo.filter((u) => u.kind === 'make').map((u) => affected(u.item));
      const ok = all.every((x) => fits(x, c.week));
      const better = localMargin(a, c.week) > before + 1e-9;
      const repairs = brokenBefore && balanceBreak(c.product) === null;
      if (ok && (better || repairs)) {
        added += undo.filter((u) => u.kind === 'make').length;
        markKept(undo);
      } else {
        undoChanges(undo);
        rejectedAt.set(`${c.product}|${c.week}`, stamp);
      }
    }
    batchesAdded += added;
    if (added === 0) break;
  }

  // purchases no longer needed after rounding: trim them, latest first, keeping every week covered
  for (const m of data.materials) {
    const buys = d.buy.get(m.code)!;
    for (let r = T; r >= 1; r--) {
      if (buys[r - 1] <= EPS) continue;
      const stock = rc.materialStock(m.code, d);
      const slack = Math.min(...stock.filter((_, i) => i + 1 >= r + m.leadTimeWeeks));
      if (slack > EPS) buys[r - 1] -= Math.min(buys[r - 1], slack);
    }
  }

  // 4. the rounded plan, checked independently
  const wcValues = new Map(lpPlan.workCenters.map((l) => [`${l.workCenter}|${l.week}`, l]));
  const matValues = new Map<string, Map<number, MaterialWeekLine>>();
  for (const l of lpPlan.materials) matValues.set(l.material, (matValues.get(l.material) ?? new Map()).set(l.week, l));
  const products: ProductWeekLine[] = data.products.flatMap((p) => rc.productLines(p.code, d));
  const workCenters: WorkCenterWeekLine[] = data.workCenters.flatMap((w) =>
    Array.from({ length: T }, (_, i) => rc.workCenterLine(w.code, i + 1, d, wcValues.get(`${w.code}|${i + 1}`))),
  );
  const materials = data.materials.flatMap((m) => rc.materialLines(m.code, d, matValues.get(m.code)));
  const lines = { products, workCenters, materials };
  const margin = planMargin(data, T, lines);
  // the smoothing term is a modelling device of the LP; the rounded plan reports its margin only
  const plan: Plan = { ...lpPlan, margin, smoothingCost: 0, products, workCenters, materials, unmetOrders: explainUnmetOrders(data, T, lines), materialCalls: materialCalls(data, T, products).calls };
  const violations = checkPlan(data, plan);
  const lpMargin = lpPlan.margin.margin;
  const gap = lpMargin - margin.margin;
  return {
    plan,
    report: {
      outcome: violations.length === 0 ? 'repaired' : 'violations_remain',
      lpMargin,
      roundedMargin: margin.margin,
      gap,
      gapPct: lpMargin !== 0 ? (100 * gap) / Math.abs(lpMargin) : null,
      batchesRemoved,
      batchesAdded,
      violations,
    },
  };
}
