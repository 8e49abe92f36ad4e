import type { PlanDetail } from '@millrace/contracts';

/**
 * The margin of a plan version as the planner should read it. With whole units on, the plan
 * carried out is the rounded one: its margin is the main figure and the LP optimum is only the
 * bound it was measured against. With whole units off, the LP optimum is the plan's margin.
 */
export type MarginFigures =
  | { kind: 'whole_units'; margin: number; lpBound: number | null }
  | { kind: 'lp_optimum'; margin: number }
  | { kind: 'lp_bound_only'; lpBound: number }
  | { kind: 'none' };

export const marginLabels = { wholeUnits: 'Margin, whole units', lpBound: 'LP bound', lpOptimum: 'Margin (LP optimum, fractional units)' } as const;

export function marginFigures(plan: Pick<PlanDetail, 'wholeUnits' | 'objective'> & { rounding?: PlanDetail['rounding'] }): MarginFigures {
  if (plan.wholeUnits && plan.rounding) return { kind: 'whole_units', margin: plan.rounding.margin, lpBound: plan.objective };
  if (plan.objective === null) return { kind: 'none' };
  return plan.wholeUnits ? { kind: 'lp_bound_only', lpBound: plan.objective } : { kind: 'lp_optimum', margin: plan.objective };
}
