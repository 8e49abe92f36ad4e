import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { people } from '@/testing/fixtures';
import { planDetail, planReview } from '@/testing/plan-fixtures';
import { renderApp } from '@/testing/render-app';

afterEach(() => vi.unstubAllGlobals());

/** Lazily loaded routes can take a few seconds on a busy 2-core machine. */
const firstLoad = { timeout: 5000 };

const submitted = planDetail({ state: 'submitted' });

function reviewApi(role: 'supervisor' | 'planner', extra: Parameters<typeof mockApi>[0] = {}) {
  return mockApi({
    'GET /api/me': () => json(people[role]),
    'GET /api/plans/1': () => json(submitted),
    'GET /api/plans/1/review': () => json(planReview(submitted)),
    ...extra,
  });
}

describe('supervisor review', () => {
  it('when the review opens, then changes against the last approved version are signed, and cautions and certificate are shown', async () => {
    reviewApi('supervisor');
    renderApp('/plans/1/review');
    expect(await screen.findByRole('heading', { name: 'Review of #1 Week plan' }, firstLoad)).toBeInTheDocument();
    const totals = await screen.findByRole('table', { name: 'Totals against the last approved version' }, firstLoad);
    expect(within(totals).getByRole('row', { name: /Margin/ })).toHaveTextContent('900.00 EUR990.00 EUR▲ +90');
    expect(within(totals).getByRole('row', { name: /Overtime hours/ })).toHaveTextContent('▲ +6');
    expect(within(totals).getByRole('row', { name: /Units short/ })).toHaveTextContent('±0');
    expect(within(screen.getByRole('table', { name: 'Changed quantities' })).getByRole('row', { name: /T-1/ })).toHaveTextContent('▼ −2');
    expect(screen.getByRole('note', { name: 'Caution: Above the working-time limit' })).toHaveTextContent('above the plant’s limit of 45 h');
    expect(screen.getByRole('note', { name: 'Caution: The plan is advice' })).toBeInTheDocument();
    expect(screen.getByRole('region', { name: 'Certificate' })).toHaveTextContent('Verified by a second solver');
  });

  it('when no version was approved before, then nothing is shown as a change against zero', async () => {
    const first = planReview(submitted);
    first.baseline = null;
    first.changes.quantities = [{ product: 'T-1', weekStart: '2026-12-14', before: 0, after: 8, delta: 8 }];
    first.unmet = { before: [], after: [] };
    reviewApi('supervisor', { 'GET /api/plans/1/review': () => json(first) });
    renderApp('/plans/1/review');
    const totals = await screen.findByRole('table', { name: 'Totals against the last approved version' }, firstLoad);
    expect(within(totals).getByRole('row', { name: /Margin/ })).toHaveTextContent('Margin—990.00 EUR—');
    expect(within(totals).queryByText(/▲|▼/)).toBeNull();
    const quantities = screen.getByRole('table', { name: 'Changed quantities' });
    expect(within(quantities).queryByRole('columnheader', { name: 'Last approved' })).toBeNull();
    expect(within(quantities).getByRole('row', { name: /T-1/ })).toHaveTextContent(/^T-114 Dec8$/);
    expect(screen.getByRole('heading', { name: 'Quantities made (1 product-weeks)' })).toBeInTheDocument();
    expect(screen.getByText('No approved version yet.')).toBeInTheDocument();
  });

  it('when the supervisor returns the plan without a comment, then the comment is asked for and nothing is sent; with one, it is sent', async () => {
    const api = reviewApi('supervisor', { 'POST /api/plans/1/return': () => json(planDetail({ state: 'returned' })) });
    renderApp('/plans/1/review');
    const user = userEvent.setup();
    const back = await screen.findByRole('button', { name: 'Return to planner' }, firstLoad);
    await user.click(back);
    const comment = screen.getByLabelText('Comment (required to return)');
    expect(await screen.findByText('Say why the plan goes back to the planner.')).toBeInTheDocument();
    expect(comment).toHaveAttribute('aria-invalid', 'true');
    expect(comment).toHaveFocus();
    expect(api.sent('POST', '/api/plans/1/return')).toHaveLength(0);

    await user.type(comment, '   ');
    await user.click(back);
    expect(api.sent('POST', '/api/plans/1/return')).toHaveLength(0);

    await user.type(comment, 'Edge bander overtime is too high in week 2.');
    await user.click(back);
    await waitFor(() => expect(api.sent('POST', '/api/plans/1/return')).toHaveLength(1));
    expect(api.sent('POST', '/api/plans/1/return')[0].body).toEqual({ comment: 'Edge bander overtime is too high in week 2.' });
    expect(await screen.findByText('Returned to the planner with your comment.')).toBeInTheDocument();
  });

  it('when the supervisor approves, then the approve request is sent and the buttons for a submitted plan go away', async () => {
    const approved = planDetail({ state: 'approved' });
    const api = reviewApi('supervisor', {
      'GET /api/plans/1': [() => json(submitted), () => json(approved)],
      'POST /api/plans/1/approve': () => json(approved),
    });
    renderApp('/plans/1/review');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Approve' }, firstLoad));
    await waitFor(() => expect(api.sent('POST', '/api/plans/1/approve')).toHaveLength(1));
    expect(api.sent('POST', '/api/plans/1/approve')[0].body).toEqual({});
    expect(await screen.findByText('Approved; the planner has been told by e-mail.')).toBeInTheDocument();
    // Approved now: release is the next step, approve and return are gone.
    expect(await screen.findByRole('button', { name: 'Release to the floor' }, firstLoad)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Approve' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Return to planner' })).not.toBeInTheDocument();
  });

  it('when the API refuses a step (someone acted first), then its reason is shown', async () => {
    reviewApi('supervisor', {
      'POST /api/plans/1/approve': () => apiError(409, 'conflict', 'This plan version is approved; only a submitted version can be approved.'),
    });
    renderApp('/plans/1/review');
    await userEvent.setup().click(await screen.findByRole('button', { name: 'Approve' }, firstLoad));
    expect(await screen.findByRole('alert')).toHaveTextContent('only a submitted version can be approved');
  });

  it('when a planner opens the review of a submitted plan, then there are no approve or return buttons', async () => {
    reviewApi('planner');
    renderApp('/plans/1/review');
    await screen.findByRole('heading', { name: 'Review of #1 Week plan' }, firstLoad);
    expect(screen.queryByRole('button', { name: 'Approve' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Return to planner' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Submit for sign-off' })).not.toBeInTheDocument();
  });
});
