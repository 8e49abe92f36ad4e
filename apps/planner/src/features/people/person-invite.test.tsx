import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

async function openPeople(invite: () => Response) {
  const api = mockApi({ 'GET /api/me': () => json(people.admin), 'GET /api/people': () => json([]), 'POST /api/invitations': invite });
  renderApp('/people');
  const form = await screen.findByRole('form', { name: 'Invite a person' });
  return { api, form: within(form), user: userEvent.setup() };
}

describe('invite by e-mail (People, admin)', () => {
  it('when the admin sends an invitation, then e-mail, name and role are sent and the page says until when the link works', async () => {
    const { api, form, user } = await openPeople(() => json({ personId: 9, email: 'jo@example.test', expiresAt: '2026-12-09T10:00:00.000Z' }, { status: 201 }));
    await user.type(form.getByRole('textbox', { name: 'E-mail' }), 'Jo@Example.test');
    await user.type(form.getByRole('textbox', { name: 'Name' }), 'Jo Joiner');
    await user.selectOptions(form.getByRole('combobox', { name: 'Role' }), 'floor_lead');
    await user.click(form.getByRole('button', { name: 'Send invitation' }));

    expect(await screen.findByText(/The last invitation went to jo@example.test; its link works once, until/)).toBeInTheDocument();
    expect(api.sent('POST', '/api/invitations')[0].body).toEqual({ email: 'jo@example.test', name: 'Jo Joiner', role: 'floor_lead' });
    expect(form.getByRole('textbox', { name: 'E-mail' })).toHaveValue('');
  });

  it('when the e-mail already belongs to someone (409 on email), then the e-mail field says so', async () => {
    const { form, user } = await openPeople(() =>
      apiError(409, 'conflict', 'A person with the e-mail pat@example.test already exists.', { fields: [{ path: 'email', message: 'This e-mail is already in use.' }] }),
    );
    await user.type(form.getByRole('textbox', { name: 'E-mail' }), 'pat@example.test');
    await user.type(form.getByRole('textbox', { name: 'Name' }), 'Pat Again');
    await user.click(form.getByRole('button', { name: 'Send invitation' }));
    await waitFor(() => expect(form.getByRole('textbox', { name: 'E-mail' })).toHaveAccessibleDescription(/This e-mail is already in use/));
  });

  it('when the form is sent empty, then each field says what is missing and nothing is sent', async () => {
    const { api, form, user } = await openPeople(() => json({}));
    await user.click(form.getByRole('button', { name: 'Send invitation' }));
    expect(form.getByRole('textbox', { name: 'E-mail' })).toHaveAccessibleDescription(/Enter a valid e-mail address/);
    expect(form.getByRole('textbox', { name: 'Name' })).toHaveAccessibleDescription(/Enter a name/);
    expect(api.sent('POST', '/api/invitations')).toHaveLength(0);
  });
});
