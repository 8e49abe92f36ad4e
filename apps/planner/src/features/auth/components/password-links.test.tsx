import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { homeSummary, people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

const signedOut = () => apiError(401, 'unauthenticated', 'Sign in first.');
/** 43 base64url characters, the shape of a link's secret (packages/contracts invitations.ts). */
const token = 'A'.repeat(40) + '_-9';
const joiner = { purpose: 'invitation', email: 'jo@example.test', name: 'Jo Joiner', role: 'supervisor', expiresAt: '2026-12-09T10:00:00.000Z' };
const usedLink = () =>
  apiError(400, 'validation_failed', 'This link is not valid any more.', {
    fields: [{ path: 'token', message: 'This link is not valid, was already used or has expired; ask for a new one.' }],
  });

describe('welcome page (invitation link)', () => {
  it('when the invitation is open, then it names the person and role, and a good password signs them in', async () => {
    const api = mockApi({
      'GET /api/me': [signedOut, () => json(people.supervisor)],
      [`GET /api/invitations/${token}`]: () => json(joiner),
      'POST /api/invitations/accept': () => json({ email: joiner.email }),
      'POST /api/auth/sign-in': () => json(people.supervisor),
      'GET /api/home': () => json(homeSummary),
    });
    const view = renderApp(`/welcome?token=${token}`);
    const user = userEvent.setup();
    expect(await screen.findByRole('heading', { level: 1, name: 'Welcome, Jo Joiner' })).toBeInTheDocument();
    expect(screen.getByText('Supervisor')).toBeInTheDocument();
    expect(screen.getByText('jo@example.test')).toBeInTheDocument();

    await user.type(screen.getByLabelText('New password'), 'walnut-veneer-on-birch');
    await user.type(screen.getByLabelText('New password again'), 'walnut-veneer-on-birch');
    await user.click(screen.getByRole('button', { name: 'Set password and sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Test Works' })).toBeInTheDocument();
    expect(view.location().pathname).toBe('/');
    expect(api.sent('POST', '/api/invitations/accept')[0].body).toEqual({ token, password: 'walnut-veneer-on-birch' });
    expect(api.sent('POST', '/api/auth/sign-in')[0].body).toEqual({ email: 'jo@example.test', password: 'walnut-veneer-on-birch' });
  });

  it('when the password is too short or the two entries differ, then the fields say so and nothing is sent', async () => {
    const api = mockApi({ 'GET /api/me': signedOut, [`GET /api/invitations/${token}`]: () => json(joiner) });
    renderApp(`/welcome?token=${token}`);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('New password'), 'short');
    await user.type(screen.getByLabelText('New password again'), 'other');
    await user.click(screen.getByRole('button', { name: 'Set password and sign in' }));
    // 12 characters: the policy of issue 6 (packages/contracts people.ts passwordMinLength)
    expect(await screen.findByLabelText('New password')).toHaveAccessibleDescription(/Use at least 12 characters\./);
    expect(screen.getByLabelText('New password again')).toHaveAccessibleDescription(/The two entries differ/);
    expect(api.sent('POST', '/api/invitations/accept')).toHaveLength(0);
  });

  it('when the API refuses the password by its policy, then the reason is shown on the password field', async () => {
    mockApi({
      'GET /api/me': signedOut,
      [`GET /api/invitations/${token}`]: () => json(joiner),
      'POST /api/invitations/accept': () =>
        apiError(400, 'validation_failed', 'The password does not meet the policy.', {
          fields: [{ path: 'password', message: 'This password is on a list of commonly used passwords; choose another.' }],
        }),
    });
    renderApp(`/welcome?token=${token}`);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('New password'), 'passwordpassword');
    await user.type(screen.getByLabelText('New password again'), 'passwordpassword');
    await user.click(screen.getByRole('button', { name: 'Set password and sign in' }));
    await waitFor(() => expect(screen.getByLabelText('New password')).toHaveAccessibleDescription(/on a list of commonly used passwords/));
    expect(screen.getByLabelText('New password')).toHaveAttribute('aria-invalid', 'true');
  });

  it('when the invitation link has expired or was used, then the page says the link can no longer be used', async () => {
    const api = mockApi({ 'GET /api/me': signedOut, [`GET /api/invitations/${token}`]: usedLink });
    renderApp(`/welcome?token=${token}`);
    expect(await screen.findByRole('alert')).toHaveTextContent('This link can no longer be used');
    expect(screen.getByRole('alert')).toHaveTextContent('Ask your Millrace admin to send you a new invitation');
    expect(screen.queryByLabelText('New password')).not.toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Go to sign-in' })).toHaveAttribute('href', '/sign-in');
    expect(api.unhandled).toEqual([]);
  });

  it('when the link is used up while the page is open, then submitting shows the same clear message', async () => {
    mockApi({ 'GET /api/me': signedOut, [`GET /api/invitations/${token}`]: () => json(joiner), 'POST /api/invitations/accept': usedLink });
    renderApp(`/welcome?token=${token}`);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('New password'), 'walnut-veneer-on-birch');
    await user.type(screen.getByLabelText('New password again'), 'walnut-veneer-on-birch');
    await user.click(screen.getByRole('button', { name: 'Set password and sign in' }));
    expect(await screen.findByText('This link can no longer be used')).toBeInTheDocument();
  });
});

