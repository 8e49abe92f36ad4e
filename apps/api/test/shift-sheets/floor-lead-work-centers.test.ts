import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { personSchema, shiftSheetsWeekSchema, type Person, type Role, type ShiftSheetsWeek } from '@millrace/contracts';
import { testPeople } from '../support/seed-people';
import { FIRST_WEEK, WEEKS, type SmallPlant } from '../support/small-plant';
import type { TestAgent, TestContext } from '../support/test-app';
import { planInState } from './sheet-plans';
import { startPrintingContext, type PrintingContext } from './printing-context';

/**
 * Floor leads' work centers (DESIGN.md, roles: a floor lead "sees and prints the shift sheets of
 * released plans for their work centers"). An admin assigns work centers through PATCH
 * /api/people/:id; a floor lead with assignments then reads only those work centers' sheets, as
 * JSON and as the PDF the server prints with Chromium (PLANNER_DIST, CHROMIUM_PATH; read back
 * with poppler-utils' pdfinfo); a floor lead with none sees every work center. The expected
 * sheets are the supervisor's view of the same week (everyone but floor leads sees the whole
 * plant), filtered here by the assignment — never values from the sequencer itself.
 */
let ctx: TestContext;
let printing: PrintingContext;
let plant: SmallPlant;
let agents: Record<Role, TestAgent>;
let released: number;
/** the supervisor's whole-plant view of the week with work on both work centers */
let whole: ShiftSheetsWeek;
const dir = mkdtempSync(join(tmpdir(), 'millrace-lead-sheets-'));

beforeAll(async () => {
  printing = await startPrintingContext();
  ({ ctx, agents } = printing);
  plant = printing.plant;
  released = await planInState(agents, 'Lead sheets', FIRST_WEEK, 'released');
  const weeks = await Promise.all(WEEKS.map(async (w) => shiftSheetsWeekSchema.parse((await agents.supervisor.get(`/api/plans/${released}/shift-sheets?week=${w}`)).body)));
  const shiftsOf = (week: ShiftSheetsWeek, code: string) => week.workCenters.find((c) => c.code === code)!.days.reduce((a, d) => a + d.shifts.length, 0);
  whole = weeks.reduce((a, b) => (Math.min(shiftsOf(b, 'SAW'), shiftsOf(b, 'ASM')) > Math.min(shiftsOf(a, 'SAW'), shiftsOf(a, 'ASM')) ? b : a));
  expect(shiftsOf(whole, 'SAW')).toBeGreaterThan(0);
  expect(shiftsOf(whole, 'ASM')).toBeGreaterThan(0);
});

afterAll(async () => {
  await printing?.close();
  rmSync(dir, { recursive: true, force: true });
});

async function person(email: string): Promise<Person> {
  const list = await agents.admin.get('/api/people');
  expect(list.status).toBe(200);
  return personSchema.parse(list.body.find((p: { email: string }) => p.email === email));
}

async function assign(email: string, workCenterIds: number[]): Promise<Person> {
  const before = await person(email);
  const res = await agents.admin.patch(`/api/people/${before.id}`).send({ workCenterIds, version: before.version });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return personSchema.parse(res.body);
}

const sheetsOf = async (agent: TestAgent) => {
  const res = await agent.get(`/api/plans/${released}/shift-sheets?week=${whole.week.start}`);
  expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
  return shiftSheetsWeekSchema.parse(res.body);
};
const shiftCount = (week: ShiftSheetsWeek) => week.workCenters.reduce((a, c) => a + c.days.reduce((b, d) => b + d.shifts.length, 0), 0);

