import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { personSchema } from '@millrace/contracts';
import { judgePassword } from '../src/auth/password-policy';
import { createTestContext, type TestContext } from './support/test-app';
import { testPassword, testPeople } from './support/seed-people';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

async function personByEmail(email: string) {
  const admin = await ctx.agentFor('admin');
  const list = await admin.get('/api/people');
  return personSchema.parse(list.body.find((p: { email: string }) => p.email === email));
}

describe('people (admin)', () => {
  it('when an admin lists people, then each has id, email, name, role, active, version and timestamps but never a hash', async () => {
    const admin = await ctx.agentFor('admin');
    const res = await admin.get('/api/people');
    expect(res.status).toBe(200);
    const people = personSchema.strict().array().parse(res.body);
    expect(people.map((p) => p.email).sort()).toEqual(Object.values(testPeople).map((p) => p.email).sort());
    expect(JSON.stringify(res.body)).not.toMatch(/argon2|password/i);
  });

  it('when an admin creates a person with a role and a good password, then 201 and that person can sign in', async () => {
    const admin = await ctx.agentFor('admin');
    const res = await admin.post('/api/people').send({ email: 'New.Planner@Millrace.test', name: 'New Planner', role: 'planner', password: 'tangerine-lathe-4417' });
    expect(res.status).toBe(201);
    const person = personSchema.parse(res.body);
    expect(person).toMatchObject({ email: 'new.planner@millrace.test', name: 'New Planner', role: 'planner', active: true, version: 1 });
    const signIn = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'new.planner@millrace.test', password: 'tangerine-lathe-4417' });
    expect(signIn.status).toBe(200);
    expect(signIn.body.role).toBe('planner');
  });

  it('when the e-mail is taken, then 409 conflict naming the e-mail', async () => {
    const admin = await ctx.agentFor('admin');
    const res = await admin.post('/api/people').send({ email: 'planner@millrace.test', name: 'Twin', role: 'planner', password: 'tangerine-lathe-4417' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields).toEqual([{ path: 'email', message: expect.any(String) }]);
  });

  it('when the password is shorter than 12 characters or a common password, then 400 on the password field and nothing is saved', async () => {
    const admin = await ctx.agentFor('admin');
    const short = await admin.post('/api/people').send({ email: 'short@millrace.test', name: 'Short', role: 'planner', password: 'abc123xyz' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields).toEqual([{ path: 'password', message: 'Use at least 12 characters.' }]);
    // "password1234" and "qwertyuiop123" appear on Mozilla's common-password list shipped in fxa-common-password-list.
    for (const common of ['password1234', 'qwertyuiop123']) {
      const res = await admin.post('/api/people').send({ email: 'common@millrace.test', name: 'Common', role: 'planner', password: common });
      expect(res.status).toBe(400);
      expect(res.body.error.fields[0]).toMatchObject({ path: 'password', message: expect.stringMatching(/common/) });
    }
    const list = await admin.get('/api/people');
    expect(list.body.map((p: { email: string }) => p.email)).not.toContain('common@millrace.test');
    expect(list.body.map((p: { email: string }) => p.email)).not.toContain('short@millrace.test');
  });

  it('when the password policy judges, then length counts characters and e-mail/name are refused', () => {
    expect(judgePassword('password1234', { email: 'a@b.test' }).outcome).toBe('rejected');
    expect(judgePassword('PASSWORD1234', { email: 'a@b.test' }).outcome).toBe('rejected');
    expect(judgePassword('jo.smith.mill', { email: 'jo.smith.mill@b.test' }).outcome).toBe('rejected');
    expect(judgePassword('tangerine-lathe-4417', { email: 'a@b.test' }).outcome).toBe('acceptable');
  });

  it('when an admin changes a role with the version read, then the version goes up and the new role applies to the live session', async () => {
    const admin = await ctx.agentFor('admin');
    await admin.post('/api/people').send({ email: 'mover@millrace.test', name: 'Mover', role: 'floor_lead', password: testPassword });
    const mover = ctx.anonymous();
    expect((await mover.post('/api/auth/sign-in').send({ email: 'mover@millrace.test', password: testPassword })).status).toBe(200);
    expect((await mover.get('/api/people')).status).toBe(403);

    const before = await personByEmail('mover@millrace.test');
    const res = await admin.patch(`/api/people/${before.id}`).send({ role: 'admin', version: before.version });
    expect(res.status).toBe(200);
    expect(personSchema.parse(res.body)).toMatchObject({ role: 'admin', version: before.version + 1 });
    expect((await mover.get('/api/people')).status).toBe(200);
  });

  it('when the version sent is stale, then 409 conflict and nothing changes', async () => {
    const admin = await ctx.agentFor('admin');
    const p = await personByEmail(testPeople.supervisor.email);
    const first = await admin.patch(`/api/people/${p.id}`).send({ name: 'Renamed Supervisor', version: p.version });
    expect(first.status).toBe(200);
    const stale = await admin.patch(`/api/people/${p.id}`).send({ role: 'planner', version: p.version });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('conflict');
    expect(stale.body.error.message).toMatch(/Someone else changed supervisor@millrace\.test/);
    const after = await personByEmail(testPeople.supervisor.email);
    expect(after.role).toBe('supervisor');
    expect(after.version).toBe(p.version + 1);
  });

  it('when the person does not exist, then 404', async () => {
    const admin = await ctx.agentFor('admin');
    const res = await admin.patch('/api/people/99999').send({ active: false, version: 1 });
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('when the body carries nothing to change, then 400', async () => {
    const admin = await ctx.agentFor('admin');
    const p = await personByEmail(testPeople.planner.email);
    const res = await admin.patch(`/api/people/${p.id}`).send({ version: p.version });
    expect(res.status).toBe(400);
  });

  it('when an admin deactivates a signed-in person, then that person is signed out at once and cannot sign in', async () => {
    const admin = await ctx.agentFor('admin');
    await admin.post('/api/people').send({ email: 'leaver@millrace.test', name: 'Leaver', role: 'planner', password: testPassword });
    const leaver = ctx.anonymous();
    expect((await leaver.post('/api/auth/sign-in').send({ email: 'leaver@millrace.test', password: testPassword })).status).toBe(200);
    expect((await leaver.get('/api/me')).status).toBe(200);

    const p = await personByEmail('leaver@millrace.test');
    const res = await admin.patch(`/api/people/${p.id}`).send({ active: false, version: p.version });
    expect(res.status).toBe(200);
    expect(res.body.active).toBe(false);
    const [{ n }] = await ctx.dataSource.query('SELECT COUNT(*) AS n FROM session WHERE user_id = ?', [p.id]);
    expect(Number(n)).toBe(0);
    expect((await leaver.get('/api/me')).status).toBe(401);
    const again = await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'leaver@millrace.test', password: testPassword });
    expect(again.status).toBe(401);
  });

  it('when a deactivated person still has a session row (e.g. deactivated by another process), then the session is refused', async () => {
    const admin = await ctx.agentFor('admin');
    await admin.post('/api/people').send({ email: 'sidedoor@millrace.test', name: 'Side Door', role: 'planner', password: testPassword });
    const agent = ctx.anonymous();
    await agent.post('/api/auth/sign-in').send({ email: 'sidedoor@millrace.test', password: testPassword });
    await ctx.dataSource.query('UPDATE person SET active = 0 WHERE email = ?', ['sidedoor@millrace.test']);
    expect((await agent.get('/api/me')).status).toBe(401);
  });

  it('when the last active admin would be demoted or deactivated, then 409', async () => {
    // Only the test admin and "mover" are admins now; demote mover first, then try the last one.
    const admin = await ctx.agentFor('admin');
    const mover = await personByEmail('mover@millrace.test');
    expect((await admin.patch(`/api/people/${mover.id}`).send({ role: 'planner', version: mover.version })).status).toBe(200);
    const last = await personByEmail(testPeople.admin.email);
    const demote = await admin.patch(`/api/people/${last.id}`).send({ role: 'planner', version: last.version });
    expect(demote.status).toBe(409);
    expect(demote.body.error.message).toMatch(/last active admin/);
    const deactivate = await admin.patch(`/api/people/${last.id}`).send({ active: false, version: last.version });
    expect(deactivate.status).toBe(409);
  });
});

