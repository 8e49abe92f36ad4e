import { describe, expect, it } from 'vitest';
import { buildModel } from '../src/build-model';
import { mapSolution } from '../src/map-solution';
import { roundPlan } from '../src/round-plan';
import type { Plan } from '../src/plan';
import type { PlanningData } from '../src/planning-data';
import { buildShiftSheets, DEFAULT_SHIFT_SHEET_SETTINGS, ShiftSheetError } from '../src/shift-sheets/build-shift-sheets';
import { workingTimeCautions } from '../src/shift-sheets/working-time';
import { shiftWindows } from '../src/shift-sheets/shift-windows';
import type { ShiftSheet, ShiftSheetSettings } from '../src/shift-sheets/shift-sheet';
import { generatePlant, type PlantSize } from './support/generate-plant';
import { solveUnderTest, solverName } from './support/solver';

/** Hand-worked cases: a work center at full efficiency, no overtime, on the given shift pattern. */
const workCenterOn =
  (shiftPattern: { shiftsPerDay: number; hoursPerShift: number; daysPerWeek: number; shiftStarts: string[] }) =>
  (code: string) => ({ code, name: code, efficiency: 1, overtimeCapHoursPerWeek: null, overtimeCostPerHour: 0, shiftPattern, exceptions: [] });

/** Hand-worked cases: a finished product with no cost, stock or batch rules. */
const plainProduct = (code: string) => ({ code, name: code, unit: 'pcs', kind: 'finished' as const, price: 1, safetyStock: 0, batchMultiple: 1, openingStock: 0, latePenalty: 0 });

async function approvedPlan(seed: number, size: PlantSize, whole: boolean): Promise<{ data: PlanningData; plan: Plan }> {
  const data = generatePlant(seed, size);
  const built = buildModel(data, { horizonWeeks: size.weeks });
  const result = await solveUnderTest(built.problem);
  expect(result.status).toBe('optimal');
  const lp = mapSolution(data, built, result);
  return { data, plan: whole ? roundPlan(data, lp).plan : lp };
}

/** seed, size, whole units, transfer lag (min), transfer batch settings */
const cases: [number, PlantSize, boolean, number, Partial<ShiftSheetSettings>][] = [
  [61, { finished: 6, subassemblies: 3, workCenters: 3, materials: 4, weeks: 3 }, true, 0, {}],
  [62, { finished: 10, subassemblies: 4, workCenters: 4, materials: 5, weeks: 3 }, true, 45, { transferBatchShare: 0.1 }],
  [63, { finished: 8, subassemblies: 4, workCenters: 3, materials: 4, weeks: 2 }, false, 15, { transferBatchShare: 0.3 }],
  [61, { finished: 6, subassemblies: 3, workCenters: 3, materials: 4, weeks: 3 }, true, 30, { transferBatchShare: 1 }],
  [66, { finished: 8, subassemblies: 3, workCenters: 4, materials: 3, weeks: 2 }, true, 0, { transferBatchUnits: { 'P-1': 1, 'P-2': 7, 'S-1': 5 } }],
  [62, { finished: 10, subassemblies: 4, workCenters: 4, materials: 5, weeks: 3 }, true, 0, { dispatchRule: 'earliest_start' }],
  [63, { finished: 8, subassemblies: 4, workCenters: 3, materials: 4, weeks: 2 }, false, 15, { dispatchRule: 'bottleneck_first', transferBatchShare: 0.1 }],
  [66, { finished: 8, subassemblies: 3, workCenters: 4, materials: 3, weeks: 2 }, true, 30, { dispatchRule: 'bottleneck_first' }],
];

/** the minute a step has completed `cumulative` units, read off its jobs (each runs at a steady rate) */
function completedAt(jobs: { quantity: number; startMinute: number; endMinute: number }[], cumulative: number): number {
  const total = jobs.reduce((a, j) => a + j.quantity, 0);
  if (cumulative >= total - 1e-9) return Math.max(...jobs.map((j) => j.endMinute));
  let before = 0;
  for (const j of [...jobs].sort((a, b) => a.startMinute - b.startMinute)) {
    if (j.quantity > 1e-12 && before + j.quantity >= cumulative - 1e-9) return j.startMinute + (Math.max(0, cumulative - before) / j.quantity) * (j.endMinute - j.startMinute);
    before += j.quantity;
  }
  throw new Error('unreachable');
}

