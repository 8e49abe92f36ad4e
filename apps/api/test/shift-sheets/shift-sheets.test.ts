import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { roles, sheetPlanSchema, shiftSheetsWeekSchema, type PlanLine, type Role, type ShiftSheetsWeek } from '@millrace/contracts';
import { DEFAULT_SHIFT_SHEET_SETTINGS } from '@millrace/plan-model';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { testPeople } from '../support/seed-people';
import { FIRST_WEEK, WEEKS, seedSmallPlant, type SmallPlant } from '../support/small-plant';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { planInState } from './sheet-plans';

/**
 * GET /api/plans/:id/shift-sheets on the small joinery of test/support/small-plant.ts (1 shift
 * of 8 h from 07:00, 5 days a week on both work centers), planned, solved and signed off through
 * the real API. Expected values come from the seeded calendar and routings and from the plan's
 * own lines, never from the sequencer: what the floor needs (DOMAIN.md §4, common practice) is
 * the jobs of each shift inside that shift, one after another, later routing steps after earlier
 * ones, and every unit the plan makes on the sheets or listed as not scheduled.
 */
let ctx: TestContext;
let runner: SolverJobRunner;
let plant: SmallPlant;
const agents = {} as Record<Role, TestAgent>;
const ids = {} as Record<'draft' | 'submitted' | 'approved' | 'released', number>;

beforeAll(async () => {
  ctx = await createTestContext();
  for (const role of roles) agents[role] = await ctx.agentFor(role);
  plant = await seedSmallPlant(agents.planner);
  runner = new SolverJobRunner(ctx.dataSource, { pollMs: 100 });
  runner.start();
  for (const state of ['draft', 'submitted', 'approved', 'released'] as const) ids[state] = await planInState(agents, `Sheets ${state}`, FIRST_WEEK, state);
});

afterAll(async () => {
  await runner?.stop();
  await ctx?.close();
});

const sheetsOf = async (agent: TestAgent, id: number, week?: string) => agent.get(`/api/plans/${id}/shift-sheets${week ? `?week=${week}` : ''}`);
const minutesOf = (wallClock: string) => {
  const [date, time] = wallClock.split('T');
  const [h, m] = time.split(':').map(Number);
  return Date.parse(`${date}T00:00:00Z`) / 60000 + h * 60 + m;
};

describe('which plan versions have shift sheets, and for whom', () => {
  it.each(['draft', 'submitted'] as const)('when anyone asks for the sheets of a %s plan, then 409 names the plan and its state', async (state) => {
    for (const role of ['planner', 'supervisor', 'floor_lead'] as const) {
      const res = await sheetsOf(agents[role], ids[state]);
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('conflict');
      expect(res.body.error.message).toContain(`Plan version ${ids[state]}`);
      expect(res.body.error.message).toContain(state === 'draft' ? 'a draft' : 'submitted');
    }
  });

  it('when the plan does not exist, then 404', async () => {
    const res = await sheetsOf(agents.planner, 999_999);
    expect(res.status).toBe(404);
  });

  it('when nobody is signed in, then 401', async () => {
    expect((await sheetsOf(ctx.anonymous(), ids.approved)).status).toBe(401);
  });

  it('when planners, supervisors and admins read an approved or released plan, then they get its sheets', async () => {
    for (const role of ['planner', 'supervisor', 'admin'] as const)
      for (const state of ['approved', 'released'] as const) expect((await sheetsOf(agents[role], ids[state])).status).toBe(200);
  });

  it('when a floor lead opens an approved plan that is not released yet, then 403 says floor leads see released plans only', async () => {
    const res = await sheetsOf(agents.floor_lead, ids.approved);
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/released plan versions only/);
    expect((await sheetsOf(agents.floor_lead, ids.released)).status).toBe(200);
  });

  it('when people list the plans with sheets, then floor leads see only released ones and supervisors approved and released ones', async () => {
    const floor = (await agents.floor_lead.get('/api/shift-sheets/plans')).body.map((p: unknown) => sheetPlanSchema.parse(p));
    expect(floor.map((p: { id: number }) => p.id)).toEqual([ids.released]);
    const sup = (await agents.supervisor.get('/api/shift-sheets/plans')).body.map((p: unknown) => sheetPlanSchema.parse(p));
    expect(sup.map((p: { id: number }) => p.id).sort()).toEqual([ids.approved, ids.released].sort());
    expect(sup.find((p: { id: number }) => p.id === ids.released)).toMatchObject({ state: 'released', approvedBy: testPeople.supervisor.name, firstWeek: FIRST_WEEK });
  });
});

