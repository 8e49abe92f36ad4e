import { describe, expect, it } from 'vitest';
import { buildModel } from '../src/build-model';
import { mapSolution } from '../src/map-solution';
import { roundPlan } from '../src/round-plan';
import type { Plan } from '../src/plan';
import type { PlanningData } from '../src/planning-data';
import { buildShiftSheets, ShiftSheetError } from '../src/shift-sheets/build-shift-sheets';
import { workingTimeCautions } from '../src/shift-sheets/working-time';
import { shiftWindows } from '../src/shift-sheets/shift-windows';
import type { ShiftSheet } from '../src/shift-sheets/shift-sheet';
import { generatePlant, type PlantSize } from './support/generate-plant';
import { solveUnderTest, solverName } from './support/solver';

async function approvedPlan(seed: number, size: PlantSize, whole: boolean): Promise<{ data: PlanningData; plan: Plan }> {
  const data = generatePlant(seed, size);
  const built = buildModel(data, { horizonWeeks: size.weeks });
  const result = await solveUnderTest(built.problem);
  expect(result.status).toBe('optimal');
  const lp = mapSolution(data, built, result);
  return { data, plan: whole ? roundPlan(data, lp).plan : lp };
}

const cases: [number, PlantSize, boolean, number][] = [
  [61, { finished: 6, subassemblies: 3, workCenters: 3, materials: 4, weeks: 3 }, true, 0],
  [62, { finished: 10, subassemblies: 4, workCenters: 4, materials: 5, weeks: 3 }, true, 45],
  [63, { finished: 8, subassemblies: 4, workCenters: 3, materials: 4, weeks: 2 }, false, 15],
];

