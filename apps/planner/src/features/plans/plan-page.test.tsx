import { screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { planDetail, runProgress } from '@/testing/plan-fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const summary = ({ certificate, solveMessage, checkViolations, rounding, infeasibility, resultsHash, modelSize, ...rest }: ReturnType<typeof planDetail>) => {
  void certificate, solveMessage, checkViolations, rounding, infeasibility, resultsHash, modelSize;
  return rest;
};

function pageWith(others: ReturnType<typeof planDetail>[]) {
  const plan = planDetail({ id: 1, state: 'draft' });
  mockApi({
    'GET /api/me': () => json(people.planner),
    'GET /api/plans': () => json([plan, ...others].map(summary)),
    'GET /api/plans/1': () => json(plan),
    'GET /api/plans/1/audit': () => json([]),
    'GET /api/plans/1/runs/5': () => json(runProgress({ state: 'finished', finishedAt: '2026-12-02T08:00:09.000Z' })),
  });
  renderApp('/plans/1');
}

describe('plan version page', () => {
  it('when no version has been approved yet, then it says so instead of offering changes since the last approved', async () => {
    pageWith([planDetail({ id: 2, name: 'Other draft', state: 'draft' })]);
    expect(await screen.findByText('No approved version yet', {}, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Changes since last approved' })).toBeNull();
  });

  it('when another version was approved and released, then the page links to the changes since it', async () => {
    pageWith([planDetail({ id: 2, name: 'Last week', state: 'released' })]);
    expect(await screen.findByRole('link', { name: 'Changes since last approved' }, { timeout: 5000 })).toHaveAttribute('href', '/plans/1/review');
    expect(screen.queryByText('No approved version yet')).toBeNull();
  });
});