/** transfer batch per the settings' definition: share of the week's quantity or units per product, ≥ 1 unit, whole when the quantity is whole */
function batchOf(settings: ShiftSheetSettings, product: string, quantity: number): number {
  const raw = Math.max(settings.transferBatchUnits[product] ?? settings.transferBatchShare * quantity, Math.min(1, quantity));
  return Math.min(quantity, Math.abs(quantity - Math.round(quantity)) < 1e-9 ? Math.ceil(raw - 1e-9) : raw);
}

/**
 * Transfer-batch precedence: every batch k of the later jobs (cumulative units ((k−1)b, kb])
 * starts no earlier than the feeding jobs completed their share of batch k, plus the lag; the
 * first job's setup starts no earlier than batch 1 is there.
 */
function expectBatchPrecedence(
  feeding: { quantity: number; startMinute: number; endMinute: number }[],
  later: { quantity: number; startMinute: number; endMinute: number; setupStartMinute: number }[],
  batch: number,
  quantity: number,
  lag: number,
  scale: number,
) {
  const fed = feeding.reduce((a, j) => a + j.quantity, 0);
  const readyAt = (cumulative: number) => completedAt(feeding, Math.min(fed, scale * cumulative)) + lag;
  let before = 0;
  const sorted = [...later].sort((a, b) => a.setupStartMinute - b.setupStartMinute);
  if (sorted.length > 0) expect(sorted[0].setupStartMinute).toBeGreaterThanOrEqual(readyAt(Math.min(batch, quantity)) - 1e-6);
  for (const j of sorted) {
    const rate = j.quantity > 1e-12 ? (j.endMinute - j.startMinute) / j.quantity : 0;
    for (let k = 1; (k - 1) * batch < before + j.quantity - 1e-9; k++) {
      if (k * batch <= before + 1e-9) continue;
      const batchStart = j.startMinute + Math.max(0, (k - 1) * batch - before) * rate;
      expect(batchStart).toBeGreaterThanOrEqual(readyAt(Math.min(k * batch, quantity)) - 1e-6);
    }
    before += j.quantity;
  }
}

