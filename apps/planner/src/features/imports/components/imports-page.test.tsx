import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { ImportPreview } from '@millrace/contracts';
import { json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const mapping = { product: 'product', weekStart: 'week', type: 'type', orderRef: null, qty: 'qty', unit: null };
const preview = (bad: boolean): ImportPreview => ({
  kind: 'demand',
  fileName: 'demand.csv',
  format: 'csv',
  sheets: [],
  sheet: null,
  delimiter: ',',
  headerRow: 1,
  columns: ['product', 'week', 'type', 'qty'],
  mapping,
  mappingSource: 'suggested',
  suggestedMapping: mapping,
  rows: [
    { rowNumber: 2, values: { product: 'T-1', weekStart: '2026-12-14', type: 'forecast', qty: '11' }, errors: [], outcome: 'update' },
    bad
      ? { rowNumber: 3, values: { product: 'NOPE', weekStart: '2026-12-14', type: 'forecast', qty: '4' }, errors: [{ field: 'product', message: 'There is no product with the code NOPE.' }], outcome: 'error' }
      : { rowNumber: 3, values: { product: 'T-2', weekStart: '2026-12-14', type: 'forecast', qty: '4' }, errors: [], outcome: 'create' },
  ],
  fileErrors: [],
  counts: { rows: 2, errorRows: bad ? 1 : 0 },
  summary: { created: bad ? 0 : 1, updated: 1, unchanged: 0, removed: 0 },
});

describe('imports page', () => {
  it('when a file has a bad row, then the row and its problem are shown and importing is blocked; a good file imports', async () => {
    const api = mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/imports': () => json([]),
      'POST /api/imports/demand': [() => json(preview(true)), () => json(preview(false))],
      'POST /api/imports/demand/apply': () =>
        json({ run: { id: 1 }, summary: { created: 1, updated: 1, unchanged: 0, removed: 0 } }, { status: 201 }),
    });
    renderApp('/imports?kind=demand');
    const user = userEvent.setup();
    const input = await screen.findByLabelText(/^File \(CSV or XLSX/);
    await user.upload(input, new File(['product,week,type,qty\n'], 'demand.csv', { type: 'text/csv' }));
    await user.click(screen.getByRole('button', { name: 'Check file' }));

    expect(await screen.findByText(/1 of 2 rows have problems/)).toBeInTheDocument();
    expect(screen.getByRole('cell', { name: /product: There is no product with the code NOPE\./ })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Import 2 rows' })).toBeDisabled();

    await user.click(screen.getByRole('button', { name: 'Check file' }));
    expect(await screen.findByText(/Applying would add 1, change 1, leave 0 as they are/)).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Import 2 rows' }));
    expect(await screen.findByText(/Imported: 1 new, 1 changed, 0 unchanged/)).toBeInTheDocument();

    const applied = api.sent('POST', '/api/imports/demand/apply');
    expect(applied).toHaveLength(1);
    // the upload went as multipart with the file, not as JSON
    const init = (globalThis.fetch as unknown as { mock: { calls: [string, RequestInit][] } }).mock.calls.find(([url]) => String(url).endsWith('/apply'))![1];
    expect(init.body).toBeInstanceOf(FormData);
    expect((init.body as FormData).get('file')).toBeInstanceOf(File);
    expect(JSON.parse(String((init.body as FormData).get('mapping')))).toEqual(mapping);
    await waitFor(() => expect(api.sent('GET', '/api/imports').length).toBeGreaterThan(1));
  });

  it('when a kind is chosen, then a collapsible panel lists the headers read for it with the other names accepted', async () => {
    mockApi({ 'GET /api/me': () => json(people.planner), 'GET /api/imports': () => json([]) });
    renderApp('/imports?kind=routings');
    const user = userEvent.setup();
    const summary = await screen.findByText('Columns we read');
    const table = screen.getByRole('table', { name: 'Columns read from a routings file', hidden: true });
    expect(table).not.toBeVisible();
    await user.click(summary);
    expect(table).toBeVisible();
    // run time per unit and setup time are the usual routing columns (common practice, no source)
    expect(screen.getByRole('row', { name: /hours per unit Required run hours, run time/ })).toBeInTheDocument();
    expect(screen.getByRole('row', { name: /setup hours Optional setup, setup time/ })).toBeInTheDocument();
    // another kind lists its own fields, with the allowed values of a choice
    await user.selectOptions(screen.getByRole('combobox', { name: 'What the file holds' }), 'demand');
    expect(await screen.findByRole('row', { name: /type Optional .* one of firm, forecast/ })).toBeInTheDocument();
  });

  it('when a supervisor opens imports, then it is not part of their role', async () => {
    mockApi({ 'GET /api/me': () => json(people.supervisor) });
    renderApp('/imports');
    expect(await screen.findByRole('alert')).toHaveTextContent('Not available for your role');
  });
});
