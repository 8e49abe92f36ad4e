import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import type { Express } from 'express';
import { createApp } from '../src/app';
import { createDataSource } from '../src/db/data-source';
import { createTestContext, type TestContext } from './support/test-app';
import { testPassword } from './support/seed-people';
import { TcpProxy } from './support/tcp-proxy';

/**
 * The database going away and coming back: requests get 503 db_unavailable with a clear message
 * (never a crash), health says degraded, and the same app recovers by itself once it returns.
 */
let ctx: TestContext;
let proxy: TcpProxy;
let proxied: DataSource;
let app: Express;

beforeAll(async () => {
  ctx = await createTestContext();
  proxy = new TcpProxy(ctx.config.db.host, ctx.config.db.port);
  await proxy.start();
  proxied = createDataSource({ ...ctx.config.db, host: '127.0.0.1', port: proxy.port });
  app = createApp({ dataSource: proxied, config: ctx.config });
});
afterAll(async () => {
  await proxy?.stop();
  if (proxied?.isInitialized) await proxied.destroy();
  await ctx?.close();
});

describe('database outage', () => {
  it('when the data source is not connected yet, then health is degraded (503) and API calls answer 503 db_unavailable', async () => {
    const health = await request(app).get('/api/health');
    expect(health.status).toBe(503);
    expect(health.body).toEqual({ status: 'degraded', db: 'down' });
    const me = await request(app).get('/api/me');
    expect(me.status).toBe(503);
    expect(me.body.error.code).toBe('db_unavailable');
    expect(me.body.error.message).toMatch(/database/i);
  });

  it('when the database goes away after sign-in and comes back, then 503 meanwhile and the same session works afterwards', async () => {
    await proxied.initialize();
    const agent = request.agent(app);
    const signIn = await agent.post('/api/auth/sign-in').set('Origin', ctx.origin).send({ email: 'planner@millrace.test', password: testPassword });
    expect(signIn.status).toBe(200);
    expect((await agent.get('/api/me')).status).toBe(200);

    await proxy.stop();
    const health = await request(app).get('/api/health');
    expect(health.status).toBe(503);
    expect(health.body).toEqual({ status: 'degraded', db: 'down' });
    const me = await agent.get('/api/me');
    expect(me.status).toBe(503);
    expect(me.body.error.code).toBe('db_unavailable');
    expect(me.headers['retry-after']).toBeDefined();
    const people = await agent.get('/api/people');
    expect(people.status).toBe(503);
    const signInDown = await request(app)
      .post('/api/auth/sign-in')
      .set('Origin', ctx.origin)
      .send({ email: 'planner@millrace.test', password: testPassword });
    expect(signInDown.status).toBe(503);

    await proxy.start(); // same port
    const healthBack = await request(app).get('/api/health');
    expect(healthBack.status).toBe(200);
    expect(healthBack.body).toEqual({ status: 'ok', db: 'up' });
    const meBack = await agent.get('/api/me');
    expect(meBack.status).toBe(200);
    expect(meBack.body.email).toBe('planner@millrace.test');
  });
});

describe('start-up before the database', () => {
  it('when the database is not up at start, then the server keeps retrying and connects once it is', async () => {
    const { connectWithRetry } = await import('../src/db/connect-with-retry');
    const late = new TcpProxy(ctx.config.db.host, ctx.config.db.port);
    await late.start();
    const port = late.port;
    await late.stop(); // nothing listens on `port` now
    const ds = createDataSource({ ...ctx.config.db, host: '127.0.0.1', port });
    const lines: string[] = [];
    const connecting = connectWithRetry(ds, { delaysMs: [50, 100], log: (l) => lines.push(l) });
    await new Promise((r) => setTimeout(r, 400));
    expect(ds.isInitialized).toBe(false);
    expect(lines.length).toBeGreaterThanOrEqual(2);
    expect(lines[0]).toMatch(/retrying in 50 ms/);
    await late.start(); // the database "comes up" on the same port
    expect(await connecting).toBe('connected');
    expect(await ds.query('SELECT COUNT(*) AS n FROM person')).toEqual([{ n: expect.anything() }]);
    await ds.destroy();
    await late.stop();
  });
});