describe(`shift sheets: properties over generated plans (solver: ${solverName})`, () => {
  for (const [seed, size, whole, lag, batches] of cases) {
    it(`seed ${seed} (${whole ? 'whole units' : 'LP quantities'}, transfer lag ${lag} min, batches ${JSON.stringify(batches)}): conservation, batch precedence, no overlap, inside open shifts, within shift + overtime, one setup per run`, async () => {
      const { data, plan } = await approvedPlan(seed, size, whole);
      const { sheets, unscheduled, settings } = buildShiftSheets(data, plan, { transferLagMinutes: lag, ...batches });
      expect(sheets.length).toBeGreaterThan(0);
      // minutes from the plan's first week, so precedence can be checked across week boundaries
      const offset = (week: number) => Math.round((Date.parse(data.weeks.find((w) => w.index === week)!.startDate) - Date.parse(data.weeks[0].startDate)) / 60000);
      const jobs = sheets.flatMap((s) =>
        s.jobs.map((j) => {
          const o = offset(s.week);
          return { ...j, sheet: s, lotWeek: j.carriedFromWeek ?? s.week, setupStartMinute: j.setupStartMinute + o, startMinute: j.startMinute + o, endMinute: j.endMinute + o };
        }),
      );
      /** the jobs of one plan week's production of a product's step, wherever they ran */
      const stepJobs = (product: string, operation: number, week: number) => jobs.filter((j) => j.lotWeek === week && j.product === product && j.operation === operation);

      // carried work is marked with its plan week, an earlier week than the sheet's
      for (const j of jobs) if (j.carriedFromWeek !== null) expect(j.carriedFromWeek).toBeLessThan(j.sheet.week);
      // only what is still open after the plan's last week stays unscheduled
      for (const u of unscheduled) expect(u.reason).toMatch(/plan's last week/);

      // 1. conservation: every routing step of every product made in a plan week gets exactly the
      // plan's quantity, over its own week and the weeks it is carried into (issue 8)
      for (const l of plan.products.filter((x) => x.make > 1e-9)) {
        for (const r of data.routings.filter((x) => x.product === l.product)) {
          const scheduled = stepJobs(l.product, r.sequence, l.week).reduce((a, j) => a + j.quantity, 0);
          const left = unscheduled.filter((u) => u.week === l.week && u.product === l.product && u.operation === r.sequence).reduce((a, u) => a + u.quantity, 0);
          expect(Math.abs(scheduled + left - l.make)).toBeLessThan(1e-9 * (1 + l.make));
        }
      }
      // 2. routing precedence by transfer batches (lot streaming: Trietsch & Baker 1993, from
      // memory), across week boundaries too: batch k of a later step starts only after the
      // earlier step finished batch k, plus the lag; a product's first step takes batch k only
      // after each sub-assembly made in the same plan week finished the same share of its plan
      // quantity, plus the lag
      for (const l of plan.products.filter((x) => x.make > 1e-9)) {
        const week = l.week;
        const batch = batchOf(settings, l.product, l.make);
        const steps = data.routings.filter((r) => r.product === l.product).sort((a, b) => a.sequence - b.sequence);
        for (let k = 1; k < steps.length; k++) expectBatchPrecedence(stepJobs(l.product, steps[k - 1].sequence, week), stepJobs(l.product, steps[k].sequence, week), batch, l.make, lag, 1);
        if (steps.length === 0) continue;
        const firstJobs = stepJobs(l.product, steps[0].sequence, week);
        for (const b of data.bom.filter((x) => x.parent === l.product && x.componentProduct !== undefined)) {
          const made = plan.products.find((x) => x.product === b.componentProduct && x.week === week && x.make > 1e-9);
          const compSteps = data.routings.filter((r) => r.product === b.componentProduct).sort((a, b2) => a.sequence - b2.sequence);
          if (!made || compSteps.length === 0) continue;
          const compJobs = stepJobs(b.componentProduct!, compSteps[compSteps.length - 1].sequence, week);
          expect(firstJobs.reduce((a, j) => a + j.quantity, 0) / l.make).toBeLessThanOrEqual(compJobs.reduce((a, j) => a + j.quantity, 0) / made.make + 1e-9);
          if (compJobs.length === 0) continue;
          expectBatchPrecedence(compJobs, firstJobs, batch, l.make, lag, made.make / l.make);
        }
      }
      // a split into transfer batches only ever helps the floor: with batches of the whole
      // quantity the later steps start after the whole earlier step (the classic rule)
      if (settings.transferBatchShare === 1 && Object.keys(settings.transferBatchUnits).length === 0)
        for (const l of plan.products.filter((x) => x.make > 1e-9)) {
          const steps = data.routings.filter((r) => r.product === l.product).sort((a, b) => a.sequence - b.sequence);
          for (let k = 1; k < steps.length; k++) {
            const before = stepJobs(l.product, steps[k - 1].sequence, l.week);
            for (const j of stepJobs(l.product, steps[k].sequence, l.week)) expect(j.setupStartMinute).toBeGreaterThanOrEqual(Math.max(...before.map((b) => b.endMinute)) + lag - 1e-9);
          }
        }
      // 3. no two jobs overlap on one work center (setups included), carried work and the week's own alike
      for (const wc of data.workCenters) {
        const mine = jobs.filter((j) => j.sheet.workCenter === wc.code).sort((a, b) => a.setupStartMinute - b.setupStartMinute);
        for (let i = 1; i < mine.length; i++) expect(mine[i].setupStartMinute).toBeGreaterThanOrEqual(mine[i - 1].endMinute - 1e-9);
      }
      // 4. every job inside an open shift window of its work center (overtime counted as open)
      for (const j of jobs) {
        const o = offset(j.sheet.week);
        expect(j.setupStartMinute - o).toBeGreaterThanOrEqual(j.sheet.shiftStartMinute - 1e-9);
        expect(j.endMinute - o).toBeLessThanOrEqual((j.sheet.overtimeEndMinute ?? j.sheet.shiftEndMinute) + 1e-9);
        expect(j.startMinute - j.setupStartMinute).toBeCloseTo(j.setupMinutes, 9);
        if (j.overtime) expect(j.endMinute - o).toBeGreaterThan(j.sheet.shiftEndMinute);
      }
      // 5. total time per shift within its length plus its overtime
      for (const s of sheets) expect(s.plannedMinutes).toBeLessThanOrEqual(s.availableMinutes + s.overtimeMinutes + 1e-9);
      // the first operation of each job lists what to issue: quantity per (scrap included) × job quantity
      for (const j of jobs.filter((x) => x.previousWorkCenter === null)) {
        const lines = data.bom.filter((b) => b.parent === j.product);
        expect(j.materials.map((m) => m.item)).toEqual(lines.map((b) => b.material ?? b.componentProduct));
        j.materials.forEach((m, i) => expect(m.quantity).toBeCloseTo((lines[i].qtyPer / (1 - lines[i].scrapPct / 100)) * j.quantity, 9));
      }
      // setups counted once per run: an operation's setup is on its first job; its later jobs in
      // the same week continue it; in a later week it continues without a setup or, when other
      // work ran on the work center in between, starts over with one
      for (const l of plan.products.filter((x) => x.make > 1e-9))
        for (const r of data.routings.filter((x) => x.product === l.product)) {
          const mine = stepJobs(l.product, r.sequence, l.week).sort((a, b) => a.setupStartMinute - b.setupStartMinute);
          if (mine.length > 0) expect(mine[0].continued).toBe(false);
          mine.slice(1).forEach((j, i) => {
            if (j.continued) expect(j.setupMinutes).toBe(0);
            else expect([j.setupMinutes > 0, j.sheet.week > mine[i].sheet.week]).toEqual([true, true]);
          });
        }
      // the sheets of a later week alone are those of the whole run (continued from the first week)
      const lastWeek = Math.max(...sheets.map((s) => s.week));
      const alone = buildShiftSheets(data, plan, { transferLagMinutes: lag, ...batches, weeks: [lastWeek] });
      expect(alone.sheets).toEqual(sheets.filter((s) => s.week === lastWeek));
      // whole-unit plans are split in whole units
      if (whole) for (const j of jobs) expect(Math.abs(j.quantity - Math.round(j.quantity))).toBeLessThan(1e-9);
    });
  }

  it('puts no job on holidays, in downtime or in a closed week; the open time is the plan capacity model\'s (DOMAIN.md §1)', () => {
    const data = generatePlant(64, { finished: 3, subassemblies: 1, workCenters: 2, materials: 2, weeks: 3 });
    const wc = { ...data.workCenters[0], efficiency: 0.8, shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['06:00'] } };
    wc.exceptions = [{ week: 1, holidayDays: 2, downtimeHours: 3 }, { week: 2, closed: true }, { week: 3, holidayDays: 0.5 }];
    const open = (week: number, overtime: number) => shiftWindows(wc, week, overtime).windows.reduce((a, w) => a + (w.overtimeEnd - w.start), 0);
    // rough-cut capacity (DOMAIN.md §1): shifts × hours × (days − holidays) × efficiency − downtime
    // standard hours; in clock hours ÷ efficiency: (1 × 8 × 3 × 0.8 − 3) ÷ 0.8 = 20.25 h
    const w1 = shiftWindows(wc, 1, 0).windows;
    expect(w1.map((w) => w.day)).toEqual([0, 1, 2]); // 5 days − 2 holidays
    expect(open(1, 0)).toBeCloseTo(20.25 * 60, 9); // downtime comes off the last open shift: 3 ÷ 0.8 = 3.75 h
    expect(w1[2].end - w1[2].start).toBeCloseTo(4.25 * 60, 9);
    expect(shiftWindows(wc, 2, 4).windows).toEqual([]);
    // half a holiday: 4.5 days → the fifth day keeps half its shift; 36 h plus the plan's 10 h overtime
    expect(open(3, 10)).toBeCloseTo(46 * 60, 9);
    const w3 = shiftWindows(wc, 3, 10).windows;
    expect(w3[4].end - w3[4].start).toBeCloseTo(4 * 60, 9);
    // overtime goes after each day's last shift, evenly
    expect(w3.map((w) => w.overtimeEnd - w.end)).toEqual([120, 120, 120, 120, 120]);
  });
});

