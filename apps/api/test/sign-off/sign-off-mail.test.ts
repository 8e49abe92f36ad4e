import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { outboxMessageSchema, roles, type Role } from '@millrace/contracts';
import { OutboxSender } from '../../src/mail/outbox-sender';
import { createSmtpMailer } from '../../src/mail/smtp-mailer';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { testPeople } from '../support/seed-people';
import { FIRST_WEEK, seedSmallPlant } from '../support/small-plant';
import { waitForRun } from '../support/plan-runs';
import { TcpProxy } from '../support/tcp-proxy';

/**
 * Sign-off e-mail through the outbox, delivered over real SMTP to the local mail catcher
 * (apps/mail-catcher) and read back through its HTTP API (MAIL_CATCHER_URL). The SMTP
 * connection goes through a TCP proxy so a test can take the mail server away and bring it back.
 */
const catcherUrl = process.env.MAIL_CATCHER_URL;
if (!catcherUrl) throw new Error('These tests read mail back from the mail catcher: set MAIL_CATCHER_URL and SMTP_HOST/SMTP_PORT (the README test command does).');

interface Caught {
  id: string;
  to: string[];
  subject: string;
}
interface CaughtFull extends Caught {
  text: string;
  html: string | null;
}

async function caught(to: string): Promise<Caught[]> {
  const res = await fetch(`${catcherUrl}/messages?to=${encodeURIComponent(to)}`);
  return (await res.json()) as Caught[];
}

async function waitForMail(to: string, subject: RegExp, timeoutMs = 20_000): Promise<CaughtFull> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const hit = (await caught(to)).find((m) => subject.test(m.subject));
    if (hit) return (await (await fetch(`${catcherUrl}/messages/${encodeURIComponent(hit.id)}`)).json()) as CaughtFull;
    if (Date.now() > until) throw new Error(`no mail to ${to} with subject ${subject} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

let ctx: TestContext;
let runner: SolverJobRunner;
let sender: OutboxSender;
let proxy: TcpProxy;
const agents = {} as Record<Role, TestAgent>;

async function solvedPlan(name: string): Promise<number> {
  const created = await agents.planner.post('/api/plans').send({ name, horizonWeeks: 4, firstWeek: FIRST_WEEK, wholeUnits: false });
  expect(created.status).toBe(201);
  const run = await agents.planner.post(`/api/plans/${created.body.id}/solve`);
  expect((await waitForRun(agents.planner, created.body.id, run.body.runId)).state).toBe('finished');
  return created.body.id;
}

beforeAll(async () => {
  ctx = await createTestContext();
  for (const role of roles) agents[role] = await ctx.agentFor(role);
  await seedSmallPlant(agents.planner);
  runner = new SolverJobRunner(ctx.dataSource, { pollMs: 100 });
  runner.start();
  proxy = new TcpProxy(ctx.config.smtp.host, ctx.config.smtp.port);
  await proxy.start();
  sender = new OutboxSender(ctx.dataSource, createSmtpMailer({ ...ctx.config.smtp, host: '127.0.0.1', port: proxy.port }), {
    pollMs: 100,
    backoffBaseMs: 300,
    backoffMaxMs: 1_000,
  });
  await fetch(`${catcherUrl}/messages`, { method: 'DELETE' });
});

afterAll(async () => {
  await sender?.stop();
  await runner?.stop();
  await proxy?.stop();
  await ctx?.close();
});

describe('sign-off e-mail', () => {
  it('when a plan is submitted, approved and released, then supervisors, the planner and floor leads get mail with working links', async () => {
    sender.start();
    const id = await solvedPlan('February mail');
    const publicUrl = ctx.config.http.publicUrl;

    expect((await agents.planner.post(`/api/plans/${id}/submit`).send({ comment: 'Overtime only in week 2' })).status).toBe(200);
    const toSupervisor = await waitForMail(testPeople.supervisor.email, /February mail/);
    expect(toSupervisor.to).toEqual([testPeople.supervisor.email]);
    expect(toSupervisor.subject).toBe('Plan "February mail" is waiting for your sign-off');
    const reviewLink = `${publicUrl}/plans/${id}/review`;
    expect(toSupervisor.text).toContain(reviewLink);
    expect(toSupervisor.text).toContain('Overtime only in week 2');
    expect(toSupervisor.html).toContain(`href="${reviewLink}"`);
    // The link opens the review page, which reads this API resource for the supervisor.
    expect((await agents.supervisor.get(new URL(reviewLink).pathname.replace(/^\/plans/, '/api/plans'))).status).toBe(200);

    expect((await agents.supervisor.post(`/api/plans/${id}/approve`).send({ comment: 'Fine' })).status).toBe(200);
    const toPlanner = await waitForMail(testPeople.planner.email, /February mail" was approved/);
    expect(toPlanner.to).toEqual([testPeople.planner.email]);
    expect(toPlanner.text).toContain(`${publicUrl}/plans/${id}`);

    expect((await agents.supervisor.post(`/api/plans/${id}/release`).send({})).status).toBe(200);
    const toFloor = await waitForMail(testPeople.floor_lead.email, /February mail/);
    expect(toFloor.subject).toBe('New shift sheets: plan "February mail" is released');
    const sheetsLink = `${publicUrl}/shift-sheets?plan=${id}`;
    expect(toFloor.text).toContain(sheetsLink);
    expect(toFloor.html).toContain(`href="${sheetsLink}"`);
    // Nobody else was written to about the release.
    expect((await caught(testPeople.admin.email)).length).toBe(0);
  });

  it('when a plan is returned, then the submitting planner gets the comment', async () => {
    const id = await solvedPlan('March return');
    await agents.planner.post(`/api/plans/${id}/submit`).send({});
    expect((await agents.supervisor.post(`/api/plans/${id}/return`).send({ comment: 'Too much overtime on the assembly bench.' })).status).toBe(200);
    const mail = await waitForMail(testPeople.planner.email, /March return" came back/);
    expect(mail.text).toContain('Too much overtime on the assembly bench.');
  });

  it('when the SMTP server is down during a transition, then the transition succeeds and the mail goes out after the server returns', async () => {
    await sender.stop();
    const id = await solvedPlan('April outage');
    await proxy.stop();

    const res = await agents.planner.post(`/api/plans/${id}/submit`).send({});
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('submitted');

    const round = await sender.sendDue();
    expect(round).toEqual({ sent: 0, failed: 1 });
    const outbox = await agents.admin.get('/api/outbox');
    expect(outbox.status).toBe(200);
    const waiting = outbox.body.map((m: unknown) => outboxMessageSchema.parse(m)).find((m: { planId: number | null }) => m.planId === id);
    expect(waiting).toMatchObject({ to: testPeople.supervisor.email, state: 'pending', attempts: 1 });
    expect(waiting.lastError).toBeTruthy();
    expect(waiting.nextAttemptAt).not.toBeNull();
    expect((await agents.planner.get('/api/outbox')).status).toBe(403);

    await proxy.start(); // the same port again
    sender.start();
    const mail = await waitForMail(testPeople.supervisor.email, /April outage/);
    expect(mail.subject).toContain('waiting for your sign-off');
    const after = await agents.admin.get('/api/outbox?state=sent');
    expect(after.body.find((m: { planId: number | null }) => m.planId === id)).toMatchObject({ state: 'sent', attempts: 2 });
  });
});
