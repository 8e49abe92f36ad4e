import type { Material, PlanningData, Product, WorkCenter } from './planning-data';
import type { MaterialWeekLine, ProductWeekLine, WorkCenterWeekLine } from './plan';
import { componentUsePerUnit } from './bom-graph';
import { availableHours, overtimeCapHours } from './capacity';
import { demandByWeek, type WeeklyDemand } from './demand';
import { loadHoursPerUnit } from './routing-load';
import { supplyCap } from './material-supply';
import { holdingCostPerUnitWeek, standardCosts } from './standard-cost';

/**
 * Rebuilds plan lines from decisions — how much of each product is made and how much forecast
 * is served each week, how much of each material is bought — by walking the balances forward:
 * the net position of a product (stock − backlog) moves by production − firm orders − use in
 * parents − forecast served; forecast is served as decided, as far as goods are on hand;
 * overtime is what the load needs beyond regular time. Used by the rounding repair pass and by
 * edits of a plan; the checker verifies the result independently.
 *
 * Everything the walks need is indexed once (items by code, users of each item, receipts and
 * capacity per week), because the repair pass calls them many thousands of times; the numeric
 * walks (lateByWeek, materialStock, margin) give the same numbers as the lines without building them.
 */
export interface PlanDecisions {
  /** per product, make per week (index week − 1) */
  make: Map<string, number[]>;
  /** per product, forecast the plan wants to serve per week (served only from stock on hand) */
  sell: Map<string, number[]>;
  /** per material, purchases released per week */
  buy: Map<string, number[]>;
}

type Use = { parent: string; use: number };
/** one term of a tracked sum: factor × make of one product in the week */
type Term = { factor: number; make: number[] | undefined };

export class PlanRecompute {
  readonly demand: Map<string, WeeklyDemand>;
  readonly load: Map<string, Map<string, number>>;
  private readonly parentsOf = new Map<string, Use[]>();
  private readonly usersOf = new Map<string, Use[]>();
  private readonly loaders = new Map<string, { product: string; hours: number }[]>();
  private readonly products: Map<string, Product>;
  private readonly workCenters: Map<string, WorkCenter>;
  private readonly materials: Map<string, Material>;
  private readonly directMaterials = new Map<string, string[]>();
  private readonly directComponents = new Map<string, string[]>();
  /** per material, scheduled receipts per week (index week − 1) */
  private readonly receipts = new Map<string, number[]>();
  /** per work center, [available, regular + capped overtime] standard hours per week */
  private readonly hours = new Map<string, { available: number[]; max: number[] }>();
  /**
   * The decisions being tracked (see track): per week, each material's use, each work center's
   * load and each sub-assembly's use in parents, with the terms of each sum resolved to the
   * decisions' make arrays (changed in place, never replaced).
   */
  private tracked: {
    d: PlanDecisions;
    use: Map<string, number[]>;
    load: Map<string, number[]>;
    used: Map<string, number[]>;
    terms: { use: Map<string, Term[]>; load: Map<string, Term[]>; used: Map<string, Term[]> };
  } | null = null;
  /** per product: holding cost per unit-week, end-of-horizon and safety-shortfall penalties per unit */
  private readonly productCosts = new Map<string, { holding: number; endPenalty: number; shortfallPenalty: number }>();

