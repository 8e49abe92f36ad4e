import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, weekStartOf, workCenterDetailSchema, workCenterPageSchema, workCenterSchema } from '@millrace/contracts';
import { createTestContext, type TestContext } from './support/test-app';
import { countRows, createProduct, createWorkCenter } from './support/master-data';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());
const thisWeek = weekStartOf(new Date().toISOString().slice(0, 10), 'monday');

describe('work centers', () => {
  it('when a planner creates a two-shift work center, then 201 with the pattern; readers see it, floor leads do not', async () => {
    const planner = await ctx.agentFor('planner');
    const res = await planner.post('/api/work-centers').send({
      code: 'WC-MILL',
      name: 'Milling',
      efficiency: 0.85,
      overtimeCapHoursPerWeek: 10,
      overtimeCostPerHour: 55,
      shiftPattern: { shiftsPerDay: 2, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['06:00', '14:00'] },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(workCenterSchema.strict().parse(res.body)).toMatchObject({ code: 'WC-MILL', efficiency: 0.85, overtimeCapHoursPerWeek: 10, version: 1 });
    const supervisor = await ctx.agentFor('supervisor');
    const list = workCenterPageSchema.parse((await supervisor.get('/api/work-centers?q=MILL')).body);
    expect(list.items.map((w) => w.shiftPattern)).toEqual([{ shiftsPerDay: 2, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['06:00', '14:00'] }]);
    expect((await (await ctx.agentFor('floor_lead')).get('/api/work-centers')).status).toBe(403);
    expect((await supervisor.post('/api/work-centers').send({ code: 'NO', name: 'No' })).status).toBe(403);
  });

  it('when the shift pattern does not add up, then 400 names the nested fields', async () => {
    const planner = await ctx.agentFor('planner');
    const res = await planner.post('/api/work-centers').send({
      code: 'WC-BAD',
      name: 'Bad',
      efficiency: 0,
      shiftPattern: { shiftsPerDay: 2, hoursPerShift: 13, daysPerWeek: 8, shiftStarts: ['25:00', '06:00'] },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual([
      'efficiency',
      'shiftPattern.daysPerWeek',
      'shiftPattern.hoursPerShift',
      'shiftPattern.shiftStarts.0',
    ]);
  });

  it('when a planner edits with a stale version, then 409; with the current one, the pattern changes', async () => {
    const planner = await ctx.agentFor('planner');
    const wc = await createWorkCenter(planner, { code: 'WC-EDIT' });
    const ok = await planner.patch(`/api/work-centers/${wc.id}`).send({ version: wc.version, shiftPattern: { shiftsPerDay: 3, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['06:00', '14:00', '22:00'] } });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect(ok.body.shiftPattern.shiftStarts).toEqual(['06:00', '14:00', '22:00']);
    const stale = await planner.patch(`/api/work-centers/${wc.id}`).send({ version: wc.version, name: 'Renamed' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toBe('Someone else changed work center WC-EDIT since you opened it; reload to see their change.');
  });

  it('when a planner saves the calendar, then the weeks come back in order and the version moves on', async () => {
    const planner = await ctx.agentFor('planner');
    const wc = await createWorkCenter(planner, { code: 'WC-CAL' });
    const res = await planner.put(`/api/work-centers/${wc.id}/calendar`).send({
      version: wc.version,
      weeks: [
        { weekStart: addDays(thisWeek, 14), downtimeHours: 6, note: 'Service' },
        { weekStart: thisWeek, holidayDays: 1, extraShifts: 1 },
      ],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const detail = workCenterDetailSchema.strict().parse(res.body);
    expect(detail.version).toBe(wc.version + 1);
    expect(detail.calendar).toEqual([
      { weekStart: thisWeek, holidayDays: 1, downtimeHours: 0, extraShifts: 1, note: null },
      { weekStart: addDays(thisWeek, 14), holidayDays: 0, downtimeHours: 6, extraShifts: 0, note: 'Service' },
    ]);
  });

  it('when calendar weeks are not week starts, repeat, or have more holidays than working days, then 400 and nothing changes', async () => {
    const planner = await ctx.agentFor('planner');
    const wc = await createWorkCenter(planner, { code: 'WC-CALBAD' });
    const before = await countRows(ctx.dataSource, 'work_center_week');
    const dup = await planner.put(`/api/work-centers/${wc.id}/calendar`).send({ version: wc.version, weeks: [{ weekStart: thisWeek }, { weekStart: thisWeek }] });
    expect(dup.status).toBe(400);
    expect(dup.body.error.fields).toEqual([{ path: 'weeks.1.weekStart', message: `The week of ${thisWeek} is listed twice.` }]);
    const wednesday = addDays(thisWeek, 2);
    const bad = await planner.put(`/api/work-centers/${wc.id}/calendar`).send({ version: wc.version, weeks: [{ weekStart: wednesday }] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual([{ path: 'weeks.0.weekStart', message: `${wednesday} is a Wednesday; weeks start on Monday.` }]);
    const holidays = await planner.put(`/api/work-centers/${wc.id}/calendar`).send({ version: wc.version, weeks: [{ weekStart: thisWeek, holidayDays: 6 }] });
    expect(holidays.status).toBe(400);
    expect(holidays.body.error.fields).toEqual([{ path: 'weeks.0.holidayDays', message: 'WC-CALBAD works 5 days a week; at most 5 holidays.' }]);
    expect(await countRows(ctx.dataSource, 'work_center_week')).toBe(before);
  });

  it('when a routing still uses the work center, then delete answers 409 naming the product; once unused, 204', async () => {
    const planner = await ctx.agentFor('planner');
    const wc = await createWorkCenter(planner, { code: 'WC-USED' });
    const p = await createProduct(planner, { code: 'P-ROUTED' });
    await planner.put(`/api/products/${p.id}/routing`).send({ version: p.version, steps: [{ sequence: 10, workCenterId: wc.id, hoursPerUnit: 1 }] });
    const res = await planner.delete(`/api/work-centers/${wc.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('Work center WC-USED cannot be deleted: it is still used by the routing of P-ROUTED. Remove those first.');
    await planner.put(`/api/products/${p.id}/routing`).send({ version: p.version + 1, steps: [] });
    expect((await planner.delete(`/api/work-centers/${wc.id}`)).status).toBe(204);
  });
});
