import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { planComparisonSchema, planResultsSchema, scenarioSchema, type ScenarioCreate } from '@millrace/contracts';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { FIRST_WEEK, WEEKS, seedSmallPlant } from '../support/small-plant';
import { waitForRun } from '../support/plan-runs';
import { copyPlanInState } from '../support/plan-fixtures';

let ctx: TestContext;
let planner: TestAgent;
let supervisor: TestAgent;
let runner: SolverJobRunner;

const extraShift: ScenarioCreate = {
  name: 'Second shift on assembly',
  description: 'What if assembly runs two shifts in weeks 2–3?',
  overrides: [{ kind: 'extra_shift', workCenter: 'ASM', fromWeek: WEEKS[1], toWeek: WEEKS[2], extraShiftsPerDay: 1 }],
};

async function solved(body: Record<string, unknown>): Promise<number> {
  const created = await planner.post('/api/plans').send({ horizonWeeks: 4, firstWeek: FIRST_WEEK, wholeUnits: false, ...body });
  expect(created.status).toBe(201);
  const run = await planner.post(`/api/plans/${created.body.id}/solve`);
  expect((await waitForRun(planner, created.body.id, run.body.runId)).state).toBe('finished');
  return created.body.id;
}

beforeAll(async () => {
  ctx = await createTestContext();
  planner = await ctx.agentFor('planner');
  supervisor = await ctx.agentFor('supervisor');
  await seedSmallPlant(planner);
  runner = new SolverJobRunner(ctx.dataSource, { pollMs: 100 });
  runner.start();
});

afterAll(async () => {
  await runner?.stop();
  await ctx?.close();
});

describe('scenarios', () => {
  it('when a planner creates, reads, changes and deletes a scenario, then each step answers as it should', async () => {
    const created = await planner.post('/api/scenarios').send(extraShift);
    expect(created.status).toBe(201);
    const s = scenarioSchema.parse(created.body);
    expect(s).toMatchObject({ name: extraShift.name, version: 1, locked: false, usedByPlanIds: [] });
    expect(s.overrides).toEqual(extraShift.overrides);

    expect((await supervisor.get('/api/scenarios')).body.map((x: { id: number }) => x.id)).toContain(s.id);
    expect((await supervisor.get(`/api/scenarios/${s.id}`)).status).toBe(200);
    expect((await supervisor.post('/api/scenarios').send({ ...extraShift, name: 'Other' })).status).toBe(403);

    const changed = await planner.patch(`/api/scenarios/${s.id}`).send({ description: 'Two shifts', version: 1 });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ description: 'Two shifts', version: 2 });
    const stale = await planner.patch(`/api/scenarios/${s.id}`).send({ description: 'Again', version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/Someone else changed/);

    expect((await planner.post('/api/scenarios').send(extraShift)).status).toBe(409); // same name
    expect((await planner.delete(`/api/scenarios/${s.id}`)).status).toBe(204);
    expect((await planner.get(`/api/scenarios/${s.id}`)).status).toBe(404);
  });

  it('when an override is malformed, then 400 names the field', async () => {
    const backwards = await planner
      .post('/api/scenarios')
      .send({ name: 'Backwards', overrides: [{ kind: 'maintenance', workCenter: 'SAW', fromWeek: WEEKS[2], toWeek: WEEKS[0] }] });
    expect(backwards.status).toBe(400);
    const unknownKind = await planner.post('/api/scenarios').send({ name: 'Odd', overrides: [{ kind: 'holiday', workCenter: 'SAW' }] });
    expect(unknownKind.status).toBe(400);
    expect(unknownKind.body.error.fields[0].path).toMatch(/^overrides\.0/);
  });

  it('when a scenario is an input of an approved plan, then it can no longer be changed or deleted (409)', async () => {
    const s = (await planner.post('/api/scenarios').send({ ...extraShift, name: 'Locked by approval' })).body;
    const base = await solved({ name: 'Base for lock' });
    const approved = await copyPlanInState(ctx.dataSource, base, 'approved', null);
    await ctx.dataSource.query('UPDATE plan_version SET scenario_id = ? WHERE id = ?', [s.id, approved]);
    const read = scenarioSchema.parse((await planner.get(`/api/scenarios/${s.id}`)).body);
    expect(read).toMatchObject({ locked: true, usedByPlanIds: [approved] });
    const patch = await planner.patch(`/api/scenarios/${s.id}`).send({ description: 'change', version: read.version });
    expect(patch.status).toBe(409);
    expect(patch.body.error.message).toMatch(/approved or released/);
    expect((await planner.delete(`/api/scenarios/${s.id}`)).status).toBe(409);
  });
});

