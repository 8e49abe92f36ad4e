import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SheetJob, SheetPlan, ShiftSheet, ShiftSheetsWeek } from '@millrace/contracts';
import { sheetLabourLawNote } from '@millrace/contracts';
import { people } from '@/testing/fixtures';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

/** Lazily loaded routes can take a few seconds on a busy 2-core machine. */
const firstLoad = { timeout: 5000 };

const job = (over: Partial<SheetJob>): SheetJob => ({
  sequence: 1, product: 'P-1', productName: 'Part one', family: null, operation: 10, quantity: 4, unit: 'pcs',
  setupStart: '2027-01-04T07:00', start: '2027-01-04T07:30', end: '2027-01-04T11:30', setupStartMinute: 420, startMinute: 450, endMinute: 690,
  setupMinutes: 30, overtime: false, continued: false, carriedFromWeek: null, dueWeek: '2027-01-04', orderRefs: ['SO-1'], previousWorkCenter: null,
  nextWorkCenter: 'W2', nextWorkCenterName: 'Second', materials: [{ item: 'M-1', name: 'Board', quantity: 8, unit: 'm2' }], ...over,
});

const sheet = (day: number, jobs: SheetJob[], overtime = 0): ShiftSheet => {
  const date = `2027-01-0${4 + day}`;
  return {
    workCenter: 'W1', workCenterName: 'First', date, weekday: 'monday', shift: 1, shiftStart: `${date}T07:00`, shiftEnd: `${date}T15:00`,
    overtimeEnd: overtime ? `${date}T16:00` : null, shiftStartMinute: day * 1440 + 420, shiftEndMinute: day * 1440 + 900,
    overtimeEndMinute: overtime ? day * 1440 + 960 : null, availableMinutes: 480, overtimeMinutes: overtime, plannedMinutes: 500, jobs,
  };
};

const week: ShiftSheetsWeek = {
  plan: { id: 7, name: 'January', state: 'released', approvedBy: 'Sam Supervisor', approvedAt: '2027-01-01T09:00:00.000Z' },
  plantName: 'Test plant',
  week: { start: '2027-01-04', index: 1 },
  weeks: ['2027-01-04', '2027-01-11', '2027-01-18', '2027-01-25'],
  limits: { maxWeeklyHours: 48, minDailyRestHours: 11, source: 'EU Working Time Directive 2003/88/EC defaults' },
  labourLawNote: sheetLabourLawNote,
  workCenterScope: 'all',
  workCenters: [
    {
      code: 'W1', name: 'First', plannedMinutes: 1000, availableMinutes: 960, overtimeMinutes: 60, overtimeNotPlacedHours: 0,
      openShifts: [0, 1].map((d) => ({ date: `2027-01-0${4 + d}`, weekday: 'monday', shift: 1, startMinute: d * 1440 + 420, endMinute: d * 1440 + 900, overtimeEndMinute: d * 1440 + (d === 1 ? 960 : 900) })),
      days: [
        { date: '2027-01-04', weekday: 'monday', shifts: [sheet(0, [job({})])] },
        { date: '2027-01-05', weekday: 'tuesday', shifts: [sheet(1, [job({ product: 'P-2', productName: 'Part two', overtime: true, setupStart: '2027-01-05T14:00', start: '2027-01-05T14:00', end: '2027-01-05T15:40', setupStartMinute: 2280, startMinute: 2280, endMinute: 2380, setupMinutes: 0 })], 60)] },
      ],
    },
    { code: 'W2', name: 'Second', plannedMinutes: 0, availableMinutes: 480, overtimeMinutes: 0, overtimeNotPlacedHours: 0, openShifts: [], days: [] },
  ],
  cautions: [{ kind: 'weekly_hours', workCenter: 'W1', shift: 1, limit: 48, actual: 52, message: 'First, shift 1, week 1: the crew is planned for 52.0 h, above the 48 h weekly limit. Check local labour law and agreements.', source: 'EU Working Time Directive 2003/88/EC, Art. 6' }],
  unscheduled: [],
  carriedOver: [],
  sheetCount: 2,
};

