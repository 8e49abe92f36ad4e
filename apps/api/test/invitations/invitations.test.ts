import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { invitationSentSchema, personTokenInfoSchema } from '@millrace/contracts';
import { passwordResetLimits } from '../../src/invitations/password-reset-rate-limit';
import { OutboxSender } from '../../src/mail/outbox-sender';
import { createSmtpMailer } from '../../src/mail/smtp-mailer';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';
import { testPassword, testPeople } from '../support/seed-people';

/**
 * Invitations and password resets by e-mail (issue 6 item 4): single-use links that expire, only
 * their hash stored, read back from the real mail catcher (MAIL_CATCHER_URL).
 */
const catcherUrl = process.env.MAIL_CATCHER_URL;
if (!catcherUrl) throw new Error('These tests read mail back from the mail catcher: set MAIL_CATCHER_URL and SMTP_HOST/SMTP_PORT (the README test command does).');

let ctx: TestContext;
let admin: TestAgent;
let sender: OutboxSender;
const goodPassword = 'walnut-veneer-on-birch-ply';

async function latestMailTo(to: string): Promise<{ subject: string; text: string; html: string | null } | null> {
  const list = (await (await fetch(`${catcherUrl}/messages?to=${encodeURIComponent(to)}`)).json()) as { id: string }[];
  const last = list.at(-1);
  return last ? ((await (await fetch(`${catcherUrl}/messages/${encodeURIComponent(last.id)}`)).json()) as { subject: string; text: string; html: string | null }) : null;
}

async function deliver(): Promise<void> {
  const round = await sender.sendDue();
  expect(round.failed).toBe(0);
}

function tokenIn(text: string, path: string): string {
  const m = new RegExp(`${ctx.config.http.publicUrl.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')}${path}\\?token=([A-Za-z0-9_-]{43})`).exec(text);
  if (!m) throw new Error(`no ${path} link in: ${text}`);
  return m[1];
}

const signIn = (email: string, password: string) => ctx.anonymous().post('/api/auth/sign-in').send({ email, password });

beforeAll(async () => {
  ctx = await createTestContext();
  admin = await ctx.agentFor('admin');
  sender = new OutboxSender(ctx.dataSource, createSmtpMailer(ctx.config.smtp));
  await fetch(`${catcherUrl}/messages`, { method: 'DELETE' });
});

afterAll(async () => {
  await ctx?.close();
});