async function pdfPages(agent: TestAgent, query = ''): Promise<{ status: number; pages: number | null; body: unknown }> {
  const res = await agent
    .get(`/api/plans/${released}/shift-sheets.pdf?week=${whole.week.start}${query}`)
    .buffer(true)
    .parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
  const buf = res.body as Buffer;
  if (!String(res.headers['content-type']).startsWith('application/pdf')) return { status: res.status, pages: null, body: JSON.parse(buf.toString('utf8')) };
  const file = join(dir, `${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, buf);
  const info = execFileSync('pdfinfo', [file], { encoding: 'utf8' });
  return { status: res.status, pages: Number(/^Pages:\s+(\d+)/m.exec(info)![1]), body: null };
}

describe('assigning work centers to people', () => {
  it('when an admin assigns work centers, then the answer and the people list carry them and the version moves on', async () => {
    const before = await person(testPeople.floor_lead.email);
    expect(before.workCenterIds).toEqual([]);
    const after = await assign(testPeople.floor_lead.email, [plant.workCenters.ASM, plant.workCenters.SAW]);
    expect([...after.workCenterIds!].sort()).toEqual([plant.workCenters.ASM, plant.workCenters.SAW].sort());
    expect(after.version).toBe(before.version + 1);
    expect([...(await person(testPeople.floor_lead.email)).workCenterIds!].sort()).toEqual([plant.workCenters.ASM, plant.workCenters.SAW].sort());
    // [] clears them
    expect((await assign(testPeople.floor_lead.email, [])).workCenterIds).toEqual([]);
  });

  it('when a work center id does not exist, then 400 names that id and nothing changes', async () => {
    const before = await assign(testPeople.floor_lead.email, [plant.workCenters.SAW]);
    const res = await agents.admin.patch(`/api/people/${before.id}`).send({ workCenterIds: [plant.workCenters.ASM, 987_654], version: before.version });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.message).toContain('987654');
    expect(res.body.error.fields).toEqual([{ path: 'workCenterIds.1', message: 'There is no work center with id 987654.' }]);
    const after = await person(testPeople.floor_lead.email);
    expect(after.workCenterIds).toEqual([plant.workCenters.SAW]);
    expect(after.version).toBe(before.version);
  });

  it('when an id is listed twice or is not a positive whole number, then 400 names the entry', async () => {
    const p = await person(testPeople.floor_lead.email);
    const twice = await agents.admin.patch(`/api/people/${p.id}`).send({ workCenterIds: [plant.workCenters.SAW, plant.workCenters.SAW], version: p.version });
    expect(twice.status).toBe(400);
    expect(twice.body.error.fields).toEqual([{ path: 'workCenterIds.1', message: `Work center id ${plant.workCenters.SAW} is listed twice.` }]);
    const bad = await agents.admin.patch(`/api/people/${p.id}`).send({ workCenterIds: ['SAW'], version: p.version });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].path).toBe('workCenterIds.0');
  });

  it('when the version read is stale, then 409 and the assignment is not saved', async () => {
    const p = await assign(testPeople.floor_lead.email, [plant.workCenters.SAW]);
    const res = await agents.admin.patch(`/api/people/${p.id}`).send({ workCenterIds: [plant.workCenters.ASM], version: p.version - 1 });
    expect(res.status).toBe(409);
    expect((await person(testPeople.floor_lead.email)).workCenterIds).toEqual([plant.workCenters.SAW]);
  });

  it('when someone who is not an admin assigns work centers, then 403', async () => {
    const p = await person(testPeople.floor_lead.email);
    for (const role of ['planner', 'supervisor', 'floor_lead'] as const) {
      expect((await agents[role].patch(`/api/people/${p.id}`).send({ workCenterIds: [], version: p.version })).status).toBe(403);
    }
  });

  it('when an assigned work center is deleted, then it leaves the assignment', async () => {
    const spare = await agents.planner.post('/api/work-centers').send({
      code: 'SPARE',
      name: 'Spare bench',
      shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] },
    });
    expect(spare.status, JSON.stringify(spare.body)).toBe(201);
    await assign(testPeople.supervisor.email, [spare.body.id, plant.workCenters.ASM]);
    expect((await agents.planner.delete(`/api/work-centers/${spare.body.id}`)).status).toBe(204);
    const after = await person(testPeople.supervisor.email);
    expect(after.workCenterIds).toEqual([plant.workCenters.ASM]);
    // any role may hold work centers; only floor leads' sheets are cut to them
    expect(shiftCount(await sheetsOf(agents.supervisor))).toBe(shiftCount(whole));
    await assign(testPeople.supervisor.email, []);
  });
});

describe('a floor lead’s sheets', () => {
  it('when the floor lead has work centers assigned, then the week holds only those, with their cautions and sheet count', async () => {
    await assign(testPeople.floor_lead.email, [plant.workCenters.SAW]);
    const week = await sheetsOf(agents.floor_lead);
    expect(week.workCenterScope).toBe('assigned');
    expect(week.workCenters.map((c) => c.code)).toEqual(['SAW']);
    const saw = whole.workCenters.find((c) => c.code === 'SAW')!;
    expect(week.workCenters[0]).toEqual(saw);
    expect(week.sheetCount).toBe(saw.days.reduce((a, d) => a + d.shifts.length, 0));
    expect(week.sheetCount).toBeLessThan(whole.sheetCount);
    expect(week.cautions).toEqual(whole.cautions.filter((c) => c.workCenter === 'SAW'));
    expect(week.unscheduled).toEqual(whole.unscheduled.filter((u) => u.workCenter === 'SAW'));
    // the others still see the whole plant
    expect(whole.workCenterScope).toBe('all');
    expect(whole.workCenters.map((c) => c.code).sort()).toEqual(['ASM', 'SAW']);
  });

  it('when the floor lead has none assigned, then every work center is shown and the answer says why', async () => {
    await assign(testPeople.floor_lead.email, []);
    const week = await sheetsOf(agents.floor_lead);
    expect(week.workCenterScope).toBe('none_assigned');
    expect(week.workCenters).toEqual(whole.workCenters);
    expect(week.sheetCount).toBe(whole.sheetCount);
  });

  it('when the floor lead with one work center downloads the week as PDF, then it has one page per shift of that work center only', async () => {
    await assign(testPeople.floor_lead.email, [plant.workCenters.ASM]);
    const asmShifts = whole.workCenters.find((c) => c.code === 'ASM')!.days.reduce((a, d) => a + d.shifts.length, 0);
    const mine = await pdfPages(agents.floor_lead);
    expect(mine.status, JSON.stringify(mine.body)).toBe(200);
    expect(mine.pages).toBe(asmShifts);
    expect(asmShifts).toBeLessThan(whole.sheetCount);
    // another work center by name: not theirs
    const other = await pdfPages(agents.floor_lead, '&workCenter=SAW');
    expect(other.status).toBe(403);
    expect((other.body as { error: { message: string } }).error.message).toMatch(/SAW is not one of your work centers \(ASM\)/);
  });

  it('when the floor lead with none assigned downloads the week as PDF, then every work-center shift is a page', async () => {
    await assign(testPeople.floor_lead.email, []);
    const all = await pdfPages(agents.floor_lead);
    expect(all.status, JSON.stringify(all.body)).toBe(200);
    expect(all.pages).toBe(shiftCount(whole));
  });
});

describe('the release e-mail to floor leads', () => {
  it('when a plan is released, then a floor lead with work centers gets them named and one without gets the plain message, both with the sheets link', async () => {
    const other = await agents.admin.post('/api/people').send({ email: 'second.lead@millrace.test', name: 'Second Lead', role: 'floor_lead' });
    expect(other.status).toBe(201);
    expect(other.body.workCenterIds).toEqual([]);
    await assign(testPeople.floor_lead.email, [plant.workCenters.SAW, plant.workCenters.ASM]);
    const id = await planInState(agents, 'Lead mail', FIRST_WEEK, 'released');
    const rows: { to_address: string; text_body: string; html_body: string }[] = await ctx.dataSource.query(
      "SELECT to_address, text_body, html_body FROM outbox_message WHERE event = 'plan.release' AND plan_id = ? ORDER BY to_address",
      [id],
    );
    expect(rows.map((r) => r.to_address)).toEqual([testPeople.floor_lead.email, 'second.lead@millrace.test']);
    const link = `${ctx.config.http.publicUrl}/shift-sheets?plan=${id}`;
    const [mine, plain] = rows;
    expect(mine.text_body).toContain('ready to print, for your work centers ASM (Assembly bench), SAW (Panel saw).');
    expect(mine.text_body).toContain(`Open your shift sheets: ${link}`);
    expect(mine.html_body).toContain(`href="${link}"`);
    expect(plain.text_body).toContain('Your shift sheets for these weeks are ready to print.');
    expect(plain.text_body).not.toMatch(/ASM|SAW/);
    expect(plain.text_body).toContain(`Open your shift sheets: ${link}`);
  });
});
