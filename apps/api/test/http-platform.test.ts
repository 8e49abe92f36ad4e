import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { errorBodySchema } from '@millrace/contracts';
import { createTestContext, type TestContext } from './support/test-app';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

describe('health', () => {
  it('when the database is up, then GET /api/health answers {"status":"ok","db":"up"} without sign-in', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', db: 'up' });
  });
});

describe('bad input', () => {
  it('when body fields are wrong, missing or unknown, then 400 validation_failed names each by path', async () => {
    const admin = await ctx.agentFor('admin');
    const res = await admin.post('/api/people').send({ email: 'nope', role: 'boss', nickname: 'x' });
    expect(res.status).toBe(400);
    const body = errorBodySchema.parse(res.body);
    expect(body.error.code).toBe('validation_failed');
    expect(body.error.fields?.map((f) => f.path).sort()).toEqual(['email', 'name', 'nickname', 'role']);
    for (const f of body.error.fields ?? []) expect(f.message.length).toBeGreaterThan(0);
  });

  it('when a path parameter is not a number, then 400 names params.id', async () => {
    const admin = await ctx.agentFor('admin');
    const res = await admin.patch('/api/people/abc').send({ role: 'planner', version: 1 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: 'params.id' })]);
  });

  it('when the JSON is malformed, then 400 validation_failed saying so', async () => {
    const res = await ctx.anonymous().post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.message).toMatch(/not valid JSON/);
  });

  it('when the body is larger than 1 MB, then 413 payload_too_large', async () => {
    const big = JSON.stringify({ email: 'a@b.test', password: 'x'.repeat(1024 * 1024 + 10) });
    const res = await ctx.anonymous().post('/api/auth/sign-in').set('Content-Type', 'application/json').send(big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });

  it('when a body just under the limit is sent, then it is read (and judged on its fields)', async () => {
    const body = JSON.stringify({ email: 'a@b.test', password: 'x'.repeat(900 * 1024) });
    const res = await ctx.anonymous().post('/api/auth/sign-in').set('Content-Type', 'application/json').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: 'password' })]);
  });

  it('when nested fields are wrong, then the field paths are dotted (a.b.0)', async () => {
    // Uses the validator directly on a throw-away route so the path format is pinned down.
    const express = (await import('express')).default;
    const { z } = await import('zod');
    const { validate } = await import('../src/http/validate-request');
    const { errorHandler } = await import('../src/http/error-handler');
    const app = express();
    app.use(express.json());
    const input = validate({ body: z.strictObject({ rows: z.array(z.strictObject({ qty: z.number().positive() })) }) });
    app.post('/x', input, (_req, res) => {
      res.json(input.from(res).body);
    });
    app.use(errorHandler({ error: () => undefined }));
    const bad = await request(app).post('/x').send({ rows: [{ qty: 1 }, { qty: -2 }, { qty: 3, extra: 1 }] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual(['rows.1.qty', 'rows.2.extra']);
    const good = await request(app).post('/x').send({ rows: [{ qty: 1 }] });
    expect(good.body).toEqual({ rows: [{ qty: 1 }] });
  });

  it('when something unexpected throws, then 500 with a plain message and no stack trace', async () => {
    const express = (await import('express')).default;
    const { errorHandler } = await import('../src/http/error-handler');
    const app = express();
    app.get('/boom', () => {
      throw new Error('secret internal detail at /srv/app.js:12');
    });
    const logged: unknown[] = [];
    app.use(errorHandler({ error: (_m, e) => logged.push(e) }));
    const res = await request(app).get('/boom');
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe('internal_error');
    expect(JSON.stringify(res.body)).not.toContain('secret');
    expect(logged).toHaveLength(1);
  });
});

describe('serving the planner', () => {
  it('when PLANNER_DIST is set, then files are served, other non-/api GETs get index.html, and /api stays JSON', async () => {
    const { mkdtemp, writeFile, mkdir, rm } = await import('node:fs/promises');
    const { tmpdir } = await import('node:os');
    const path = await import('node:path');
    const { createApp } = await import('../src/app');
    const dist = await mkdtemp(path.join(tmpdir(), 'millrace-planner-'));
    try {
      await writeFile(path.join(dist, 'index.html'), '<!doctype html><title>planner shell</title>');
      await mkdir(path.join(dist, 'assets'));
      await writeFile(path.join(dist, 'assets', 'app.js'), 'console.log("app")');
      const app = createApp({ dataSource: ctx.dataSource, config: { ...ctx.config, plannerDist: dist } });
      const root = await request(app).get('/');
      expect(root.status).toBe(200);
      expect(root.text).toContain('planner shell');
      const deep = await request(app).get('/plans/3/review');
      expect(deep.status).toBe(200);
      expect(deep.text).toContain('planner shell');
      const asset = await request(app).get('/assets/app.js');
      expect(asset.text).toContain('console.log');
      const api = await request(app).get('/api/nothing-here');
      expect(api.status).toBe(404);
      expect(api.body.error.code).toBe('not_found');
    } finally {
      await rm(dist, { recursive: true, force: true });
    }
  });
});
