import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Person, WorkCenter } from '@millrace/contracts';
import { apiError, json, mockApi, type Handler } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

/** Lazily loaded routes can take a few seconds on a busy 2-core machine. */
const firstLoad = { timeout: 5000 };

const stamp = '2026-12-01T08:00:00.000Z';
const person = (over: Partial<Person>): Person => ({ id: 1, email: 'x@example.test', name: 'X', role: 'planner', active: true, version: 3, createdAt: stamp, updatedAt: stamp, workCenterIds: [], ...over });
const lead = person({ id: 4, email: 'flo@example.test', name: 'Flo Lead', role: 'floor_lead', workCenterIds: [12] });
const planner = person({ id: 2, email: 'pat@example.test', name: 'Pat Planner', role: 'planner' });

const workCenter = (id: number, code: string, name: string): WorkCenter => ({
  id, code, name, efficiency: 1, overtimeCapHoursPerWeek: null, overtimeCostPerHour: 0,
  shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] }, version: 1, createdAt: stamp, updatedAt: stamp,
});
// by code, as the API lists them
const centers = [workCenter(13, 'ASM', 'Assembly'), workCenter(12, 'CNC', 'CNC router'), workCenter(11, 'SAW', 'Panel saw')];

function peopleApi(list: Person[], patch: Handler = (r) => json({ ...lead, ...(r.body as object), version: lead.version + 1 })) {
  return mockApi({
    'GET /api/me': () => json(people.admin),
    'GET /api/people': () => json(list),
    'GET /api/work-centers': () => json({ items: centers, total: centers.length, page: 1, pageSize: 5000 }),
    [`PATCH /api/people/${lead.id}`]: patch,
  });
}

async function openPicker() {
  const user = userEvent.setup();
  const summary = await screen.findByLabelText('Work centers of Flo Lead: CNC', {}, firstLoad);
  await user.click(summary);
  const group = within(await screen.findByRole('group', { name: 'Work centers of Flo Lead' }));
  return { user, group };
}

describe('work centers of floor leads (People, admin)', () => {
  it('when the admin ticks another work center and saves, then the whole list goes out with the version read and the page says what they now see', async () => {
    const api = peopleApi([lead, planner]);
    renderApp('/people');
    const { user, group } = await openPicker();
    expect(group.getByRole('checkbox', { name: 'CNC CNC router' })).toBeChecked();
    expect(group.getByRole('checkbox', { name: 'SAW Panel saw' })).not.toBeChecked();
    expect(group.getByRole('button', { name: 'Save work centers' })).toBeDisabled();
    await user.click(group.getByRole('checkbox', { name: 'SAW Panel saw' }));
    await user.click(group.getByRole('button', { name: 'Save work centers' }));
    expect(await screen.findByText('Flo Lead now sees the shift sheets of CNC, SAW.')).toBeInTheDocument();
    expect(api.sent('PATCH', `/api/people/${lead.id}`).map((r) => r.body)).toEqual([{ workCenterIds: [12, 11], version: lead.version }]);
  });

  it('when the admin unticks every work center, then [] is sent and the page says the lead sees all of them', async () => {
    const api = peopleApi([lead]);
    renderApp('/people');
    const { user, group } = await openPicker();
    await user.click(group.getByRole('checkbox', { name: 'CNC CNC router' }));
    await user.click(group.getByRole('button', { name: 'Save work centers' }));
    expect(await screen.findByText('Flo Lead has no work centers now and sees the sheets of all of them.')).toBeInTheDocument();
    expect(api.sent('PATCH', `/api/people/${lead.id}`)[0].body).toEqual({ workCenterIds: [], version: lead.version });
  });

  it('when the API refuses a work center (400 naming it), then its message is shown and the list reloads', async () => {
    const api = peopleApi([lead], () =>
      apiError(400, 'validation_failed', 'There is no work center with id 11; flo@example.test was not changed.', { fields: [{ path: 'workCenterIds.1', message: 'There is no work center with id 11.' }] }),
    );
    renderApp('/people');
    const { user, group } = await openPicker();
    await user.click(group.getByRole('checkbox', { name: 'SAW Panel saw' }));
    await user.click(group.getByRole('button', { name: 'Save work centers' }));
    expect(await screen.findByText(/Flo Lead was not changed: There is no work center with id 11/)).toBeInTheDocument();
    expect(api.sent('GET', '/api/people').length).toBeGreaterThan(1);
  });

  it('when a person is not a floor lead, then there is nothing to pick and a lead without work centers reads "sees all"', async () => {
    peopleApi([planner, { ...lead, workCenterIds: [] }]);
    renderApp('/people');
    expect(await screen.findByLabelText('Work centers of Flo Lead: None: sees all', {}, firstLoad)).toBeInTheDocument();
    const row = screen.getByRole('row', { name: /Pat Planner/ });
    expect(within(row).queryByRole('group')).toBeNull();
    expect(within(row).queryByText(/None: sees all/)).toBeNull();
    expect(within(row).getByText('—')).toBeInTheDocument();
  });

  it('when nobody on the page is a floor lead or has work centers, then the work centers are not even loaded', async () => {
    const api = peopleApi([planner]);
    renderApp('/people');
    await screen.findByRole('row', { name: /Pat Planner/ }, firstLoad);
    expect(api.sent('GET', '/api/work-centers')).toHaveLength(0);
  });
});
