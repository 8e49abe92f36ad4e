import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { ImportPreview } from '@millrace/contracts';
import { json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const mapping = { parent: 'parent', component: 'component', qtyPer: 'qty', unit: null, scrapPct: null };
const workbook = (sheet: string): ImportPreview => ({
  kind: 'bom',
  fileName: 'bom.xlsx',
  format: 'xlsx',
  sheets: ['Notes', 'BOM'],
  sheet,
  delimiter: null,
  headerRow: 1,
  columns: ['parent', 'component', 'qty'],
  mapping,
  mappingSource: 'suggested',
  suggestedMapping: mapping,
  rows: [{ rowNumber: 2, values: { parent: 'T-1', component: 'L-1', qtyPer: '4' }, errors: [], outcome: 'create' }],
  fileErrors: [],
  counts: { rows: 1, errorRows: 0 },
  summary: { created: 1, updated: 0, unchanged: 0, removed: 0 },
});

function sentForm(index: number): FormData {
  const calls = (globalThis.fetch as unknown as { mock: { calls: [string, RequestInit][] } }).mock.calls.filter(([url]) => String(url).endsWith('/api/imports/bom'));
  return calls[index][1].body as FormData;
}

describe('import preview', () => {
  it('when another sheet is chosen, then the file is read again from that sheet; a kept mapping is sent for the kind', async () => {
    const api = mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/imports': () => json([]),
      'GET /api/plans': () => json([]),
      'POST /api/imports/bom': [() => json(workbook('Notes')), () => json(workbook('BOM'))],
      'PUT /api/imports/bom/mapping': () => json({ kind: 'bom', mapping, updatedAt: '2026-12-02T01:00:00.000Z' }),
    });
    renderApp('/imports?kind=bom');
    const user = userEvent.setup();
    await user.upload(await screen.findByLabelText(/^File \(CSV or XLSX/), new File(['x'], 'bom.xlsx'));
    await user.click(screen.getByRole('button', { name: 'Check file' }));

    await user.selectOptions(await screen.findByLabelText('Sheet'), 'BOM');
    await waitFor(() => expect(api.sent('POST', '/api/imports/bom')).toHaveLength(2));
    expect(sentForm(0).get('sheet')).toBeNull();
    expect(sentForm(1).get('sheet')).toBe('BOM');
    expect(sentForm(1).get('mapping')).toBeNull(); // a new sheet starts the mapping over

    await user.click(await screen.findByRole('button', { name: 'Keep this mapping for the next bom file' }));
    expect(await screen.findByText(/Mapping kept/)).toBeInTheDocument();
    expect(api.sent('PUT', '/api/imports/bom/mapping')[0].body).toEqual({ mapping });
  });

  it('when a plan version is solved, then its plan lines and material calls can be downloaded', async () => {
    mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/imports': () => json([]),
      'GET /api/plans': () => json([{ id: 7, name: 'January', solveStatus: 'solved', firstWeek: '2027-01-04', lastWeek: '2027-01-25' }, { id: 8, name: 'Draft', solveStatus: 'not_solved' }]),
    });
    renderApp('/imports');
    const link = await screen.findByRole('link', { name: 'Material calls as XLSX' });
    expect(link).toHaveAttribute('href', '/api/exports/material-calls?format=xlsx&plan=7');
    expect(screen.getByRole('link', { name: 'Plan lines as CSV' })).toHaveAttribute('href', '/api/exports/plan-lines?format=csv&plan=7');
  });
});
