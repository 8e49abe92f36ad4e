import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Product } from '@millrace/contracts';
import { json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const base = { unit: 'pcs', price: 1, holdingCostRatePct: 24, safetyStock: 0, batchMultiple: 1, openingStock: 0, latePenalty: 0, active: true, version: 1, createdAt: '', updatedAt: '' };
const products: Product[] = [
  { ...base, id: 1, code: 'A-TOP', name: 'Oak top', kind: 'subassembly', family: 'oak' },
  { ...base, id: 2, code: 'B-TBL', name: 'Oak table', kind: 'finished', family: 'oak' },
  { ...base, id: 3, code: 'C-LEG', name: 'Ash leg', kind: 'subassembly', family: null },
];
const page = { items: products, total: 3, page: 1, pageSize: 5000 };

const bodyCodes = () =>
  within(screen.getByRole('table', { name: 'Products' }))
    .getAllByRole('row')
    .slice(1)
    .map((r) => within(r).getAllByRole('cell')[0].textContent);

describe('products table (view kept in the URL)', () => {
  it('when the address carries search, filter, sort and hidden columns, then the table opens in that view', async () => {
    mockApi({ 'GET /api/me': () => json(people.supervisor), 'GET /api/products': () => json(page) });
    renderApp('/products?q=oak&f.kind=subassembly&sort=-name&hide=family');
    await screen.findByRole('table', { name: 'Products' });
    expect(bodyCodes()).toEqual(['A-TOP']);
    expect(screen.getByText('1 of 3 rows match')).toBeInTheDocument();
    expect(screen.queryByRole('columnheader', { name: /Family/ })).not.toBeInTheDocument();
    expect(screen.getByRole('columnheader', { name: /Name/ })).toHaveAttribute('aria-sort', 'descending');
  });

  it('when there is one product, then the count reads "1 row"', async () => {
    mockApi({ 'GET /api/me': () => json(people.supervisor), 'GET /api/products': () => json({ ...page, items: products.slice(0, 1), total: 1 }) });
    renderApp('/products');
    await screen.findByRole('table', { name: 'Products' });
    expect(screen.getByText('1 row')).toBeInTheDocument();
  });

  it('when the person sorts, filters and hides a column, then the address records it', async () => {
    mockApi({ 'GET /api/me': () => json(people.planner), 'GET /api/products': () => json(page) });
    const view = renderApp('/products');
    const user = userEvent.setup();
    await screen.findByRole('table', { name: 'Products' });
    expect(bodyCodes()).toEqual(['A-TOP', 'B-TBL', 'C-LEG']);

    await user.click(screen.getByRole('button', { name: /^Name/ }));
    await waitFor(() => expect(bodyCodes()).toEqual(['C-LEG', 'B-TBL', 'A-TOP'])); // Ash leg < Oak table < Oak top
    await user.selectOptions(screen.getByRole('combobox', { name: 'Kind' }), 'subassembly');
    await waitFor(() => expect(bodyCodes()).toEqual(['C-LEG', 'A-TOP']));
    await user.type(screen.getByRole('searchbox', { name: 'Search products' }), 'ash');
    await waitFor(() => expect(bodyCodes()).toEqual(['C-LEG']));
    await waitFor(() => expect(new URLSearchParams(view.location().search).get('q')).toBe('ash'));
    await user.click(screen.getByText('Columns'));
    await user.click(screen.getByRole('checkbox', { name: 'Family' }));

    await waitFor(() => expect(new URLSearchParams(view.location().search).get('q')).toBe('ash'));
    const params = new URLSearchParams(view.location().search);
    expect(params.get('sort')).toBe('name');
    expect(params.get('f.kind')).toBe('subassembly');
    expect(params.get('q')).toBe('ash');
    expect(params.get('hide')).toBe('family');
    expect(screen.getByRole('link', { name: 'New product' })).toBeInTheDocument();
  });

  it('when there are no products yet, then an empty state says what they are, with no table', async () => {
    mockApi({ 'GET /api/me': () => json(people.supervisor), 'GET /api/products': () => json({ ...page, items: [], total: 0 }) });
    renderApp('/products');
    expect(await screen.findByText('No products yet')).toBeInTheDocument();
    expect(screen.queryByRole('table')).not.toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'New product' })).not.toBeInTheDocument();
  });
});
