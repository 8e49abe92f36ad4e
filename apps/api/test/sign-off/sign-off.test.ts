import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  auditEntrySchema,
  planActionSchema,
  planReviewSchema,
  planStateSchema,
  roles,
  type PlanAction,
  type PlanState,
  type Role,
} from '@millrace/contracts';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { testPeople } from '../support/seed-people';
import { FIRST_WEEK, seedSmallPlant } from '../support/small-plant';
import { waitForRun } from '../support/plan-runs';
import { copyPlanInState, personId, planState } from '../support/plan-fixtures';

/**
 * Sign-off rules written out independently of the module's table (issue 6 item 1: planners
 * submit; supervisors approve, return and release; approved and released versions are
 * immutable). Four-eyes sign-off is common practice, no source.
 */
const rules: Record<PlanAction, { role: Role; from: PlanState[]; to: PlanState }> = {
  submit: { role: 'planner', from: ['draft', 'returned'], to: 'submitted' },
  approve: { role: 'supervisor', from: ['submitted'], to: 'approved' },
  return: { role: 'supervisor', from: ['submitted'], to: 'returned' },
  release: { role: 'supervisor', from: ['approved'], to: 'released' },
};

let ctx: TestContext;
let runner: SolverJobRunner;
const agents = {} as Record<Role, TestAgent>;
let solvedPlanId: number;
let plannerId: number;

async function createSolvedPlan(name: string): Promise<number> {
  const created = await agents.planner.post('/api/plans').send({ name, horizonWeeks: 4, firstWeek: FIRST_WEEK, wholeUnits: false });
  expect(created.status).toBe(201);
  const solve = await agents.planner.post(`/api/plans/${created.body.id}/solve`);
  expect(solve.status).toBe(202);
  expect((await waitForRun(agents.planner, created.body.id, solve.body.runId)).state).toBe('finished');
  return created.body.id;
}

const bodyFor = (action: PlanAction) => (action === 'return' ? { comment: 'Please move the bench orders out of week 3.' } : {});

beforeAll(async () => {
  ctx = await createTestContext();
  for (const role of roles) agents[role] = await ctx.agentFor(role);
  await seedSmallPlant(agents.planner);
  runner = new SolverJobRunner(ctx.dataSource, { pollMs: 100 });
  runner.start();
  solvedPlanId = await createSolvedPlan('Base plan');
  plannerId = await personId(ctx.dataSource, testPeople.planner.email);
});

afterAll(async () => {
  await runner?.stop();
  await ctx?.close();
});

const cases = planStateSchema.options.flatMap((state) =>
  planActionSchema.options.flatMap((action) => roles.map((role) => ({ state, action, role }))),
);

describe('sign-off over HTTP, every state × action × role', () => {
  it.each(cases)('when a $role posts $action on a $state plan, then the answer and the resulting state follow the rules', async ({ state, action, role }) => {
    const id = await copyPlanInState(ctx.dataSource, solvedPlanId, state, plannerId);
    const res = await agents[role].post(`/api/plans/${id}/${action}`).send(bodyFor(action));
    const rule = rules[action];
    if (role === 'floor_lead' || role !== rule.role) {
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
      expect(await planState(ctx.dataSource, id)).toBe(state);
    } else if (!rule.from.includes(state)) {
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('conflict');
      expect(await planState(ctx.dataSource, id)).toBe(state);
    } else {
      expect(res.status).toBe(200);
      expect(res.body.state).toBe(rule.to);
      expect(await planState(ctx.dataSource, id)).toBe(rule.to);
      const audit = (await agents.supervisor.get(`/api/plans/${id}/audit`)).body.map((e: unknown) => auditEntrySchema.parse(e));
      expect(audit.at(-1)).toMatchObject({ action, fromState: state, toState: rule.to, actor: { name: testPeople[role].name, role } });
    }
  });
});

