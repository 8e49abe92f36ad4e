import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { ProductDetail } from '@millrace/contracts';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const product: ProductDetail = {
  id: 7,
  code: 'T-1',
  name: 'Test table',
  unit: 'pcs',
  kind: 'finished',
  price: 120,
  holdingCostRatePct: 24,
  safetyStock: 5,
  batchMultiple: 1,
  openingStock: 0,
  latePenalty: 3,
  family: null,
  active: true,
  version: 4,
  createdAt: '2026-11-01T00:00:00.000Z',
  updatedAt: '2026-11-01T00:00:00.000Z',
  bom: [],
  routing: [],
};

describe('product editor (master-data form)', () => {
  it('when the server rejects a field (400 with a path), then the message sits on that field', async () => {
    const api = mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/products/7': () => json(product),
      'PATCH /api/products/7': () =>
        apiError(400, 'validation_failed', 'Check the marked fields.', { fields: [{ path: 'code', message: 'Code T-2 is already used by another product.' }] }),
    });
    renderApp('/products/7');
    const user = userEvent.setup();
    const code = await screen.findByRole('textbox', { name: 'Code' });
    await user.clear(code);
    await user.type(code, 'T-2');
    await user.click(screen.getByRole('button', { name: 'Save product' }));

    await waitFor(() => expect(code).toHaveAccessibleDescription(/Code T-2 is already used by another product\./));
    expect(code).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByRole('alert')).toHaveTextContent('Not saved');
    const sent = api.sent('PATCH', '/api/products/7')[0].body as Record<string, unknown>;
    expect(sent).toMatchObject({ code: 'T-2', name: 'Test table', version: 4 });
  });

  it('when the code clashes with another product (409 with the field), then the message is on Code, not a reload banner', async () => {
    mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/products/7': () => json(product),
      'PATCH /api/products/7': () =>
        apiError(409, 'conflict', 'Another product already has the code C-1.', { fields: [{ path: 'code', message: 'The code C-1 is already used.' }] }),
    });
    renderApp('/products/7');
    const user = userEvent.setup();
    const code = await screen.findByRole('textbox', { name: 'Code' });
    await user.clear(code);
    await user.type(code, 'C-1');
    await user.click(screen.getByRole('button', { name: 'Save product' }));
    await waitFor(() => expect(code).toHaveAccessibleDescription(/The code C-1 is already used\./));
    expect(screen.getByRole('alert')).toHaveTextContent('Not saved');
    expect(screen.queryByRole('button', { name: 'Reload their version' })).not.toBeInTheDocument();
  });

  it('when a server error names no field on screen, then it is listed in the banner by its path', async () => {
    mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/products/7': () => json(product),
      'PATCH /api/products/7': () =>
        apiError(422, 'unprocessable', 'The product cannot be changed like this.', { issues: [{ item: 'T-1', message: 'It is used in 2 bills of materials.' }] }),
    });
    renderApp('/products/7');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('checkbox', { name: 'Active (planned)' }));
    await user.click(screen.getByRole('button', { name: 'Save product' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('T-1: It is used in 2 bills of materials.');
  });

  it('when someone else saved first (409), then a banner says so and Reload shows their version', async () => {
    const theirs = { ...product, name: 'Test table, oiled', version: 5 };
    const api = mockApi({
      'GET /api/me': () => json(people.planner),
      'GET /api/products/7': [() => json(product), () => json(theirs)],
      'GET /api/settings': () => json({ currency: 'EUR' }),
      'PATCH /api/products/7': [
        () => apiError(409, 'conflict', 'Someone else changed product T-1 since you opened it; reload to see their change.'),
        () => json({ ...theirs, price: 130, version: 6 }),
      ],
    });
    renderApp('/products/7');
    const user = userEvent.setup();
    // money fields carry the plant currency from the settings (a price is in a currency: common practice, no source)
    const price = await screen.findByRole('textbox', { name: 'Price per unit (EUR)' });
    expect(screen.getByRole('textbox', { name: 'Late penalty per unit per week (EUR)' })).toBeInTheDocument();
    await user.clear(price);
    await user.type(price, '130');
    await user.click(screen.getByRole('button', { name: 'Save product' }));

    const banner = await screen.findByRole('alert');
    expect(banner).toHaveTextContent('Changed by someone else');
    expect(banner).toHaveTextContent('Someone else changed product T-1 since you opened it');
    expect(price).toHaveValue('130'); // the edit is not thrown away by the conflict

    await user.click(screen.getByRole('button', { name: 'Reload their version' }));
    await waitFor(() => expect(screen.getByRole('textbox', { name: 'Name' })).toHaveValue('Test table, oiled'));
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();

    // saving again now sends the version just read
    await user.clear(price);
    await user.type(price, '130');
    await user.click(screen.getByRole('button', { name: 'Save product' }));
    await screen.findByText('Saved.');
    expect(api.sent('PATCH', '/api/products/7')[1].body).toMatchObject({ price: 130, version: 5 });
  });

  it('when a number breaks a rule of the contract schema, then the save stops with a message on the field', async () => {
    const api = mockApi({ 'GET /api/me': () => json(people.planner), 'GET /api/products/7': () => json(product) });
    renderApp('/products/7');
    const user = userEvent.setup();
    const safety = await screen.findByRole('textbox', { name: 'Safety stock' });
    await user.clear(safety);
    await user.type(safety, '-2');
    await user.click(screen.getByRole('button', { name: 'Save product' }));
    await waitFor(() => expect(safety).toHaveAccessibleDescription(/A quantity cannot be negative\./));
    expect(api.sent('PATCH', '/api/products/7')).toHaveLength(0);
  });

  it('when a supervisor opens a product, then every input is disabled and there is no save button', async () => {
    mockApi({ 'GET /api/me': () => json(people.supervisor), 'GET /api/products/7': () => json(product) });
    renderApp('/products/7');
    expect(await screen.findByRole('textbox', { name: 'Code' })).toBeDisabled();
    expect(screen.getByRole('textbox', { name: 'Name' })).toBeDisabled();
    expect(screen.queryByRole('button', { name: 'Save product' })).not.toBeInTheDocument();
    expect(screen.getByRole('note')).toHaveTextContent('Read only');
  });
});
