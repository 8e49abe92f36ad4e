import { describe, expect, it } from 'vitest';
import { applyScenario, ScenarioError } from '../src/scenario';
import { comparePlans } from '../src/compare-plans';
import { availableHours, overtimeCapHours } from '../src/capacity';
import { supplyCap } from '../src/material-supply';
import { buildModel } from '../src/build-model';
import { mapSolution } from '../src/map-solution';
import { checkPlan } from '../src/check-plan';
import type { PlanningData } from '../src/planning-data';
import { generatePlant } from './support/generate-plant';
import { sailboatPlant } from './support/sailboat';
import { solveUnderTest, solverName } from './support/solver';

const plant = () => generatePlant(41, { finished: 5, subassemblies: 2, workCenters: 3, materials: 3, weeks: 6 });

async function planOf(data: PlanningData, weeks: number) {
  const built = buildModel(data, { horizonWeeks: weeks });
  const result = await solveUnderTest(built.problem);
  expect(result.status).toBe('optimal');
  return mapSolution(data, built, result);
}

describe('applyScenario', () => {
  it('adds an extra shift for some weeks (one more shift × hours × days × efficiency)', () => {
    const base = plant();
    const wc = base.workCenters[0];
    const s = applyScenario(base, [{ kind: 'extra_shift', workCenter: wc.code, fromWeek: 2, toWeek: 3 }]);
    const w2 = s.workCenters[0];
    const perShift = wc.shiftPattern!.hoursPerShift * wc.efficiency;
    for (const week of [2, 3]) {
      const before = availableHours(wc, week);
      const extraDays = Math.max(0, wc.shiftPattern!.daysPerWeek - wc.exceptions.filter((e) => e.week === week).reduce((a, e) => a + (e.holidayDays ?? 0), 0));
      expect(availableHours(w2, week)).toBeCloseTo(before > 0 || extraDays > 0 ? before + perShift * extraDays : 0, 9);
    }
    expect(availableHours(w2, 1)).toBe(availableHours(wc, 1));
    expect(base.workCenters[0].exceptions).toEqual(wc.exceptions); // the original is untouched
  });

  it('takes a work center down for maintenance: no regular time, no overtime', () => {
    const s = applyScenario(plant(), [{ kind: 'maintenance', workCenter: 'WC-2', fromWeek: 4, toWeek: 4 }]);
    const wc = s.workCenters.find((w) => w.code === 'WC-2')!;
    expect(availableHours(wc, 4)).toBe(0);
    expect(overtimeCapHours(wc, 4)).toBe(0);
    expect(availableHours(wc, 3)).toBeGreaterThan(0);
  });

  it('cuts a supply cap for some weeks, by a new cap or a factor', () => {
    const base = plant();
    const capped = base.materials.find((m) => m.weeklySupplyCap !== null)!;
    const s = applyScenario(base, [
      { kind: 'supply_cap', material: capped.code, fromWeek: 1, toWeek: 2, factor: 0.5 },
      { kind: 'supply_cap', material: base.materials[0].code, fromWeek: 5, toWeek: 5, cap: 7 },
    ]);
    const m = s.materials.find((x) => x.code === capped.code)!;
    expect(supplyCap(m, 1)).toBe(capped.weeklySupplyCap! * 0.5);
    expect(supplyCap(m, 3)).toBe(capped.weeklySupplyCap);
    expect(supplyCap(s.materials[0], 5)).toBe(7);
  });

  it('scales demand for one product or all', () => {
    const base = plant();
    const one = applyScenario(base, [{ kind: 'demand_scale', product: 'P-1', factor: 2, demandKind: 'firm' }]);
    base.demand.forEach((d, i) => expect(one.demand[i].qty).toBe(d.product === 'P-1' && d.kind === 'firm' ? 2 * d.qty : d.qty));
    const all = applyScenario(base, [{ kind: 'demand_scale', factor: 0.5, fromWeek: 2, toWeek: 3 }]);
    base.demand.forEach((d, i) => expect(all.demand[i].qty).toBe(d.week >= 2 && d.week <= 3 ? d.qty / 2 : d.qty));
  });

  it('names every bad override', () => {
    try {
      applyScenario(plant(), [
        { kind: 'extra_shift', workCenter: 'WC-404', fromWeek: 1, toWeek: 2 },
        { kind: 'maintenance', workCenter: 'WC-1', fromWeek: 3, toWeek: 99 },
        { kind: 'demand_scale', product: 'P-404', factor: 2 },
        { kind: 'supply_cap', material: 'M-1', fromWeek: 1, toWeek: 1 },
      ]);
      expect.unreachable('bad overrides were accepted');
    } catch (e) {
      expect(e).toBeInstanceOf(ScenarioError);
      expect((e as ScenarioError).issues.map((i) => i.override)).toEqual([0, 1, 2, 3]);
      expect((e as ScenarioError).message).toMatch(/WC-404 does not exist/);
    }
  });
});

describe(`comparePlans (solver: ${solverName})`, () => {
  it('compares the sailboat plan with an extra-shift scenario: overtime and stock fall, margin rises by what they cost', async () => {
    // Winston §3.10 sailboat data (cost 78,450). A second shift in quarters 2–3 adds 40 regular
    // boats a quarter, so the 45 overtime boats (10 + 35) become regular (45 × (450 − 400) =
    // 2,250) and quarter 1 no longer builds ahead (the 10 boats held at 20 = 200): 190 boats at
    // 400 = 76,000, a margin 2,450 higher.
    const base = sailboatPlant();
    const a = await planOf(base, 4);
    const scenario = applyScenario(base, [{ kind: 'extra_shift', workCenter: 'YARD', fromWeek: 2, toWeek: 3 }]);
    const b = await planOf(scenario, 4);
    expect(checkPlan(scenario, b)).toEqual([]);
    const c = comparePlans(a, b);
    expect(c.margin.diff).toBeCloseTo(2450, 3);
    expect(c.holdingCost.diff).toBeCloseTo(-200, 3);
    expect(c.overtimeHours.a).toBeCloseTo(45, 4);
    expect(c.overtimeHours.b).toBeCloseTo(0, 4);
    expect(c.overtimeCost.diff).toBeCloseTo(-2250, 3);
    expect(c.workCenters).toHaveLength(1);
    expect(c.workCenters[0].loadHours.diff).toBeCloseTo(0, 4);
    expect(c.unmetOrders).toEqual([]);
    expect(JSON.parse(JSON.stringify(c))).toEqual(c); // plain JSON
  });

  it('lists unmet orders and quantity differences when demand doubles', async () => {
    const base = sailboatPlant();
    base.workCenters[0].overtimeCapHoursPerWeek = 0;
    const a = await planOf(base, 4);
    const b = await planOf(applyScenario(base, [{ kind: 'demand_scale', product: 'BOAT', factor: 2 }]), 4);
    const c = comparePlans(a, b);
    expect(c.unmetOrderCount.b).toBeGreaterThan(c.unmetOrderCount.a);
    expect(c.shortUnits.b).toBeGreaterThan(c.shortUnits.a);
    expect(c.unmetOrders.every((u) => u.shortB >= u.shortA)).toBe(true);
    expect(c.quantityDifferences.length).toBeGreaterThan(0);
  });
});
