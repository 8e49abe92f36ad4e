import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { plantSettingsSchema, weekStartOf } from '@millrace/contracts';
import { createTestContext, type TestContext } from './support/test-app';
import { createProduct } from './support/master-data';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

const body = (version: number, changes: Record<string, unknown> = {}) => ({
  plantName: 'Test Works',
  currency: 'eur',
  weekStart: 'monday',
  defaultShiftPattern: { shiftsPerDay: 2, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['06:00', '14:00'] },
  maxWeeklyHours: 48,
  minDailyRestHours: 11,
  overtimePremium: 1.5,
  version,
  ...changes,
});

describe('plant settings', () => {
  it('when a fresh database is read, then the working-time defaults are 48 h a week, 11 h rest and a 1.5 overtime premium', async () => {
    const supervisor = await ctx.agentFor('supervisor');
    const res = await supervisor.get('/api/settings');
    expect(res.status).toBe(200);
    const settings = plantSettingsSchema.strict().parse(res.body);
    // EU Working Time Directive 2003/88/EC Art. 6 (48 h average) and Art. 3 (11 h daily rest);
    // US Fair Labor Standards Act: at least 1.5× the regular rate for overtime.
    expect(settings).toMatchObject({ maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5, weekStart: 'monday' });
    // 1 × 8 h × 5 days (DOMAIN.md §3, common practice, no source)
    expect(settings.defaultShiftPattern).toEqual({ shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] });
    expect((await (await ctx.agentFor('floor_lead')).get('/api/settings')).status).toBe(200);
  });

  it('when an admin and then a planner save with the version they read, then both saves land; a supervisor gets 403', async () => {
    const admin = await ctx.agentFor('admin');
    const v1 = (await admin.get('/api/settings')).body.version;
    const saved = await admin.put('/api/settings').send(body(v1));
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect(saved.body).toMatchObject({ plantName: 'Test Works', currency: 'EUR', version: v1 + 1 });
    const planner = await ctx.agentFor('planner');
    expect((await planner.put('/api/settings').send(body(v1 + 1, { plantName: 'Test Works 2' }))).status).toBe(200);
    const supervisor = await ctx.agentFor('supervisor');
    expect((await supervisor.put('/api/settings').send(body(v1 + 2))).status).toBe(403);
  });

  it('when the version is stale, then 409 with the reload sentence', async () => {
    const admin = await ctx.agentFor('admin');
    const res = await admin.put('/api/settings').send(body(1));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('Someone else changed the plant settings since you opened it; reload to see their change.');
  });

  it('when fields are wrong, then 400 names each one, nested paths included', async () => {
    const admin = await ctx.agentFor('admin');
    const v = (await admin.get('/api/settings')).body.version;
    const res = await admin.put('/api/settings').send(
      body(v, { currency: 'euro', weekStart: 'someday', overtimePremium: 0.5, defaultShiftPattern: { shiftsPerDay: 3, hoursPerShift: 9, daysPerWeek: 5, shiftStarts: ['06:00'] } }),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual([
      'currency',
      'defaultShiftPattern.hoursPerShift',
      'defaultShiftPattern.shiftStarts',
      'overtimePremium',
      'weekStart',
    ]);
  });

  it('when demand is stored on Monday weeks, then the week start cannot change (409 on weekStart)', async () => {
    const planner = await ctx.agentFor('planner');
    const p = await createProduct(planner, { code: 'S-1' });
    const thisWeek = weekStartOf(new Date().toISOString().slice(0, 10), 'monday');
    await planner.put('/api/demand').send({ changes: [{ kind: 'forecast', productId: p.id, weekStart: thisWeek, qty: 1, version: null }] });
    const v = (await planner.get('/api/settings')).body.version;
    const res = await planner.put('/api/settings').send(body(v, { weekStart: 'sunday' }));
    expect(res.status).toBe(409);
    expect(res.body.error.fields).toEqual([{ path: 'weekStart', message: 'Weeks already start on monday in stored data.' }]);
  });
});
