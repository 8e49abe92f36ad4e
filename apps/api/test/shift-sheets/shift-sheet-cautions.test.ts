import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { roles, shiftSheetsWeekSchema, type Role, type ShiftSheetsWeek } from '@millrace/contracts';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { planInState } from './sheet-plans';

/**
 * Working-time cautions per crew at the limits, and a loaded work center with no open shift.
 *
 * Defaults: at most 48 hours per 7 days on average, overtime included (EU Working Time Directive
 * 2003/88/EC, Art. 6) and at least 11 consecutive hours of daily rest (Art. 3). Each work center
 * below has one product that sells far beyond its capacity and no overtime, so every open shift
 * of every week is full and the crew works exactly its pattern:
 *   W48 — 12 h from 07:00, 4 days: 48 h a week (at the limit), 12 h rest
 *   W60 — 12 h from 07:00, 5 days: 60 h a week (above), 12 h rest
 *   R11 — 13 h from 07:00, 3 days: 39 h, 11 h rest (at the limit)
 *   R10 — 14 h from 07:00, 3 days: 42 h, 10 h rest (below)
 * HOL has every working day of the first week off as holidays but allows cheap overtime, so the
 * plan makes its firm order in overtime there: load with no open shift.
 */
const FIRST_WEEK = '2027-03-01'; // a Monday
const SECOND_WEEK = '2027-03-08';
const WEEKS = ['2027-03-01', '2027-03-08', '2027-03-15', '2027-03-22'];

let ctx: TestContext;
let runner: SolverJobRunner;
const agents = {} as Record<Role, TestAgent>;

async function ok(res: Promise<{ status: number; body: any }>, status: number): Promise<any> {
  const r = await res;
  expect(r.status, JSON.stringify(r.body)).toBe(status);
  return r.body;
}

async function seedCrewPlant(planner: TestAgent): Promise<void> {
  const crews: Array<[string, number, number, number, number]> = [
    // code, hours per shift, days per week, overtime cap, overtime cost
    ['W48', 12, 4, 0, 40],
    ['W60', 12, 5, 0, 40],
    ['R11', 13, 3, 0, 40],
    ['R10', 14, 3, 0, 40],
    ['HOL', 8, 5, 10, 1],
  ];
  for (const [code, hours, days, cap, cost] of crews) {
    const wc = await ok(
      planner.post('/api/work-centers').send({
        code,
        name: `Crew ${code}`,
        efficiency: 1,
        overtimeCapHoursPerWeek: cap,
        overtimeCostPerHour: cost,
        shiftPattern: { shiftsPerDay: 1, hoursPerShift: hours, daysPerWeek: days, shiftStarts: ['07:00'] },
      }),
      201,
    );
    const product = await ok(
      planner.post('/api/products').send({ code: `P-${code}`, name: `Part for ${code}`, unit: 'pcs', kind: 'finished', price: 100, latePenalty: code === 'HOL' ? 60 : 1 }),
      201,
    );
    await ok(planner.put(`/api/products/${product.id}/routing`).send({ version: product.version, steps: [{ sequence: 10, workCenterId: wc.id, hoursPerUnit: 1 }] }), 200);
    const qty = code === 'HOL' ? [10, 0, 0, 0] : [1000, 1000, 1000, 1000];
    const changes = WEEKS.flatMap((weekStart, i) => (qty[i] > 0 ? [{ kind: 'firm', productId: product.id, weekStart, orderRef: `SO-${code}-${i + 1}`, qty: qty[i], version: null }] : []));
    await ok(planner.put('/api/demand').send({ changes }), 200);
    if (code === 'HOL') {
      const detail = await ok(planner.get(`/api/work-centers/${wc.id}`), 200);
      await ok(planner.put(`/api/work-centers/${wc.id}/calendar`).send({ version: detail.version, weeks: [{ weekStart: FIRST_WEEK, holidayDays: 5, note: 'Plant holiday' }] }), 200);
    }
  }
}

beforeAll(async () => {
  ctx = await createTestContext();
  for (const role of roles) agents[role] = await ctx.agentFor(role);
  await seedCrewPlant(agents.planner);
  await ok(
    agents.planner.post('/api/work-centers').send({
      code: 'IDLE', name: 'Idle bench', efficiency: 1, overtimeCapHoursPerWeek: 0, overtimeCostPerHour: 0,
      shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] },
    }),
    201,
  );
  runner = new SolverJobRunner(ctx.dataSource, { pollMs: 100 });
  runner.start();
});

afterAll(async () => {
  await runner?.stop();
  await ctx?.close();
});

const week = async (planId: number, start: string): Promise<ShiftSheetsWeek> => shiftSheetsWeekSchema.parse(await ok(agents.supervisor.get(`/api/plans/${planId}/shift-sheets?week=${start}`), 200));
const hoursPerCrew = (w: ShiftSheetsWeek, code: string) => w.workCenters.find((c) => c.code === code)!.plannedMinutes / 60;

