import { screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { planDetail } from '@/testing/plan-fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const summary = ({ certificate, solveMessage, checkViolations, rounding, infeasibility, resultsHash, modelSize, ...rest }: ReturnType<typeof planDetail>) => {
  void certificate, solveMessage, checkViolations, rounding, infeasibility, resultsHash, modelSize;
  return rest;
};

describe('plan versions list', () => {
  it('when the state filter is in the address, then only plans in that state are listed, each with its certificate status', async () => {
    const submitted = planDetail({ id: 2, name: 'Up for review', state: 'submitted' });
    const draft = planDetail({ id: 3, name: 'Still a draft', state: 'draft', solveStatus: 'not_solved', objective: null, certificate: null, latestRunId: null });
    const api = mockApi({
      'GET /api/me': () => json(people.supervisor),
      'GET /api/plans': () => json([summary(draft), summary(submitted)]),
      'GET /api/plans/2': () => json(submitted),
    });
    renderApp('/plans?f.state=submitted');
    const table = await screen.findByRole('table', { name: 'Plan versions' }, { timeout: 5000 });
    const row = await within(table).findByRole('row', { name: /#2 Up for review/ });
    expect(within(table).queryByRole('row', { name: /#3 Still a draft/ })).toBeNull();
    expect(screen.getByRole('combobox', { name: 'State' })).toHaveValue('submitted');
    expect(await within(row).findByText('✓ Verified by a second solver')).toBeInTheDocument();
    expect(row).toHaveTextContent('1,000.00 EUR');
    // Only solved versions are read for their certificate.
    expect(api.sent('GET', '/api/plans/3')).toHaveLength(0);
    // Supervisors do not create plans.
    expect(screen.queryByRole('link', { name: 'New plan version' })).toBeNull();
  });

  it('when a version was rounded to whole units, then its row shows the whole-units margin first and the LP bound beside it, each named', async () => {
    // 1,100 LP bound and 1,090 whole-units margin: a rounded plan cannot beat its LP relaxation
    // (Winston, Operations Research, ch. 9, from memory: the LP relaxation bounds an integer programme).
    const rounded = planDetail({ id: 4, name: 'Rounded', objective: 1100, rounding: { outcome: 'repaired', margin: 1090, lpBound: 1100, gap: 10, relativeGap: 10 / 1100 } });
    const fractional = planDetail({ id: 5, name: 'Fractional', wholeUnits: false, objective: 1200 });
    mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/plans': () => json([summary(rounded), summary(fractional)]),
      'GET /api/plans/4': () => json(rounded),
      'GET /api/plans/5': () => json(fractional),
    });
    renderApp('/plans');
    const table = await screen.findByRole('table', { name: 'Plan versions' }, { timeout: 5000 });
    const row = await within(table).findByRole('row', { name: /#4 Rounded/ });
    await within(row).findByText('1,090.00 EUR');
    expect(row).toHaveTextContent('Margin, whole units; LP bound 1,100.00 EUR');
    expect(within(table).getByRole('row', { name: /#5 Fractional/ })).toHaveTextContent('1,200.00 EURMargin (LP optimum, fractional units)');
    expect(within(table).getByRole('columnheader', { name: /^Margin/ })).toBeInTheDocument();
  });
});
