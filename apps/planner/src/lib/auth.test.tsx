import { screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { json, mockApi } from '@/testing/mock-api';
import { homeSummary, people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

/**
 * The planner asks who is signed in through the open GET /api/session, which answers 200 either
 * way, so a signed-out visit leaves no failed request (and no console error) in the browser.
 * GET /api/me (401 without a session) is never called for it.
 */
describe('the session check', () => {
  it('when nobody is signed in, then the app asks GET /api/session, shows the sign-in page and never calls GET /api/me', async () => {
    const api = mockApi({ 'GET /api/session': () => json({ signedIn: false }) });
    const view = renderApp('/plans');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(view.location().pathname).toBe('/sign-in');
    expect(new URLSearchParams(view.location().search).get('next')).toBe('/plans');
    expect(api.sent('GET', '/api/session').length).toBeGreaterThan(0);
    expect(api.sent('GET', '/api/me')).toHaveLength(0);
    expect(api.unhandled).toEqual([]);
  });

  it('when someone is signed in, then the shell greets the person the session names', async () => {
    const api = mockApi({ 'GET /api/session': () => json({ signedIn: true, person: people.supervisor }), 'GET /api/home': () => json(homeSummary) });
    renderApp('/');
    expect(await screen.findByRole('navigation', { name: 'Main' })).toBeInTheDocument();
    expect(await screen.findByText(people.supervisor.name, { exact: false })).toBeInTheDocument();
    expect(api.sent('GET', '/api/me')).toHaveLength(0);
  });

  it('when someone signed in opens the sign-in page, then they go straight on', async () => {
    mockApi({ 'GET /api/session': () => json({ signedIn: true, person: people.planner }), 'GET /api/home': () => json(homeSummary) });
    const view = renderApp('/sign-in?next=%2F');
    expect(await screen.findByRole('navigation', { name: 'Main' })).toBeInTheDocument();
    expect(view.location().pathname).toBe('/');
  });
});
