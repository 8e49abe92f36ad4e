import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { homeSummary, people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const signedOut = () => apiError(401, 'unauthenticated', 'Sign in first.');

describe('sign-in page', () => {
  it('when the form is sent empty, then each field says what is missing and nothing is sent', async () => {
    const api = mockApi({ 'GET /api/me': signedOut });
    renderApp('/sign-in');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Sign in' }));

    expect(screen.getByRole('textbox', { name: 'E-mail' })).toHaveAccessibleDescription(/Enter a valid e-mail address/);
    expect(screen.getByLabelText('Password')).toHaveAccessibleDescription(/Enter your password/);
    expect(screen.getByRole('textbox', { name: 'E-mail' })).toHaveAttribute('aria-invalid', 'true');
    expect(api.sent('POST', '/api/auth/sign-in')).toHaveLength(0);
  });

  it('when the e-mail or password is wrong (401), then a clear message says so and the person stays on the page', async () => {
    const api = mockApi({
      'GET /api/me': signedOut,
      'POST /api/auth/sign-in': () => apiError(401, 'invalid_credentials', 'E-mail or password is wrong.'),
    });
    const view = renderApp('/sign-in');
    const user = userEvent.setup();
    await user.type(await screen.findByRole('textbox', { name: 'E-mail' }), '  Pat@Example.test ');
    await user.type(screen.getByLabelText('Password'), 'not-the-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('The e-mail address or the password is not right');
    expect(view.location().pathname).toBe('/sign-in');
    // the contract's schema trims and lower-cases the address before it is sent
    expect(api.sent('POST', '/api/auth/sign-in')[0].body).toEqual({ email: 'pat@example.test', password: 'not-the-password' });
  });

  it('when sign-in is hammered (429 with Retry-After), then the message says how long to wait', async () => {
    mockApi({
      'GET /api/me': signedOut,
      'POST /api/auth/sign-in': () => apiError(429, 'rate_limited', 'Too many attempts.', {}, { 'Retry-After': '30' }),
    });
    renderApp('/sign-in');
    const user = userEvent.setup();
    await user.type(await screen.findByRole('textbox', { name: 'E-mail' }), 'pat@example.test');
    await user.type(screen.getByLabelText('Password'), 'whatever-it-is');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('Too many sign-in attempts. Wait 30 seconds before trying again.');
  });

  it('when sign-in succeeds, then the page the person asked for opens', async () => {
    const api = mockApi({
      'GET /api/me': [signedOut, () => json(people.planner)],
      'POST /api/auth/sign-in': () => json(people.planner),
      'GET /api/home': () => json(homeSummary),
    });
    const view = renderApp('/sign-in?next=%2F%3Fweeks%3D4');
    const user = userEvent.setup();
    await user.type(await screen.findByRole('textbox', { name: 'E-mail' }), 'pat@example.test');
    await user.type(screen.getByLabelText('Password'), 'correct-horse');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Test Works' })).toBeInTheDocument();
    expect(view.location().search).toBe('?weeks=4');
    await waitFor(() => expect(api.sent('GET', '/api/home')[0]?.search).toBe('?weeks=4'));
  });

  it('when someone not signed in opens a page, then they land on sign-in with the page kept as next', async () => {
    mockApi({ 'GET /api/me': signedOut });
    const view = renderApp('/products?q=oak');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(view.location().pathname).toBe('/sign-in');
    expect(new URLSearchParams(view.location().search).get('next')).toBe('/products?q=oak');
  });
});
