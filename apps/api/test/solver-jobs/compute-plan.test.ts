import { describe, expect, it } from 'vitest';
import { readMps, solveWithHighs } from '@millrace/lp-core';
import type { PlanningData } from '@millrace/plan-model';
import { computePlan, type ComputeRequest } from '../../src/solver-jobs/compute-plan';
import { chooseCrossCheckSolver, crossCheckPlan } from '../../src/solver-jobs/cross-check-plan';

/**
 * The worker's computation without the queue: a one-product, one-work-center plant (invented
 * data) where capacity is a plain fact: 1 shift × 8 h × 5 days = 40 h a week (common practice,
 * no source) at 1 h per unit, so at most 40 units a week.
 */
function plant(firstWeekQty: number, mustShip: boolean): PlanningData {
  return {
    plant: { currency: 'EUR', weekStart: 'monday', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 },
    weeks: ['2027-01-04', '2027-01-11', '2027-01-18', '2027-01-25'].map((startDate, i) => ({ index: i + 1, startDate })),
    products: [
      { code: 'A', name: 'Stool', unit: 'pcs', kind: 'finished', price: 100, safetyStock: 0, batchMultiple: 1, openingStock: 0, latePenalty: 5 },
    ],
    bom: [],
    routings: [{ product: 'A', sequence: 10, workCenter: 'W', hoursPerUnit: 1, setupHours: 0 }],
    workCenters: [
      {
        code: 'W',
        name: 'Lathe',
        efficiency: 1,
        overtimeCapHoursPerWeek: 0,
        overtimeCostPerHour: 0,
        shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] },
        exceptions: [],
      },
    ],
    materials: [],
    demand: [
      { product: 'A', week: 1, kind: 'firm', qty: firstWeekQty, orderRef: 'SO-9', mustShip },
      { product: 'A', week: 2, kind: 'firm', qty: 10, orderRef: 'SO-10' },
      { product: 'A', week: 3, kind: 'firm', qty: 10, orderRef: 'SO-11' },
      { product: 'A', week: 4, kind: 'firm', qty: 10, orderRef: 'SO-12' },
    ],
  };
}

const request = (data: PlanningData, smoothing = { enabled: false, weight: 0 }): ComputeRequest => ({
  planId: 1,
  data,
  horizonWeeks: 4,
  smoothing,
  wholeUnits: false,
});
const hooks = { onProgress: () => {}, shouldStop: () => false };

describe('computing a plan', () => {
  it('when a must-ship order needs more than the week can make, then the plan is infeasible and the conflict is named in words', () => {
    // 100 units must ship in week 1 but 40 h at 1 h/unit make at most 40.
    const outcome = computePlan(request(plant(100, true)), hooks);
    expect(outcome.kind).toBe('finished');
    if (outcome.kind !== 'finished') return;
    expect(outcome.record.solveStatus).toBe('infeasible');
    expect(outcome.record.objective).toBeNull();
    expect(outcome.record.results).toBeNull();
    const inf = outcome.record.infeasibility!;
    expect(inf.summary).toMatch(/infeasible/i);
    expect(inf.conflicts.join(' ')).toContain('SO-9');
    expect(inf.conflicts.some((c) => /Lathe/.test(c))).toBe(true);
  });

  it('when the same order is not must-ship, then the plan is solved with the order partly late, and matches HiGHS on its MPS', async () => {
    const outcome = computePlan(request(plant(100, false)), hooks);
    if (outcome.kind !== 'finished') throw new Error('cancelled');
    expect(outcome.record.solveStatus).toBe('solved');
    const unmet = outcome.record.results!.unmet.find((u) => u.orderRef === 'SO-9')!;
    expect(unmet.qtyShort).toBeCloseTo(60, 4); // 100 ordered, 40 made in week 1 (interior-point accuracy)
    // Reference: HiGHS on the exported MPS.
    const highs = await solveWithHighs(readMps(outcome.record.mps!));
    expect(Math.abs(-highs.objective - outcome.record.objective!) / Math.max(1, Math.abs(highs.objective))).toBeLessThan(1e-6);
  });

  it('when smoothing is on, then the model is a QP and the cross-check uses the log-barrier method and verifies it', async () => {
    const outcome = computePlan(request(plant(60, false), { enabled: true, weight: 0.5 }), hooks);
    if (outcome.kind !== 'finished') throw new Error('cancelled');
    expect(outcome.record.solveStatus).toBe('solved');
    const problem = readMps(outcome.record.mps!);
    expect(problem.Q).toBeDefined();
    expect(chooseCrossCheckSolver(problem)).toBe('barrier');
    const check = await crossCheckPlan({ mps: outcome.record.mps!, planObjective: outcome.record.objective! });
    expect(check.solver).toBe('barrier');
    expect(check.status).toBe('verified');
    // The message names the margin to the cent, not with every float digit.
    expect(check.message).toContain(`(${check.objective!.toFixed(2)})`);
    // HiGHS solves convex QPs too: a third opinion on the same MPS.
    const highs = await solveWithHighs(problem);
    expect(Math.abs(-highs.objective - outcome.record.objective!) / Math.max(1, Math.abs(highs.objective))).toBeLessThan(1e-6);
  });

  it('when a cross-check disagrees beyond 1e-6 relative, then the plan is unverified with both numbers', async () => {
    const outcome = computePlan(request(plant(100, false)), hooks);
    if (outcome.kind !== 'finished') throw new Error('cancelled');
    const wrong = outcome.record.objective! * (1 + 1e-4);
    const check = await crossCheckPlan({ mps: outcome.record.mps!, planObjective: wrong });
    expect(check.status).toBe('unverified');
    expect(Math.abs(check.objective! - outcome.record.objective!) / Math.abs(outcome.record.objective!)).toBeLessThan(1e-6);
    expect(check.planObjective).toBe(wrong);
    expect(check.message).toContain(wrong.toFixed(2));
  });

  it('when the checking simplex cannot finish in its time limit, then the check says not_finished, never verified', async () => {
    const outcome = computePlan(request(plant(100, false)), hooks);
    if (outcome.kind !== 'finished') throw new Error('cancelled');
    const check = await crossCheckPlan(
      { mps: outcome.record.mps!, planObjective: outcome.record.objective! },
      { lpSolverTimeLimitSeconds: 0.001, largeTimeLimitSeconds: 0.001 },
    );
    expect(check.status).toBe('not_finished');
    expect(check.objective).toBeNull();
  });

  it('when the stop hook answers yes, then the computation ends as cancelled', () => {
    const outcome = computePlan(request(plant(100, false)), { onProgress: () => {}, shouldStop: () => true });
    expect(outcome.kind).toBe('cancelled');
  });
});
