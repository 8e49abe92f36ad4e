import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { PlanLine } from '@millrace/contracts';
import { testLoad } from '@/testing/plan-fixtures';
import { LoadChart } from './load-chart';
import { StockChart } from './stock-chart';

const line = (product: string, productName: string, week: number, stock: number, late: number): PlanLine => ({
  product,
  productName,
  week,
  weekStart: `2026-12-0${week}`,
  demand: 10,
  make: 10,
  ship: 10,
  stock,
  late,
});

describe('results charts', () => {
  it('when the work center is changed, then the chart and its table show that work center, regular hours being load minus overtime', async () => {
    render(<LoadChart load={testLoad} />);
    const picker = screen.getByRole('combobox', { name: 'Work center' });
    expect(within(picker).getAllByRole('option').map((o) => o.textContent)).toEqual(['EDGE Edge bander', 'SAW Saw']);
    // Week 2 of the edge bander: 46 h loaded of which 6 h overtime → 40 h regular (arithmetic).
    const edge = screen.getByRole('table', { name: 'Load of Edge bander per week' });
    expect(within(edge).getAllByRole('row')[2]).toHaveTextContent(/^W2\s*40\s*6\s*40$/);
    await userEvent.setup().selectOptions(picker, 'SAW');
    expect(screen.getByText('Load against available hours: Saw')).toBeInTheDocument();
    expect(screen.getByRole('table', { name: 'Load of Saw per week' })).toBeInTheDocument();
  });

  it('when a product is late somewhere, then the stock chart opens on it and the picker switches to another', async () => {
    const lines = [line('A-1', 'Alpha', 1, 5, 0), line('B-2', 'Beta', 1, 0, 3), line('B-2', 'Beta', 2, 0, 0)];
    render(<StockChart lines={lines} />);
    const picker = screen.getByRole('combobox', { name: 'Product' });
    expect(picker).toHaveValue('B-2');
    expect(screen.getByRole('table', { name: 'Stock and backorder of Beta per week' })).toBeInTheDocument();
    await userEvent.setup().selectOptions(picker, 'A-1');
    expect(screen.getByText('Stock and backorder: Alpha')).toBeInTheDocument();
  });
});
