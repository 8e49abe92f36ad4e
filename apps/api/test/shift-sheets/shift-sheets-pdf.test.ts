import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { shiftSheetsWeekSchema, type Role, type ShiftSheetsWeek } from '@millrace/contracts';
import { FIRST_WEEK, WEEKS } from '../support/small-plant';
import type { TestAgent } from '../support/test-app';
import { planInState } from './sheet-plans';
import { startPrintingContext, type PrintingContext } from './printing-context';

/**
 * The printed sheets: the print view of the built planner (PLANNER_DIST) rendered to PDF by
 * Debian's Chromium (CHROMIUM_PATH) and read back with poppler-utils (pdfinfo, pdftotext).
 * Issue 8: one page per work-center shift with work, and each page names its work center and
 * shift. Paper sizes: A4 is 210 × 297 mm = 595 × 842 pt (ISO 216); Letter is 8.5 × 11 in =
 * 612 × 792 pt (ANSI); the sheets print landscape.
 */
let printing: PrintingContext;
let agents: Record<Role, TestAgent>;
let released: number;
let approved: number;
let week: ShiftSheetsWeek;
const dir = mkdtempSync(join(tmpdir(), 'millrace-sheets-'));

beforeAll(async () => {
  printing = await startPrintingContext();
  ({ agents } = printing);
  released = await planInState(agents, 'Printed plan', FIRST_WEEK, 'released');
  approved = await planInState(agents, 'Approved, not released', FIRST_WEEK, 'approved');
  // the week with the most sheets
  const weeks = await Promise.all(WEEKS.map(async (w) => shiftSheetsWeekSchema.parse((await agents.floor_lead.get(`/api/plans/${released}/shift-sheets?week=${w}`)).body)));
  week = weeks.reduce((a, b) => (b.sheetCount > a.sheetCount ? b : a));
  expect(week.sheetCount).toBeGreaterThan(1);
});

afterAll(async () => {
  await printing?.close();
  if (!process.env.KEEP_SHEET_PDFS) rmSync(dir, { recursive: true, force: true });
});

async function pdf(agent: TestAgent, query: string): Promise<{ status: number; body: Buffer | { error: { code: string; message: string; fields?: { path: string }[] } }; type: string; file: string }> {
  const res = await agent
    .get(`/api/plans/${query}`)
    .buffer(true)
    .parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
  const buf = res.body as Buffer;
  const type = String(res.headers['content-type']);
  if (!type.startsWith('application/pdf')) return { status: res.status, body: JSON.parse(buf.toString('utf8')), type, file: '' };
  const file = join(dir, `${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, buf);
  return { status: res.status, body: buf, type, file };
}

const dayWords = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
const longDay = (isoDate: string) => dayWords.format(new Date(`${isoDate}T00:00:00Z`));
const info = (file: string) => execFileSync('pdfinfo', [file], { encoding: 'utf8' });
const pageCount = (file: string) => Number(/^Pages:\s+(\d+)/m.exec(info(file))![1]);
const pageText = (file: string, page: number) => execFileSync('pdftotext', ['-f', String(page), '-l', String(page), '-layout', file, '-'], { encoding: 'utf8' });

describe('shift sheets as PDF, printed by Chromium', () => {
  it('when a floor lead downloads a released week, then there is one page per work-center shift with work, each naming its work center, day and shift, in order', async () => {
    const res = await pdf(agents.floor_lead, `${released}/shift-sheets.pdf?week=${week.week.start}`);
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
    expect(res.type).toMatch(/^application\/pdf/);
    const sheets = week.workCenters.flatMap((c) => c.days.flatMap((d) => d.shifts));
    expect(pageCount(res.file)).toBe(sheets.length);
    expect(info(res.file)).toMatch(/Page size:\s+84[12](\.\d+)? x 59[56](\.\d+)? pts \(A4\)/);
    sheets.forEach((s, i) => {
      const text = pageText(res.file, i + 1);
      expect(text).toContain(`Shift sheet · ${s.workCenter} ${s.workCenterName} · ${longDay(s.date)} · Shift ${s.shift}`);
      expect(text).toContain(`Shift ${s.shift}, ${s.shiftStart.slice(11)}–${s.shiftEnd.slice(11)}`);
      expect(text).toMatch(new RegExp(`Page ${i + 1} of ${sheets.length}`));
      expect(text).toContain(`Sheet ${i + 1} of ${sheets.length}`);
      expect(text).toContain(`#${released} Printed plan`);
      expect(text).toContain('Initials');
      // every job of the shift is on its page, by product code
      for (const j of s.jobs) expect(text).toContain(j.product);
    });
  });

  it('when one work center is printed on Letter paper, then only its shifts are there, one a page, on Letter', async () => {
    const wc = week.workCenters.find((c) => c.days.length > 0)!;
    const shifts = wc.days.flatMap((d) => d.shifts);
    const res = await pdf(agents.supervisor, `${released}/shift-sheets.pdf?week=${week.week.start}&workCenter=${wc.code}&paper=letter`);
    expect(res.status).toBe(200);
    expect(pageCount(res.file)).toBe(shifts.length);
    expect(info(res.file)).toMatch(/Page size:\s+79[12](\.\d+)? x 61[12](\.\d+)? pts \(letter\)/);
    const other = week.workCenters.find((c) => c.code !== wc.code)!;
    shifts.forEach((s, i) => {
      const text = pageText(res.file, i + 1);
      expect(text).toContain(`Shift sheet · ${wc.code} ${wc.name} · ${longDay(s.date)} · Shift ${s.shift}`);
      expect(text).not.toContain(`${other.code} ${other.name}`);
    });
  });

  it('when the PDF cannot or may not be made, then the answer says why before any printing', async () => {
    const forbidden = await pdf(agents.floor_lead, `${approved}/shift-sheets.pdf?week=${FIRST_WEEK}`);
    expect(forbidden.status).toBe(403);
    const draft = await planInState(agents, 'Draft for print', FIRST_WEEK, 'draft');
    const conflict = await pdf(agents.planner, `${draft}/shift-sheets.pdf`);
    expect(conflict.status).toBe(409);
    expect((conflict.body as { error: { message: string } }).error.message).toContain('a draft');
    const unknown = await pdf(agents.planner, `${released}/shift-sheets.pdf?week=${FIRST_WEEK}&workCenter=NOPE`);
    expect(unknown.status).toBe(400);
    expect((unknown.body as { error: { fields: { path: string }[] } }).error.fields[0].path).toBe('query.workCenter');
    const paper = await pdf(agents.planner, `${released}/shift-sheets.pdf?paper=a3`);
    expect(paper.status).toBe(400);
  });
});
