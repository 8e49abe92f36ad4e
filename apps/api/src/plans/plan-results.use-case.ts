import type { EntityManager } from 'typeorm';
import Papa from 'papaparse';
import type { PlanResults } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { findPlan, loadPlanMps, loadPlanResults } from './plans.repository';

/**
 * The results of a solved and checked plan version. A plan that failed the independent check,
 * or has not been solved, has no results to show (409 saying why).
 */
export async function readPlanResults(db: EntityManager, planId: number): Promise<PlanResults> {
  const plan = await findPlan(db, planId);
  if (!plan) throw AppError.notFound(`Plan version ${planId} does not exist.`);
  if (plan.solveStatus !== 'solved') {
    const why =
      plan.solveStatus === 'check_failed'
        ? 'its plan failed the independent check against the planning data; see checkViolations on the plan'
        : `its solve status is ${plan.solveStatus}`;
    throw AppError.conflict(`Plan version ${planId} has no results to show: ${why}.`);
  }
  const results = await loadPlanResults(db, planId);
  if (!results) throw AppError.conflict(`Plan version ${planId} has no results stored.`);
  return results;
}

/** Plan lines as CSV (one row per product and week). */
export function planLinesCsv(results: PlanResults): string {
  return Papa.unparse(
    results.lines.map((l) => ({
      product: l.product,
      product_name: l.productName,
      week: l.week,
      week_start: l.weekStart,
      demand: l.demand,
      make: l.make,
      ship: l.ship,
      stock: l.stock,
      late: l.late,
    })),
    { newline: '\r\n' },
  );
}

/** The exact MPS of the LP that was solved (its optimum is minus the plan's objective). */
export async function readPlanMps(db: EntityManager, planId: number): Promise<string> {
  const plan = await findPlan(db, planId);
  if (!plan) throw AppError.notFound(`Plan version ${planId} does not exist.`);
  const mps = await loadPlanMps(db, planId);
  if (!mps) throw AppError.conflict(`Plan version ${planId} has no solved model yet (its solve status is ${plan.solveStatus}).`);
  return mps;
}