describe('shift sheets: work a week cannot finish is carried over, ahead of the next week\'s own work', () => {
  // Worked by hand from the precedence rule (a step starts after its earlier step's batch is
  // done; DOMAIN.md §4) with the whole quantity moving at once: one 8 h shift from 07:00 on
  // WC-A and WC-B, Monday to Friday. Week 1: P step 10 (1 h/unit × 20) runs Mon 07:00 – Wed
  // 11:00; step 20 (2 h/unit) then has Wed 11:00–15:00, Thu and Fri = 20 h = 10 units, and
  // 10 units (20 h) are left. Week 2: those 10 units run first on WC-B (Mon, Tue, Wed to
  // 11:00), and Q (due in week 2, ready Monday 07:00) runs after them, Wed 11:00–15:00.
  const pattern = { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] };
  const wc = workCenterOn(pattern);
  const item = plainProduct;
  const data: PlanningData = {
    plant: { currency: 'EUR', weekStart: 'monday', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 },
    weeks: [{ index: 1, startDate: '2027-01-04' }, { index: 2, startDate: '2027-01-11' }],
    products: [item('P'), item('Q')],
    bom: [],
    routings: [
      { product: 'P', sequence: 10, workCenter: 'WC-A', hoursPerUnit: 1, setupHours: 0 },
      { product: 'P', sequence: 20, workCenter: 'WC-B', hoursPerUnit: 2, setupHours: 0 },
      { product: 'Q', sequence: 10, workCenter: 'WC-B', hoursPerUnit: 2, setupHours: 0 },
    ],
    workCenters: [wc('WC-A'), wc('WC-B')],
    materials: [],
    demand: [{ product: 'Q', week: 2, qty: 2, kind: 'firm', orderRef: 'SO-1' }],
  } as PlanningData;
  const plan = {
    horizonWeeks: 2,
    outcome: 'optimal',
    products: [{ product: 'P', week: 1, make: 20 }, { product: 'Q', week: 2, make: 2 }],
    workCenters: [],
  } as unknown as Plan;
  const lines = (r: ReturnType<typeof buildShiftSheets>, week: number) =>
    r.sheets.filter((s) => s.workCenter === 'WC-B' && s.week === week).flatMap((s) => s.jobs.map((j) => `${j.product} ${j.quantity} ${j.start.slice(5)}–${j.end.slice(11)}${j.carriedFromWeek === null ? '' : ` from week ${j.carriedFromWeek}`}`));

  it('week 1 hands 10 units of P step 20 to week 2, which runs them first; the quantities add up to the plan', () => {
    const r = buildShiftSheets(data, plan, { transferBatchShare: 1 });
    expect(lines(r, 1)).toEqual(['P 2 01-06T11:00–15:00', 'P 4 01-07T07:00–15:00', 'P 4 01-08T07:00–15:00']);
    expect(lines(r, 2)).toEqual(['P 4 01-11T07:00–15:00 from week 1', 'P 4 01-12T07:00–15:00 from week 1', 'P 2 01-13T07:00–11:00 from week 1', 'Q 2 01-13T11:00–15:00']);
    expect(r.carriedOver).toEqual([{ workCenter: 'WC-B', fromWeek: 1, outOfWeek: 1, product: 'P', operation: 20, quantity: 10, hours: 20, reason: 'no open shift time left in the week' }]);
    expect(r.unscheduled).toEqual([]);
  });
  it('the sheets of week 2 alone continue from week 1', () => {
    expect(lines(buildShiftSheets(data, plan, { transferBatchShare: 1, weeks: [2] }), 2)).toEqual(lines(buildShiftSheets(data, plan, { transferBatchShare: 1 }), 2));
  });
  it('what is still open after the plan\'s last week stays listed as unscheduled, with its plan week and reason', () => {
    const heavy = { ...plan, products: [{ product: 'P', week: 1, make: 20 }, { product: 'Q', week: 2, make: 10 }] } as unknown as Plan;
    const r = buildShiftSheets(data, heavy, { transferBatchShare: 1 });
    // week 2 on WC-B: 20 h carried P, then Q's 20 h has 20 h left (Wed 11:00 – Fri 15:00): it all fits
    expect(r.unscheduled).toEqual([]);
    const heavier = { ...plan, products: [{ product: 'P', week: 1, make: 20 }, { product: 'Q', week: 2, make: 12 }] } as unknown as Plan;
    expect(buildShiftSheets(data, heavier, { transferBatchShare: 1 }).unscheduled).toEqual([
      { workCenter: 'WC-B', week: 2, product: 'Q', operation: 10, quantity: 2, hours: 4, reason: "no open shift time left by the end of the plan's last week (week 2)" },
    ]);
  });
});

