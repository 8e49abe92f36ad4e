import type { PlanningData } from './planning-data';

/**
 * Standard hours one unit of a product puts on each work center, summed over its routing steps.
 *
 * Setup hours in the weekly model: a week's true setup time depends on how many runs the floor
 * makes, which a linear model cannot see. When a product is made in batch multiples (> 1) the
 * setup is amortised over one batch (setupHours / batchMultiple per unit) so the weekly load is
 * not understated; otherwise setup time is left out of the weekly model and placed by the shift
 * sheets, which schedule every setup explicitly. The independent plan checker uses the same rule.
 */
export function loadHoursPerUnit(data: PlanningData): Map<string, Map<string, number>> {
  const batch = new Map(data.products.map((p) => [p.code, p.batchMultiple]));
  const load = new Map<string, Map<string, number>>();
  for (const r of data.routings) {
    const perWc = load.get(r.product) ?? new Map<string, number>();
    const b = batch.get(r.product) ?? 1;
    const setupShare = b > 1 ? r.setupHours / b : 0;
    perWc.set(r.workCenter, (perWc.get(r.workCenter) ?? 0) + r.hoursPerUnit + setupShare);
    load.set(r.product, perWc);
  }
  return load;
}
