import { fireEvent, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { DemandGrid } from '@millrace/contracts';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const weeks = ['2026-12-07', '2026-12-14', '2026-12-21'];
const empty = (weekStart: string) => ({ weekStart, firmQty: 0, firmOrders: [], forecastQty: 0, forecastVersion: null });

/** Two products × three weeks; T-1 has one firm order in week 1, a forecast in week 2 and two orders (B-1, B-2) in week 3. */
const grid: DemandGrid = {
  weeks,
  rows: [
    {
      productId: 1,
      productCode: 'T-1',
      productName: 'Test table',
      unit: 'pcs',
      kind: 'finished',
      cells: [
        { weekStart: weeks[0], firmQty: 10, firmOrders: [{ id: 11, orderRef: 'A-1', qty: 10, mustShip: false, version: 2 }], forecastQty: 0, forecastVersion: null },
        { weekStart: weeks[1], firmQty: 0, firmOrders: [], forecastQty: 4, forecastVersion: 3 },
        {
          weekStart: weeks[2],
          firmQty: 5,
          firmOrders: [
            { id: 21, orderRef: 'B-1', qty: 2, mustShip: true, version: 1 },
            { id: 22, orderRef: 'B-2', qty: 3, mustShip: false, version: 6 },
          ],
          forecastQty: 0,
          forecastVersion: null,
        },
      ],
    },
    { productId: 2, productCode: 'C-1', productName: 'Test chair', unit: 'pcs', kind: 'finished', cells: weeks.map(empty) },
  ],
  weekTotals: weeks.map((w, i) => ({ weekStart: w, firmQty: [10, 0, 5][i], forecastQty: i === 1 ? 4 : 0 })),
  total: 2,
  page: 1,
  pageSize: 5000,
};

const cell = (name: RegExp) => screen.getByRole('gridcell', { name });
/** Focus moves after the browser's next frame (the grid may scroll first); allow for a busy machine. */
const expectFocusOn = (name: RegExp) => waitFor(() => expect(cell(name)).toHaveFocus(), { timeout: 4000 });

async function openGrid(role: 'planner' | 'supervisor' = 'planner') {
  const api = mockApi({ 'GET /api/me': () => json(people[role]), 'GET /api/demand': () => json(grid) });
  renderApp('/demand');
  await screen.findByRole('grid', { name: 'Demand per product and week' });
  return { api, user: userEvent.setup() };
}

describe('demand grid', () => {
  it('when arrow keys, Tab and Shift+Tab are pressed, then the focus moves cell by cell', async () => {
    const { user } = await openGrid();
    await user.click(cell(/^T-1 firm, week of 7 Dec 2026/));
    expect(cell(/^T-1 firm, week of 7 Dec 2026/)).toHaveFocus();

    await user.keyboard('{ArrowRight}');
    await expectFocusOn(/^T-1 firm, week of 14 Dec 2026/);
    await user.keyboard('{ArrowDown}');
    await expectFocusOn(/^T-1 forecast, week of 14 Dec 2026: 4/);
    await user.keyboard('{ArrowDown}');
    await expectFocusOn(/^C-1 firm, week of 14 Dec 2026/);
    await user.keyboard('{ArrowLeft}');
    await expectFocusOn(/^C-1 firm, week of 7 Dec 2026/);
    await user.keyboard('{Tab}{Tab}{Tab}');
    // past the last week Tab wraps to the first week of the next line
    await expectFocusOn(/^C-1 forecast, week of 7 Dec 2026/);
    await user.keyboard('{Shift>}{Tab}{/Shift}');
    await expectFocusOn(/^C-1 firm, week of 21 Dec 2026/);
  });

  it('when a number is typed and Enter pressed, then the cell changes, focus moves down and the week total follows', async () => {
    const { user } = await openGrid();
    await user.click(cell(/^T-1 forecast, week of 14 Dec 2026/));
    await user.keyboard('12{Enter}');

    expect(cell(/^T-1 forecast, week of 14 Dec 2026: 12, changed/)).toBeInTheDocument();
    await expectFocusOn(/^C-1 firm, week of 14 Dec 2026/);
    expect(cell(/^Forecast total, week of 14 Dec 2026: 12$/)).toBeInTheDocument();
    expect(screen.getByText('• 1 unsaved change')).toBeInTheDocument();
  });

  it('when a spreadsheet block is pasted, then it fills cells from the active one and the totals add up', async () => {
    const { user } = await openGrid();
    await user.click(cell(/^T-1 forecast, week of 7 Dec 2026/));
    // two lines × three columns, tab-separated, as spreadsheet programs copy them
    fireEvent.paste(cell(/^T-1 forecast, week of 7 Dec 2026/), {
      clipboardData: { getData: () => '5\t6\t7\r\n1,250\t\t2\r\n' },
    });

    expect(cell(/^T-1 forecast, week of 7 Dec 2026: 5, changed/)).toBeInTheDocument();
    expect(cell(/^T-1 forecast, week of 14 Dec 2026: 6, changed/)).toBeInTheDocument();
    expect(cell(/^T-1 forecast, week of 21 Dec 2026: 7, changed/)).toBeInTheDocument();
    expect(cell(/^C-1 firm, week of 7 Dec 2026: 1,250, changed/)).toBeInTheDocument();
    expect(cell(/^C-1 firm, week of 14 Dec 2026: 0$/)).toBeInTheDocument(); // empty pasted cell leaves it as it was
    expect(cell(/^C-1 firm, week of 21 Dec 2026: 2, changed/)).toBeInTheDocument();
    // firm totals: 10 (order A-1) + 1250 in week 1; forecast totals 5, 6, 7
    expect(cell(/^Firm total, week of 7 Dec 2026: 1,260$/)).toBeInTheDocument();
    expect(cell(/^Forecast total, week of 14 Dec 2026: 6$/)).toBeInTheDocument();
    expect(screen.getByText(/Pasted 5 cells/)).toBeInTheDocument();
  });

  it('when a pasted block holds text that is not a quantity, then nothing is pasted and the bad cell is named', async () => {
    const { user } = await openGrid();
    await user.click(cell(/^T-1 forecast, week of 7 Dec 2026/));
    fireEvent.paste(cell(/^T-1 forecast, week of 7 Dec 2026/), { clipboardData: { getData: () => '5\tten\n' } });
    expect(await screen.findByText(/Nothing was pasted\. Row 1, column 2: “ten” is not a quantity/)).toBeInTheDocument();
    expect(cell(/^T-1 forecast, week of 7 Dec 2026: 0$/)).toBeInTheDocument();
  });

  it('when changes are saved, then one PUT carries every change with the version read, and new firm orders get the reference', async () => {
    const { api, user } = await openGrid();
    api.on('PUT /api/demand', () => json({ created: 1, updated: 2, deleted: 0, unchanged: 0 }));
    await user.click(cell(/^T-1 firm, week of 7 Dec 2026/));
    await user.keyboard('8{Tab}');
    await user.keyboard('3{Enter}'); // T-1 firm week 2: no order yet → needs the reference
    await user.click(cell(/^T-1 forecast, week of 14 Dec 2026/));
    await user.keyboard('9{Enter}');

    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(await screen.findByText(/Enter the customer order reference for new firm quantities/)).toBeInTheDocument();
    expect(api.sent('PUT', '/api/demand')).toHaveLength(0);

    await user.type(screen.getByRole('textbox', { name: 'Order reference for new firm quantities' }), 'PO-77');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(await screen.findByText(/Saved in one go: 1 new, 2 changed, 0 removed/)).toBeInTheDocument();

    const puts = api.sent('PUT', '/api/demand');
    expect(puts).toHaveLength(1);
    expect(puts[0].body).toEqual({
      changes: [
        { kind: 'firm', productId: 1, weekStart: '2026-12-07', orderRef: 'A-1', qty: 8, version: 2 },
        { kind: 'firm', productId: 1, weekStart: '2026-12-14', orderRef: 'PO-77', qty: 3, version: null },
        { kind: 'forecast', productId: 1, weekStart: '2026-12-14', qty: 9, version: 3 },
      ],
    });
  });

  it('when someone else changed a cell (409), then nothing is saved, the cell is marked and the edits can be kept on reload', async () => {
    const { api, user } = await openGrid();
    api.on('PUT /api/demand', () =>
      apiError(409, 'conflict', 'Someone else changed the forecast of T-1 for 14 Dec since you opened it.', {
        fields: [{ path: 'changes.0', message: 'Someone else changed the forecast of T-1 for 14 Dec since you opened it.' }],
      }),
    );
    await user.click(cell(/^T-1 forecast, week of 14 Dec 2026/));
    await user.keyboard('9{Enter}');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('Changed by someone else — nothing was saved');
    expect(cell(/^T-1 forecast, week of 14 Dec 2026: 9, changed, problem: Someone else changed/)).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Reload, keep my changes' }));
    await waitFor(() => expect(screen.queryByRole('alert')).not.toBeInTheDocument());
    expect(cell(/^T-1 forecast, week of 14 Dec 2026: 9, changed$/)).toBeInTheDocument();
    expect(api.sent('GET', '/api/demand')).toHaveLength(2);
  });

  it('when a week holds several firm orders, then typing is refused in the grid and each order is changed in the list below', async () => {
    const { api, user } = await openGrid();
    api.on('PUT /api/demand', () => json({ created: 0, updated: 1, deleted: 0, unchanged: 0 }));
    await user.click(cell(/^T-1 firm, week of 21 Dec 2026: 5, 2 orders/));
    await user.keyboard('9');
    expect(screen.getByText(/several firm orders; change each one in the order list below the grid/)).toBeInTheDocument();

    const b2 = screen.getByRole('textbox', { name: 'Quantity of order B-2' });
    await user.clear(b2);
    await user.type(b2, '7{Enter}');
    expect(cell(/^T-1 firm, week of 21 Dec 2026: 9, changed, 2 orders/)).toBeInTheDocument();
    expect(cell(/^Firm total, week of 21 Dec 2026: 9$/)).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    await screen.findByText(/Saved in one go/);
    expect(api.sent('PUT', '/api/demand')[0].body).toEqual({
      changes: [{ kind: 'firm', productId: 1, weekStart: '2026-12-21', orderRef: 'B-2', qty: 7, version: 6 }],
    });
  });

  it('when a planner ticks "must ship" on a firm order, then that order alone is saved with the mark and the version read', async () => {
    const { api, user } = await openGrid();
    api.on('PUT /api/demand', () => json({ created: 0, updated: 1, deleted: 0, unchanged: 0 }));
    await user.click(cell(/^T-1 firm, week of 7 Dec 2026: 10/));
    const box = screen.getByRole('checkbox', { name: 'Order A-1 must ship' });
    expect(box).not.toBeChecked();
    await user.click(box);
    expect(await screen.findByText('Order A-1 must ship complete in its week.')).toBeInTheDocument();
    expect(api.sent('PUT', '/api/demand')[0].body).toEqual({
      changes: [{ kind: 'firm', productId: 1, weekStart: '2026-12-07', orderRef: 'A-1', qty: 10, mustShip: true, version: 2 }],
    });

    await user.click(cell(/^T-1 firm, week of 21 Dec 2026: 5, 2 orders/));
    expect(screen.getByRole('checkbox', { name: 'Order B-1 must ship' })).toBeChecked();
    expect(screen.getByRole('checkbox', { name: 'Order B-2 must ship' })).not.toBeChecked();
  });

  it('when the order\'s quantity has an unsaved edit, then its must-ship mark waits until that is saved', async () => {
    const { user } = await openGrid();
    await user.click(cell(/^T-1 firm, week of 7 Dec 2026: 10/));
    await user.keyboard('12{Enter}');
    await user.click(cell(/^T-1 firm, week of 7 Dec 2026: 12/));
    expect(screen.getByRole('checkbox', { name: 'Order A-1 must ship' })).toBeDisabled();
  });

  it('when a supervisor opens demand, then cells are read-only and typing changes nothing', async () => {
    const { user } = await openGrid('supervisor');
    expect(screen.queryByRole('button', { name: 'Save changes' })).not.toBeInTheDocument();
    await user.click(cell(/^T-1 forecast, week of 14 Dec 2026/));
    await user.keyboard('7{Enter}');
    expect(cell(/^T-1 forecast, week of 14 Dec 2026: 4$/)).toHaveAttribute('aria-readonly', 'true');
    expect(screen.getByText('Demand is read only for your role.')).toBeInTheDocument();
    await user.click(cell(/^T-1 firm, week of 7 Dec 2026: 10/));
    expect(screen.getByRole('checkbox', { name: 'Order A-1 must ship' })).toBeDisabled();
  });
});
