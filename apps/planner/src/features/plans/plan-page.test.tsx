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

function pageWith(others: ReturnType<typeof planDetail>[], plan = planDetail({ id: 1, state: 'draft' })) {
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

  it('when whole units are on, then the whole-units margin is the main figure and the LP optimum is named the LP bound', async () => {
    // the rounded plan's margin sits below the LP relaxation's optimum, which bounds it
    // (Winston, Operations Research, ch. 9, from memory: the LP relaxation bounds an integer programme)
    const plan = planDetail({ id: 1, objective: 634_689.9, rounding: { outcome: 'repaired', margin: 633_590.15, lpBound: 634_689.9, gap: 1_099.75, relativeGap: 1_099.75 / 634_689.9 } });
    pageWith([], plan);
    const facts = await screen.findByText('Margin, whole units', { selector: 'dt' }, { timeout: 5000 });
    expect(facts.nextElementSibling).toHaveTextContent('633,590.15 EUR');
    expect(screen.getByText('LP bound', { selector: 'dt' }).nextElementSibling).toHaveTextContent('634,689.90 EUR');
    // the whole-units margin comes first
    const labels = screen.getAllByRole('term').map((t) => t.textContent);
    expect(labels.indexOf('Margin, whole units')).toBeLessThan(labels.indexOf('LP bound'));
  });
});
