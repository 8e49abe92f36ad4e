import type { PlanningData } from './planning-data';
import type { MaterialWeekLine, ProductWeekLine, ShortageCause, UnmetOrder, WorkCenterWeekLine } from './plan';
import { bomDescendants } from './bom-graph';
import { money, qty, weekRanges } from './format';
import { TOLERANCES } from './tolerances';

/**
 * A work center is named as a cause only if its bottleneck value is at least this share of the
 * largest bottleneck value among the work centers on the order's path (5 %). Smaller values are
 * real but do not explain the shortfall: one more hour there gains next to nothing beside the
 * main bottleneck. Common practice, no source.
 */
export const MIN_BOTTLENECK_SHARE = 0.05;

/**
 * Every firm order not shipped complete in its week, with its causes in words.
 *
 * Backlog is assigned to orders first-in-first-out by due week, ordinary orders first: in the
 * model must-ship orders are served before all others, so they carry only backlog beyond the
 * ordinary orders' (none in a feasible model plan). Causes are
 * the binding rows on the order's product and everything below it in the bill of materials
 * (multi-level), in the weeks up to the due week: work centers whose capacity binds, materials
 * limited by their supply cap or by lead time, materials scarce beyond their purchase cost. If
 * none binds, the shortfall is economic: delivering on time would cost more than the late
 * penalty it avoids. A work center whose bottleneck value is below MIN_BOTTLENECK_SHARE of the
 * largest on the path is left out; values carry the plant currency ("72.50 EUR/h").
 */
export function explainUnmetOrders(
  data: PlanningData,
  horizonWeeks: number,
  lines: { products: ProductWeekLine[]; workCenters: WorkCenterWeekLine[]; materials: MaterialWeekLine[] },
): UnmetOrder[] {
  const out: UnmetOrder[] = [];
  const group = <T,>(xs: T[], key: (x: T) => string) => {
    const m = new Map<string, T[]>();
    for (const x of xs) {
      const k = key(x);
      const list = m.get(k);
      if (list) list.push(x);
      else m.set(k, [x]);
    }
    return m;
  };
  const indexed = {
    workCenters: group(lines.workCenters, (l) => l.workCenter),
    materials: group(lines.materials, (l) => l.material),
  };
  const demandOf = group(data.demand, (d) => d.product);
  const linesOf = group(lines.products, (l) => l.product);
  const causesMemo = new Map<string, ShortageCause[]>();
  const causesFor = (product: string, week: number) => {
    const key = `${product}|${week}`;
    if (!causesMemo.has(key)) causesMemo.set(key, shortageCauses(data, product, week, indexed));
    return causesMemo.get(key)!;
  };
  for (const p of data.products) {
    const all = (demandOf.get(p.code) ?? [])
      .filter((d) => d.kind === 'firm' && d.week <= horizonWeeks && d.qty > 0)
      .map((d, k) => ({ ...d, ref: d.orderRef ?? `${p.code}/week ${d.week}#${k + 1}` }))
      .sort((a, b) => a.week - b.week || a.ref.localeCompare(b.ref));
    if (all.length === 0) continue;
    const lateBy = new Map((linesOf.get(p.code) ?? []).map((l) => [l.week, l.late]));
    // ordered quantity due up to week t: the list is sorted by week, so these orders are a prefix
    // of it; running sums in list order (the same additions as summing that prefix)
    const prefixSums = new Map<typeof all, { weeks: number[]; sums: number[] }>();
    const cum = (list: typeof all, t: number) => {
      let p = prefixSums.get(list);
      if (!p) {
        const sums = [0];
        for (const o of list) sums.push(sums[sums.length - 1] + o.qty);
        prefixSums.set(list, (p = { weeks: list.map((o) => o.week), sums }));
      }
      // k = number of orders due by week t (binary search for the first one due later)
      let lo = 0;
      let hi = p.weeks.length;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (p.weeks[mid] <= t) lo = mid + 1;
        else hi = mid;
      }
      return p.sums[lo];
    };
    const others = all.filter((o) => !o.mustShip);
    const must = all.filter((o) => o.mustShip);
    // the backlog belongs to ordinary orders first; must-ship orders carry only what exceeds them
    const backlogOf = (list: typeof all, t: number) => {
      const late = lateBy.get(t) ?? 0;
      const ordinary = Math.min(late, cum(others, t));
      return list === others ? ordinary : late - ordinary;
    };
    for (const list of [must, others]) {
      const shippedBy = (t: number) => cum(list, t) - backlogOf(list, t);
      let start = 0;
      for (const o of list) {
        const end = start + o.qty;
        const short = Math.min(o.qty, Math.max(0, end - Math.max(start, shippedBy(o.week))));
        if (short > TOLERANCES.quantity * 10) {
          let completeWeek: number | null = null;
          for (let t = o.week; t <= horizonWeeks; t++)
            if (shippedBy(t) >= end - TOLERANCES.quantity * 10) {
              completeWeek = t;
              break;
            }
          const causes = causesFor(p.code, o.week);
          const when = completeWeek === null ? 'not complete within the horizon' : `complete in week ${completeWeek}`;
          out.push({
            orderRef: o.ref,
            product: p.code,
            week: o.week,
            qty: o.qty,
            shortQty: short,
            completeWeek,
            causes,
            text: `Order ${o.ref}: ${qty(short)} short in week ${o.week} (${when}) — ${causes.map((c) => c.text).join('; ')}`,
          });
        }
        start = end;
      }
    }
  }
  return out;
}