  constructor(
    readonly data: PlanningData,
    readonly horizonWeeks: number,
    /** rolled-up standard costs, when the caller already has them */
    std: Map<string, number> = standardCosts(data),
  ) {
    const T = horizonWeeks;
    this.demand = demandByWeek(data, T);
    this.load = loadHoursPerUnit(data);
    this.products = new Map(data.products.map((p) => [p.code, p]));
    this.workCenters = new Map(data.workCenters.map((w) => [w.code, w]));
    this.materials = new Map(data.materials.map((m) => [m.code, m]));
    const push = <V>(map: Map<string, V[]>, key: string, v: V) => {
      const list = map.get(key);
      if (list) list.push(v);
      else map.set(key, [v]);
    };
    for (const b of data.bom) {
      const entry = { parent: b.parent, use: componentUsePerUnit(b) };
      if (b.componentProduct !== undefined) {
        push(this.parentsOf, b.componentProduct, entry);
        push(this.directComponents, b.parent, b.componentProduct);
      }
      if (b.material !== undefined) {
        push(this.usersOf, b.material, entry);
        push(this.directMaterials, b.parent, b.material);
      }
    }
    for (const [product, perWc] of this.load) for (const [wc, hours] of perWc) push(this.loaders, wc, { product, hours });
    for (const m of data.materials) {
      const r = new Array<number>(T).fill(0);
      for (let t = 1; t <= T; t++) r[t - 1] = m.scheduledReceipts.filter((x) => x.week === t).reduce((a, x) => a + x.qty, 0);
      this.receipts.set(m.code, r);
    }
    for (const w of data.workCenters) {
      const available = Array.from({ length: T }, (_, i) => availableHours(w, i + 1));
      const max = available.map((a, i) => a + w.efficiency * overtimeCapHours(w, i + 1));
      this.hours.set(w.code, { available, max });
    }
    for (const p of data.products) {
      this.productCosts.set(p.code, {
        holding: holdingCostPerUnitWeek(p, std.get(p.code) ?? 0),
        endPenalty: data.plant.endBackorderPenaltyPerUnit ?? p.latePenalty * T,
        shortfallPenalty: data.plant.safetyShortfallPenaltyPerUnitWeek ?? p.latePenalty / 2,
      });
    }
  }

  /**
   * Keeps each material's use and each work center's load per week for `d` from now on, so the
   * walks need not sum them over every user each time; every later change of `d.make` must be
   * reported with makeChanged. (Each kept sum is recomputed whole, so it equals the untracked one.)
   */
  track(d: PlanDecisions): void {
    const resolve = <K extends string>(map: Map<string, ({ use: number; parent: string } | { hours: number; product: string })[]>) =>
      new Map([...map].map(([key, list]) => [key as K, list.map((e) => ('use' in e ? { factor: e.use, make: d.make.get(e.parent) } : { factor: e.hours, make: d.make.get(e.product) }))]));
    const terms = { use: resolve(this.usersOf), load: resolve(this.loaders), used: resolve(this.parentsOf) };
    const weekly = (list: Term[] | undefined) => Array.from({ length: this.horizonWeeks }, (_, i) => sumTerms(list, i + 1));
    this.tracked = {
      d,
      terms,
      use: new Map(this.data.materials.map((m) => [m.code, weekly(terms.use.get(m.code))])),
      load: new Map(this.data.workCenters.map((w) => [w.code, weekly(terms.load.get(w.code))])),
      used: new Map([...terms.used].map(([product, list]) => [product, weekly(list)])),
    };
  }

  /** the tracked decisions' make of `product` in `week` has changed */
  makeChanged(product: string, week: number): void {
    const tracked = this.tracked;
    if (!tracked) return;
    for (const m of this.directMaterials.get(product) ?? []) tracked.use.get(m)![week - 1] = sumTerms(tracked.terms.use.get(m), week);
    for (const w of this.load.get(product)?.keys() ?? []) tracked.load.get(w)![week - 1] = sumTerms(tracked.terms.load.get(w), week);
    for (const c of this.directComponents.get(product) ?? []) tracked.used.get(c)![week - 1] = sumTerms(tracked.terms.used.get(c), week);
  }

  private sumLoad(workCenter: string, week: number, d: PlanDecisions): number {
    let a = 0;
    for (const l of this.loaders.get(workCenter) ?? []) a += l.hours * (d.make.get(l.product)?.[week - 1] ?? 0);
    return a;
  }

  usedInParents(product: string, week: number, d: PlanDecisions): number {
    const parents = this.parentsOf.get(product);
    if (!parents) return 0;
    let a = 0;
    for (const e of parents) a += e.use * (d.make.get(e.parent)?.[week - 1] ?? 0);
    return a;
  }

  productLines(product: string, d: PlanDecisions): ProductWeekLine[] {
    const out: ProductWeekLine[] = [];
    this.walkProduct(product, d, (t, m, used, served, latePrev, late, stock, safetyShortfall) => {
      const firm = this.demand.get(product)!.firm[t - 1];
      out.push({
        product,
        week: t,
        make: m,
        shipFirm: firm + latePrev - late,
        shipForecast: served,
        ship: firm + latePrev - late + served,
        usedInParents: used,
        stock,
        late,
        safetyShortfall,
      });
    });
    return out;
  }

