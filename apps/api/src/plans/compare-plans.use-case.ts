import type { EntityManager } from 'typeorm';
import type { PlanComparison, PlanResults } from '@millrace/contracts';
import { planSummarySchema } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { findPlan, loadPlanResults } from './plans.repository';

/**
 * Two solved plan versions side by side (e.g. the plant as it is and a scenario): margin,
 * overtime, material spend, unmet orders and load per work center over the horizon.
 */
export async function comparePlans(db: EntityManager, aId: number, bId: number): Promise<PlanComparison> {
  const [a, b] = await Promise.all([solved(db, aId), solved(db, bId)]);
  const pair = (f: (r: PlanResults) => number) => ({ a: f(a.results), b: f(b.results), delta: f(b.results) - f(a.results) });
  const centers = new Map<string, string>();
  for (const r of [...a.results.load, ...b.results.load]) centers.set(r.workCenter, r.workCenterName);
  const sum = (r: PlanResults, wc: string, f: 'loadHours' | 'overtimeHours') => r.load.filter((l) => l.workCenter === wc).reduce((s, l) => s + l[f], 0);
  const peak = (r: PlanResults, wc: string) => {
    const values = r.load.filter((l) => l.workCenter === wc && l.percentOfAvailable !== null).map((l) => l.percentOfAvailable as number);
    return values.length > 0 ? Math.max(...values) : null;
  };
  return {
    a: planSummarySchema.parse(a.plan),
    b: planSummarySchema.parse(b.plan),
    margin: pair((r) => r.totals.margin),
    overtimeHours: pair((r) => r.totals.overtimeHours),
    overtimeCost: pair((r) => r.totals.overtimeCost),
    materialSpend: pair((r) => r.totals.materialSpend),
    unmetQty: pair((r) => r.totals.unmetQty),
    loadByWorkCenter: [...centers].sort(([x], [y]) => x.localeCompare(y)).map(([workCenter, workCenterName]) => {
      const la = sum(a.results, workCenter, 'loadHours');
      const lb = sum(b.results, workCenter, 'loadHours');
      const oa = sum(a.results, workCenter, 'overtimeHours');
      const ob = sum(b.results, workCenter, 'overtimeHours');
      return {
        workCenter,
        workCenterName,
        loadHours: { a: la, b: lb, delta: lb - la },
        overtimeHours: { a: oa, b: ob, delta: ob - oa },
        peakPercent: { a: peak(a.results, workCenter), b: peak(b.results, workCenter) },
      };
    }),
    unmet: { a: a.results.unmet, b: b.results.unmet },
  };
}

async function solved(db: EntityManager, id: number) {
  const plan = await findPlan(db, id);
  if (!plan) throw AppError.notFound(`Plan version ${id} does not exist.`);
  const results = plan.solveStatus === 'solved' ? await loadPlanResults(db, id) : null;
  if (!results) throw AppError.conflict(`Plan version ${id} has no valid results to compare (its solve status is ${plan.solveStatus}).`);
  return { plan, results };
}