describe('shift sheets: overtime the plan counts on that finds no room after the last shift', () => {
  // Worked by hand from the rule that overtime goes after each working day's last shift, as far
  // as the next shift allows (shift-windows.ts). WC-A: three shifts of 7.5 h from 06:00, seven
  // days (06:00–13:30, 13:30–21:00, 21:00–04:30): after each day's last shift 04:30–06:00 =
  // 1.5 h of room, on six days (the seventh day's last shift ends after the week), so 9 h of the
  // plan's 12.5 h fit and 3.5 h do not. WC-B: three 8 h shifts from 06:00, seven days, round the
  // clock: none of its 2 h fits. WC-C: one 8 h shift from 07:00, five days: its 4 h all fit.
  const item = plainProduct;
  const data: PlanningData = {
    plant: { currency: 'EUR', weekStart: 'monday', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 },
    weeks: [{ index: 1, startDate: '2027-01-04' }],
    products: [item('P')],
    bom: [],
    routings: [{ product: 'P', sequence: 10, workCenter: 'WC-A', hoursPerUnit: 1, setupHours: 0 }],
    workCenters: [
      workCenterOn({ shiftsPerDay: 3, hoursPerShift: 7.5, daysPerWeek: 7, shiftStarts: ['06:00', '13:30', '21:00'] })('WC-A'),
      workCenterOn({ shiftsPerDay: 3, hoursPerShift: 8, daysPerWeek: 7, shiftStarts: ['06:00', '14:00', '22:00'] })('WC-B'),
      workCenterOn({ shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] })('WC-C'),
    ],
    materials: [],
    demand: [],
  } as PlanningData;
  const plan = {
    horizonWeeks: 1,
    outcome: 'optimal',
    products: [{ product: 'P', week: 1, make: 10 }],
    workCenters: [
      { workCenter: 'WC-A', week: 1, overtimeHours: 12.5 },
      { workCenter: 'WC-B', week: 1, overtimeHours: 2 },
      { workCenter: 'WC-C', week: 1, overtimeHours: 4 },
    ],
  } as unknown as Plan;

  it('lists 3.5 h at WC-A and 2 h at WC-B as not placed, nothing at WC-C; the placed overtime is on the shifts', () => {
    const r = buildShiftSheets(data, plan);
    expect(r.overtimeNotPlaced.map((o) => ({ ...o, hours: Number(o.hours.toFixed(9)) }))).toEqual([
      { workCenter: 'WC-A', week: 1, hours: 3.5 },
      { workCenter: 'WC-B', week: 1, hours: 2 },
    ]);
    const placed = (code: string, overtime: number) => shiftWindows(data.workCenters.find((w) => w.code === code)!, 1, overtime).windows.reduce((a, w) => a + (w.overtimeEnd - w.end), 0);
    expect(placed('WC-A', 12.5)).toBeCloseTo(9 * 60, 9);
    expect(placed('WC-B', 2)).toBe(0);
    expect(placed('WC-C', 4)).toBeCloseTo(4 * 60, 9);
    // P's 10 h run on WC-A from Monday 06:00 and need none of the overtime
    expect(r.sheets.flatMap((s) => s.jobs.map((j) => `${s.workCenter} ${j.quantity} ${j.start.slice(5)}–${j.end.slice(11)}${j.overtime ? ' OT' : ''}`))).toEqual(['WC-A 7 01-04T06:00–13:00', 'WC-A 3 01-04T13:30–16:30']);
  });
});

