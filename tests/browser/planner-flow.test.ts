import { readFileSync } from 'node:fs';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readBrowserEnv } from './support/browser-env';
import { demoPeople, signIn } from './support/sign-in';
import { startTestServer, type TestServer } from './support/test-server';
import { clearScreenshots, launchBrowser, WatchedPage } from './support/watched-page';

/**
 * Issue 5's browser flows on the real server with the demo plant: a planner edits a work
 * center's calendar and the demand, runs a plan and watches the progress bar reach the end,
 * opens the results and downloads the MPS; a floor lead finds nothing editable.
 */
const suite = 'planner-flow';
let server: TestServer;
let browser: Browser;

beforeAll(async () => {
  clearScreenshots(suite);
  const env = readBrowserEnv();
  server = await startTestServer(env);
  browser = await launchBrowser(env.chromiumPath);
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('planner in the browser', () => {
  it('when a planner edits a calendar and demand, runs a plan and opens its results, then every step works without an error', async () => {
    const w = await WatchedPage.open(browser, server.url, suite, 'planner');
    const { page } = w;
    try {
      await signIn(w, demoPeople.planner);
      await w.shot('home');

      // A work center's calendar: one holiday in a new week row.
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Work centers' }).click();
      await page.getByRole('link', { name: 'SAND', exact: true }).click();
      await page.getByRole('tab', { name: /Calendar/ }).click();
      await page.getByRole('button', { name: 'Add week' }).click();
      const rows = page.getByLabel(/^Holidays in days, row \d+$/);
      const last = rows.last();
      await last.fill('1');
      await page.getByRole('button', { name: 'Save calendar' }).click();
      await expect.poll(() => page.getByRole('status').filter({ hasText: 'Saved.' }).count(), { timeout: 15_000 }).toBeGreaterThan(0);
      await w.shot('calendar-saved');

      // Demand: type a firm quantity into the first editable cell and save in one request.
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Demand' }).click();
      const grid = page.getByRole('grid', { name: 'Demand per product and week' });
      await grid.waitFor();
      const cell = grid.getByRole('gridcell', { name: /firm, week of/ }).nth(3);
      await cell.click();
      await page.keyboard.type('7');
      await page.keyboard.press('Enter');
      await expect.poll(() => page.getByText(/1 unsaved change/).count()).toBeGreaterThan(0);
      await page.getByRole('button', { name: 'Save changes' }).click();
      await expect.poll(() => page.getByText(/Saved in one go/).count(), { timeout: 15_000 }).toBeGreaterThan(0);
      await w.shot('demand-saved');

      // A new plan version, solved with the live progress bar.
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Plans' }).click();
      await page.getByRole('link', { name: 'New plan version' }).first().click();
      await page.getByLabel('Name').fill('Browser flow plan');
      await page.getByLabel('Horizon (weeks)').fill('8');
      await w.shot('new-plan');
      await page.getByRole('button', { name: 'Create plan version' }).click();
      await page.getByRole('heading', { name: /Browser flow plan/ }).waitFor();
      await page.getByRole('button', { name: 'Solve', exact: true }).click();
      const bar = page.getByRole('progressbar', { name: 'Solve progress' });
      await bar.waitFor();
      const seen = new Set<string>();
      const until = Date.now() + 120_000;
      let shotWhileRunning = false;
      while (Date.now() < until) {
        const now = (await bar.getAttribute('aria-valuenow')) ?? 'indeterminate';
        seen.add(now);
        if (!shotWhileRunning && now !== '100') {
          await w.shot('solving');
          shotWhileRunning = true;
        }
        if (now === '100') break;
        await page.waitForTimeout(250);
      }
      expect(await bar.getAttribute('aria-valuenow')).toBe('100');
      expect(await bar.getAttribute('aria-valuetext')).toMatch(/^Finished, 100 %\. Iteration \d+ · gap /);
      await page.getByText('Solved and checked').first().waitFor({ timeout: 30_000 });
      // The page follows the background cross-check until it ends (verified, unverified or not finished).
      const certificate = page.getByRole('region', { name: 'Certificate' });
      await certificate.getByText(/(Verified by a second solver|Unverified: the second solver disagrees|Cross-check not finished)/).waitFor({ timeout: 90_000 });
      await w.shot('solved');

      // Results: the summary sentence says which work center holds the plan back and what an hour is worth.
      await page.getByRole('link', { name: 'Open results' }).click();
      const summary = page.getByRole('region', { name: 'Summary' });
      await summary.waitFor({ timeout: 30_000 });
      expect(await summary.textContent()).toMatch(/holds the plan back in weeks? [\d–, and]+; one more hour there is worth (up to )?[\d,]+\.\d\d EUR/);
      await w.shot('results-load-board');
      expect(await page.locator('td[data-binding]').count()).toBeGreaterThan(0);
      await page.getByRole('tab', { name: 'Charts' }).click();
      await page.locator('.recharts-surface').first().waitFor();
      await w.shot('results-charts');
      await page.getByRole('tab', { name: 'Plan table' }).click();
      await page.getByRole('table', { name: 'Plan lines' }).waitFor();
      await w.shot('results-plan-table');

      // The MPS download: the exact model, in MPS sections.
      const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download MPS model' }).click()]);
      const file = await download.path();
      const mps = readFileSync(file!, 'utf8');
      expect(mps).toMatch(/^ROWS$/m);
      expect(mps).toMatch(/^COLUMNS$/m);
      expect(mps).toMatch(/^ENDATA\s*$/m);
      expect(download.suggestedFilename()).toMatch(/^plan-\d+\.mps$/);

      // The plan lines as CSV: a header and one row per product and week.
      const [csvDownload] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download plan lines (CSV)' }).click()]);
      const csv = readFileSync((await csvDownload.path())!, 'utf8').trim().split(/\r?\n/);
      expect(csv[0]).toBe('product,product_name,week,week_start,demand,make,ship,stock,late');
      expect(csv.length).toBeGreaterThan(8);

      expect(w.problems).toEqual([]);
    } finally {
      await w.close();
    }
  });

  it('when a floor lead signs in, then nothing is editable and plan and master-data pages are closed to them', async () => {
    const w = await WatchedPage.open(browser, server.url, suite, 'floor-lead');
    const { page } = w;
    try {
      await signIn(w, demoPeople.floorLead);
      await page.getByRole('main').waitFor();
      await page.waitForLoadState('networkidle');
      await w.shot('home');
      const nav = page.getByRole('navigation', { name: 'Main' });
      // Floor leads read their home page and the shift sheets of released plans, nothing else.
      const links = await nav.getByRole('link').allTextContents();
      expect(links[0]).toBe('Home');
      expect(links.filter((l) => !['Home', 'Shift sheets'].includes(l))).toEqual([]);
      // View choices (how many weeks to show) are fine; anything that changes data is not.
      const editable = page.locator('main form, main input:not([type="search"]):not([disabled]), main textarea:not([disabled]), main [contenteditable="true"]');
      expect(await editable.count()).toBe(0);
      const mainButtons = await page.getByRole('main').getByRole('button').allTextContents();
      expect(mainButtons).toEqual([]);

      for (const path of ['/plans', '/plans/new', '/work-centers/1', '/demand', '/scenarios']) {
        await page.goto(path);
        await page.getByRole('alert').filter({ hasText: 'Not available for your role' }).waitFor();
        expect(await editable.count()).toBe(0);
      }
      await w.shot('plans-closed');
      expect(w.problems).toEqual([]);
    } finally {
      await w.close();
    }
  });
});
