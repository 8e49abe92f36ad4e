import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const invitation = { id: '0002-b', from: 'Millrace <no-reply@millrace.test>', to: ['jo@example.test'], subject: 'You are invited to Millrace', date: '2026-12-02T09:30:00.000Z' };
const notice = { id: '0001-a', from: 'Millrace <no-reply@millrace.test>', to: ['sam@example.test'], subject: 'Plan submitted for review', date: '2026-12-01T08:00:00.000Z' };

describe('caught mail page', () => {
  it('when an admin opens Caught mail, then messages are listed and one opens with its text and a sandboxed HTML part', async () => {
    const api = mockApi({
      'GET /api/me': () => json(people.admin),
      'GET /api/dev/mail': () => json([invitation, notice]),
      'GET /api/dev/mail/0002-b': () =>
        json({ ...invitation, cc: [], text: 'Choose your password: http://x.test/welcome?token=abc', html: '<p>Choose <script>alert(1)</script>your password</p>' }),
    });
    const view = renderApp('/dev/mail');
    const user = userEvent.setup();
    const table = await screen.findByRole('table', { name: 'Caught messages' });
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(3);
    expect(rows[1]).toHaveTextContent('jo@example.test');
    expect(rows[2]).toHaveTextContent('Plan submitted for review');

    await user.click(within(table).getByRole('link', { name: 'You are invited to Millrace' }));
    expect(view.location().search).toBe('?message=0002-b');
    const reader = await screen.findByRole('article', { name: 'You are invited to Millrace' });
    expect(within(reader).getByLabelText('Plain-text part')).toHaveTextContent('Choose your password: http://x.test/welcome?token=abc');

    await user.click(within(reader).getByRole('tab', { name: 'HTML' }));
    const frame = await within(reader).findByTitle('HTML part of You are invited to Millrace');
    // empty sandbox: no scripts, forms or same-origin access for the message's HTML
    expect(frame).toHaveAttribute('sandbox', '');
    expect(frame.getAttribute('srcdoc')).toContain('<script>alert(1)</script>');
    expect(api.unhandled).toEqual([]);
  });

  it('when the server has no mail catcher (404), then the page says caught mail is for development', async () => {
    mockApi({
      'GET /api/me': () => json(people.admin),
      'GET /api/dev/mail': () => apiError(404, 'not_found', 'Caught mail exists only in development: this server has no local mail catcher.'),
    });
    renderApp('/dev/mail');
    expect(await screen.findByRole('alert')).toHaveTextContent('Caught mail exists only in development');
  });

  it('when a planner opens the address, then the page is refused for the role and nothing is asked', async () => {
    const api = mockApi({ 'GET /api/me': () => json(people.planner) });
    renderApp('/dev/mail');
    expect(await screen.findByRole('alert')).toHaveTextContent('Not available for your role');
    expect(api.sent('GET', '/api/dev/mail')).toHaveLength(0);
  });
});