describe('shift sheets: a job without setup that does not fit the rest of a shift', () => {
  it('starts in the shift where its first unit runs, not where the previous step ended', () => {
    // Step 10 fills WC-A's Monday shift (8 × 1 h); step 20 on WC-B is released at 15:00, when
    // WC-B's Monday overtime (30 min) cannot hold one 1 h unit, so the job moves to Tuesday.
    const pattern = { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] };
    const wc = workCenterOn(pattern);
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
    // the whole quantity moves at once here, so step 20 waits for all 8 units of step 10
    const { sheets } = buildShiftSheets(data, plan, { transferBatchShare: 1 });
    const b = sheets.filter((s) => s.workCenter === 'WC-B');
    expect(b.map((s) => s.date)).toEqual(['2027-01-05']);
    const job = b[0].jobs[0];
    expect([job.setupStart, job.start, job.quantity]).toEqual(['2027-01-05T07:00', '2027-01-05T07:00', 8]);
    expect(b[0].plannedMinutes).toBe(8 * 60);
  });
});

describe('shift sheets: transfer batches (overlapping operations)', () => {
  // One product, 8 units, two steps on two work centers with one 12 h shift from 06:00, so
  // nothing splits across shifts. With n equal sublots of s = Q/n units on two machines the
  // makespan is s·p1 + (n−1)·s·max(p1, p2) + s·p2 (two-machine lot streaming with equal
  // sublots: Trietsch & Baker 1993, Basic techniques for lot streaming, Operations Research
  // 41(6), from memory); with the whole quantity at once it is Q·p1 + Q·p2.
  const pattern = { shiftsPerDay: 1, hoursPerShift: 12, daysPerWeek: 5, shiftStarts: ['06:00'] };
  const wc = workCenterOn(pattern);
  const twoSteps = (p1: number, p2: number): PlanningData => ({
    plant: { currency: 'EUR', weekStart: 'monday', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 },
    weeks: [{ index: 1, startDate: '2027-01-04' }],
    products: [{ code: 'P', name: 'P', unit: 'pcs', kind: 'finished', price: 1, safetyStock: 0, batchMultiple: 1, openingStock: 0, latePenalty: 0 }],
    bom: [],
    routings: [
      { product: 'P', sequence: 10, workCenter: 'WC-A', hoursPerUnit: p1, setupHours: 0 },
      { product: 'P', sequence: 20, workCenter: 'WC-B', hoursPerUnit: p2, setupHours: 0 },
    ],
    workCenters: [wc('WC-A'), wc('WC-B')],
    materials: [],
    demand: [],
  });
  const plan = { horizonWeeks: 1, outcome: 'optimal', products: [{ product: 'P', week: 1, make: 8 }], workCenters: [] } as unknown as Plan;
  const stepB = (data: PlanningData, settings: Partial<ShiftSheetSettings>) =>
    buildShiftSheets(data, plan, settings).sheets.filter((s) => s.workCenter === 'WC-B').flatMap((s) => s.jobs.map((j) => `${j.quantity} ${j.start.slice(11)}–${j.end.slice(11)}${j.continued ? ' continued' : ''}`));

  it('equal run times, four batches of 2: makespan 2 + 3·2 + 2 = 10 h, where the whole quantity waits for step 10', () => {
    expect(stepB(twoSteps(1, 1), { transferBatchShare: 0.25 })).toEqual(['8 08:00–16:00']);
    // whole quantity: step 20 starts at 14:00 and the 18:00 shift end splits it
    expect(stepB(twoSteps(1, 1), { transferBatchShare: 1 })).toEqual(['4 14:00–18:00', '4 06:00–10:00 continued']);
  });
  it('a faster later step waits for each batch: 2·1 + 3·2·1 + 2·0.5 = 9 h, four lines without a new setup', () => {
    expect(stepB(twoSteps(1, 0.5), { transferBatchShare: 0.25 })).toEqual(['2 08:00–09:00', '2 10:00–11:00 continued', '2 12:00–13:00 continued', '2 14:00–15:00 continued']);
  });
  it('a slower later step runs without a wait: 2·0.5 + 3·2·1 + 2·1 = 9 h', () => {
    expect(stepB(twoSteps(0.5, 1), { transferBatchShare: 0.25 })).toEqual(['8 07:00–15:00']);
  });
  it('one-unit batches per product: 1 + 7·1 + 1 = 9 h; the default is a quarter of the quantity', () => {
    expect(stepB(twoSteps(1, 1), { transferBatchUnits: { P: 1 } })).toEqual(['8 07:00–15:00']);
    expect(stepB(twoSteps(1, 1), {})).toEqual(['8 08:00–16:00']);
    expect(DEFAULT_SHIFT_SHEET_SETTINGS.transferBatchShare).toBe(0.25);
  });
  it('refuses a batch share outside (0, 1] and a batch that is not a positive number of units, naming the product', () => {
    expect(() => buildShiftSheets(twoSteps(1, 1), plan, { transferBatchShare: 0 })).toThrow(/transfer batch share must be above 0 and at most 1, got 0/);
    expect(() => buildShiftSheets(twoSteps(1, 1), plan, { transferBatchShare: 1.5 })).toThrow(/got 1\.5/);
    expect(() => buildShiftSheets(twoSteps(1, 1), plan, { transferBatchUnits: { P: -2 } })).toThrow(/the transfer batch of P must be a positive number of units, got -2/);
  });
});

