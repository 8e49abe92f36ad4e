import { describe, expect, it } from 'vitest';
import { buildModel } from '../src/build-model';
import { mapSolution } from '../src/map-solution';
import { roundPlan } from '../src/round-plan';
import { checkPlan } from '../src/check-plan';
import type { PlanningData } from '../src/planning-data';
import { generatePlant, type PlantSize } from './support/generate-plant';
import { sailboatPlant } from './support/sailboat';
import { solveUnderTest, solverName } from './support/solver';

async function lpPlan(data: PlanningData, weeks: number) {
  const built = buildModel(data, { horizonWeeks: weeks, wholeUnits: true });
  const result = await solveUnderTest(built.problem);
  expect(result.status).toBe('optimal');
  return mapSolution(data, built, result);
}

describe(`whole units and batch multiples (solver: ${solverName})`, () => {
  it('leaves an LP plan that is already whole (Winston sailboat, §3.10) unchanged: gap 0', async () => {
    const data = sailboatPlant();
    const plan = await lpPlan(data, 4);
    const { plan: rounded, report } = roundPlan(data, plan);
    expect(report.outcome).toBe('repaired');
    expect(rounded.products.map((l) => l.make)).toEqual([40, 50, 75, 25]);
    expect(report.gap).toBeCloseTo(0, 3);
    expect(report.roundedMargin).toBeCloseTo(-78_450, 3);
  });

  const sizes: [number, PlantSize][] = [
    [31, { finished: 6, subassemblies: 3, workCenters: 3, materials: 4, weeks: 5 }],
    [32, { finished: 12, subassemblies: 5, workCenters: 5, materials: 8, weeks: 8 }],
  ];
  for (const [seed, size] of sizes) {
    it(`rounds a generated plant (seed ${seed}) to batch multiples that pass the independent checker, below the LP bound`, async () => {
      const data = generatePlant(seed, size);
      const plan = await lpPlan(data, size.weeks);
      const { plan: rounded, report } = roundPlan(data, plan);
      // every production quantity is a whole multiple of its product's batch
      const batch = new Map(data.products.map((p) => [p.code, p.batchMultiple]));
      for (const l of rounded.products) {
        const k = l.make / batch.get(l.product)!;
        expect(Math.abs(k - Math.round(k))).toBeLessThan(1e-9);
      }
      // forecast served in whole units
      for (const l of rounded.products) expect(Math.abs(l.shipForecast - Math.round(l.shipForecast))).toBeLessThan(1e-9);
      expect(report.outcome).toBe('repaired');
      expect(checkPlan(data, rounded)).toEqual([]);
      // the LP margin bounds every whole-unit plan (no smoothing), and the gap is reported
      expect(report.roundedMargin).toBeLessThanOrEqual(report.lpMargin + 1e-6);
      expect(report.gap).toBeCloseTo(report.lpMargin - report.roundedMargin, 6);
      expect(report.roundedMargin).toBeCloseTo(rounded.margin.margin, 6);
    });
  }

  it('refuses to round a plan that was not solved', async () => {
    const data = sailboatPlant();
    const plan = await lpPlan(data, 4);
    expect(() => roundPlan(data, { ...plan, outcome: 'infeasible' })).toThrow(/only a solved plan/);
  });
});