describe('the sheets of an approved plan', () => {
  let weeks: ShiftSheetsWeek[];
  let lines: PlanLine[];

  beforeAll(async () => {
    weeks = [];
    for (const week of WEEKS) {
      const res = await sheetsOf(agents.supervisor, ids.approved, week);
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      weeks.push(shiftSheetsWeekSchema.parse(res.body));
    }
    lines = (await agents.planner.get(`/api/plans/${ids.approved}/lines`)).body;
  });

  it('when no week is named, then the first week of the plan is shown', async () => {
    const res = await sheetsOf(agents.planner, ids.approved);
    expect(res.body.week).toEqual({ start: FIRST_WEEK, index: 1 });
    expect(res.body.weeks).toEqual(WEEKS);
  });

  it('when the sheets are read, then the header names the plant, the plan version and who approved it and when', async () => {
    const settings = (await agents.planner.get('/api/settings')).body;
    const audit = (await agents.supervisor.get(`/api/plans/${ids.approved}/audit`)).body as Array<{ action: string; at: string }>;
    for (const w of weeks) {
      expect(w.plantName).toBe(settings.plantName);
      expect(w.plan).toEqual({ id: ids.approved, name: 'Sheets approved', state: 'approved', approvedBy: testPeople.supervisor.name, approvedAt: audit.find((a) => a.action === 'approve')!.at });
    }
  });

  it('when the week is laid out, then every work center shows its five open 07:00–15:00 shifts (the seeded calendar)', () => {
    for (const w of weeks) {
      expect(new Set(w.workCenters.map((c) => c.code))).toEqual(new Set(['SAW', 'ASM']));
      for (const c of w.workCenters) {
        expect(c.openShifts.map((s) => s.date)).toEqual([0, 1, 2, 3, 4].map((d) => new Date(Date.parse(`${w.week.start}T00:00:00Z`) + d * 864e5).toISOString().slice(0, 10)));
        expect(c.openShifts.map((s) => [s.shift, s.startMinute % 1440, s.endMinute - s.startMinute])).toEqual(Array(5).fill([1, 7 * 60, 8 * 60]));
        expect(c.availableMinutes).toBe(5 * 8 * 60);
        for (const day of c.days)
          for (const s of day.shifts) {
            expect(s.date).toBe(day.date);
            expect(s.shiftStart).toBe(`${s.date}T07:00`);
            expect(s.shiftEnd).toBe(`${s.date}T15:00`);
          }
      }
    }
  });

  it('when the jobs of a shift are listed, then they are numbered in run order, do not overlap and stay inside the shift and its overtime', () => {
    let sheets = 0;
    for (const w of weeks)
      for (const c of w.workCenters)
        for (const day of c.days)
          for (const s of day.shifts) {
            sheets += 1;
            expect(s.jobs.length).toBeGreaterThan(0);
            expect(s.jobs.map((j) => j.sequence)).toEqual(s.jobs.map((_, i) => i + 1));
            const until = minutesOf(s.overtimeEnd ?? s.shiftEnd);
            let free = minutesOf(s.shiftStart);
            for (const j of s.jobs) {
              expect(minutesOf(j.setupStart)).toBeGreaterThanOrEqual(free);
              expect(minutesOf(j.start) - minutesOf(j.setupStart)).toBe(Math.round(j.setupMinutes));
              expect(minutesOf(j.end)).toBeGreaterThanOrEqual(minutesOf(j.start));
              expect(minutesOf(j.end)).toBeLessThanOrEqual(until);
              expect(j.overtime).toBe(minutesOf(j.end) > minutesOf(s.shiftEnd));
              free = minutesOf(j.end);
            }
          }
    expect(weeks.reduce((a, w) => a + w.sheetCount, 0)).toBe(sheets);
  });

  it('when the quantities of each product and routing step of a plan week are added up over its week and the weeks its unfinished work is carried into, then they equal what the plan makes that week', () => {
    const steps: Record<string, number[]> = { TOP: [10], TBL: [10, 20], BEN: [10, 20] };
    const all = weeks.flatMap((w) => w.workCenters.flatMap((c) => c.days.flatMap((d) => d.shifts.flatMap((s) => s.jobs.map((j) => ({ ...j, sheetWeek: w.week.start }))))));
    // carried work is marked with the earlier plan week it belongs to
    for (const j of all) if (j.carriedFromWeek !== null) expect(j.carriedFromWeek < j.sheetWeek).toBe(true);
    const unscheduled = weeks.flatMap((w) => w.unscheduled);
    for (const planWeek of WEEKS) {
      for (const [product, ops] of Object.entries(steps)) {
        const make = lines.find((l) => l.product === product && l.weekStart === planWeek)?.make ?? 0;
        for (const op of ops) {
          const onSheets = all.filter((j) => (j.carriedFromWeek ?? j.sheetWeek) === planWeek && j.product === product && j.operation === op).reduce((a, j) => a + j.quantity, 0);
          const open = unscheduled.filter((u) => u.planWeek === planWeek && u.product === product && u.operation === op).reduce((a, u) => a + u.quantity, 0);
          expect(onSheets + open).toBeCloseTo(make, 6);
        }
      }
    }
    // only the plan's last week lists work still open
    for (const w of weeks.slice(0, -1)) expect(w.unscheduled).toEqual([]);
  });

  it('when a product has a later routing step, then each transfer batch of that step starts after the earlier step has finished it, across week boundaries too, and the sheet names the next work center', () => {
    // default transfer batch: a quarter of the week's quantity, whole units (plan-model's documented default)
    const share = DEFAULT_SHIFT_SHEET_SETTINGS.transferBatchShare;
    type Job = { quantity: number; start: string; end: string; setupStart: string };
    // the minute a step has completed `units`, read off its jobs (each runs at a steady rate); sheet times are whole minutes
    const completedAt = (jobs: Job[], units: number) => {
      let before = 0;
      for (const j of [...jobs].sort((a, b) => minutesOf(a.start) - minutesOf(b.start))) {
        if (j.quantity > 0 && before + j.quantity >= units - 1e-9) return minutesOf(j.start) + ((units - before) / j.quantity) * (minutesOf(j.end) - minutesOf(j.start));
        before += j.quantity;
      }
      return Math.max(...jobs.map((j) => minutesOf(j.end)));
    };
    // batch k of the later jobs starts no earlier than the feeding jobs completed their share of it (1 min of rounding)
    const expectBatches = (feeding: Job[], later: Job[], make: number, scale: number) => {
      if (feeding.length === 0 || later.length === 0) return;
      const batch = Math.min(make, Math.max(1, Math.ceil(share * make - 1e-9)));
      const fed = feeding.reduce((a, j) => a + j.quantity, 0);
      const ready = (units: number) => completedAt(feeding, Math.min(fed, scale * Math.min(units, make)));
      let before = 0;
      const sorted = [...later].sort((a, b) => minutesOf(a.setupStart) - minutesOf(b.setupStart));
      expect(minutesOf(sorted[0].setupStart)).toBeGreaterThanOrEqual(ready(batch) - 1);
      for (const j of sorted) {
        const rate = j.quantity > 0 ? (minutesOf(j.end) - minutesOf(j.start)) / j.quantity : 0;
        for (let k = 1; (k - 1) * batch < before + j.quantity - 1e-9; k++)
          if (k * batch > before + 1e-9) expect(minutesOf(j.start) + Math.max(0, (k - 1) * batch - before) * rate).toBeGreaterThanOrEqual(ready(k * batch) - 1);
        before += j.quantity;
      }
    };
    // a plan week's jobs, wherever they ran (its own week and the weeks its unfinished work is carried into)
    const all = weeks.flatMap((w) => w.workCenters.flatMap((c) => c.days.flatMap((d) => d.shifts.flatMap((s) => s.jobs.map((j) => ({ ...j, wc: c.code, planWeek: j.carriedFromWeek ?? w.week.start }))))));
    for (const planWeek of WEEKS) {
      const jobs = all.filter((j) => j.planWeek === planWeek);
      const makeOf = (product: string) => lines.find((l) => l.product === product && l.weekStart === planWeek)?.make ?? 0;
      for (const product of ['TBL', 'BEN']) {
        const first = jobs.filter((j) => j.product === product && j.operation === 10);
        const second = jobs.filter((j) => j.product === product && j.operation === 20);
        for (const j of first) expect([j.wc, j.nextWorkCenter, j.nextWorkCenterName]).toEqual(['SAW', 'ASM', 'Assembly bench']);
        for (const j of second) expect([j.wc, j.nextWorkCenter]).toEqual(['ASM', null]);
        expectBatches(first, second, makeOf(product), 1);
      }
      // the table top (a sub-assembly of the table) is cut batch by batch ahead of the table's own saw step
      const tops = jobs.filter((j) => j.product === 'TOP');
      const tables = jobs.filter((j) => j.product === 'TBL' && j.operation === 10);
      if (tops.length && tables.length) expectBatches(tops, tables, makeOf('TBL'), makeOf('TOP') / makeOf('TBL'));
    }
  });

  it('when a table is made in a week with a firm table order, then its jobs carry the order and its due week', () => {
    const w1 = weeks[0];
    const tbl = w1.workCenters.flatMap((c) => c.days.flatMap((d) => d.shifts.flatMap((s) => s.jobs))).filter((j) => j.product === 'TBL');
    if ((lines.find((l) => l.product === 'TBL' && l.weekStart === FIRST_WEEK)?.make ?? 0) > 0) {
      expect(tbl.length).toBeGreaterThan(0);
      for (const j of tbl) expect([j.dueWeek, j.orderRefs, j.productName, j.unit]).toEqual([FIRST_WEEK, ['SO-101'], 'Dining table', 'pcs']);
      // the first operation issues the bill of materials: one table top and one fittings kit per table (small-plant BOM)
      for (const j of tbl.filter((x) => x.operation === 10)) expect(j.materials.map((m) => [m.item, m.quantity])).toEqual([['TOP', j.quantity], ['FIT', j.quantity]]);
    }
  });

  it('when working-time limits are shown, then they are the plant defaults with the EU Working Time Directive named as their source, and the note defers to local law', () => {
    for (const w of weeks) {
      // EU Working Time Directive 2003/88/EC, Art. 6 (48 h average week) and Art. 3 (11 h daily rest)
      expect(w.limits).toMatchObject({ maxWeeklyHours: 48, minDailyRestHours: 11 });
      expect(w.limits.source).toMatch(/Working Time Directive 2003\/88\/EC/);
      expect(w.labourLawNote).toMatch(/Local labour law/);
      // 1 shift of 8 h, 5 days (+ at most the plan's overtime) stays far inside both limits
      expect(w.cautions).toEqual([]);
    }
  });
});