const plans: SheetPlan[] = [{ id: 7, name: 'January', state: 'released', firstWeek: '2027-01-04', lastWeek: '2027-01-25', approvedBy: 'Sam Supervisor', approvedAt: '2027-01-01T09:00:00.000Z' }];

function sheetsApi(extra: Parameters<typeof mockApi>[0] = {}) {
  return mockApi({
    'GET /api/me': () => json(people.floor_lead),
    'GET /api/shift-sheets/plans': () => json(plans),
    'GET /api/plans/7/shift-sheets': () => json(week),
    ...extra,
  });
}

describe('shift sheets for the floor', () => {
  it('when a floor lead opens the link of the release e-mail, then the week shows as a timeline and lists, overtime marked in words, cautions with the directive, nothing to edit', async () => {
    const api = sheetsApi();
    renderApp('/shift-sheets?plan=7&week=2027-01-04');
    const timeline = await screen.findByRole('figure', { name: 'Timeline of the week starting 2027-01-04' }, firstLoad);
    expect(within(timeline).getByText('P-2').parentElement).toHaveTextContent('P-2 4 OT');
    expect(screen.getByRole('navigation', { name: 'Main' })).toHaveTextContent('Shift sheets');
    expect(screen.getByText('#7 January')).toBeInTheDocument();
    const monday = screen.getByRole('table', { name: /W1, Monday, 4 January 2027, Shift 1, 07:00–15:00/ });
    expect(within(monday).getAllByRole('row')[1]).toHaveTextContent('1P-1 Part oneIssue: 8 m2 M-1104 pcs30 min from 07:0007:3011:30W2 Second');
    const tuesday = screen.getByRole('table', { name: /W1, Tuesday, 5 January 2027/ });
    expect(within(tuesday).getAllByRole('row')[1]).toHaveTextContent('⏱ Overtime');
    expect(screen.getByRole('note', { name: 'Caution: Weekly hours above the limit: W1, shift 1' })).toHaveTextContent('Art. 6');
    expect(screen.getAllByText(/Local labour law, collective agreements and licensed practice take precedence/).length).toBeGreaterThan(0);
    expect(screen.getByText('No work is planned on W2 this week.')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Download PDF (A4)' })).toHaveAttribute('href', '/api/plans/7/shift-sheets.pdf?week=2027-01-04&paper=a4');
    expect(screen.getByRole('link', { name: 'Print W1' })).toHaveAttribute('href', '/print/shift-sheets/7?week=2027-01-04&workCenter=W1');
    expect(screen.queryAllByRole('textbox')).toHaveLength(0);
    expect(screen.queryByText(/does not fit after the last shift/)).toBeNull();
    expect(api.requests.find((r) => r.path === '/api/plans/7/shift-sheets')?.search).toBe('?week=2027-01-04');
  });

  it('when work of an earlier week is carried over, then the list, the timeline and the print view say so in plain words, and the page lists what goes on to next week and what stays open', async () => {
    const carried = job({ carriedFromWeek: '2026-12-28', continued: true, setupMinutes: 0, setupStart: '2027-01-04T07:00', start: '2027-01-04T07:00', setupStartMinute: 420, startMinute: 420, materials: [] });
    const withCarry: ShiftSheetsWeek = {
      ...week,
      workCenters: [{ ...week.workCenters[0], days: [{ date: '2027-01-04', weekday: 'monday', shifts: [sheet(0, [carried])] }] }, week.workCenters[1]],
      carriedOver: [{ workCenter: 'W1', planWeek: '2027-01-04', intoWeek: '2027-01-11', product: 'P-3', operation: 20, quantity: 6, hours: 3, reason: 'no open shift time left in the week' }],
      unscheduled: [{ workCenter: 'W2', planWeek: '2027-01-04', product: 'P-4', operation: 10, quantity: 2, hours: 1.5, reason: "no open shift time left by the end of the plan's last week (week of 2027-01-25)" }],
      sheetCount: 1,
    };
    sheetsApi({ 'GET /api/plans/7/shift-sheets': () => json(withCarry) });
    const view = renderApp('/shift-sheets?plan=7&week=2027-01-04');
    const timeline = await screen.findByRole('figure', { name: 'Timeline of the week starting 2027-01-04' }, firstLoad);
    expect(within(timeline).getByText('P-1').parentElement).toHaveTextContent('P-1 4 CO');
    expect(within(timeline).getByText('P-1').parentElement).toHaveTextContent('carried over from week of 28 Dec');
    const monday = screen.getByRole('table', { name: /W1, Monday, 4 January 2027/ });
    expect(within(monday).getAllByRole('row')[1]).toHaveTextContent('Carried over from week of 28 Dec');
    expect(screen.getByRole('region', { name: /Carried on to the week of 2027-01-11/ })).toHaveTextContent('W1: P-3 operation 20, 6 units (3 h) of the week of 4 Jan — no open shift time left in the week.');
    expect(screen.getByRole('note', { name: /Work still open after the plan’s last week/ })).toHaveTextContent('W2: P-4 operation 10, 2 units (1 h 30 min)');
    view.unmount();
    renderApp('/print/shift-sheets/7?week=2027-01-04&workCenter=W1');
    expect(await screen.findByRole('region', { name: 'Sheet 1 of 1: W1, 2027-01-04, shift 1' }, firstLoad)).toHaveTextContent('Carried over from week of 28 Dec');
  });

  it('when the plan counts on overtime that found no room after the last shift, then the week page and the printed sheets of that work center say so in words, deferring to labour law', async () => {
    // 3.5 h = 3 h 30 min (arithmetic, worked by hand)
    const unplaced: ShiftSheetsWeek = { ...week, workCenters: [{ ...week.workCenters[0], overtimeNotPlacedHours: 3.5 }, week.workCenters[1]] };
    sheetsApi({ 'GET /api/plans/7/shift-sheets': () => json(unplaced) });
    const view = renderApp('/shift-sheets?plan=7&week=2027-01-04');
    const note = await screen.findByRole('note', { name: 'Caution: Overtime not on the sheets: W1 First' }, firstLoad);
    expect(note).toHaveTextContent('The plan counts on 3 h 30 min of overtime at W1 this week that does not fit after the last shift; the supervisor decides where it goes.');
    expect(note).toHaveTextContent('fatigue risk');
    expect(screen.getByRole('region', { name: 'Working time' })).toHaveTextContent('Local labour law, collective agreements and licensed practice take precedence');
    expect(screen.queryByRole('note', { name: /Overtime not on the sheets: W2/ })).toBeNull();
    view.unmount();
    renderApp('/print/shift-sheets/7?week=2027-01-04&workCenter=W1');
    const first = await screen.findByRole('region', { name: 'Sheet 1 of 2: W1, 2027-01-04, shift 1' }, firstLoad);
    expect(first).toHaveTextContent('⚠ Overtime: The plan counts on 3 h 30 min of overtime at W1 this week that does not fit after the last shift; the supervisor decides where it goes.');
    expect(screen.getByRole('region', { name: 'Sheet 2 of 2: W1, 2027-01-05, shift 1' })).toHaveTextContent('3 h 30 min of overtime at W1');
  });

  it('when the plan is not released, then the API’s reason is shown in words', async () => {
    sheetsApi({ 'GET /api/plans/7/shift-sheets': () => apiError(403, 'forbidden', 'Plan version 7 is approved but not yet released; floor leads see the shift sheets of released plan versions only.') });
    renderApp('/shift-sheets?plan=7&week=2027-01-04');
    expect(await screen.findByRole('alert', {}, firstLoad)).toHaveTextContent('floor leads see the shift sheets of released plan versions only');
  });

  it('when the sheets cannot be built, then each item the API names is listed', async () => {
    sheetsApi({
      'GET /api/plans/7/shift-sheets': () =>
        apiError(422, 'unprocessable', 'The shift sheets of plan version 7 cannot be built.', { issues: [{ item: 'routing P-1 step 20', message: 'points at work center W9, which has been deleted' }] }),
    });
    renderApp('/shift-sheets?plan=7&week=2027-01-04');
    expect(await screen.findByText('routing P-1 step 20:', {}, firstLoad)).toBeInTheDocument();
  });

  it('when the print view opens for one work center, then each shift is one sheet with header, blanks and its number, and Print prints', async () => {
    sheetsApi();
    const print = vi.fn();
    vi.stubGlobal('print', print);
    const view = renderApp('/print/shift-sheets/7?week=2027-01-04&workCenter=W1');
    const first = await screen.findByRole('region', { name: 'Sheet 1 of 2: W1, 2027-01-04, shift 1' }, firstLoad);
    expect(view.container.querySelector('[data-print-state]')).toHaveAttribute('data-print-state', 'ready');
    expect(screen.getAllByRole('region', { name: /^Sheet \d of 2/ })).toHaveLength(2);
    expect(first).toHaveTextContent('Test plant');
    expect(first).toHaveTextContent('#7 January (released)');
    expect(first).toHaveTextContent('Sam Supervisor');
    expect(within(first).getByRole('img', { name: 'Done: job 1' })).toBeInTheDocument();
    expect(within(first).getByRole('columnheader', { name: 'Initials' })).toBeInTheDocument();
    // the due week stays on one line of its narrow column, in a short form
    const due = within(first).getByText('due wk of 4 Jan');
    expect(due).toHaveClass('whitespace-nowrap');
    const second = screen.getByRole('region', { name: 'Sheet 2 of 2: W1, 2027-01-05, shift 1' });
    expect(second).toHaveTextContent('OVERTIME');
    expect(second).toHaveTextContent('the crew is planned for 52.0 h');
    await userEvent.setup().click(screen.getByRole('button', { name: 'Print' }));
    await waitFor(() => expect(print).toHaveBeenCalledTimes(1));
  });

  it('when a floor lead has no work centers assigned, then the page says every work center is shown', async () => {
    sheetsApi({ 'GET /api/plans/7/shift-sheets': () => json({ ...week, workCenterScope: 'none_assigned' }) });
    renderApp('/shift-sheets?plan=7&week=2027-01-04');
    expect(await screen.findByText('No work centers assigned: showing all.', {}, firstLoad)).toBeInTheDocument();
    expect(screen.queryByText('Your work centers:')).toBeNull();
  });

  it('when a floor lead has work centers assigned, then the page names them and shows no "showing all" note', async () => {
    const mine = { ...week, workCenterScope: 'assigned' as const, workCenters: week.workCenters.slice(0, 1) };
    sheetsApi({ 'GET /api/plans/7/shift-sheets': () => json(mine) });
    renderApp('/shift-sheets?plan=7&week=2027-01-04');
    expect(await screen.findByText('Your work centers:', {}, firstLoad)).toBeInTheDocument();
    expect(screen.getByText('Your work centers:').parentElement).toHaveTextContent('Your work centers: W1 First');
    expect(screen.queryByText(/No work centers assigned/)).toBeNull();
    expect(screen.getByRole('option', { name: 'All your work centers' })).toBeInTheDocument();
  });

  it('when a planner reads the sheets, then there is no note about assigned work centers', async () => {
    sheetsApi({ 'GET /api/me': () => json(people.planner) });
    renderApp('/shift-sheets?plan=7&week=2027-01-04');
    await screen.findByRole('figure', { name: 'Timeline of the week starting 2027-01-04' }, firstLoad);
    expect(screen.queryByText(/No work centers assigned|Your work centers/)).toBeNull();
  });
});