describe('reset-password page', () => {
  it('when the reset link is open, then a new password is set and the page leads to sign-in', async () => {
    const api = mockApi({
      'GET /api/me': signedOut,
      [`GET /api/password-resets/${token}`]: () => json({ ...joiner, purpose: 'password_reset' }),
      'POST /api/password-resets/confirm': () => json({ email: joiner.email }),
    });
    renderApp(`/reset-password?token=${token}`);
    const user = userEvent.setup();
    expect(await screen.findByRole('heading', { level: 1, name: 'Choose a new password' })).toBeInTheDocument();
    await user.type(await screen.findByLabelText('New password'), 'walnut-veneer-on-birch');
    await user.type(screen.getByLabelText('New password again'), 'walnut-veneer-on-birch');
    await user.click(screen.getByRole('button', { name: 'Set new password' }));
    expect(await screen.findByText(/The password of jo@example.test is changed/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Sign in' })).toHaveAttribute('href', '/sign-in');
    expect(api.sent('POST', '/api/password-resets/confirm')[0].body).toEqual({ token, password: 'walnut-veneer-on-birch' });
  });

  it('when the reset link has expired, then the page offers to ask for a new link', async () => {
    mockApi({ 'GET /api/me': signedOut, [`GET /api/password-resets/${token}`]: usedLink });
    renderApp(`/reset-password?token=${token}`);
    expect(await screen.findByRole('alert')).toHaveTextContent('This link can no longer be used');
    expect(screen.getByRole('link', { name: 'Ask for a new link' })).toHaveAttribute('href', '/forgot-password');
  });

  it('when the address has no token at all, then nothing is asked of the API and the link is refused', async () => {
    const api = mockApi({ 'GET /api/me': signedOut });
    renderApp('/reset-password');
    expect(await screen.findByRole('alert')).toHaveTextContent('This link can no longer be used');
    expect(api.requests.filter((r) => r.path.startsWith('/api/password-resets'))).toHaveLength(0);
  });
});

describe('forgot password', () => {
  it('when "Forgot password?" is followed and an address sent, then the same neutral confirmation shows', async () => {
    const api = mockApi({
      'GET /api/me': signedOut,
      'POST /api/password-resets/request': () => json({ message: 'If the address belongs to an active account, a link is on its way.' }, { status: 202 }),
    });
    const view = renderApp('/sign-in');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('link', { name: 'Forgot password?' }));
    await waitFor(() => expect(view.location().pathname).toBe('/forgot-password'));
    await user.type(await screen.findByRole('textbox', { name: 'E-mail' }), ' Nobody@Example.test ');
    await user.click(screen.getByRole('button', { name: 'Send link' }));
    expect(await screen.findByText(/If this address belongs to an active Millrace account/)).toBeInTheDocument();
    expect(api.sent('POST', '/api/password-resets/request')[0].body).toEqual({ email: 'nobody@example.test' });
  });

  it('when reset links are asked for too often (429), then the page says how long to wait', async () => {
    mockApi({
      'GET /api/me': signedOut,
      'POST /api/password-resets/request': () => apiError(429, 'rate_limited', 'Too many requests.', {}, { 'Retry-After': '600' }),
    });
    renderApp('/forgot-password');
    const user = userEvent.setup();
    await user.type(await screen.findByRole('textbox', { name: 'E-mail' }), 'pat@example.test');
    await user.click(screen.getByRole('button', { name: 'Send link' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('Too many requests for a reset link. Wait 10 minutes before asking again.');
    expect(screen.queryByText(/is on its way/)).not.toBeInTheDocument();
  });
});

describe('change password (every role)', () => {
  it('when a floor lead opens "Change password" and the current password is wrong, then that field says so; a right one saves', async () => {
    const api = mockApi({
      'GET /api/me': () => json(people.floor_lead),
      'GET /api/home': () => json(homeSummary),
      'PUT /api/me/password': [
        () =>
          apiError(400, 'validation_failed', 'The current password is not right.', {
            fields: [{ path: 'currentPassword', message: 'This is not your current password.' }],
          }),
        () => new Response(null, { status: 204 }),
      ],
    });
    const view = renderApp('/');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('link', { name: 'Change password' }));
    await waitFor(() => expect(view.location().pathname).toBe('/account/password'));
    await user.type(await screen.findByLabelText('Current password'), 'wrong-one');
    await user.type(screen.getByLabelText('New password'), 'walnut-veneer-on-birch');
    await user.type(screen.getByLabelText('New password again'), 'walnut-veneer-on-birch');
    await user.click(screen.getByRole('button', { name: 'Change password' }));
    await waitFor(() => expect(screen.getByLabelText('Current password')).toHaveAccessibleDescription(/This is not your current password/));

    await user.clear(screen.getByLabelText('Current password'));
    await user.type(screen.getByLabelText('Current password'), 'right-one-here');
    await user.click(screen.getByRole('button', { name: 'Change password' }));
    expect(await screen.findByText('Password changed. Other sessions are signed out.')).toBeInTheDocument();
    expect(api.sent('PUT', '/api/me/password')[1].body).toEqual({ currentPassword: 'right-one-here', newPassword: 'walnut-veneer-on-birch' });
  });
});
