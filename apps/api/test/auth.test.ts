import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { errorBodySchema, meSchema } from '@millrace/contracts';
import { signInLimits } from '../src/auth/sign-in-rate-limit';
import { createTestContext, type TestContext } from './support/test-app';
import { testPassword, testPeople } from './support/seed-people';
import { createPerson } from '../src/people/create-person.use-case';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

function sessionCookieOf(res: request.Response): string | undefined {
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  return cookies.find((c) => c.startsWith('millrace_session='));
}

describe('sign-in', () => {
  it('when the e-mail and password are right, then 200 with {email,name,role} and an HttpOnly SameSite=Lax session cookie', async () => {
    const res = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'planner@millrace.test', password: testPassword });
    expect(res.status).toBe(200);
    expect(meSchema.strict().parse(res.body)).toEqual({ email: 'planner@millrace.test', name: 'Test Planner', role: 'planner' });
    const cookie = sessionCookieOf(res);
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    // PUBLIC_URL is http in tests, so the cookie must not be Secure (it would never be sent back).
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('when the e-mail differs only in case and spaces, then sign-in still works', async () => {
    const res = await ctx.anonymous().post('/api/auth/sign-in').send({ email: '  Planner@Millrace.TEST ', password: testPassword });
    expect(res.status).toBe(200);
  });

  it('when signed in, then GET /api/me returns the person', async () => {
    const agent = await ctx.agentFor('supervisor');
    const res = await agent.get('/api/me');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ email: 'supervisor@millrace.test', name: 'Test Supervisor', role: 'supervisor' });
  });

  it('when not signed in, then GET /api/me answers 401 unauthenticated', async () => {
    const res = await request(ctx.app).get('/api/me');
    expect(res.status).toBe(401);
    expect(errorBodySchema.parse(res.body).error.code).toBe('unauthenticated');
  });

  it('when signing in again, then a new session id is issued and the previous session ends', async () => {
    const agent = ctx.anonymous();
    const first = await agent.post('/api/auth/sign-in').send({ email: 'admin@millrace.test', password: testPassword });
    const second = await agent.post('/api/auth/sign-in').send({ email: 'admin@millrace.test', password: testPassword });
    const a = sessionCookieOf(first)!.split(';')[0];
    const b = sessionCookieOf(second)!.split(';')[0];
    expect(a).not.toBe(b);
    const old = await request(ctx.app).get('/api/me').set('Cookie', a);
    expect(old.status).toBe(401);
    const current = await request(ctx.app).get('/api/me').set('Cookie', b);
    expect(current.status).toBe(200);
  });

  it('when the password is wrong or the e-mail unknown, then 401 invalid_credentials with the same message and no cookie', async () => {
    const wrong = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'planner@millrace.test', password: 'not-the-password' });
    const unknown = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'nobody@millrace.test', password: testPassword });
    for (const res of [wrong, unknown]) {
      expect(res.status).toBe(401);
      expect(errorBodySchema.parse(res.body).error.code).toBe('invalid_credentials');
      expect(sessionCookieOf(res)).toBeUndefined();
    }
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
  });

  it('when the person is deactivated, then the right password answers the same 401 as a wrong one', async () => {
    await createPerson(ctx.dataSource, { email: 'gone@millrace.test', name: 'Gone', role: 'planner', password: testPassword });
    await ctx.dataSource.query('UPDATE person SET active = 0 WHERE email = ?', ['gone@millrace.test']);
    const res = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'gone@millrace.test', password: testPassword });
    const wrong = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'planner@millrace.test', password: 'still-not-it-123' });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('invalid_credentials');
    expect(res.body.error.message).toBe(wrong.body.error.message);
  });

  it('when the body has an unknown field or a bad e-mail, then 400 names each field', async () => {
    const res = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'not-an-email', password: 'x', remember: true });
    expect(res.status).toBe(400);
    const body = errorBodySchema.parse(res.body);
    expect(body.error.code).toBe('validation_failed');
    expect(body.error.fields?.map((f) => f.path).sort()).toEqual(['email', 'remember']);
  });
});

describe('sign-in rate limit', () => {
  it(`when one e-mail fails ${signInLimits.maxFailuresPerEmailAndIp} times from one address, then the next attempt gets 429 with Retry-After, even with the right password`, async () => {
    await createPerson(ctx.dataSource, { email: 'hammered@millrace.test', name: 'Hammered', role: 'planner', password: testPassword });
    for (let i = 0; i < signInLimits.maxFailuresPerEmailAndIp; i++) {
      const res = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'hammered@millrace.test', password: `wrong-password-${i}` });
      expect(res.status).toBe(401);
    }
    const limited = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'hammered@millrace.test', password: testPassword });
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('rate_limited');
    const retryAfter = Number(limited.headers['retry-after']);
    expect(Number.isInteger(retryAfter)).toBe(true);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(signInLimits.windowMs / 1000);
    expect(sessionCookieOf(limited)).toBeUndefined();
    // Another e-mail from the same address is not blocked by this one's failures.
    const other = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'planner@millrace.test', password: testPassword });
    expect(other.status).toBe(200);
  });

  it('when the failures are older than the window, then sign-in works again', async () => {
    await createPerson(ctx.dataSource, { email: 'waited@millrace.test', name: 'Waited', role: 'planner', password: testPassword });
    for (let i = 0; i < signInLimits.maxFailuresPerEmailAndIp; i++) {
      await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'waited@millrace.test', password: `wrong-password-${i}` });
    }
    expect((await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'waited@millrace.test', password: testPassword })).status).toBe(429);
    // Age the stored failures past the window (as if the time had passed).
    await ctx.dataSource.query('UPDATE sign_in_attempt SET attempted_at = attempted_at - INTERVAL 16 MINUTE WHERE email = ?', ['waited@millrace.test']);
    const res = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'waited@millrace.test', password: testPassword });
    expect(res.status).toBe(200);
  });
});

