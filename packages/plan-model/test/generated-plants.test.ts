import { describe, expect, it } from 'vitest';
import { writeMps } from '@millrace/lp-core';
import { buildModel, type BuiltModel } from '../src/build-model';
import { mapSolution } from '../src/map-solution';
import { checkPlan } from '../src/check-plan';
import type { Plan } from '../src/plan';
import type { PlanningData } from '../src/planning-data';
import { generatePlant, type PlantSize } from './support/generate-plant';
import { highsObjectiveFromMps, solveWithHighsRef } from './support/highs-solve';
import { lpCoreSolve, solveUnderTest, solverName } from './support/solver';

const sizes: [number, PlantSize][] = [
  [11, { finished: 4, subassemblies: 2, workCenters: 3, materials: 3, weeks: 4 }],
  [12, { finished: 12, subassemblies: 5, workCenters: 5, materials: 8, weeks: 8 }],
  [13, { finished: 30, subassemblies: 12, workCenters: 8, materials: 15, weeks: 12 }],
];

const relDiff = (a: number, b: number) => Math.abs(a - b) / Math.max(1, Math.abs(a), Math.abs(b));

async function solvedPlant(seed: number, size: PlantSize): Promise<{ data: PlanningData; built: BuiltModel; plan: Plan; objective: number }> {
  const data = generatePlant(seed, size);
  const built = buildModel(data, { horizonWeeks: size.weeks });
  const result = await solveUnderTest(built.problem);
  expect(result.status).toBe('optimal');
  return { data, built, plan: mapSolution(data, built, result), objective: result.objective };
}

