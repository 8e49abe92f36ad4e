import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readBrowserEnv, type BrowserEnv } from './support/browser-env';
import { waitForMail } from './support/mail-catcher';
import { demoPeople, signIn } from './support/sign-in';
import { startTestServer, type TestServer } from './support/test-server';
import { clearScreenshots, launchBrowser, WatchedPage } from './support/watched-page';

/**
 * Issue 6's browser flow on the real server: the planner solves and submits a plan version,
 * the supervisor reviews and approves it in the UI, and the planner's e-mail arrives in the
 * mail catcher (read back over its HTTP API).
 */
const suite = 'sign-off-flow';
let env: BrowserEnv;
let server: TestServer;
let browser: Browser;

beforeAll(async () => {
  clearScreenshots(suite);
  env = readBrowserEnv();
  server = await startTestServer(env);
  browser = await launchBrowser(env.chromiumPath);
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('sign-off in the browser', () => {
  it('when the planner submits and the supervisor approves, then the plan is approved, the trail shows it and the planner gets an e-mail', async () => {
    const planName = `Sign-off flow ${Date.now()}`;

    // Planner: create, solve, submit.
    const planner = await WatchedPage.open(browser, server.url, suite, 'planner');
    let planPath = '';
    try {
      const { page } = planner;
      await signIn(planner, demoPeople.planner);
      await page.goto('/plans/new');
      await page.getByLabel('Name').fill(planName);
      await page.getByLabel('Horizon (weeks)').fill('6');
      await page.getByRole('button', { name: 'Create plan version' }).click();
      await page.getByRole('heading', { name: new RegExp(planName) }).waitFor();
      planPath = new URL(page.url()).pathname;
      await page.getByRole('button', { name: 'Solve', exact: true }).click();
      await page.getByRole('progressbar', { name: 'Solve progress' }).and(page.locator('[aria-valuenow="100"]')).waitFor({ timeout: 120_000 });
      const submit = page.getByRole('button', { name: 'Submit for sign-off' });
      await expect.poll(() => submit.isEnabled(), { timeout: 30_000 }).toBe(true);
      await planner.shot('solved');
      await submit.click();
      await page.getByText('Submitted for sign-off; the supervisors have been told by e-mail.').waitFor();
      await page.getByRole('cell', { name: 'Submitted', exact: true }).waitFor();
      // Submitted: the planner can no longer submit or solve it.
      expect(await page.getByRole('button', { name: /Submit for sign-off|Solve/ }).count()).toBe(0);
      await planner.shot('submitted');
      expect(planner.problems).toEqual([]);
    } finally {
      await planner.close();
    }

    // Supervisor: find it in the list, review, approve.
    const supervisor = await WatchedPage.open(browser, server.url, suite, 'supervisor');
    try {
      const { page } = supervisor;
      await signIn(supervisor, demoPeople.supervisor);
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Plans' }).click();
      await page.getByRole('combobox', { name: 'State', exact: true }).selectOption('submitted');
      await page.getByRole('link', { name: new RegExp(planName) }).click();
      await page.getByRole('link', { name: 'Review for sign-off' }).click();
      await page.getByRole('table', { name: 'Totals against the last approved version' }).waitFor({ timeout: 30_000 });
      expect(await page.getByText('There is no approved version to compare with yet').count()).toBe(1);
      await page.getByRole('note', { name: 'Caution: The plan is advice' }).waitFor();
      await supervisor.shot('review');
      await page.getByRole('button', { name: 'Approve' }).click();
      await page.getByText('Approved; the planner has been told by e-mail.').waitFor();
      await page.getByRole('button', { name: 'Release to the floor' }).waitFor();
      await supervisor.shot('approved');

      await page.goto(planPath);
      await page.getByRole('cell', { name: 'Approved', exact: true }).waitFor();
      const trail = await page.getByRole('table', { name: /Audit trail/ }).getByRole('row').allTextContents();
      expect(trail.some((r) => /Pia Planner.*Submitted.*Draft → Submitted/.test(r))).toBe(true);
      expect(trail.some((r) => /Approved.*Submitted → Approved/.test(r))).toBe(true);
      await supervisor.shot('audit-trail');
      expect(supervisor.problems).toEqual([]);
    } finally {
      await supervisor.close();
    }

    // The planner's e-mail, read back from the mail catcher.
    const mail = await waitForMail(env.mailCatcherUrl, demoPeople.planner, new RegExp(`Plan "${planName}" was approved`));
    expect(mail.text).toContain(planName);
    const link = mail.text.match(/Open the plan: (\S+)/)?.[1];
    expect(link).toBe(`${server.url}${planPath}`);

    // The link in the e-mail opens the approved plan for the planner, who can no longer change it.
    const again = await WatchedPage.open(browser, server.url, suite, 'planner-from-mail');
    try {
      await signIn(again, demoPeople.planner);
      await again.page.goto(link!);
      await again.page.getByRole('heading', { name: new RegExp(planName) }).waitFor();
      await again.page.getByRole('cell', { name: 'Approved', exact: true }).waitFor();
      expect(await again.page.getByRole('button', { name: /Solve|Submit for sign-off/ }).count()).toBe(0);
      await again.shot('approved-plan-from-mail');
      expect(again.problems).toEqual([]);
    } finally {
      await again.close();
    }
  });
});