describe(`shift sheets: properties over generated plans (solver: ${solverName})`, () => {
  for (const [seed, size, whole, lag] of cases) {
    it(`seed ${seed} (${whole ? 'whole units' : 'LP quantities'}, transfer lag ${lag} min): conservation, precedence, no overlap, inside open shifts, within shift + overtime`, async () => {
      const { data, plan } = await approvedPlan(seed, size, whole);
      const { sheets, unscheduled } = buildShiftSheets(data, plan, { transferLagMinutes: lag });
      expect(sheets.length).toBeGreaterThan(0);
      const jobs = sheets.flatMap((s) => s.jobs.map((j) => ({ ...j, sheet: s })));

      // 1. conservation: every routing step of every product made in a week gets exactly the plan's quantity
      for (const l of plan.products.filter((x) => x.make > 1e-9)) {
        for (const r of data.routings.filter((x) => x.product === l.product)) {
          const scheduled = jobs.filter((j) => j.sheet.week === l.week && j.product === l.product && j.operation === r.sequence).reduce((a, j) => a + j.quantity, 0);
          const left = unscheduled.filter((u) => u.week === l.week && u.product === l.product && u.operation === r.sequence).reduce((a, u) => a + u.quantity, 0);
          expect(Math.abs(scheduled + left - l.make)).toBeLessThan(1e-9 * (1 + l.make));
        }
      }
      // 2. routing precedence: a step starts only after the earlier step has finished, plus the lag
      for (const week of new Set(jobs.map((j) => j.sheet.week)))
        for (const p of data.products) {
          const steps = data.routings.filter((r) => r.product === p.code).sort((a, b) => a.sequence - b.sequence);
          for (let k = 1; k < steps.length; k++) {
            const before = jobs.filter((j) => j.sheet.week === week && j.product === p.code && j.operation === steps[k - 1].sequence);
            const after = jobs.filter((j) => j.sheet.week === week && j.product === p.code && j.operation === steps[k].sequence);
            if (after.length === 0) continue;
            const ready = Math.max(...before.map((j) => j.endMinute)) + lag;
            for (const j of after) expect(j.setupStartMinute).toBeGreaterThanOrEqual(ready - 1e-9);
          }
        }
      // 3. no two jobs overlap on one work center (setups included)
      for (const wc of data.workCenters)
        for (const week of new Set(jobs.map((j) => j.sheet.week))) {
          const mine = jobs.filter((j) => j.sheet.workCenter === wc.code && j.sheet.week === week).sort((a, b) => a.setupStartMinute - b.setupStartMinute);
          for (let i = 1; i < mine.length; i++) expect(mine[i].setupStartMinute).toBeGreaterThanOrEqual(mine[i - 1].endMinute - 1e-9);
        }
      // 4. every job inside an open shift window of its work center (overtime counted as open)
      for (const j of jobs) {
        expect(j.setupStartMinute).toBeGreaterThanOrEqual(j.sheet.shiftStartMinute - 1e-9);
        expect(j.endMinute).toBeLessThanOrEqual((j.sheet.overtimeEndMinute ?? j.sheet.shiftEndMinute) + 1e-9);
        expect(j.startMinute - j.setupStartMinute).toBeCloseTo(j.setupMinutes, 9);
        if (j.overtime) expect(j.endMinute).toBeGreaterThan(j.sheet.shiftEndMinute);
      }
      // 5. total time per shift within its length plus its overtime
      for (const s of sheets) expect(s.plannedMinutes).toBeLessThanOrEqual(s.availableMinutes + s.overtimeMinutes + 1e-9);
      // the first operation of each job lists what to issue: quantity per (scrap included) × job quantity
      for (const j of jobs.filter((x) => x.previousWorkCenter === null)) {
        const lines = data.bom.filter((b) => b.parent === j.product);
        expect(j.materials.map((m) => m.item)).toEqual(lines.map((b) => b.material ?? b.componentProduct));
        j.materials.forEach((m, i) => expect(m.quantity).toBeCloseTo((lines[i].qtyPer / (1 - lines[i].scrapPct / 100)) * j.quantity, 9));
      }
      // whole-unit plans are split in whole units
      if (whole) for (const j of jobs) expect(Math.abs(j.quantity - Math.round(j.quantity))).toBeLessThan(1e-9);
    });
  }

  it('puts no job on holidays, in downtime or in a closed week (windows from the calendar)', () => {
    const data = generatePlant(64, { finished: 3, subassemblies: 1, workCenters: 2, materials: 2, weeks: 3 });
    const wc = { ...data.workCenters[0], shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['06:00'] } };
    wc.exceptions = [{ week: 1, holidayDays: 2, downtimeHours: 3 }, { week: 2, closed: true }];
    const w1 = shiftWindows(wc, 1, 0).windows;
    expect(w1.map((w) => w.day)).toEqual([0, 1, 2]); // 5 days − 2 holidays
    expect(w1[2].end - w1[2].start).toBe(5 * 60); // 3 h downtime off the last open shift
    expect(shiftWindows(wc, 2, 4).windows).toEqual([]);
    // overtime goes after each day's last shift
    const w3 = shiftWindows(wc, 3, 10).windows;
    expect(w3.map((w) => w.overtimeEnd - w.end)).toEqual([120, 120, 120, 120, 120]);
  });
});