  /** backlog of firm orders at the end of each week (index week − 1), as productLines has it */
  lateByWeek(product: string, d: PlanDecisions): number[] {
    const out = new Array<number>(this.horizonWeeks);
    this.walkProduct(product, d, (t, _m, _used, _served, _latePrev, late) => {
      out[t - 1] = late;
    });
    return out;
  }

  /**
   * The balance walk behind productLines: the net position of a product moves by production −
   * firm orders − use in parents − forecast served, week by week.
   */
  private walkProduct(
    product: string,
    d: PlanDecisions,
    visit: (week: number, make: number, used: number, served: number, latePrev: number, late: number, stock: number, safetyShortfall: number) => void,
  ): void {
    const p = this.products.get(product)!;
    const dem = this.demand.get(product)!;
    const make = d.make.get(product) ?? [];
    const sell = d.sell.get(product) ?? [];
    const kept = this.tracked?.d === d ? (this.tracked.used.get(product) ?? null) : null;
    const parents = kept || this.tracked?.d === d ? [] : (this.parentsOf.get(product) ?? []).map((e) => ({ use: e.use, make: d.make.get(e.parent) }));
    let net = p.openingStock;
    let latePrev = 0;
    for (let t = 1; t <= this.horizonWeeks; t++) {
      const m = make[t - 1] ?? 0;
      let used = kept ? kept[t - 1] : 0;
      for (const e of parents) used += e.use * (e.make?.[t - 1] ?? 0);
      // what is physically on hand this week after use in parents; forecast is served from it as
      // the plan says (even while firm orders wait, as the LP may choose), but never from goods
      // that must-ship orders need
      const physical = Math.max(0, net) + m - used;
      const served = Math.max(0, Math.min(sell[t - 1] ?? 0, dem.forecast[t - 1], physical - dem.mustShip[t - 1]));
      net += m - dem.firm[t - 1] - used - served;
      const stock = Math.max(0, net);
      const late = Math.max(0, -net);
      visit(t, m, used, served, latePrev, late, stock, Math.max(0, p.safetyStock - stock));
      latePrev = late;
    }
  }

  loadHours(workCenter: string, week: number, d: PlanDecisions): number {
    if (this.tracked?.d === d) return this.tracked.load.get(workCenter)?.[week - 1] ?? 0;
    return this.sumLoad(workCenter, week, d);
  }

  workCenterLine(workCenter: string, week: number, d: PlanDecisions, values?: { bottleneckValue: number; binding: boolean }): WorkCenterWeekLine {
    const w = this.workCenters.get(workCenter)!;
    const loadHours = this.loadHours(workCenter, week, d);
    const available = this.hours.get(workCenter)!.available[week - 1];
    const cap = overtimeCapHours(w, week);
    return {
      workCenter,
      week,
      loadHours,
      availableHours: available,
      overtimeHours: Math.max(0, (loadHours - available) / w.efficiency),
      overtimeCapHours: cap === Infinity ? null : cap,
      loadPct: available > 0 ? (100 * loadHours) / available : null,
      binding: values?.binding ?? false,
      bottleneckValue: values?.bottleneckValue ?? 0,
    };
  }

  /** regular time + capped overtime, in standard hours */
  maxHours(workCenter: string, week: number): number {
    return this.hours.get(workCenter)!.max[week - 1];
  }

  materialLines(material: string, d: PlanDecisions, values?: Map<number, { bottleneckValue: number; supplyCapValue: number }>): MaterialWeekLine[] {
    const m = this.materials.get(material)!;
    const buy = d.buy.get(material) ?? [];
    const out: MaterialWeekLine[] = [];
    this.walkMaterial(material, d, (t, arriving, receipt, use, stock) => {
      out.push({
        material,
        week: t,
        buy: buy[t - 1] ?? 0,
        arriving,
        scheduledReceipt: receipt,
        use,
        stock,
        supplyCap: supplyCap(m, t),
        bottleneckValue: values?.get(t)?.bottleneckValue ?? 0,
        supplyCapValue: values?.get(t)?.supplyCapValue ?? 0,
      });
    });
    return out;
  }