describe('sign-off rules beyond the table', () => {
  it('when a draft that was never solved is submitted, then 409 says it must be solved and checked first, and nothing changes', async () => {
    const created = await agents.planner.post('/api/plans').send({ name: 'Unsolved', horizonWeeks: 4, firstWeek: FIRST_WEEK });
    const res = await agents.planner.post(`/api/plans/${created.body.id}/submit`).send({});
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/not been solved/);
    expect(await planState(ctx.dataSource, created.body.id)).toBe('draft');
  });

  it('when a plan that failed the independent check is submitted, then 409', async () => {
    const id = await copyPlanInState(ctx.dataSource, solvedPlanId, 'draft', null);
    await ctx.dataSource.query(`UPDATE plan_version SET solve_status = 'check_failed' WHERE id = ?`, [id]);
    const res = await agents.planner.post(`/api/plans/${id}/submit`).send({});
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/failed the independent check/);
  });

  it('when a supervisor returns a plan without a comment, then 400 names the comment field', async () => {
    const id = await copyPlanInState(ctx.dataSource, solvedPlanId, 'submitted', plannerId);
    const res = await agents.supervisor.post(`/api/plans/${id}/return`).send({});
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('comment');
    expect(await planState(ctx.dataSource, id)).toBe('submitted');
  });

  it('when a plan goes through create, solve, submit, approve and release, then the audit trail holds each step with hashes', async () => {
    const id = await createSolvedPlan('Audited plan');
    expect((await agents.planner.post(`/api/plans/${id}/submit`).send({ comment: 'Ready' })).status).toBe(200);
    expect((await agents.supervisor.post(`/api/plans/${id}/approve`).send({})).status).toBe(200);
    expect((await agents.supervisor.post(`/api/plans/${id}/release`).send({})).status).toBe(200);
    const plan = (await agents.planner.get(`/api/plans/${id}`)).body;
    const audit = (await agents.planner.get(`/api/plans/${id}/audit`)).body.map((e: unknown) => auditEntrySchema.parse(e));
    expect(audit.map((e: { action: string; fromState: string | null; toState: string }) => [e.action, e.fromState, e.toState])).toEqual([
      ['create', null, 'draft'],
      ['solve', 'draft', 'draft'],
      ['solved', 'draft', 'draft'],
      ['submit', 'draft', 'submitted'],
      ['approve', 'submitted', 'approved'],
      ['release', 'approved', 'released'],
    ]);
    for (const e of audit) expect(e.inputsHash).toBe(plan.inputsHash);
    for (const e of audit.slice(2)) expect(e.resultsHash).toBe(plan.resultsHash);
    // the finished solve is noted by the system with its outcome and the plan's objective
    expect(audit[2].actor).toEqual({ id: null, name: 'Millrace', role: null });
    const objective = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 }).format(plan.objective);
    expect(audit[2].comment).toBe(`Run ${plan.latestRunId} finished: solved; objective ${objective} ${plan.currency}.`);
    expect(audit[3].comment).toBe('Ready');
  });

  it('when someone tries to change or delete an audit row in the database, then the database refuses', async () => {
    await expect(ctx.dataSource.query(`UPDATE plan_audit SET comment = 'edited'`)).rejects.toThrow(/append-only/);
    await expect(ctx.dataSource.query('DELETE FROM plan_audit')).rejects.toThrow(/append-only/);
  });

  it('when an approved plan is renamed or solved again, then 409 and it stays as it was', async () => {
    const id = await copyPlanInState(ctx.dataSource, solvedPlanId, 'approved', plannerId);
    const before = (await agents.planner.get(`/api/plans/${id}`)).body;
    expect((await agents.planner.patch(`/api/plans/${id}`).send({ name: 'Changed', version: before.version })).status).toBe(409);
    expect((await agents.planner.post(`/api/plans/${id}/solve`)).status).toBe(409);
    const after = (await agents.planner.get(`/api/plans/${id}`)).body;
    expect(after).toEqual(before);
  });

  it('when a draft is renamed with the version read, then it changes; with a stale version, 409', async () => {
    const id = await copyPlanInState(ctx.dataSource, solvedPlanId, 'draft', null);
    const plan = (await agents.planner.get(`/api/plans/${id}`)).body;
    const ok = await agents.planner.patch(`/api/plans/${id}`).send({ name: 'Renamed', version: plan.version });
    expect(ok.status).toBe(200);
    expect(ok.body.name).toBe('Renamed');
    expect((await agents.planner.patch(`/api/plans/${id}`).send({ name: 'Again', version: plan.version })).status).toBe(409);
  });

  it('when a second plan over the same weeks is released, then the earlier released plan is superseded, with an audit row', async () => {
    const first = await copyPlanInState(ctx.dataSource, solvedPlanId, 'approved', plannerId);
    const second = await copyPlanInState(ctx.dataSource, solvedPlanId, 'approved', plannerId);
    expect((await agents.supervisor.post(`/api/plans/${first}/release`).send({})).status).toBe(200);
    expect((await agents.supervisor.post(`/api/plans/${second}/release`).send({})).status).toBe(200);
    expect(await planState(ctx.dataSource, first)).toBe('superseded');
    expect(await planState(ctx.dataSource, second)).toBe('released');
    const audit = (await agents.supervisor.get(`/api/plans/${first}/audit`)).body;
    expect(audit.at(-1)).toMatchObject({ action: 'supersede', fromState: 'released', toState: 'superseded' });
    expect(audit.at(-1).comment).toContain(`plan version ${second}`);
  });

  it('when a plan puts crews above the plant working-time limit, then the review cautions per work center and week, deferring to labour law', async () => {
    // Lower the plant's weekly limit to 42 h: one 8 h shift on 5 days is 40 h, so any overtime above 2 h per crew breaches it.
    await ctx.dataSource.query('UPDATE plant_settings SET max_weekly_hours = 42 WHERE id = 1');
    try {
      const id = await createSolvedPlan('Overtime heavy');
      const results = (await agents.supervisor.get(`/api/plans/${id}/results`)).body;
      const over = results.load.filter((l: { overtimeHours: number }) => l.overtimeHours > 2 + 1e-6);
      expect(over.length).toBeGreaterThan(0); // the assembly bench needs overtime in this plant
      const review = planReviewSchema.parse((await agents.supervisor.get(`/api/plans/${id}/review`)).body);
      const working = review.cautions.filter((c) => c.kind === 'working_time');
      expect(working.map((c) => [c.item, c.week])).toEqual(over.map((l: { workCenter: string; week: number }) => [l.workCenter, l.week]));
      for (const c of working) expect(c.message).toMatch(/above the plant's limit of 42 h.*local labour law/);
    } finally {
      await ctx.dataSource.query('UPDATE plant_settings SET max_weekly_hours = 48 WHERE id = 1');
    }
  });

  it('when a submitted plan is reviewed, then it is compared with the last approved version, with certificate and cautions', async () => {
    const approved = await createSolvedPlan('Approved baseline');
    await agents.planner.post(`/api/plans/${approved}/submit`).send({});
    await agents.supervisor.post(`/api/plans/${approved}/approve`).send({});
    // Change the data: the first table order drops from 15 to 5, so the new plan must differ.
    await ctx.dataSource.query(`UPDATE firm_order SET qty = 5 WHERE order_ref = 'SO-101'`);
    const next = await createSolvedPlan('Next version');
    await agents.planner.post(`/api/plans/${next}/submit`).send({});
    const res = await agents.supervisor.get(`/api/plans/${next}/review`);
    expect(res.status).toBe(200);
    const review = planReviewSchema.parse(res.body);
    expect(review.baseline?.id).toBe(approved);
    expect(review.certificate).not.toBeNull();
    expect(review.cautions[0].kind).toBe('advisory');
    expect(review.cautions[0].message).toMatch(/labour law/);
    const base = (await agents.supervisor.get(`/api/plans/${approved}/results`)).body;
    const now = (await agents.supervisor.get(`/api/plans/${next}/results`)).body;
    expect(review.changes.margin).toEqual({ before: base.totals.margin, after: now.totals.margin, delta: now.totals.margin - base.totals.margin });
    expect(review.changes.quantities.length).toBeGreaterThan(0);
    // Every changed quantity listed really differs between the two stored plans, matched by product and week.
    for (const q of review.changes.quantities) {
      const b = base.lines.find((l: { product: string; weekStart: string }) => l.product === q.product && l.weekStart === q.weekStart)?.make ?? 0;
      const a = now.lines.find((l: { product: string; weekStart: string }) => l.product === q.product && l.weekStart === q.weekStart)?.make ?? 0;
      expect(q).toMatchObject({ before: b, after: a });
      expect(Math.abs(a - b)).toBeGreaterThan(1e-6);
    }
  });
});
