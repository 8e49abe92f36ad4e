import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Scenario } from '@millrace/contracts';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const firstLoad = { timeout: 5000 };

const page = (items: { code: string; name: string }[]) => ({ items: items.map((x, i) => ({ id: i + 1, ...x })), total: items.length, page: 1, pageSize: 5000 });

const scenario: Scenario = {
  id: 4,
  name: 'Saturday on the edge bander',
  description: '',
  overrides: [{ kind: 'extra_shift', workCenter: 'EDGE', fromWeek: '2026-12-07', toWeek: '2026-12-14', extraShiftsPerDay: 1 }],
  version: 3,
  createdAt: '2026-12-01T08:00:00.000Z',
  updatedAt: '2026-12-01T08:00:00.000Z',
  usedByPlanIds: [],
  locked: false,
};

function scenarioApi(role: 'planner' | 'supervisor', extra: Parameters<typeof mockApi>[0] = {}) {
  return mockApi({
    'GET /api/me': () => json(people[role]),
    'GET /api/scenarios/4': () => json(scenario),
    'GET /api/work-centers': () => json(page([{ code: 'EDGE', name: 'Edge bander' }, { code: 'SAW', name: 'Saw' }])),
    'GET /api/materials': () => json(page([{ code: 'OAK', name: 'Oak board' }])),
    'GET /api/products': () => json(page([{ code: 'T-1', name: 'Test table' }])),
    ...extra,
  });
}

describe('scenario editor', () => {
  it('when the planner adds a maintenance closure and saves, then every override is sent with the version read', async () => {
    const api = scenarioApi('planner', { 'PATCH /api/scenarios/4': () => json({ ...scenario, version: 4 }) });
    renderApp('/scenarios/4');
    const user = userEvent.setup();
    await screen.findByRole('heading', { name: 'Scenario: Saturday on the edge bander' }, firstLoad);
    await screen.findByText('1. Extra shift on a work center', {}, firstLoad);
    await user.selectOptions(screen.getByLabelText('Kind of override to add'), 'maintenance');
    await user.click(screen.getByRole('button', { name: 'Add override' }));
    const second = screen.getByText('2. Work center closed for maintenance').closest('li')!;
    await user.selectOptions(within(second).getByLabelText('Work center'), 'SAW');
    // the contract's maintenance override has no hours: the work center is closed for whole weeks
    expect(within(second).queryByRole('textbox', { name: /hours/i })).not.toBeInTheDocument();
    expect(within(second).getByText(/Closed for the whole of each week/)).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Save scenario' }));
    await waitFor(() => expect(api.sent('PATCH', '/api/scenarios/4')).toHaveLength(1));
    expect(api.sent('PATCH', '/api/scenarios/4')[0].body).toEqual({
      name: 'Saturday on the edge bander',
      description: '',
      version: 3,
      overrides: [
        { kind: 'extra_shift', workCenter: 'EDGE', fromWeek: '2026-12-07', toWeek: '2026-12-14', extraShiftsPerDay: 1 },
        { kind: 'maintenance', workCenter: 'SAW', fromWeek: '2026-12-07', toWeek: '2026-12-14' },
      ],
    });
  });

  it('when the API rejects a field of an override, then the message lands on that field', async () => {
    scenarioApi('planner', {
      'PATCH /api/scenarios/4': () =>
        apiError(400, 'validation_failed', 'One field is not valid.', { fields: [{ path: 'overrides.0.fromWeek', message: '2026-12-08 is not a week start (weeks start on Monday).' }] }),
    });
    renderApp('/scenarios/4');
    const user = userEvent.setup();
    const name = await screen.findByLabelText('Name', {}, firstLoad);
    await user.type(name, ' (draft)');
    await user.click(screen.getByRole('button', { name: 'Save scenario' }));
    const from = await screen.findByLabelText('From week');
    await waitFor(() => expect(from).toHaveAttribute('aria-invalid', 'true'));
    expect(from).toHaveAccessibleDescription(expect.stringContaining('is not a week start'));
  });

  it('when a supervisor opens a scenario, then it is read only', async () => {
    scenarioApi('supervisor');
    renderApp('/scenarios/4');
    await screen.findByText('1. Extra shift on a work center', {}, firstLoad);
    expect(screen.getByRole('note')).toHaveTextContent('Read only: only planners can change this.');
    expect(screen.queryByRole('button', { name: 'Save scenario' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Add override' })).not.toBeInTheDocument();
    expect(screen.getByLabelText('Extra shifts a day')).toBeDisabled();
  });
});