describe('working-time cautions at the limits, defaults from the EU Working Time Directive 2003/88/EC', () => {
  let planId: number;
  let w2: ShiftSheetsWeek;

  beforeAll(async () => {
    const settings = await ok(agents.admin.get('/api/settings'), 200);
    // the plant's defaults are the directive's: 48 h a week (Art. 6), 11 h daily rest (Art. 3)
    expect([settings.maxWeeklyHours, settings.minDailyRestHours]).toEqual([48, 11]);
    planId = await planInState(agents, 'Crew limits', FIRST_WEEK, 'approved');
    w2 = await week(planId, SECOND_WEEK);
  });

  it('when every shift is full, then each crew works its whole pattern (the premise of the checks below)', () => {
    expect([hoursPerCrew(w2, 'W48'), hoursPerCrew(w2, 'W60'), hoursPerCrew(w2, 'R11'), hoursPerCrew(w2, 'R10')]).toEqual([48, 60, 39, 42]);
  });

  it('when a crew works exactly 48 h, then there is no weekly caution; at 60 h there is one, citing Art. 6 of the directive', () => {
    const weekly = w2.cautions.filter((c) => c.kind === 'weekly_hours');
    expect(weekly.map((c) => c.workCenter)).toEqual(['W60']);
    expect(weekly[0]).toMatchObject({ shift: 1, limit: 48, actual: 60 });
    expect(weekly[0].source).toMatch(/Working Time Directive 2003\/88\/EC, Art\. 6/);
    expect(weekly[0].message).toMatch(/local labour law/i);
  });

  it('when a crew rests exactly 11 h between shifts, then there is no rest caution; at 10 h there is one per short night, citing Art. 3', () => {
    const rest = w2.cautions.filter((c) => c.kind === 'daily_rest');
    expect(rest.map((c) => c.workCenter)).toEqual(['R10', 'R10']);
    for (const c of rest) {
      expect(c).toMatchObject({ limit: 11, actual: 10 });
      expect(c.source).toMatch(/Working Time Directive 2003\/88\/EC, Art\. 3/);
    }
    expect(w2.limits.source).toMatch(/2003\/88\/EC/);
    expect(w2.labourLawNote).toMatch(/Local labour law, collective agreements and licensed practice take precedence/);
  });

  it('when the plant sets stricter limits, then a new plan’s sheets apply them (40 h a week, 12 h rest)', async () => {
    const s = await ok(agents.admin.get('/api/settings'), 200);
    const { updatedAt: _u, ...rest } = s;
    await ok(agents.admin.put('/api/settings').send({ ...rest, maxWeeklyHours: 40, minDailyRestHours: 12 }), 200);
    const strict = await week(await planInState(agents, 'Crew limits, strict', FIRST_WEEK, 'approved'), SECOND_WEEK);
    expect(strict.limits).toMatchObject({ maxWeeklyHours: 40, minDailyRestHours: 12 });
    expect(strict.cautions.filter((c) => c.kind === 'weekly_hours').map((c) => c.workCenter).sort()).toEqual(['R10', 'W48', 'W60']);
    expect(strict.cautions.filter((c) => c.kind === 'daily_rest').map((c) => c.workCenter).sort()).toEqual(['R10', 'R10', 'R11', 'R11']);
    // the approved plan keeps the limits it was built with
    expect((await week(planId, SECOND_WEEK)).limits).toMatchObject({ maxWeeklyHours: 48, minDailyRestHours: 11 });
  });
});

describe('a loaded work center with no open shift', () => {
  it('when the plan makes HOL’s order in overtime in a week of holidays, then the week’s sheets answer 422 naming HOL and the week, and the other weeks still build', async () => {
    const planId = await planInState(agents, 'Holiday week', FIRST_WEEK, 'released');
    const load = (await ok(agents.planner.get(`/api/plans/${planId}/load`), 200)) as Array<{ workCenter: string; weekStart: string; overtimeHours: number; availableHours: number }>;
    const hol = load.find((l) => l.workCenter === 'HOL' && l.weekStart === FIRST_WEEK)!;
    expect(hol.availableHours).toBe(0);
    expect(hol.overtimeHours).toBeGreaterThan(0);
    const res = await agents.floor_lead.get(`/api/plans/${planId}/shift-sheets?week=${FIRST_WEEK}`);
    expect(res.status).toBe(422);
    expect(res.body.error.issues).toEqual([{ item: `work center HOL, week starting ${FIRST_WEEK}`, message: expect.stringMatching(new RegExp(`work center HOL has no open shift in the week starting ${FIRST_WEEK} but the plan loads it`)) }]);
    expect(res.body).not.toHaveProperty('workCenters');
    const w2 = await agents.floor_lead.get(`/api/plans/${planId}/shift-sheets?week=${SECOND_WEEK}`);
    expect(w2.status).toBe(200);
    // IDLE has a calendar but no routing uses it: it is on the sheets with nothing to print
    expect(w2.body.workCenters.find((c: { code: string }) => c.code === 'IDLE').days).toEqual([]);
    const pdf = await agents.floor_lead.get(`/api/plans/${planId}/shift-sheets.pdf?week=${SECOND_WEEK}&workCenter=IDLE`);
    expect(pdf.status).toBe(409);
    expect(pdf.body.error.message).toBe(`Work center IDLE has no work in the week starting ${SECOND_WEEK} of plan version ${planId}; there is no sheet to print.`);
  });
});