describe('bad input', () => {
  it('when the week is not one of the plan, then 400 names the week field and the plan’s weeks', async () => {
    const res = await sheetsOf(agents.planner, ids.approved, '2030-01-07');
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('query.week');
    expect(res.body.error.fields[0].message).toContain(`${WEEKS[0]} to ${WEEKS[3]}`);
    const bad = await sheetsOf(agents.planner, ids.approved, 'next');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].path).toBe('query.week');
  });

  it('when an unknown query field is sent, then 400 names it', async () => {
    const res = await agents.planner.get(`/api/plans/${ids.approved}/shift-sheets?wek=${FIRST_WEEK}`);
    expect(res.status).toBe(400);
  });

  it('when a work center the plan loads has been deleted since, then 422 names each routing step that points at it and nothing is built', async () => {
    // Move the assembly steps to the saw so the assembly bench can be deleted, as a planner would.
    for (const [product, steps] of [
      [plant.products.TBL, [{ sequence: 10, workCenterId: plant.workCenters.SAW, hoursPerUnit: 0.3 }, { sequence: 20, workCenterId: plant.workCenters.SAW, hoursPerUnit: 1.5 }]],
      [plant.products.BEN, [{ sequence: 10, workCenterId: plant.workCenters.SAW, hoursPerUnit: 0.4 }, { sequence: 20, workCenterId: plant.workCenters.SAW, hoursPerUnit: 0.8 }]],
    ] as const) {
      const p = (await agents.planner.get(`/api/products/${product}`)).body;
      const put = await agents.planner.put(`/api/products/${product}/routing`).send({ version: p.version, steps });
      expect(put.status, JSON.stringify(put.body)).toBe(200);
    }
    const del = await agents.planner.delete(`/api/work-centers/${plant.workCenters.ASM}`);
    expect(del.status, JSON.stringify(del.body)).toBe(204);

    const made = (await agents.planner.get(`/api/plans/${ids.released}/lines`)).body as PlanLine[];
    const week = WEEKS.find((w) => made.some((l) => l.weekStart === w && (l.product === 'TBL' || l.product === 'BEN') && l.make > 0))!;
    const res = await sheetsOf(agents.floor_lead, ids.released, week);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('unprocessable');
    const items = (res.body.error.issues as Array<{ item: string; message: string }>).map((i) => i.item);
    expect(items.every((i) => /^routing (TBL|BEN) step 20$/.test(i))).toBe(true);
    expect(items.length).toBeGreaterThan(0);
    expect(res.body.error.issues[0].message).toMatch(/work center ASM, which has been deleted/);
    expect(res.body).not.toHaveProperty('workCenters');
  });
});
