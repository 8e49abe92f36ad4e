import type { PlanningData } from './planning-data';
import type { MaterialWeekLine, ProductWeekLine, WorkCenterWeekLine } from './plan';
import { componentUsePerUnit } from './bom-graph';
import { availableHours, overtimeCapHours } from './capacity';
import { demandByWeek, type WeeklyDemand } from './demand';
import { loadHoursPerUnit } from './routing-load';
import { supplyCap } from './material-supply';

/**
 * Rebuilds plan lines from decisions — how much of each product is made and how much forecast
 * is served each week, how much of each material is bought — by walking the balances forward:
 * the net position of a product (stock − backlog) moves by production − firm orders − use in
 * parents − forecast served; forecast is served as decided, as far as goods are on hand;
 * overtime is what the load needs beyond regular time. Used by the rounding repair pass and by
 * edits of a plan; the checker verifies the result independently.
 */
export interface PlanDecisions {
  /** per product, make per week (index week − 1) */
  make: Map<string, number[]>;
  /** per product, forecast the plan wants to serve per week (served only from stock on hand) */
  sell: Map<string, number[]>;
  /** per material, purchases released per week */
  buy: Map<string, number[]>;
}

export class PlanRecompute {
  readonly demand: Map<string, WeeklyDemand>;
  readonly load: Map<string, Map<string, number>>;
  private parentsOf: Map<string, { parent: string; use: number }[]>;
  private usersOf: Map<string, { parent: string; use: number }[]>;
  private loaders: Map<string, { product: string; hours: number }[]>;

  constructor(
    readonly data: PlanningData,
    readonly horizonWeeks: number,
  ) {
    this.demand = demandByWeek(data, horizonWeeks);
    this.load = loadHoursPerUnit(data);
    this.parentsOf = new Map();
    this.usersOf = new Map();
    for (const b of data.bom) {
      const entry = { parent: b.parent, use: componentUsePerUnit(b) };
      if (b.componentProduct !== undefined) this.parentsOf.set(b.componentProduct, [...(this.parentsOf.get(b.componentProduct) ?? []), entry]);
      if (b.material !== undefined) this.usersOf.set(b.material, [...(this.usersOf.get(b.material) ?? []), entry]);
    }
    this.loaders = new Map();
    for (const [product, perWc] of this.load)
      for (const [wc, hours] of perWc) this.loaders.set(wc, [...(this.loaders.get(wc) ?? []), { product, hours }]);
  }

  usedInParents(product: string, week: number, d: PlanDecisions): number {
    return (this.parentsOf.get(product) ?? []).reduce((a, e) => a + e.use * (d.make.get(e.parent)?.[week - 1] ?? 0), 0);
  }

  productLines(product: string, d: PlanDecisions): ProductWeekLine[] {
    const p = this.data.products.find((x) => x.code === product)!;
    const dem = this.demand.get(product)!;
    const make = d.make.get(product) ?? [];
    const sell = d.sell.get(product) ?? [];
    const out: ProductWeekLine[] = [];
    let net = p.openingStock;
    let latePrev = 0;
    for (let t = 1; t <= this.horizonWeeks; t++) {
      const m = make[t - 1] ?? 0;
      const used = this.usedInParents(product, t, d);
      // what is physically on hand this week after use in parents; forecast is served from it as
      // the plan says (even while firm orders wait, as the LP may choose), but never from goods
      // that must-ship orders need
      const physical = Math.max(0, net) + m - used;
      const served = Math.max(0, Math.min(sell[t - 1] ?? 0, dem.forecast[t - 1], physical - dem.mustShip[t - 1]));
      net += m - dem.firm[t - 1] - used - served;
      const stock = Math.max(0, net);
      const late = Math.max(0, -net);
      out.push({
        product,
        week: t,
        make: m,
        shipFirm: dem.firm[t - 1] + latePrev - late,
        shipForecast: served,
        ship: dem.firm[t - 1] + latePrev - late + served,
        usedInParents: used,
        stock,
        late,
        safetyShortfall: Math.max(0, p.safetyStock - stock),
      });
      latePrev = late;
    }
    return out;
  }

  loadHours(workCenter: string, week: number, d: PlanDecisions): number {
    return (this.loaders.get(workCenter) ?? []).reduce((a, l) => a + l.hours * (d.make.get(l.product)?.[week - 1] ?? 0), 0);
  }

  workCenterLine(workCenter: string, week: number, d: PlanDecisions, values?: { bottleneckValue: number; binding: boolean }): WorkCenterWeekLine {
    const w = this.data.workCenters.find((x) => x.code === workCenter)!;
    const loadHours = this.loadHours(workCenter, week, d);
    const available = availableHours(w, week);
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
    const w = this.data.workCenters.find((x) => x.code === workCenter)!;
    return availableHours(w, week) + w.efficiency * overtimeCapHours(w, week);
  }

  materialLines(material: string, d: PlanDecisions, values?: Map<number, { bottleneckValue: number; supplyCapValue: number }>): MaterialWeekLine[] {
    const m = this.data.materials.find((x) => x.code === material)!;
    const buy = d.buy.get(material) ?? [];
    const users = this.usersOf.get(material) ?? [];
    const out: MaterialWeekLine[] = [];
    let stock = m.onHand;
    for (let t = 1; t <= this.horizonWeeks; t++) {
      const release = t - m.leadTimeWeeks;
      const arriving = release >= 1 ? (buy[release - 1] ?? 0) : 0;
      const receipt = m.scheduledReceipts.filter((r) => r.week === t).reduce((a, r) => a + r.qty, 0);
      const use = users.reduce((a, e) => a + e.use * (d.make.get(e.parent)?.[t - 1] ?? 0), 0);
      stock += receipt + arriving - use;
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
    }
    return out;
  }

  /** materials a product's production consumes directly */
  materialsOf(product: string): string[] {
    return this.data.bom.filter((b) => b.parent === product && b.material !== undefined).map((b) => b.material!);
  }

  /** component products a product's production consumes directly */
  componentsOf(product: string): string[] {
    return this.data.bom.filter((b) => b.parent === product && b.componentProduct !== undefined).map((b) => b.componentProduct!);
  }

  workCentersOf(product: string): string[] {
    return [...(this.load.get(product)?.keys() ?? [])];
  }
}