describe('sign-out', () => {
  it('when signing out, then the session ends on the server and the cookie is cleared', async () => {
    const agent = ctx.anonymous();
    const signIn = await agent.post('/api/auth/sign-in').send({ email: testPeople.floor_lead.email, password: testPassword });
    const cookieHeader = sessionCookieOf(signIn)!.split(';')[0];
    expect((await agent.get('/api/me')).status).toBe(200);
    const out = await agent.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    const cleared = sessionCookieOf(out);
    expect(cleared).toMatch(/^millrace_session=;/);
    expect((await agent.get('/api/me')).status).toBe(401);
    // Replaying the old cookie does not work either: the session is gone from the database.
    expect((await request(ctx.app).get('/api/me').set('Cookie', cookieHeader)).status).toBe(401);
    const [{ n }] = await ctx.dataSource.query(
      'SELECT COUNT(*) AS n FROM session s JOIN person p ON p.id = s.user_id WHERE p.email = ?',
      [testPeople.floor_lead.email],
    );
    expect(Number(n)).toBe(0);
  });

  it('when signing out without a session, then 204 and nothing breaks', async () => {
    const res = await ctx.anonymous().post('/api/auth/sign-out');
    expect(res.status).toBe(204);
  });
});

describe('cross-site request protection', () => {
  it('when a state-changing request carries no Origin or Referer, then 403 origin_mismatch', async () => {
    const res = await request(ctx.app).post('/api/auth/sign-in').send({ email: 'planner@millrace.test', password: testPassword });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('origin_mismatch');
  });

  it('when the Origin is another site, then 403 origin_mismatch even with a valid session', async () => {
    const agent = await ctx.agentFor('admin');
    const res = await agent
      .post('/api/people')
      .set('Origin', 'https://evil.example')
      .send({ email: 'x@millrace.test', name: 'X', role: 'planner' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('origin_mismatch');
    expect(res.body.error.message).toContain('https://evil.example');
  });

  it('when only a Referer from PUBLIC_URL is sent, then the request is accepted', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/sign-in')
      .set('Referer', `${ctx.origin}/sign-in`)
      .send({ email: 'planner@millrace.test', password: testPassword });
    expect(res.status).toBe(200);
  });

  it('when the request is a GET, then no Origin is needed', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.status).toBe(200);
  });
});

describe('expired sessions', () => {
  it('when a session is past its expiry, then it no longer signs anyone in and the sweep removes it', async () => {
    const { deleteExpiredSessions } = await import('../src/auth/delete-expired-sessions');
    const agent = ctx.anonymous();
    const signIn = await agent.post('/api/auth/sign-in').send({ email: testPeople.planner.email, password: testPassword });
    const id = sessionCookieOf(signIn)!.split(';')[0].split('=')[1];
    expect((await agent.get('/api/me')).status).toBe(200);
    await ctx.dataSource.query('UPDATE session SET expires_at = UTC_TIMESTAMP() - INTERVAL 1 MINUTE WHERE id = ?', [id]);
    expect((await agent.get('/api/me')).status).toBe(401);
    // lucia already deleted it on that read; an expired row written directly is swept.
    await ctx.dataSource.query('INSERT INTO session (id, user_id, expires_at) SELECT ?, id, UTC_TIMESTAMP() - INTERVAL 1 HOUR FROM person WHERE email = ?', [
      'expired-session-row',
      testPeople.planner.email,
    ]);
    expect(await deleteExpiredSessions(ctx.dataSource)).toBeGreaterThanOrEqual(1);
    expect(await ctx.dataSource.query('SELECT id FROM session WHERE id = ?', ['expired-session-row'])).toEqual([]);
  });
});

describe('cookie over https', () => {
  it('when PUBLIC_URL is https, then the session cookie is also Secure', async () => {
    const { createApp } = await import('../src/app');
    const publicUrl = 'https://plan.millrace.test';
    const app = createApp({ dataSource: ctx.dataSource, config: { ...ctx.config, http: { ...ctx.config.http, publicUrl } } });
    const res = await request(app).post('/api/auth/sign-in').set('Origin', publicUrl).send({ email: testPeople.admin.email, password: testPassword });
    expect(res.status).toBe(200);
    expect(sessionCookieOf(res)).toMatch(/;\s*Secure/i);
    expect(sessionCookieOf(res)).toMatch(/HttpOnly/i);
  });
});
