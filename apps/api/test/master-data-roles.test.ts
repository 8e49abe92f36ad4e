import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from './support/test-app';
import { listRoutes } from './support/list-routes';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

const areas = /^\/api\/(settings|products|work-centers|materials|demand|home)(\/|$)/;

describe('master data and demand: who may do what (read from the Express router)', () => {
  it('when the routes are listed, then reads are for admin, planner and supervisor, writes for planners, settings for admin and planner, and home and settings reads for everyone', () => {
    const routes = listRoutes(ctx.app).filter((r) => areas.test(r.path));
    const table = Object.fromEntries(routes.map((r) => [`${r.method.toUpperCase()} ${r.path}`, [...(r.guard?.roles ?? [])].sort().join(',')]));
    const readers = 'admin,planner,supervisor';
    const everyone = 'admin,floor_lead,planner,supervisor';
    expect(table).toEqual({
      'GET /api/settings': everyone,
      'PUT /api/settings': 'admin,planner',
      'GET /api/products': readers,
      'GET /api/products/:id': readers,
      'POST /api/products': 'planner',
      'PATCH /api/products/:id': 'planner',
      'DELETE /api/products/:id': 'planner',
      'PUT /api/products/:id/bom': 'planner',
      'PUT /api/products/:id/routing': 'planner',
      'GET /api/work-centers': readers,
      'GET /api/work-centers/:id': readers,
      'POST /api/work-centers': 'planner',
      'PATCH /api/work-centers/:id': 'planner',
      'DELETE /api/work-centers/:id': 'planner',
      'PUT /api/work-centers/:id/calendar': 'planner',
      'GET /api/materials': readers,
      'GET /api/materials/:id': readers,
      'POST /api/materials': 'planner',
      'PATCH /api/materials/:id': 'planner',
      'DELETE /api/materials/:id': 'planner',
      'PUT /api/materials/:id/receipts': 'planner',
      'GET /api/demand': readers,
      'PUT /api/demand': 'planner',
      'GET /api/home': everyone,
    });
  });

  it('when a signed-out request reaches a master-data route, then 401', async () => {
    const res = await ctx.anonymous().get('/api/products');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});
