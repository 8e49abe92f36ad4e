import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { caughtMailSchema, caughtMailSummarySchema } from '@millrace/contracts';
import { createSmtpMailer } from '../../src/mail/smtp-mailer';
import { createTestContext, type TestContext } from '../support/test-app';

/**
 * Caught mail (issue 6 item 5): the admin reads the local mail catcher through the API. The
 * message goes out over real SMTP (nodemailer) to the real catcher and is read back.
 */
const catcherUrl = process.env.MAIL_CATCHER_URL;
if (!catcherUrl) throw new Error('These tests read mail back from the mail catcher: set MAIL_CATCHER_URL and SMTP_HOST/SMTP_PORT (the README test command does).');

let withCatcher: TestContext;
let withoutCatcher: TestContext;

beforeAll(async () => {
  withCatcher = await createTestContext();
  withoutCatcher = await createTestContext({ config: { mailCatcherUrl: undefined } });
});

afterAll(async () => {
  await withCatcher?.close();
  await withoutCatcher?.close();
});

describe('caught mail', () => {
  it('when a message went through the catcher, then an admin lists it and reads its text and HTML parts', async () => {
    const subject = `Caught-mail check ${randomUUID()}`;
    await createSmtpMailer(withCatcher.config.smtp).send({
      to: ['reader@millrace.test'],
      subject,
      text: 'Plain words for the reader.',
      html: '<p>HTML words for the <b>reader</b>.</p>',
    });
    const admin = await withCatcher.agentFor('admin');

    const list = await admin.get('/api/dev/mail');
    expect(list.status).toBe(200);
    const summaries = caughtMailSummarySchema.array().parse(list.body);
    const ours = summaries.find((m) => m.subject === subject);
    expect(ours).toBeDefined();
    expect(ours!.to).toEqual(['reader@millrace.test']);
    // newest first
    const dates = summaries.map((m) => m.date);
    expect([...dates].sort().reverse()).toEqual(dates);

    const one = await admin.get(`/api/dev/mail/${ours!.id}`);
    expect(one.status).toBe(200);
    const message = caughtMailSchema.parse(one.body);
    expect(message.text.trim()).toBe('Plain words for the reader.');
    expect(message.html).toContain('<b>reader</b>');

    const missing = await admin.get('/api/dev/mail/no-such-message');
    expect(missing.status).toBe(404);
    const bad = await admin.get('/api/dev/mail/..%2F..%2Fetc');
    expect(bad.status).toBe(400);
  });

  it('when another role asks, then 403; without a session, 401', async () => {
    for (const role of ['planner', 'supervisor', 'floor_lead'] as const) {
      const agent = await withCatcher.agentFor(role);
      expect((await agent.get('/api/dev/mail')).status).toBe(403);
    }
    expect((await withCatcher.anonymous().get('/api/dev/mail')).status).toBe(401);
  });

  it('when MAIL_CATCHER_URL is not set, then 404 says caught mail exists only in development', async () => {
    const admin = await withoutCatcher.agentFor('admin');
    for (const path of ['/api/dev/mail', '/api/dev/mail/any-id']) {
      const res = await admin.get(path);
      expect(res.status).toBe(404);
      expect(res.body.error.message).toMatch(/only in development/);
    }
  });

  it('when the catcher is configured but not running, then 502 names it', async () => {
    const ctx = await createTestContext({ config: { mailCatcherUrl: 'http://127.0.0.1:9' } });
    try {
      const res = await (await ctx.agentFor('admin')).get('/api/dev/mail');
      expect(res.status).toBe(502);
      expect(res.body.error.code).toBe('mail_catcher_unavailable');
    } finally {
      await ctx.close();
    }
  });
});
