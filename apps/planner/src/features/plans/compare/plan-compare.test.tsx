import { screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { PlanComparison } from '@millrace/contracts';
import { json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { planDetail } from '@/testing/plan-fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const pair = (a: number, b: number) => ({ a, b, delta: b - a });

function comparison(): PlanComparison {
  const { certificate, solveMessage, checkViolations, rounding, infeasibility, resultsHash, modelSize, ...a } = planDetail({ id: 1, name: 'Base' });
  void certificate, solveMessage, checkViolations, rounding, infeasibility, resultsHash, modelSize;
  const b = { ...a, id: 2, name: 'Saturday shift' };
  return {
    a,
    b,
    margin: pair(1000, 1100),
    revenue: pair(2000, 2100),
    materialSpend: pair(500, 500),
    overtimeCost: pair(300, 0),
    overtimeHours: pair(6, 0),
    holdingCost: pair(10, 10),
    latePenalties: pair(200, 100),
    unmetOrderCount: pair(2, 1),
    unmetQty: pair(4, 2),
    loadByWorkCenter: [
      { workCenter: 'EDGE', workCenterName: 'Edge bander', loadHours: pair(46, 52), overtimeHours: pair(6, 0), peakPercent: { a: 115, b: 87 }, bindingWeeks: { a: [2], b: [] } },
      { workCenter: 'SAW', workCenterName: 'Saw', loadHours: pair(60, 60), overtimeHours: pair(0, 0), peakPercent: { a: 100, b: 100 }, bindingWeeks: { a: [], b: [] } },
    ],
    unmetOrders: [{ orderRef: 'SO-1', product: 'T-1', week: 2, shortA: 4, shortB: 2 }],
    unmet: { a: [], b: [] },
    quantityDifferences: [{ product: 'T-1', week: 2, makeA: 8, makeB: 10, shipA: 8, shipB: 10, lateA: 4, lateB: 2 }],
  };
}

describe('comparison of two plan versions', () => {
  it('when two versions are compared, then every difference is signed and marked, and unchanged figures say ±0', async () => {
    mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/plans': () => json([]),
      'GET /api/plans/compare': () => json(comparison()),
    });
    renderApp('/plans/compare?a=1&b=2');
    const totals = await screen.findByRole('table', { name: 'Totals' }, { timeout: 5000 });
    // both versions are rounded to whole units, so the margins compared are the whole-units ones
    expect(within(totals).getByRole('row', { name: /^Margin, whole units/ })).toHaveTextContent('1,000.00 EUR1,100.00 EUR▲ +100');
    expect(within(totals).getByRole('row', { name: /^Overtime hours/ })).toHaveTextContent('▼ −6');
    expect(within(totals).getByRole('row', { name: /^Material spend/ })).toHaveTextContent('±0');
    const load = screen.getByRole('table', { name: 'Load per work center over the horizon' });
    expect(within(load).getByRole('row', { name: /EDGE Edge bander \(changed\)/ })).toHaveTextContent('▲ +6');
    expect(within(load).getByRole('row', { name: /SAW Saw/ })).not.toHaveTextContent('changed');
    expect(within(screen.getByRole('table', { name: 'Shortfall per firm order in A and B' }) ).getByRole('row', { name: /SO-1/ })).toHaveTextContent('42▼ −2');
    expect(within(screen.getByRole('table', { name: /Make, ship and late quantities/ })).getByRole('row', { name: /T-1/ })).toHaveTextContent('810▲ +2');
  });

  it('when figures have long fractions, then money keeps its cents, hours one decimal and peaks whole percents', async () => {
    // Money to the cent, hours to a tenth, load in whole percent: common practice, no source.
    const c = comparison();
    c.materialSpend = pair(23891.79, 24174.89);
    c.loadByWorkCenter = [
      { workCenter: 'ASM', workCenterName: 'Assembly', loadHours: pair(793.16, 794.2), overtimeHours: pair(2.27, 1.22), peakPercent: { a: 101.64, b: 101.53 }, bindingWeeks: { a: [2], b: [2] } },
    ];
    mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/plans': () => json([]),
      'GET /api/plans/compare': () => json(c),
    });
    renderApp('/plans/compare?a=1&b=2');
    const totals = await screen.findByRole('table', { name: 'Totals' }, { timeout: 5000 });
    expect(within(totals).getByRole('row', { name: /^Material spend/ })).toHaveTextContent('23,891.79 EUR24,174.89 EUR▲ +283.10');
    const row = within(screen.getByRole('table', { name: 'Load per work center over the horizon' })).getByRole('row', { name: /ASM Assembly/ });
    expect(row).toHaveTextContent('793.2794.2▲ +1');
    expect(row).toHaveTextContent('2.31.2▼ −1.1');
    expect(row).toHaveTextContent('102 %102 %');
  });
});