describe('invitations', () => {
  it('when an admin invites a person, then the e-mail link lets them choose a password once and sign in', async () => {
    const res = await admin.post('/api/invitations').send({ email: 'Joiner@Millrace.test', name: 'Jo Joiner', role: 'planner' });
    expect(res.status).toBe(201);
    const sent = invitationSentSchema.parse(res.body);
    expect(sent.email).toBe('joiner@millrace.test');
    expect(JSON.stringify(res.body)).not.toMatch(/token/i);
    expect((await signIn('joiner@millrace.test', goodPassword)).status).toBe(401); // no password yet

    await deliver();
    const mail = (await latestMailTo('joiner@millrace.test'))!;
    expect(mail.subject).toBe('You are invited to Millrace');
    const token = tokenIn(mail.text, '/welcome');
    expect(mail.html).toContain(`/welcome?token=${token}`);
    const [stored]: { token_hash: string }[] = await ctx.dataSource.query('SELECT token_hash FROM person_token WHERE person_id = ?', [sent.personId]);
    expect(stored.token_hash).not.toContain(token); // only the hash is kept

    const info = await ctx.anonymous().get(`/api/invitations/${token}`);
    expect(info.status).toBe(200);
    expect(personTokenInfoSchema.parse(info.body)).toMatchObject({ purpose: 'invitation', email: 'joiner@millrace.test', name: 'Jo Joiner', role: 'planner' });

    const weak = await ctx.anonymous().post('/api/invitations/accept').send({ token, password: 'joiner@millrace.test' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields[0].path).toBe('password');

    const accepted = await ctx.anonymous().post('/api/invitations/accept').send({ token, password: goodPassword });
    expect(accepted.status).toBe(200);
    const me = await signIn('joiner@millrace.test', goodPassword);
    expect(me.status).toBe(200);
    expect(me.body.role).toBe('planner');

    const reused = await ctx.anonymous().post('/api/invitations/accept').send({ token, password: 'another-long-passphrase' });
    expect(reused.status).toBe(400);
    expect(reused.body.error.fields[0].path).toBe('token');
    expect((await ctx.anonymous().get(`/api/invitations/${token}`)).status).toBe(400);
    expect((await signIn('joiner@millrace.test', 'another-long-passphrase')).status).toBe(401);
  });

  it('when an invitation link has expired, then it is refused and nothing changes', async () => {
    const res = await admin.post('/api/invitations').send({ email: 'late@millrace.test', name: 'Lee Late', role: 'floor_lead' });
    await deliver();
    const token = tokenIn((await latestMailTo('late@millrace.test'))!.text, '/welcome');
    await ctx.dataSource.query('UPDATE person_token SET expires_at = ? WHERE person_id = ?', [new Date(Date.now() - 1000), res.body.personId]);
    const accepted = await ctx.anonymous().post('/api/invitations/accept').send({ token, password: goodPassword });
    expect(accepted.status).toBe(400);
    expect(accepted.body.error.message).toMatch(/not valid/);
    expect((await signIn('late@millrace.test', goodPassword)).status).toBe(401);
  });

  it('when someone other than an admin invites, or the e-mail is taken, then 403 or 409', async () => {
    const planner = await ctx.agentFor('planner');
    expect((await planner.post('/api/invitations').send({ email: 'x@millrace.test', name: 'X', role: 'planner' })).status).toBe(403);
    expect((await admin.post('/api/invitations').send({ email: testPeople.planner.email, name: 'Dup', role: 'planner' })).status).toBe(409);
  });

  it('when a link is not a token at all, then 400 names the token', async () => {
    const res = await ctx.anonymous().post('/api/invitations/accept').send({ token: 'abc', password: goodPassword });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('token');
  });
});

describe('password reset', () => {
  it('when a person resets the password by e-mail, then old sessions end, the new password works and the link works once', async () => {
    const before = await ctx.agentFor('supervisor');
    expect((await before.get('/api/me')).status).toBe(200);

    const req = await ctx.anonymous().post('/api/password-resets/request').send({ email: testPeople.supervisor.email });
    expect(req.status).toBe(202);
    await deliver();
    const mail = (await latestMailTo(testPeople.supervisor.email))!;
    expect(mail.subject).toBe('Choose a new Millrace password');
    const token = tokenIn(mail.text, '/reset-password');
    expect((await ctx.anonymous().get(`/api/password-resets/${token}`)).body.purpose).toBe('password_reset');
    expect((await ctx.anonymous().get(`/api/invitations/${token}`)).status).toBe(400); // not an invitation

    const done = await ctx.anonymous().post('/api/password-resets/confirm').send({ token, password: goodPassword });
    expect(done.status).toBe(200);
    expect((await before.get('/api/me')).status).toBe(401); // the old session ended
    expect((await signIn(testPeople.supervisor.email, testPassword)).status).toBe(401);
    expect((await signIn(testPeople.supervisor.email, goodPassword)).status).toBe(200);
    expect((await ctx.anonymous().post('/api/password-resets/confirm').send({ token, password: 'yet-another-passphrase' })).status).toBe(400);
  });

  it('when a reset is asked for an unknown or deactivated address, then the answer is the same and no mail goes out', async () => {
    await ctx.dataSource.query('UPDATE person SET active = 0 WHERE email = ?', [testPeople.floor_lead.email]);
    for (const email of ['nobody@millrace.test', testPeople.floor_lead.email]) {
      const res = await ctx.anonymous().post('/api/password-resets/request').send({ email });
      expect(res.status).toBe(202);
      expect(res.body.message).toMatch(/If the address belongs to an active account/);
    }
    expect(await sender.sendDue()).toEqual({ sent: 0, failed: 0 });
  });

  it(`when one e-mail asks for a reset link more than ${passwordResetLimits.maxPerEmailAndIp} times from one address, then 429 with Retry-After and no more mail`, async () => {
    const email = testPeople.planner.email;
    for (let i = 0; i < passwordResetLimits.maxPerEmailAndIp; i++) {
      expect((await ctx.anonymous().post('/api/password-resets/request').send({ email })).status).toBe(202);
    }
    expect(await sender.sendDue()).toEqual({ sent: passwordResetLimits.maxPerEmailAndIp, failed: 0 });

    const limited = await ctx.anonymous().post('/api/password-resets/request').send({ email: email.toUpperCase() });
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('rate_limited');
    const retryAfter = Number(limited.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(passwordResetLimits.windowMs / 1000 - 60);
    expect(retryAfter).toBeLessThanOrEqual(passwordResetLimits.windowMs / 1000);
    expect(limited.body.error.message).toMatch(/Try again in \d+ minutes?\./);
    expect(await sender.sendDue()).toEqual({ sent: 0, failed: 0 });
    const [{ n }]: { n: number | string }[] = await ctx.dataSource.query('SELECT COUNT(*) AS n FROM password_reset_request WHERE email = ?', [email]);
    expect(Number(n)).toBe(passwordResetLimits.maxPerEmailAndIp); // the refused request is not counted again

    // another address from the same place is still served (per e-mail + IP, not per IP alone)
    expect((await ctx.anonymous().post('/api/password-resets/request').send({ email: 'someone-else@millrace.test' })).status).toBe(202);
  });

  it('when the window has passed, then the same e-mail may ask again', async () => {
    const email = testPeople.planner.email;
    await ctx.dataSource.query('UPDATE password_reset_request SET requested_at = ? WHERE email = ?', [new Date(Date.now() - passwordResetLimits.windowMs - 1000), email]);
    expect((await ctx.anonymous().post('/api/password-resets/request').send({ email })).status).toBe(202);
  });
});
