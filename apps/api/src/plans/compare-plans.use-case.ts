import type { EntityManager } from 'typeorm';
import type { PlanComparison, PlanResults } from '@millrace/contracts';
import { planSummarySchema } from '@millrace/contracts';
import { comparePlans as comparePlanModels, type NumberPair, type Plan } from '@millrace/plan-model';
import { AppError } from '../http/app-error';
import { findPlan, loadPlanModelPlan, loadPlanResults } from './plans.repository';

/**
 * Two solved plan versions side by side (e.g. the plant as it is and a scenario): plan-model's
 * comparison of the two plans they show (margin and its parts, overtime, load per work center,
 * unmet orders, material spend, differing quantities), with names and peak load from the results.
 */
export async function comparePlans(db: EntityManager, aId: number, bId: number): Promise<PlanComparison> {
  const [a, b] = await Promise.all([solved(db, aId), solved(db, bId)]);
  const c = comparePlanModels(a.plan, b.plan);
  const pair = (p: NumberPair) => ({ a: p.a, b: p.b, delta: p.diff });
  const names = new Map([...a.results.load, ...b.results.load].map((l) => [l.workCenter, l.workCenterName]));
  const peak = (r: PlanResults, wc: string) => {
    const values = r.load.filter((l) => l.workCenter === wc && l.percentOfAvailable !== null).map((l) => l.percentOfAvailable as number);
    return values.length > 0 ? Math.max(...values) : null;
  };
  return {
    a: planSummarySchema.parse(a.record),
    b: planSummarySchema.parse(b.record),
    margin: pair(c.margin),
    revenue: pair(c.revenue),
    materialSpend: pair(c.materialSpend),
    overtimeCost: pair(c.overtimeCost),
    overtimeHours: pair(c.overtimeHours),
    holdingCost: pair(c.holdingCost),
    latePenalties: pair(c.latePenalties),
    unmetOrderCount: pair(c.unmetOrderCount),
    unmetQty: pair(c.shortUnits),
    loadByWorkCenter: c.workCenters.map((w) => ({
      workCenter: w.workCenter,
      workCenterName: names.get(w.workCenter) ?? w.workCenter,
      loadHours: pair(w.loadHours),
      overtimeHours: pair(w.overtimeHours),
      peakPercent: { a: peak(a.results, w.workCenter), b: peak(b.results, w.workCenter) },
      bindingWeeks: { a: w.bindingWeeksA, b: w.bindingWeeksB },
    })),
    unmetOrders: c.unmetOrders,
    unmet: { a: a.results.unmet, b: b.results.unmet },
    quantityDifferences: c.quantityDifferences,
  };
}

async function solved(db: EntityManager, id: number): Promise<{ record: NonNullable<Awaited<ReturnType<typeof findPlan>>>; results: PlanResults; plan: Plan }> {
  const record = await findPlan(db, id);
  if (!record) throw AppError.notFound(`Plan version ${id} does not exist.`);
  const [results, plan] = record.solveStatus === 'solved' ? await Promise.all([loadPlanResults(db, id), loadPlanModelPlan(db, id)]) : [null, null];
  if (!results || !plan) throw AppError.conflict(`Plan version ${id} has no valid results to compare (its solve status is ${record.solveStatus}).`);
  return { record, results, plan };
}
