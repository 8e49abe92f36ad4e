import { describe, expect, it } from 'vitest';
import type { PlanningData, Product, WorkCenter } from '../src/planning-data';
import { buildModel } from '../src/build-model';
import { mapSolution } from '../src/map-solution';
import { checkPlan } from '../src/check-plan';
import { sailboatPlant } from './support/sailboat';
import { solveUnderTest, solverName } from './support/solver';

/**
 * Textbook check values (DOMAIN.md §2) run end to end through build-model → solver → map-solution:
 * the planning model must reproduce the published optima and shadow prices when the plant data
 * is shaped like the textbook problem.
 */

const plant = { currency: 'USD', weekStart: 'monday' as const, maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 };
const oneWeek = [{ index: 1, startDate: '2027-01-04' }];
const product = (code: string, price: number): Product => ({
  code, name: code, unit: 'pc', kind: 'finished', price, safetyStock: 0, batchMultiple: 1, openingStock: 0, latePenalty: 0,
});
/** a work center with exactly `hours` regular hours in the week and no overtime */
const center = (code: string, hours: number): WorkCenter => ({
  code, name: code, efficiency: 1, overtimeCapHoursPerWeek: 0, overtimeCostPerHour: 0,
  shiftPattern: { shiftsPerDay: 1, hoursPerShift: hours / Math.ceil(hours / 24), daysPerWeek: Math.ceil(hours / 24), shiftStarts: ['00:00'] },
  exceptions: [],
});

/** single-period product mix max Σ p_i x_i s.t. Σ a[i,k] x_i ≤ b_k, x_i ≤ D_i as plant data */
function productMix(prices: number[], hours: number[][], capacity: number[], demandCap: number[]): PlanningData {
  const products = prices.map((p, i) => product(`X${i + 1}`, p));
  const workCenters = capacity.map((b, k) => center(`R${k + 1}`, b));
  return {
    plant,
    weeks: oneWeek,
    products,
    bom: [],
    routings: hours.flatMap((row, k) =>
      row.map((a, i) => ({ product: `X${i + 1}`, sequence: 10 * (k + 1), workCenter: `R${k + 1}`, hoursPerUnit: a, setupHours: 0 })),
    ),
    workCenters,
    materials: [],
    demand: demandCap.map((d, i) => ({ product: `X${i + 1}`, week: 1, kind: 'forecast' as const, qty: d })),
  };
}

async function solvePlan(data: PlanningData, weeks: number) {
  const built = buildModel(data, { horizonWeeks: weeks });
  const result = await solveUnderTest(built.problem);
  expect(result.status).toBe('optimal');
  return { built, result, plan: mapSolution(data, built, result) };
}

describe(`textbook models through the planning model (solver: ${solverName})`, () => {
  it('Hillier & Lieberman glass plant (DOMAIN.md §2 row 1): x = (2, 6), z = 36, shadow prices (0, 1.5, 1)', async () => {
    // max 3x₁ + 5x₂; x₁ ≤ 4; 2x₂ ≤ 12; 3x₁ + 2x₂ ≤ 18 — plants as work centers with 4, 12, 18 h.
    // Source: Hillier & Lieberman, Introduction to Operations Research, ch. 3–4, 6 (x and z [S]; duals from memory, re-solved).
    // Unbounded demand is given as a large forecast (1000) that never binds.
    const hoursFor = [
      [1, 0],
      [0, 2],
      [3, 2],
    ];
    const { plan } = await solvePlan(productMix([3, 5], hoursFor, [4, 12, 18], [1000, 1000]), 1);
    expect(plan.margin.margin).toBeCloseTo(36, 6);
    expect(plan.products.map((l) => l.make)).toEqual([expect.closeTo(2, 6), expect.closeTo(6, 6)]);
    expect(plan.workCenters.map((l) => l.bottleneckValue)).toEqual([expect.closeTo(0, 6), expect.closeTo(1.5, 6), expect.closeTo(1, 6)]);
    expect(plan.workCenters.map((l) => l.binding)).toEqual([false, true, true]);
  });

  it('Winston furniture (DOMAIN.md §2 row 2): x = (2, 0, 8), z = 280, duals (0, 10, 10, 0), reduced cost of x₂ −5', async () => {
    // max 60x₁ + 30x₂ + 20x₃; lumber 8, 6, 1 ≤ 48; finishing 4, 2, 1.5 ≤ 20; carpentry 2, 1.5, 0.5 ≤ 8; x₂ ≤ 5.
    // Source: Winston, Operations Research: Applications and Algorithms, the furniture example of the
    // sensitivity chapter (data [S]; optimum, duals and reduced cost from memory, re-solved).
    const hoursFor = [
      [8, 6, 1],
      [4, 2, 1.5],
      [2, 1.5, 0.5],
    ];
    const { plan } = await solvePlan(productMix([60, 30, 20], hoursFor, [48, 20, 8], [1000, 5, 1000]), 1);
    expect(plan.margin.margin).toBeCloseTo(280, 6);
    expect(plan.products.map((l) => l.make)).toEqual([expect.closeTo(2, 6), expect.closeTo(0, 6), expect.closeTo(8, 6)]);
    expect(plan.workCenters.map((l) => l.bottleneckValue)).toEqual([expect.closeTo(0, 6), expect.closeTo(10, 6), expect.closeTo(10, 6)]);
    // the demand limit x₂ ≤ 5 does not bind: x₂ = 0 ships nothing
    expect(plan.products[1].shipForecast).toBeCloseTo(0, 6);
    // reduced cost −5 in the maximisation = making one table loses 5 of margin
    const x2 = plan.productMarginals.find((m) => m.product === 'X2')!;
    expect(x2.reducedCostByWeek[0]).toBeCloseTo(5, 6);
    expect(x2.outcome).toBe('not_worth_making');
  });

  it('Winston sailboat aggregate plan (DOMAIN.md §2 row 3): cost 78,450 with the published production, stock and duals', async () => {
    // Source: Winston, Operations Research: Applications and Algorithms, §3.10 (data [S]; answer from memory, re-solved).
    const data = sailboatPlant();
    const { built, result, plan } = await solvePlan(data, 4);
    expect(plan.objective).toBeCloseTo(78_450, 4);
    expect(plan.margin.margin).toBeCloseTo(-78_450, 4);
    const made = plan.products.map((l) => l.make);
    const overtime = plan.workCenters.map((l) => l.overtimeHours);
    // regular (40, 40, 40, 25) + overtime (0, 10, 35, 0)
    expect(made.map((m, t) => m - overtime[t])).toEqual([40, 40, 40, 25].map((v) => expect.closeTo(v, 5)));
    expect(overtime).toEqual([0, 10, 35, 0].map((v) => expect.closeTo(v, 5)));
    expect(plan.products.map((l) => l.stock)).toEqual([10, 0, 0, 0].map((v) => expect.closeTo(v, 5)));
    // demand-row duals (430, 450, 450, 400): the balance rows' duals (cost of one more boat demanded)
    const duals = built.index.row.balance[0].map((r) => result.rowDuals[r]);
    expect(duals).toEqual([430, 450, 450, 400].map((v) => expect.closeTo(v, 4)));
    expect(plan.unmetOrders).toEqual([]);
    expect(checkPlan(data, plan)).toEqual([]);
  });
});
