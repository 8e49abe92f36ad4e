import net from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { outboxMessageSchema } from '@millrace/contracts';
import { backoffDelayMs, OutboxSender } from '../../src/mail/outbox-sender';
import { enqueueMail } from '../../src/mail/outbox.repository';
import { createSmtpMailer } from '../../src/mail/smtp-mailer';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';

/** The outbox keeps trying with exponential back-off and records what it could not deliver. */
let ctx: TestContext;
let admin: TestAgent;

/** A loopback port with nothing listening: connections to it are refused, like an SMTP server that is down. */
async function closedPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  const port = (server.address() as net.AddressInfo).port;
  await new Promise<void>((r) => server.close(() => r()));
  return port;
}

beforeAll(async () => {
  ctx = await createTestContext();
  admin = await ctx.agentFor('admin');
});

afterAll(async () => {
  await ctx?.close();
});

describe('outbox delivery failures', () => {
  it('when the delay after each failure is computed, then it doubles from the base up to the cap', () => {
    const s = { backoffBaseMs: 5_000, backoffMaxMs: 60_000 };
    expect([1, 2, 3, 4, 5, 6].map((n) => backoffDelayMs(n, s))).toEqual([5_000, 10_000, 20_000, 40_000, 60_000, 60_000]);
  });

  it('when delivery keeps failing, then each attempt is recorded and after the last one the message is marked failed for the admin', async () => {
    await enqueueMail(ctx.dataSource.manager, { to: ['nobody@millrace.test'], subject: 'Undeliverable', text: 't', html: '<p>t</p>', event: 'test', planId: null });
    const port = await closedPort();
    const sender = new OutboxSender(ctx.dataSource, createSmtpMailer({ ...ctx.config.smtp, host: '127.0.0.1', port }), {
      maxAttempts: 3,
      backoffBaseMs: 1,
      backoffMaxMs: 1,
    });
    for (let attempt = 1; attempt <= 3; attempt++) {
      await new Promise((r) => setTimeout(r, 5));
      expect(await sender.sendDue()).toEqual({ sent: 0, failed: 1 });
    }
    expect(await sender.sendDue()).toEqual({ sent: 0, failed: 0 }); // given up: no more attempts

    const failed = (await admin.get('/api/outbox?state=failed')).body.map((m: unknown) => outboxMessageSchema.parse(m));
    expect(failed).toHaveLength(1);
    expect(failed[0]).toMatchObject({ to: 'nobody@millrace.test', subject: 'Undeliverable', state: 'failed', attempts: 3, nextAttemptAt: null });
    expect(failed[0].lastError).toMatch(/ECONNREFUSED|connect/i);
    // The default listing shows pending and failed mail.
    expect((await admin.get('/api/outbox')).body.map((m: { subject: string }) => m.subject)).toContain('Undeliverable');
  });
});
