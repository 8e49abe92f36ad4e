import type { HomeSummary, LoadStatus } from '@millrace/contracts';
import { availableHours, componentUsePerUnit, loadHoursPerUnit, type DemandLine, type PlanningData } from '@millrace/plan-model';

/** Load above available by less than this many standard hours counts as within capacity (rounding). */
const loadToleranceHours = 1e-6;

/**
 * Rough-cut capacity check of the demand in `data` (bill of capacity; DOMAIN.md §1, Berry,
 * Vollmann & Whybark 1979): the units each product must be made in a week are its own demand plus
 * what its parents need through their bills of materials (qty per ÷ (1 − scrap), in the same week:
 * no lead-time offset, no stock netting at this rough level); the load on a work center is those
 * units × the routing's hours per unit (setup spread over a batch, as the planning model does); the
 * available hours are shifts × hours per shift × (days − holidays) × efficiency − downtime.
 *
 * Pure: the same data gives the same summary. Firm demand decides the status; the load with the
 * forecast added is shown beside it.
 */
export function roughCutLoad(data: PlanningData): HomeSummary {
  const weeks = data.weeks.map((w) => w.startDate);
  const firm = unitsToMake(data, ['firm']);
  const withForecast = unitsToMake(data, ['firm', 'forecast']);
  const hoursPerUnit = loadHoursPerUnit(data);

  const firmLoad = loadByWorkCenter(firm, hoursPerUnit, weeks.length);
  const forecastLoad = loadByWorkCenter(withForecast, hoursPerUnit, weeks.length);
  const loadOn = (load: Map<string, number[]>, wc: string, t: number) => load.get(wc)?.[t] ?? 0;

  let overLoadedCells = 0;
  const workCenters = data.workCenters.map((wc) => ({
    code: wc.code,
    name: wc.name,
    cells: data.weeks.map((week, t) => {
      const required = loadOn(firmLoad, wc.code, t);
      const available = availableHours(wc, week.index);
      const status = loadStatus(required, available);
      if (status !== 'within_capacity') overLoadedCells += 1;
      return {
        weekStart: week.startDate,
        requiredHours: round(required),
        requiredHoursWithForecast: round(loadOn(forecastLoad, wc.code, t)),
        availableHours: round(available),
        loadPct: available > 0 ? round((required / available) * 100, 1) : null,
        status,
      };
    }),
  }));

  const firmOnly = demandByProduct(data, ['firm']);
  const firmDemand = data.products
    .map((p) => ({ productCode: p.code, productName: p.name, unit: p.unit, qtyByWeek: firmOnly.get(p.code) ?? weeks.map(() => 0) }))
    .filter((row) => row.qtyByWeek.some((q) => q > 0));

  return {
    plantName: data.plant.name ?? '',
    weeks,
    firmDemand,
    firmUnitsByWeek: weeks.map((_, t) => firmDemand.reduce((sum, row) => sum + row.qtyByWeek[t], 0)),
    workCenters,
    overLoadedCells,
  };
}

export function loadStatus(requiredHours: number, availableHours: number): LoadStatus {
  if (requiredHours <= loadToleranceHours) return 'within_capacity';
  if (availableHours <= 0) return 'no_capacity';
  return requiredHours > availableHours + loadToleranceHours ? 'over_loaded' : 'within_capacity';
}

/** Standard hours per work center and week: units to make × hours per unit, summed over products. */
function loadByWorkCenter(units: Map<string, number[]>, hoursPerUnit: Map<string, Map<string, number>>, T: number): Map<string, number[]> {
  const load = new Map<string, number[]>();
  for (const [product, perWc] of hoursPerUnit) {
    const made = units.get(product);
    if (!made) continue;
    for (const [wc, hours] of perWc) {
      const row = load.get(wc) ?? new Array<number>(T).fill(0);
      for (let t = 0; t < T; t++) row[t] += hours * made[t];
      load.set(wc, row);
    }
  }
  return load;
}

/** Demand per product and week (index 0 = week 1) of the given kinds, in one pass over the lines. */
function demandByProduct(data: PlanningData, kinds: ReadonlyArray<DemandLine['kind']>): Map<string, number[]> {
  const T = data.weeks.length;
  const byProduct = new Map<string, number[]>();
  for (const d of data.demand) {
    if (!kinds.includes(d.kind) || d.week < 1 || d.week > T) continue;
    const row = byProduct.get(d.product) ?? new Array<number>(T).fill(0);
    row[d.week - 1] += d.qty;
    byProduct.set(d.product, row);
  }
  return byProduct;
}

/**
 * Units of every product to make per week (index 0 = week 1): own demand plus the parents'
 * needs, exploded level by level. A cycle in the bills of materials (which the API refuses to
 * store) would stop the explosion at the repeated product instead of looping.
 */
function unitsToMake(data: PlanningData, kinds: ReadonlyArray<DemandLine['kind']>): Map<string, number[]> {
  const T = data.weeks.length;
  const demand = demandByProduct(data, kinds);
  const parentsOf = new Map<string, Array<{ parent: string; use: number }>>();
  for (const line of data.bom) {
    if (line.componentProduct === undefined) continue;
    const list = parentsOf.get(line.componentProduct) ?? [];
    list.push({ parent: line.parent, use: componentUsePerUnit(line) });
    parentsOf.set(line.componentProduct, list);
  }
  const memo = new Map<string, number[]>();
  const visiting = new Set<string>();
  const units = (product: string): number[] => {
    const known = memo.get(product);
    if (known) return known;
    const own = [...(demand.get(product) ?? new Array<number>(T).fill(0))];
    if (visiting.has(product)) return own;
    visiting.add(product);
    for (const { parent, use } of parentsOf.get(product) ?? []) {
      const needs = units(parent);
      for (let t = 0; t < T; t++) own[t] += needs[t] * use;
    }
    visiting.delete(product);
    memo.set(product, own);
    return own;
  };
  return new Map(data.products.map((p) => [p.code, units(p.code)]));
}

function round(value: number, decimals = 2): number {
  const f = 10 ** decimals;
  return Math.round(value * f) / f;
}