describe('shift sheets: non-delay dispatching', () => {
  it('a work center runs ready work instead of idling for a job still on an earlier step (Giffler & Thompson 1960)', () => {
    // P1 (due first) runs 8 h on WC-A, then 1 h on WC-B; P2 (no order) runs 8 h on WC-B only.
    // WC-B can start P2 on Monday 07:00; P1 reaches WC-B only at Monday 15:00, the end of its shift.
    const pattern = { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] };
    const wc = workCenterOn(pattern);
    const product = plainProduct;
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

describe('shift sheets: dispatch rules for jobs that could start at the same time', () => {
  const pattern = { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] };
  const wc = workCenterOn(pattern);
  const product = plainProduct;
  const week = (routings: PlanningData['routings'], make: Record<string, number>): { data: PlanningData; plan: Plan } => ({
    data: {
      plant: { currency: 'EUR', weekStart: 'monday', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 },
      weeks: [{ index: 1, startDate: '2027-01-04' }],
      products: Object.keys(make).map(product),
      bom: [],
      routings,
      workCenters: [...new Set(routings.map((r) => r.workCenter))].map(wc),
      materials: [],
      // P1 has the earliest firm order: the base order (earliest due date, Jackson 1955) runs it first
      demand: [{ product: 'P1', week: 1, kind: 'firm', qty: make.P1, orderRef: 'SO-1' }],
    },
    plan: { horizonWeeks: 1, outcome: 'optimal', products: Object.entries(make).map(([p, m]) => ({ product: p, week: 1, make: m })), workCenters: [] } as unknown as Plan,
  });
  const onA = (r: { data: PlanningData; plan: Plan }, rule: ShiftSheetSettings['dispatchRule']) =>
    buildShiftSheets(r.data, r.plan, { dispatchRule: rule, transferBatchShare: 1 }).sheets.filter((s) => s.workCenter === 'WC-A').flatMap((s) => s.jobs.map((j) => `${j.product} ${j.start.slice(11)}–${j.end.slice(11)}`));

  // P1 (due first): 2 h on WC-A only; P2: 2 h on WC-A, then 4 h on WC-B. Both can start on WC-A at 07:00.
  const twoJobs = week(
    [
      { product: 'P1', sequence: 10, workCenter: 'WC-A', hoursPerUnit: 1, setupHours: 0 },
      { product: 'P2', sequence: 10, workCenter: 'WC-A', hoursPerUnit: 1, setupHours: 0 },
      { product: 'P2', sequence: 20, workCenter: 'WC-B', hoursPerUnit: 2, setupHours: 0 },
    ],
    { P1: 2, P2: 2 },
  );
  it('most work remaining first: P2 (4 h still ahead on WC-B) runs before P1 (nothing ahead) and the week ends 2 h sooner (Conway, Maxwell & Miller 1967, from memory)', () => {
    expect(onA(twoJobs, 'most_work_remaining')).toEqual(['P2 07:00–09:00', 'P1 09:00–11:00']);
    const b = buildShiftSheets(twoJobs.data, twoJobs.plan, { transferBatchShare: 1 }).sheets.filter((s) => s.workCenter === 'WC-B').flatMap((s) => s.jobs);
    // makespan 2 + 4 = 6 h → 13:00, against 2 + 2 + 4 = 8 h → 15:00 when P1 goes first
    expect(b.map((j) => `${j.start.slice(11)}–${j.end.slice(11)}`)).toEqual(['09:00–13:00']);
    expect(DEFAULT_SHIFT_SHEET_SETTINGS.dispatchRule).toBe('most_work_remaining');
  });
  it('earliest start alone keeps the base order: P1 (due first) runs first, P2 reaches WC-B at 11:00', () => {
    expect(onA(twoJobs, 'earliest_start')).toEqual(['P1 07:00–09:00', 'P2 09:00–11:00']);
  });
  it('bottleneck first: of two jobs with equal work ahead, the one feeding the more loaded work center runs first (DOMAIN.md §4)', () => {
    // P1 → WC-B (1 h) and P2 → WC-C (1 h) have equal work remaining; P3 loads WC-B with 30 of its 40 h
    const r = week(
      [
        { product: 'P1', sequence: 10, workCenter: 'WC-A', hoursPerUnit: 1, setupHours: 0 },
        { product: 'P1', sequence: 20, workCenter: 'WC-C', hoursPerUnit: 1, setupHours: 0 },
        { product: 'P2', sequence: 10, workCenter: 'WC-A', hoursPerUnit: 1, setupHours: 0 },
        { product: 'P2', sequence: 20, workCenter: 'WC-B', hoursPerUnit: 1, setupHours: 0 },
        { product: 'P3', sequence: 10, workCenter: 'WC-B', hoursPerUnit: 1, setupHours: 0 },
      ],
      { P1: 1, P2: 1, P3: 30 },
    );
    expect(onA(r, 'bottleneck_first')).toEqual(['P2 07:00–08:00', 'P1 08:00–09:00']);
    expect(onA(r, 'most_work_remaining')).toEqual(['P1 07:00–08:00', 'P2 08:00–09:00']);
  });
  it('refuses an unknown dispatch rule, naming the rules it knows', () => {
    expect(() => buildShiftSheets(twoJobs.data, twoJobs.plan, { dispatchRule: 'shortest_first' as ShiftSheetSettings['dispatchRule'] })).toThrow(/dispatch rule must be one of earliest_start, most_work_remaining, bottleneck_first, got shortest_first/);
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
