import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { planDetail } from '@/testing/plan-fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

/** Lazily loaded routes can take a few seconds on a busy 2-core machine. */
const firstLoad = { timeout: 5000 };

describe('create a plan version', () => {
  it('when the API answers 422 with planning-data issues, then each issue is listed by its item and nothing is left half-done', async () => {
    const api = mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/scenarios': () => json([]),
      'POST /api/plans': () =>
        apiError(422, 'unprocessable', 'The planning data has 3 issues; fix them and create the plan again.', {
          issues: [
            { item: 'work center SAW', message: 'Work center SAW has no hours in week 2026-12-14.' },
            { item: 'product T-1', message: 'Product T-1 has no routing.' },
            { item: 'horizon', message: 'horizon: 52 weeks asked but demand is known only up to week 13' },
          ],
        }),
    });
    const view = renderApp('/plans/new');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Name', {}, firstLoad), 'Spring peak');
    await user.click(screen.getByRole('button', { name: 'Create plan version' }));

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Not saved');
    expect(alert).toHaveTextContent('The planning data has 3 issues');
    const items = within(alert).getAllByRole('listitem').map((li) => li.textContent);
    // an issue whose message already names its item is not prefixed twice
    expect(items).toEqual([
      'work center SAW: Work center SAW has no hours in week 2026-12-14.',
      'product T-1: Product T-1 has no routing.',
      'horizon: 52 weeks asked but demand is known only up to week 13',
    ]);
    expect(api.sent('POST', '/api/plans')[0].body).toEqual({
      name: 'Spring peak',
      horizonWeeks: 12,
      smoothing: { enabled: false, weight: 1 },
      wholeUnits: true,
    });
    expect(view.location().pathname).toBe('/plans/new');
  });

  it('when the horizon is outside 4–52 weeks, then the field says so and no request is sent', async () => {
    const api = mockApi({ 'GET /api/me': () => json(people.planner), 'GET /api/scenarios': () => json([]) });
    renderApp('/plans/new');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Name', {}, firstLoad), 'Too long');
    const horizon = screen.getByLabelText('Horizon (weeks)');
    await user.clear(horizon);
    await user.type(horizon, '60');
    await user.click(screen.getByRole('button', { name: 'Create plan version' }));
    expect(await screen.findByText('Plan at most 52 weeks.')).toBeInTheDocument();
    expect(horizon).toHaveAttribute('aria-invalid', 'true');
    expect(api.sent('POST', '/api/plans')).toHaveLength(0);
  });

  it('when a scenario and smoothing are chosen and the plan is created, then they are sent and the plan page opens', async () => {
    const api = mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/scenarios': () =>
        json([{ id: 3, name: 'Saturday shift', description: '', overrides: [], version: 1, createdAt: '', updatedAt: '', usedByPlanIds: [], locked: false }]),
      'POST /api/plans': () => json(planDetail({ id: 7, solveStatus: 'not_solved', latestRunId: null, certificate: null }), { status: 201 }),
      'GET /api/plans/7': () => json(planDetail({ id: 7, solveStatus: 'not_solved', latestRunId: null, certificate: null })),
      'GET /api/plans/7/audit': () => json([]),
    });
    const view = renderApp('/plans/new');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Name', {}, firstLoad), 'With Saturday');
    await user.selectOptions(screen.getByLabelText('Scenario'), '3');
    await user.click(screen.getByLabelText('Smooth production from week to week'));
    const weight = screen.getByLabelText('Smoothing weight (per unit² of change)');
    await user.clear(weight);
    await user.type(weight, '2.5');
    await user.click(screen.getByLabelText(/Whole units and batch multiples/));
    await user.click(screen.getByRole('button', { name: 'Create plan version' }));
    await waitFor(() => expect(view.location().pathname).toBe('/plans/7'));
    expect(api.sent('POST', '/api/plans')[0].body).toEqual({
      name: 'With Saturday',
      horizonWeeks: 12,
      scenarioId: 3,
      smoothing: { enabled: true, weight: 2.5 },
      wholeUnits: false,
    });
  });
});