describe(`generated plants (solver: ${solverName})`, () => {
  for (const [seed, size] of sizes) {
    const label = `${size.finished}+${size.subassemblies} products × ${size.weeks} weeks (seed ${seed})`;

    it.skipIf(!lpCoreSolve)(`${label}: lp-core's objective equals HiGHS's on the exported MPS to 1e-6`, async () => {
      // Reference: HiGHS (npm `highs`, WebAssembly), reading the model through its own MPS reader.
      const { built, objective } = await solvedPlant(seed, size);
      const ref = await highsObjectiveFromMps(writeMps(built.problem));
      expect(ref.status).toBe(7); // HiGHS model status "optimal"
      expect(relDiff(objective, ref.objective)).toBeLessThan(1e-6);
    });

    it(`${label}: the model written as MPS and read by HiGHS has the same optimum as the arrays`, async () => {
      // Guards the names and bounds that reach the API's model.mps download.
      const data = generatePlant(seed, size);
      const built = buildModel(data, { horizonWeeks: size.weeks });
      const direct = await solveWithHighsRef(built.problem);
      const viaMps = await highsObjectiveFromMps(writeMps(built.problem));
      expect(relDiff(direct.objective, viaMps.objective)).toBeLessThan(1e-6);
    });

    it(`${label}: the independent checker passes on the mapped plan and the margin matches the objective`, async () => {
      const { data, plan, objective } = await solvedPlant(seed, size);
      expect(checkPlan(data, plan)).toEqual([]);
      // the plan is plain JSON (kept with the plan version): nothing is lost in a round trip
      expect(JSON.parse(JSON.stringify(plan))).toEqual(plan);
      // margin recomputed from the data and the plan's quantities = −objective (no smoothing)
      expect(relDiff(plan.margin.margin, -objective)).toBeLessThan(1e-6);
      // every firm order short in its week is listed with at least one cause in words
      for (const u of plan.unmetOrders) {
        expect(u.causes.length).toBeGreaterThan(0);
        expect(u.text).toMatch(/^Order .+: .+ short in week \d+/);
      }
    });
  }

  it('the checker catches injected violations, each by name', async () => {
    const [seed, size] = sizes[1];
    const { data, plan } = await solvedPlant(seed, size);
    const clone = (): Plan => structuredClone(plan);
    const kinds = (p: Plan) => new Set(checkPlan(data, p).map((v) => v.kind));

    // 1. a work center loaded beyond regular time + overtime: make far more of a product using it
    const busy = plan.workCenters.find((l) => l.binding)!;
    const user = data.routings.find((r) => r.workCenter === busy.workCenter)!;
    const p1 = clone();
    const line = p1.products.find((l) => l.product === user.product && l.week === busy.week)!;
    line.make += 1000;
    expect(kinds(p1)).toContain('capacity_exceeded');
    expect(kinds(p1)).toContain('product_balance');

    // 2. overtime above its cap
    const capped = plan.workCenters.find((l) => l.overtimeCapHours !== null)!;
    const p2 = clone();
    p2.workCenters.find((l) => l.workCenter === capped.workCenter && l.week === capped.week)!.overtimeHours = capped.overtimeCapHours! + 5;
    expect(checkPlan(data, p2).map((v) => [v.kind, v.item, v.week])).toContainEqual(['overtime_cap_exceeded', capped.workCenter, capped.week]);

    // 3. stock that does not add up
    const p3 = clone();
    p3.products[0].stock += 7;
    expect(checkPlan(data, p3).map((v) => [v.kind, v.item, v.week])).toContainEqual(['product_balance', p3.products[0].product, p3.products[0].week]);

    // 4. a purchase removed: material stock would go negative somewhere
    const bought = plan.materials.find((l) => l.buy > 1)!;
    const p4 = clone();
    p4.materials.find((l) => l.material === bought.material && l.week === bought.week)!.buy = 0;
    expect(kinds(p4).has('material_negative') || kinds(p4).has('material_balance')).toBe(true);

    // 5. a purchase above the supply cap
    const capMat = data.materials.find((m) => m.weeklySupplyCap !== null)!;
    const p5 = clone();
    p5.materials.find((l) => l.material === capMat.code && l.week === 1)!.buy = capMat.weeklySupplyCap! + 50;
    expect(kinds(p5)).toContain('supply_cap_exceeded');

    // 6. a negative quantity and a missing line
    const p6 = clone();
    p6.products[1].make = -3;
    p6.workCenters.pop();
    expect(kinds(p6)).toContain('negative_quantity');
    expect(kinds(p6)).toContain('missing_line');

    // 7. forecast shipped beyond the forecast
    const p7 = clone();
    const sold = p7.products.find((l) => l.shipForecast > 0)!;
    sold.shipForecast += 10_000;
    expect(kinds(p7)).toContain('forecast_exceeded');
  });

  it('the bottleneck value of binding capacity rows matches the margin from one more hour (re-solve, 1e-4 relative)', async () => {
    // LP sensitivity analysis (Winston, sensitivity chapter; Hillier & Lieberman ch. 6): the
    // optimal margin is concave and piecewise linear in a row's bound, and the row's dual lies
    // between the gain from one more hour and the loss from one hour less; where the margin is
    // linear over that range (the basis survives), all three agree. Each row is re-solved twice.
    const [seed, size] = sizes[1];
    const { built, plan, objective } = await solvedPlant(seed, size);
    const binding = plan.workCenters.filter((l) => l.binding && l.availableHours >= 1);
    expect(binding.length).toBeGreaterThan(0);
    let linear = 0;
    // Every binding row is bounded; rows are tried until three lie where the margin is linear.
    for (const line of binding) {
      if (linear >= 3) break;
      const k = built.index.workCenters.indexOf(line.workCenter);
      const r = built.index.row.capacity[k][line.week - 1];
      const moved = async (delta: number) => {
        const problem = structuredClone(built.problem);
        problem.rowUpper[r] += delta;
        const again = await solveUnderTest(problem);
        expect(again.status).toBe('optimal');
        return again.objective;
      };
      const gain = objective - (await moved(1)); // margin = −objective
      const loss = (await moved(-1)) - objective;
      const v = line.bottleneckValue;
      expect(gain).toBeLessThanOrEqual(v * (1 + 1e-4) + 1e-6);
      expect(loss).toBeGreaterThanOrEqual(v * (1 - 1e-4) - 1e-6);
      if (relDiff(gain, loss) < 1e-6) {
        linear++;
        expect(relDiff(gain, v)).toBeLessThan(1e-4);
      }
    }
    expect(linear).toBeGreaterThan(0);
  });
});