describe('shift sheets: a job without setup that does not fit the rest of a shift', () => {
  it('starts in the shift where its first unit runs, not where the previous step ended', () => {
    // Step 10 fills WC-A's Monday shift (8 × 1 h); step 20 on WC-B is released at 15:00, when
    // WC-B's Monday overtime (30 min) cannot hold one 1 h unit, so the job moves to Tuesday.
    const pattern = { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] };
    const wc = (code: string) => ({ code, name: code, efficiency: 1, overtimeCapHoursPerWeek: null, overtimeCostPerHour: 0, shiftPattern: pattern, exceptions: [] });
    const data: PlanningData = {
      plant: { currency: 'EUR', weekStart: 'monday', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 },
      weeks: [{ index: 1, startDate: '2027-01-04' }],
      products: [{ code: 'P', name: 'P', unit: 'pcs', kind: 'finished', price: 1, safetyStock: 0, batchMultiple: 1, openingStock: 0, latePenalty: 0 }],
      bom: [],
      routings: [
        { product: 'P', sequence: 10, workCenter: 'WC-A', hoursPerUnit: 1, setupHours: 0 },
        { product: 'P', sequence: 20, workCenter: 'WC-B', hoursPerUnit: 1, setupHours: 0 },
      ],
      workCenters: [wc('WC-A'), wc('WC-B')],
      materials: [],
      demand: [],
    };
    const plan = {
      horizonWeeks: 1,
      outcome: 'optimal',
      products: [{ product: 'P', week: 1, make: 8 }],
      workCenters: [{ workCenter: 'WC-B', week: 1, overtimeHours: 2.5 }],
    } as unknown as Plan;
    const { sheets } = buildShiftSheets(data, plan);
    const b = sheets.filter((s) => s.workCenter === 'WC-B');
    expect(b.map((s) => s.date)).toEqual(['2027-01-05']);
    const job = b[0].jobs[0];
    expect([job.setupStart, job.start, job.quantity]).toEqual(['2027-01-05T07:00', '2027-01-05T07:00', 8]);
    expect(b[0].plannedMinutes).toBe(8 * 60);
  });
});

describe('shift sheets: non-delay dispatching', () => {
  it('a work center runs ready work instead of idling for a job still on an earlier step (Giffler & Thompson 1960)', () => {
    // P1 (due first) runs 8 h on WC-A, then 1 h on WC-B; P2 (no order) runs 8 h on WC-B only.
    // WC-B can start P2 on Monday 07:00; P1 reaches WC-B only at Monday 15:00, the end of its shift.
    const pattern = { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] };
    const wc = (code: string) => ({ code, name: code, efficiency: 1, overtimeCapHoursPerWeek: null, overtimeCostPerHour: 0, shiftPattern: pattern, exceptions: [] });
    const product = (code: string) => ({ code, name: code, unit: 'pcs', kind: 'finished' as const, price: 1, safetyStock: 0, batchMultiple: 1, openingStock: 0, latePenalty: 0 });
    const data: PlanningData = {
      plant: { currency: 'EUR', weekStart: 'monday', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 },
      weeks: [{ index: 1, startDate: '2027-01-04' }],
      products: [product('P1'), product('P2')],
      bom: [],
      routings: [
        { product: 'P1', sequence: 10, workCenter: 'WC-A', hoursPerUnit: 1, setupHours: 0 },
        { product: 'P1', sequence: 20, workCenter: 'WC-B', hoursPerUnit: 0.125, setupHours: 0 },
        { product: 'P2', sequence: 10, workCenter: 'WC-B', hoursPerUnit: 1, setupHours: 0 },
      ],
      workCenters: [wc('WC-A'), wc('WC-B')],
      materials: [],
      demand: [{ product: 'P1', week: 1, kind: 'firm', qty: 8, orderRef: 'SO-1' }],
    };
    const plan = { horizonWeeks: 1, outcome: 'optimal', products: [{ product: 'P1', week: 1, make: 8 }, { product: 'P2', week: 1, make: 8 }], workCenters: [] } as unknown as Plan;
    const b = buildShiftSheets(data, plan).sheets.filter((s) => s.workCenter === 'WC-B');
    expect(b.map((s) => [s.date, s.jobs.map((j) => `${j.product} ${j.start.slice(11)}–${j.end.slice(11)}`)])).toEqual([
      ['2027-01-04', ['P2 07:00–15:00']],
      ['2027-01-05', ['P1 07:00–08:00']],
    ]);
  });
});