describe('own password', () => {
  it('when the current password is right and the new one meets the policy, then it changes, other sessions end, this one continues', async () => {
    const admin = await ctx.agentFor('admin');
    await admin.post('/api/people').send({ email: 'changer@millrace.test', name: 'Changer', role: 'supervisor', password: testPassword });
    const here = ctx.anonymous();
    const elsewhere = ctx.anonymous();
    for (const a of [here, elsewhere]) await a.post('/api/auth/sign-in').send({ email: 'changer@millrace.test', password: testPassword });

    const res = await here.put('/api/me/password').send({ currentPassword: testPassword, newPassword: 'walnut-spindle-8830' });
    expect(res.status).toBe(204);
    expect((await here.get('/api/me')).status).toBe(200);
    expect((await elsewhere.get('/api/me')).status).toBe(401);
    expect((await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'changer@millrace.test', password: testPassword })).status).toBe(401);
    expect((await ctx.anonymous().post('/api/auth/sign-in').send({ email: 'changer@millrace.test', password: 'walnut-spindle-8830' })).status).toBe(200);
  });

  it('when the current password is wrong or the new one is weak, then 400 on the right field', async () => {
    const agent = await ctx.agentFor('planner');
    const wrong = await agent.put('/api/me/password').send({ currentPassword: 'not-my-password', newPassword: 'walnut-spindle-8830' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toEqual([{ path: 'currentPassword', message: expect.any(String) }]);
    const weak = await agent.put('/api/me/password').send({ currentPassword: testPassword, newPassword: 'password1234' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields).toEqual([{ path: 'newPassword', message: expect.stringMatching(/common/) }]);
    const short = await agent.put('/api/me/password').send({ currentPassword: testPassword, newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields).toEqual([{ path: 'newPassword', message: 'Use at least 12 characters.' }]);
  });

  it('when not signed in, then 401', async () => {
    const res = await request(ctx.app).put('/api/me/password').set('Origin', ctx.origin).send({ currentPassword: 'x', newPassword: 'walnut-spindle-8830' });
    expect(res.status).toBe(401);
  });
});