describe('plans built from a scenario', () => {
  it('when a plan is created from an extra-shift scenario, then it carries the overrides and compares as the what-if it is', async () => {
    const s = (await planner.post('/api/scenarios').send({ ...extraShift, name: 'Extra shift for plans' })).body;
    const base = await solved({ name: 'As is' });
    const whatIf = await solved({ name: 'With a second shift', scenarioId: s.id });
    const plan = (await planner.get(`/api/plans/${whatIf}`)).body;
    expect(plan).toMatchObject({ scenarioId: s.id, scenarioName: 'Extra shift for plans', solveStatus: 'solved' });

    const ra = planResultsSchema.parse((await planner.get(`/api/plans/${base}/results`)).body);
    const rb = planResultsSchema.parse((await planner.get(`/api/plans/${whatIf}/results`)).body);
    const asm = (r: typeof ra, week: number) => r.load.find((l) => l.workCenter === 'ASM' && l.week === week)!.availableHours;
    // Shift arithmetic (common practice, no source): a second 8 h shift on 5 days doubles a one-shift week.
    expect(asm(rb, 2)).toBeCloseTo(2 * asm(ra, 2), 9);
    expect(asm(rb, 3)).toBeCloseTo(2 * asm(ra, 3), 9);
    expect(asm(rb, 1)).toBeCloseTo(asm(ra, 1), 9);

    const cmp = planComparisonSchema.parse((await planner.get(`/api/plans/compare?a=${base}&b=${whatIf}`)).body);
    // More regular capacity relaxes the LP: its optimum cannot get worse (LP relaxation, any OR textbook).
    expect(cmp.margin.b).toBeGreaterThanOrEqual(cmp.margin.a - 1e-6 * Math.abs(cmp.margin.a));
    const used = scenarioSchema.parse((await planner.get(`/api/scenarios/${s.id}`)).body);
    expect(used.usedByPlanIds).toEqual([whatIf]);
    expect(used.locked).toBe(false); // a draft does not lock its scenario
  });

  it('when a scenario names a work center that no longer exists, then creating the plan answers 422 naming the override', async () => {
    const s = (
      await planner.post('/api/scenarios').send({
        name: 'Gone machine',
        overrides: [{ kind: 'maintenance', workCenter: 'LATHE9', fromWeek: WEEKS[0], toWeek: WEEKS[1] }],
      })
    ).body;
    const res = await planner.post('/api/plans').send({ name: 'From gone', horizonWeeks: 4, firstWeek: FIRST_WEEK, scenarioId: s.id });
    expect(res.status).toBe(422);
    expect(res.body.error.issues).toEqual([{ item: 'scenario override 1 (maintenance)', message: expect.stringMatching(/work center LATHE9 does not exist/) }]);
  });
});

describe('comparing two plan versions', () => {
  it('when two solved plans are compared, then margin, overtime, spend, unmet and load per work center come side by side', async () => {
    const a = await solved({ name: 'Compare A' });
    await ctx.dataSource.query(`UPDATE firm_order SET qty = 35 WHERE order_ref = 'SO-103'`);
    const b = await solved({ name: 'Compare B' });
    await ctx.dataSource.query(`UPDATE firm_order SET qty = 25 WHERE order_ref = 'SO-103'`);

    const res = await supervisor.get(`/api/plans/compare?a=${a}&b=${b}`);
    expect(res.status).toBe(200);
    const cmp = planComparisonSchema.parse(res.body);
    const ra = planResultsSchema.parse((await supervisor.get(`/api/plans/${a}/results`)).body);
    const rb = planResultsSchema.parse((await supervisor.get(`/api/plans/${b}/results`)).body);
    expect(cmp.a.id).toBe(a);
    expect(cmp.b.id).toBe(b);
    expect(cmp.margin).toEqual({ a: ra.totals.margin, b: rb.totals.margin, delta: rb.totals.margin - ra.totals.margin });
    expect(cmp.materialSpend.a).toBe(ra.totals.materialSpend);
    expect(cmp.overtimeHours.b).toBe(rb.totals.overtimeHours);
    expect(cmp.loadByWorkCenter.map((w) => w.workCenter)).toEqual(['ASM', 'SAW']);
    const asm = cmp.loadByWorkCenter[0];
    const sum = (r: typeof ra, f: 'loadHours' | 'overtimeHours') => r.load.filter((l) => l.workCenter === 'ASM').reduce((s, l) => s + l[f], 0);
    expect(asm.loadHours.a).toBeCloseTo(sum(ra, 'loadHours'), 9);
    expect(asm.overtimeHours.b).toBeCloseTo(sum(rb, 'overtimeHours'), 9);
    expect(cmp.unmet.a).toEqual(ra.unmet);
    expect(cmp.unmet.b).toEqual(rb.unmet);
    expect(cmp.unmetQty).toEqual({ a: ra.totals.unmetQty, b: rb.totals.unmetQty, delta: rb.totals.unmetQty - ra.totals.unmetQty });
    // The changed order shows among the differing quantities: table production differs somewhere.
    expect(cmp.quantityDifferences.some((d) => d.product === 'TBL')).toBe(true);
    // More table demand in week 3 cannot lower the work booked on the assembly bench here.
    expect(asm.loadHours.b).toBeGreaterThanOrEqual(asm.loadHours.a - 1e-6);
  });

  it('when a plan in the comparison is unsolved or missing, then 409 or 404', async () => {
    const solvedId = await solved({ name: 'Compare solved' });
    const draft = (await planner.post('/api/plans').send({ name: 'Compare draft', horizonWeeks: 4, firstWeek: FIRST_WEEK })).body.id;
    expect((await planner.get(`/api/plans/compare?a=${solvedId}&b=${draft}`)).status).toBe(409);
    expect((await planner.get(`/api/plans/compare?a=${solvedId}&b=99999`)).status).toBe(404);
    expect((await planner.get(`/api/plans/compare?a=${solvedId}`)).status).toBe(400);
  });
});
