import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { roles, type Role } from '@millrace/contracts';
import { createTestContext, type TestAgent, type TestContext } from './support/test-app';
import { listRoutes, type ListedRoute } from './support/list-routes';

/**
 * THE ROUTE MATRIX (issue 2): every route of the real app, read from the Express router, must
 * carry a guard; for every guarded route each role gets 401 without a session, 403 when not
 * allowed, and neither when allowed. Routes added later are picked up automatically.
 */

/** Public routes, by exact "METHOD path". Adding an open route means adding it here on purpose. */
const expectedOpenRoutes = new Set([
  'GET /api/health',
  'POST /api/auth/sign-in',
  'POST /api/auth/sign-out',
  'GET /api/session',
]);
/** Public token pages (invitations, password resets) are open by nature. */
const openRoutePatterns = [/^(GET|POST|PUT) \/api\/(invitations|password-resets)\//];

/** Values for path parameters; anything else becomes 1. */
const pathParamValues: Record<string, string> = {
  id: '1',
  kind: 'demand',
};

function concretePath(path: string): string {
  return path.replace(/:(\w+)\??/g, (_m, name: string) => pathParamValues[name] ?? '1').replace(/\*\w*/g, 'x');
}

function send(agent: TestAgent | ReturnType<typeof request>, route: ListedRoute, origin: string) {
  const path = concretePath(route.path);
  const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete' | 'head';
  const req = (agent as unknown as Record<string, (p: string) => request.Test>)[method](path).set('Origin', origin);
  return method === 'get' || method === 'head' || method === 'delete' ? req : req.send({});
}

let ctx: TestContext;
let routes: ListedRoute[];
const agents = {} as Record<Role, TestAgent>;

beforeAll(async () => {
  ctx = await createTestContext();
  routes = listRoutes(ctx.app).filter((r) => r.path.startsWith('/api'));
  for (const role of roles) agents[role] = await ctx.agentFor(role);
});
afterAll(async () => ctx?.close());

describe('route matrix', () => {
  it('when the app is built, then its router lists the platform routes (the enumeration works)', () => {
    const keys = routes.map((r) => `${r.method} ${r.path}`);
    for (const known of ['GET /api/health', 'POST /api/auth/sign-in', 'GET /api/me', 'GET /api/people', 'PATCH /api/people/:id']) {
      expect(keys).toContain(known);
    }
  });

  it('when any route lacks allow(...) or open() as its first handler, then this test fails', () => {
    const unguarded = routes.filter((r) => !r.guard).map((r) => `${r.method} ${r.path}`);
    expect(unguarded).toEqual([]);
  });

  it('when a route is open, then it is one of the known public routes', () => {
    const open = routes.filter((r) => r.guard?.kind === 'open').map((r) => `${r.method} ${r.path}`);
    const unexpected = open.filter((k) => !expectedOpenRoutes.has(k) && !openRoutePatterns.some((re) => re.test(k)));
    expect(unexpected).toEqual([]);
  });

  it('when each guarded route is called without a session, as each role not allowed, and as each allowed role, then 401 / 403 / neither', async () => {
    const failures: string[] = [];
    const guarded = routes.filter((r) => r.guard?.kind === 'allow');
    expect(guarded.length).toBeGreaterThan(0);
    for (const route of guarded) {
      const label = `${route.method} ${route.path}`;
      const anonymous = await send(request(ctx.app), route, ctx.origin);
      if (anonymous.status !== 401) failures.push(`${label} without a session: expected 401, got ${anonymous.status}`);
      for (const role of roles) {
        const res = await send(agents[role], route, ctx.origin);
        const allowed = route.guard!.roles.includes(role);
        if (allowed && (res.status === 401 || res.status === 403)) {
          failures.push(`${label} as ${role} (allowed): got ${res.status} ${JSON.stringify(res.body)}`);
        }
        if (!allowed && res.status !== 403) failures.push(`${label} as ${role} (not allowed): expected 403, got ${res.status}`);
      }
    }
    expect(failures).toEqual([]);
  });

  it('when an /api path has no route, then a JSON 404 (deny by default)', async () => {
    const agent = agents.admin;
    for (const [method, path] of [['get', '/api/no-such-thing'], ['post', '/api/people/1/explode'], ['delete', '/api/people/1']] as const) {
      const res = await agent[method](path).set('Origin', ctx.origin);
      expect(res.status, `${method} ${path}`).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    }
  });
});