function shortageCauses(
  data: PlanningData,
  product: string,
  dueWeek: number,
  lines: { workCenters: Map<string, WorkCenterWeekLine[]>; materials: Map<string, MaterialWeekLine[]> },
): ShortageCause[] {
  const below = bomDescendants(data.bom, product);
  const made = new Set([product, ...below.products]);
  const wcs = new Set(data.routings.filter((r) => made.has(r.product)).map((r) => r.workCenter));
  const capacity: ShortageCause[] = [];
  for (const w of data.workCenters) {
    if (!wcs.has(w.code)) continue;
    const binding = (lines.workCenters.get(w.code) ?? []).filter((l) => l.week <= dueWeek && l.binding);
    if (binding.length === 0) continue;
    const weeks = binding.map((l) => l.week);
    const value = Math.max(...binding.map((l) => l.bottleneckValue));
    const atCap = binding.some((l) => l.overtimeCapHours !== null && l.overtimeCapHours > 0 && l.overtimeHours >= l.overtimeCapHours - TOLERANCES.quantity);
    const noOvertime = binding.every((l) => l.overtimeCapHours === 0);
    // a plan never loads a work center beyond its regular time and the overtime it may use, so a
    // binding row means its hours are all used, not that it is over-loaded
    capacity.push({
      kind: 'capacity',
      item: w.code,
      weeks,
      value,
      text: `${w.name} fully used ${weekRanges(weeks)} (bottleneck value ${money(value)} ${data.plant.currency}/h${atCap ? ', overtime at its cap' : noOvertime ? ', no overtime allowed' : ''})`,
    });
  }
  const largest = Math.max(0, ...capacity.map((c) => c.value ?? 0));
  const causes: ShortageCause[] = capacity.filter((c) => (c.value ?? 0) >= MIN_BOTTLENECK_SHARE * largest);
  for (const m of data.materials) {
    if (!below.materials.has(m.code)) continue;
    const ml = (lines.materials.get(m.code) ?? []).filter((l) => l.week <= dueWeek);
    const capped = ml.filter((l) => l.supplyCapValue > TOLERANCES.value);
    if (capped.length > 0) {
      causes.push({ kind: 'supply_cap', item: m.code, weeks: capped.map((l) => l.week), text: `${m.name} limited by supply cap (${weekRanges(capped.map((l) => l.week))})` });
      continue;
    }
    const scarce = ml.filter((l) => l.bottleneckValue > m.unitCost + TOLERANCES.value && l.stock <= TOLERANCES.quantity);
    const early = scarce.filter((l) => l.week <= m.leadTimeWeeks);
    if (early.length > 0)
      causes.push({
        kind: 'lead_time',
        item: m.code,
        weeks: early.map((l) => l.week),
        text: `${m.name} short in ${weekRanges(early.map((l) => l.week))}: a purchase takes ${m.leadTimeWeeks} week${m.leadTimeWeeks === 1 ? '' : 's'} to arrive`,
      });
    else if (scarce.length > 0)
      causes.push({ kind: 'material', item: m.code, weeks: scarce.map((l) => l.week), text: `${m.name} short in ${weekRanges(scarce.map((l) => l.week))}` });
  }
  if (causes.length === 0)
    causes.push({
      kind: 'economics',
      item: product,
      weeks: [dueWeek],
      text: 'no resource limit binds: delivering on time would cost more than the late penalty it avoids',
    });
  return causes;
}