  /** stock of a material at the end of each week (index week − 1), as materialLines has it */
  materialStock(material: string, d: PlanDecisions): number[] {
    const out = new Array<number>(this.horizonWeeks);
    this.walkMaterial(material, d, (t, _arriving, _receipt, _use, stock) => {
      out[t - 1] = stock;
    });
    return out;
  }

  /** The stock walk behind materialLines: on hand + receipts + arrivals − use, week by week. */
  private walkMaterial(material: string, d: PlanDecisions, visit: (week: number, arriving: number, receipt: number, use: number, stock: number) => void): void {
    const m = this.materials.get(material)!;
    const buy = d.buy.get(material) ?? [];
    const receipts = this.receipts.get(material)!;
    const kept = this.tracked?.d === d ? this.tracked.use.get(material)! : null;
    const users = kept ? [] : (this.usersOf.get(material) ?? []).map((e) => ({ use: e.use, make: d.make.get(e.parent) }));
    let stock = m.onHand;
    for (let t = 1; t <= this.horizonWeeks; t++) {
      const release = t - m.leadTimeWeeks;
      const arriving = release >= 1 ? (buy[release - 1] ?? 0) : 0;
      const receipt = receipts[t - 1];
      let use = kept ? kept[t - 1] : 0;
      for (const e of users) use += e.use * (e.make?.[t - 1] ?? 0);
      stock += receipt + arriving - use;
      visit(t, arriving, receipt, use, stock);
    }
  }

  /**
   * Contribution margin of part of a plan — the given products and materials over the whole
   * horizon, the given work centers in one week — summed term by term exactly as planMargin sums
   * the same lines, without building them (the repair pass compares it before and after a change).
   */
  partialMargin(products: string[], workCenters: string[], week: number, materials: string[], d: PlanDecisions): number {
    const T = this.horizonWeeks;
    let revenue = 0, extraUnitCost = 0, holdingCost = 0, latePenalty = 0, endBackorderPenalty = 0, safetyShortfallPenalty = 0;
    let overtimeCost = 0, materialSpend = 0;
    for (const code of products) {
      const p = this.products.get(code)!;
      const c = this.productCosts.get(code)!;
      const firm = this.demand.get(code)!.firm;
      this.walkProduct(code, d, (t, m, _used, served, latePrev, late, stock) => {
        revenue += p.price * (firm[t - 1] + latePrev - late + served);
        extraUnitCost += (p.extraUnitCost ?? 0) * m;
        holdingCost += c.holding * stock;
        latePenalty += p.latePenalty * late;
        if (t === T) endBackorderPenalty += c.endPenalty * late;
        safetyShortfallPenalty += c.shortfallPenalty * Math.max(0, p.safetyStock - stock);
      });
    }
    for (const code of workCenters) {
      const w = this.workCenters.get(code)!;
      const available = this.hours.get(code)!.available[week - 1];
      overtimeCost += (w.overtimeCostPerHour ?? 0) * Math.max(0, (this.loadHours(code, week, d) - available) / w.efficiency);
    }
    for (const code of materials) {
      const m = this.materials.get(code)!;
      const buy = d.buy.get(code) ?? [];
      this.walkMaterial(code, d, (t, _arriving, _receipt, _use, stock) => {
        materialSpend += m.unitCost * (buy[t - 1] ?? 0);
        holdingCost += (m.holdingCostPerUnitWeek ?? 0) * stock;
      });
    }
    return revenue - materialSpend - extraUnitCost - overtimeCost - holdingCost - latePenalty - endBackorderPenalty - safetyShortfallPenalty;
  }

  /** materials a product's production consumes directly */
  materialsOf(product: string): string[] {
    return this.directMaterials.get(product) ?? [];
  }

  /** component products a product's production consumes directly */
  componentsOf(product: string): string[] {
    return this.directComponents.get(product) ?? [];
  }

  workCentersOf(product: string): string[] {
    return [...(this.load.get(product)?.keys() ?? [])];
  }

  material(code: string): Material {
    return this.materials.get(code)!;
  }
}

/** Σ factor × make[week − 1] over the terms, in their order (0 for none) */
function sumTerms(terms: Term[] | undefined, week: number): number {
  let a = 0;
  for (const e of terms ?? []) a += e.factor * (e.make?.[week - 1] ?? 0);
  return a;
}