describe('shift sheets: bad input', () => {
  it('names a work center with load but no open shift in the week', async () => {
    const { data, plan } = await approvedPlan(61, cases[0][1], true);
    const loaded = plan.workCenters.find((l) => l.week === 1 && l.loadHours > 0)!;
    const broken = structuredClone(data);
    broken.workCenters.find((w) => w.code === loaded.workCenter)!.exceptions.push({ week: 1, closed: true });
    expect(() => buildShiftSheets(broken, plan)).toThrow(ShiftSheetError);
    expect(() => buildShiftSheets(broken, plan)).toThrow(new RegExp(`work center ${loaded.workCenter} has no open shift in week 1`));
  });

  it('names a routing step pointing at a deleted work center', async () => {
    const { data, plan } = await approvedPlan(61, cases[0][1], true);
    const made = plan.products.find((l) => l.make > 0)!;
    const broken = structuredClone(data);
    broken.routings.find((r) => r.product === made.product)!.workCenter = 'WC-DELETED';
    expect(() => buildShiftSheets(broken, plan)).toThrow(/points at work center WC-DELETED, which does not exist/);
  });

  it('refuses a plan that was not solved', async () => {
    const { data, plan } = await approvedPlan(61, cases[0][1], true);
    expect(() => buildShiftSheets(data, { ...plan, outcome: 'infeasible' })).toThrow(/no production to schedule/);
  });
});

describe('working-time cautions at the limits (defaults from the EU Working Time Directive 2003/88/EC)', () => {
  const data = generatePlant(65, { finished: 2, subassemblies: 1, workCenters: 1, materials: 1, weeks: 1 });
  // data.plant: maxWeeklyHours 48 (Art. 6), minDailyRestHours 11 (Art. 3)
  const sheet = (day: number, startHour: number, hours: number, overtimeHours = 0): ShiftSheet => {
    const start = day * 1440 + startHour * 60;
    const end = start + hours * 60;
    return {
      workCenter: 'WC-1', workCenterName: 'Work center 1', week: 1, date: `2027-01-0${4 + day}`, weekday: 'monday', shift: 1,
      shiftStart: '', shiftEnd: '', overtimeEnd: null, shiftStartMinute: start, shiftEndMinute: end,
      overtimeEndMinute: overtimeHours > 0 ? end + overtimeHours * 60 : null, availableMinutes: hours * 60,
      overtimeMinutes: overtimeHours * 60, plannedMinutes: 0, jobs: [],
    };
  };
  it('48 h in a week is allowed; 48 h plus 1 h of overtime is not (Art. 6)', () => {
    const six = [0, 1, 2, 3, 4, 5].map((d) => sheet(d, 6, 8));
    expect(workingTimeCautions(data, six).filter((c) => c.kind === 'weekly_hours')).toEqual([]);
    const more = [...six.slice(0, 5), sheet(5, 6, 8, 1)];
    const c = workingTimeCautions(data, more).filter((x) => x.kind === 'weekly_hours');
    expect(c).toHaveLength(1);
    expect(c[0].actual).toBe(49);
    expect(c[0].source).toMatch(/2003\/88\/EC, Art\. 6/);
  });
  it('11 h of rest between shifts is allowed; 10 h is not (Art. 3)', () => {
    // 13 h shifts from 06:00 end at 19:00: 11 h until 06:00 the next day
    expect(workingTimeCautions(data, [sheet(0, 6, 13), sheet(1, 6, 13)]).filter((c) => c.kind === 'daily_rest')).toEqual([]);
    const c = workingTimeCautions(data, [sheet(0, 6, 13, 1), sheet(1, 6, 13)]).filter((x) => x.kind === 'daily_rest');
    expect(c).toHaveLength(1);
    expect(c[0].actual).toBe(10);
    expect(c[0].source).toMatch(/2003\/88\/EC, Art\. 3/);
  });
  it('warns on a run of five night shifts, not on four (fatigue; NIOSH 2004, from memory)', () => {
    const nights = (n: number) => Array.from({ length: n }, (_, d) => sheet(d, 22, 8));
    expect(workingTimeCautions(data, nights(4)).filter((c) => c.kind === 'night_run')).toEqual([]);
    expect(workingTimeCautions(data, nights(5)).filter((c) => c.kind === 'night_run')).toHaveLength(1);
  });
});
