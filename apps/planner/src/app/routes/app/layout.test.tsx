import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Role } from '@millrace/contracts';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { homeSummary, people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

/**
 * What each role may open, from DESIGN.md "Who uses it" and API.md "Roles": planners keep master
 * data and demand and import spreadsheets; supervisors read them; floor leads get their home page only (shift sheets come
 * with plans); admins run people, plant settings and outgoing mail and read the data.
 */
const expectedLinks: Record<Role, string[]> = {
  planner: ['Home', 'Products', 'Work centers', 'Materials', 'Demand', 'Plans', 'Shift sheets', 'Imports', 'Plant settings'],
  supervisor: ['Home', 'Products', 'Work centers', 'Materials', 'Demand', 'Plans', 'Shift sheets', 'Plant settings'],
  floor_lead: ['Home', 'Shift sheets'],
  admin: ['Home', 'Products', 'Work centers', 'Materials', 'Demand', 'Plans', 'Shift sheets', 'People', 'Plant settings', 'Mail', 'Caught mail'],
};

describe('role-dependent navigation', () => {
  for (const role of Object.keys(expectedLinks) as Role[]) {
    it(`when a ${role} signs in, then the main navigation shows exactly their links`, async () => {
      mockApi({ 'GET /api/me': () => json(people[role]), 'GET /api/home': () => json(homeSummary) });
      renderApp('/');
      const nav = await screen.findByRole('navigation', { name: 'Main' });
      const names = within(nav)
        .getAllByRole('link')
        .map((a) => a.textContent);
      expect(names).toEqual(expectedLinks[role]);
      expect(within(nav).getByRole('link', { name: 'Home' })).toHaveAttribute('aria-current', 'page');
    });
  }

  it('when a floor lead opens a master-data address, then the page says it is not for their role and loads nothing', async () => {
    const api = mockApi({ 'GET /api/me': () => json(people.floor_lead) });
    renderApp('/products');
    expect(await screen.findByRole('alert')).toHaveTextContent('Not available for your role');
    expect(api.sent('GET', '/api/products')).toHaveLength(0);
  });

  it('when the home page loads, then an over-loaded week is said in words, not by colour alone', async () => {
    mockApi({ 'GET /api/me': () => json(people.planner), 'GET /api/home': () => json(homeSummary) });
    renderApp('/');
    expect(await screen.findByText(/1 work-center week is over-loaded/)).toBeInTheDocument();
    expect(screen.getByRole('cell', { name: /SAW Saw, week of 7 Dec 2026: 50 h needed of 40 h available, over-loaded/ })).toBeInTheDocument();
  });

  it('when any call answers 401 (session ended), then the person is sent back to sign-in', async () => {
    mockApi({
      'GET /api/me': [() => json(people.planner), () => apiError(401, 'unauthenticated', 'Sign in first.')],
      'GET /api/home': () => apiError(401, 'unauthenticated', 'Sign in first.'),
    });
    const view = renderApp('/');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(view.location().pathname).toBe('/sign-in');
  });

  it('when the person signs out, then the session is ended on the server and sign-in shows', async () => {
    const api = mockApi({
      'GET /api/me': [() => json(people.supervisor), () => apiError(401, 'unauthenticated', 'Sign in first.')],
      'GET /api/home': () => json(homeSummary),
      'POST /api/auth/sign-out': () => new Response(null, { status: 204 }),
    });
    renderApp('/');
    await userEvent.setup().click(await screen.findByRole('button', { name: 'Sign out' }));
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    await waitFor(() => expect(api.sent('POST', '/api/auth/sign-out')).toHaveLength(1));
  });
});
