import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { sessionStateSchema } from '@millrace/contracts';
import { createPerson } from '../src/people/create-person.use-case';
import { createTestContext, type TestContext } from './support/test-app';
import { testPassword, testPeople } from './support/seed-people';

/**
 * GET /api/session: the open "who is signed in here?" question the planner asks before anyone
 * has signed in. It always answers 200 (so a browser shows no failed request), while GET
 * /api/me keeps its 401 without a session (DESIGN.md, API essentials).
 */
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

const sessionCookieOf = (res: request.Response) => ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('millrace_session='));

describe('GET /api/session', () => {
  it('when nobody is signed in, then 200 {signedIn: false} while GET /api/me still answers 401', async () => {
    const res = await request(ctx.app).get('/api/session');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ signedIn: false });
    expect(sessionStateSchema.parse(res.body)).toEqual({ signedIn: false });
    expect((await request(ctx.app).get('/api/me')).status).toBe(401);
  });

  it('when signed in, then 200 {signedIn: true, person} with the same e-mail, name and role as GET /api/me and nothing more', async () => {
    for (const role of ['admin', 'planner', 'supervisor', 'floor_lead'] as const) {
      const agent = await ctx.agentFor(role);
      const res = await agent.get('/api/session');
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ signedIn: true, person: { email: testPeople[role].email, name: testPeople[role].name, role } });
      expect(res.body.person).toEqual((await agent.get('/api/me')).body);
    }
  });

  it('when the person signs out, then the same browser is told {signedIn: false}', async () => {
    const agent = await ctx.agentFor('planner');
    expect((await agent.get('/api/session')).body.signedIn).toBe(true);
    expect((await agent.post('/api/auth/sign-out')).status).toBe(204);
    expect((await agent.get('/api/session')).body).toEqual({ signedIn: false });
  });

  it('when the cookie names an unknown or expired session, then {signedIn: false} and the cookie is cleared', async () => {
    const res = await request(ctx.app).get('/api/session').set('Cookie', 'millrace_session=not-a-session-we-issued');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ signedIn: false });
    expect(sessionCookieOf(res)).toMatch(/^millrace_session=;/);

    const agent = ctx.anonymous();
    const signIn = await agent.post('/api/auth/sign-in').send({ email: testPeople.supervisor.email, password: testPassword });
    const id = sessionCookieOf(signIn)!.split(';')[0].split('=')[1];
    await ctx.dataSource.query('UPDATE session SET expires_at = UTC_TIMESTAMP() - INTERVAL 1 MINUTE WHERE id = ?', [id]);
    expect((await agent.get('/api/session')).body).toEqual({ signedIn: false });
  });

  it('when the person is deactivated, then their open session answers {signedIn: false}', async () => {
    await createPerson(ctx.dataSource, { email: 'leaving@millrace.test', name: 'Leaving', role: 'planner', password: testPassword });
    const agent = ctx.anonymous();
    expect((await agent.post('/api/auth/sign-in').send({ email: 'leaving@millrace.test', password: testPassword })).status).toBe(200);
    expect((await agent.get('/api/session')).body.signedIn).toBe(true);
    await ctx.dataSource.query('UPDATE person SET active = 0 WHERE email = ?', ['leaving@millrace.test']);
    expect((await agent.get('/api/session')).body).toEqual({ signedIn: false });
  });
});
