import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { planDetail, runProgress } from '@/testing/plan-fixtures';
import { renderApp } from '@/testing/render-app';
import { runPercent } from './run-progress';

afterEach(() => vi.unstubAllGlobals());

/** Lazily loaded routes can take a few seconds on a busy 2-core machine. */
const firstLoad = { timeout: 5000 };

const solving = planDetail({ solveStatus: 'solving', objective: null, certificate: null });

describe('solve progress bar', () => {
  it('when a run goes from queued through running to finished, then the bar follows it by polling and ends at 100 %', async () => {
    mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/plans/1': [() => json(solving), () => json(solving), () => json(planDetail())],
      'GET /api/plans/1/audit': () => json([]),
      'GET /api/plans/1/runs/5': [
        () => json(runProgress({ state: 'queued', iteration: 0, relativeGap: null, elapsedSeconds: 0 })),
        () => json(runProgress({ state: 'queued', iteration: 0, relativeGap: null, elapsedSeconds: 0 })),
        () => json(runProgress({ iteration: 3, relativeGap: 1e-2 })),
        () => json(runProgress({ iteration: 11, relativeGap: 1e-6, elapsedSeconds: 3.25 })),
        () => json(runProgress({ state: 'finished', iteration: 14, relativeGap: 1e-10, elapsedSeconds: 4, finishedAt: '2026-12-02T08:00:05.000Z' })),
      ],
    });
    renderApp('/plans/1');
    const bar = await screen.findByRole('progressbar', { name: 'Solve progress' }, firstLoad);
    await waitFor(() => expect(bar).toHaveAttribute('aria-valuenow', '0'), { timeout: 4000 });
    expect(bar).toHaveAttribute('aria-valuetext', expect.stringMatching(/^Waiting for a solver, 0 %/));
    // gap 1e-2 closes 2 of the 8 orders of magnitude to the 1e-8 target: 25 %
    await waitFor(() => expect(bar).toHaveAttribute('aria-valuenow', '25'), { timeout: 4000 });
    expect(bar).toHaveAttribute('aria-valuetext', 'Solving, 25 %. Iteration 3 · gap 1.0e-2 · 1.5 s elapsed');
    await waitFor(() => expect(bar).toHaveAttribute('aria-valuenow', '75'), { timeout: 4000 });
    expect(screen.getByText('Iteration 11 · gap 1.0e-6 · 3.25 s elapsed')).toBeInTheDocument();
    await waitFor(() => expect(bar).toHaveAttribute('aria-valuenow', '100'), { timeout: 4000 });
    expect(bar).toHaveAttribute('aria-valuetext', expect.stringMatching(/^Finished, 100 %\. Iteration 14/));
    // The run ended: the plan is read again and shows its outcome.
    expect(await screen.findByText('Solved and checked', { selector: 'p' }, firstLoad)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Cancel solve' })).not.toBeInTheDocument();
  });

  it('when the planner cancels a running solve, then the cancel request is sent and the bar says it was cancelled', async () => {
    const api = mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/plans/1': () => json(solving),
      'GET /api/plans/1/audit': () => json([]),
      'GET /api/plans/1/runs/5': [() => json(runProgress()), () => json(runProgress({ state: 'cancelled', message: 'Cancelled by Pat Planner.' }))],
      'POST /api/plans/1/runs/5/cancel': () => json(runProgress({ cancelRequested: true }), { status: 202 }),
    });
    renderApp('/plans/1');
    const cancel = await screen.findByRole('button', { name: 'Cancel solve' }, firstLoad);
    await userEvent.setup().click(cancel);
    await waitFor(() => expect(api.sent('POST', '/api/plans/1/runs/5/cancel')).toHaveLength(1));
    const bar = screen.getByRole('progressbar', { name: 'Solve progress' });
    await waitFor(() => expect(bar).toHaveAttribute('aria-valuetext', expect.stringMatching(/^Cancelled/)), { timeout: 4000 });
    expect(screen.getByText('Cancelled by Pat Planner.')).toBeInTheDocument();
  });

  it('when a supervisor watches a run, then there is no cancel button (only planners may cancel)', async () => {
    mockApi({
      'GET /api/me': () => json(people.supervisor),
      'GET /api/plans/1': () => json(solving),
      'GET /api/plans/1/audit': () => json([]),
      'GET /api/plans/1/runs/5': () => json(runProgress()),
    });
    renderApp('/plans/1');
    await screen.findByRole('progressbar', { name: 'Solve progress' }, firstLoad);
    expect(screen.queryByRole('button', { name: 'Cancel solve' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Solve/ })).not.toBeInTheDocument();
  });

  it('when the gap is unknown while running, then the bar has no value (indeterminate) rather than a made-up one', () => {
    expect(runPercent(runProgress({ relativeGap: null }))).toBeNull();
    expect(runPercent(runProgress({ relativeGap: 1e-12 }))).toBe(99);
    expect(runPercent(runProgress({ relativeGap: 5 }))).toBe(0);
  });
});
