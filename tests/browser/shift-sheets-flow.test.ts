import { execFileSync } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readBrowserEnv, type BrowserEnv } from './support/browser-env';
import { waitForMail } from './support/mail-catcher';
import { demoPassword, demoPeople, signIn } from './support/sign-in';
import { startTestServer, type TestServer } from './support/test-server';
import { launchBrowser, screenshotRoot, WatchedPage } from './support/watched-page';

/**
 * Issue 8, tried as a new user would on the real server with the demo plant: a plan version is
 * solved and submitted (over the API, as the planner), the supervisor approves and releases it
 * in the UI, the floor lead opens the link of the release e-mail (read back from the mail
 * catcher), sees the week and prints the sheets of one work center — the print view in the
 * browser and the PDF the server prints with Chromium (read back with poppler-utils).
 */
const suite = 'shift-sheets-flow';
let env: BrowserEnv;
let server: TestServer;
let browser: Browser;

beforeAll(async () => {
  env = readBrowserEnv();
  server = await startTestServer(env);
  browser = await launchBrowser(env.chromiumPath);
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

/** A tiny HTTP client signed in as one demo person (session cookie, Origin on writes). */
async function apiAs(email: string) {
  const signIn = await fetch(`${server.url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: server.url },
    body: JSON.stringify({ email, password: demoPassword }),
  });
  expect(signIn.status).toBe(200);
  const cookie = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  return async (method: string, path: string, body?: unknown) => {
    const res = await fetch(`${server.url}${path}`, {
      method,
      headers: { Cookie: cookie, Origin: server.url, ...(body === undefined ? {} : { 'Content-Type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const text = await res.text();
    return { status: res.status, body: text ? JSON.parse(text) : null };
  };
}

describe('shift sheets in the browser', () => {
  it('when the supervisor releases a plan, then the floor lead follows the e-mail link, sees the week and prints one work center’s sheets', async () => {
    const planName = `Sheets flow ${Date.now()}`;

    // Planner (over the API): create, solve, submit.
    const planner = await apiAs(demoPeople.planner);
    const created = await planner('POST', '/api/plans', { name: planName, horizonWeeks: 4 });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const planId: number = created.body.id;
    expect((await planner('POST', `/api/plans/${planId}/solve`)).status).toBe(202);
    await expect.poll(async () => (await planner('GET', `/api/plans/${planId}`)).body.solveStatus, { timeout: 120_000, interval: 500 }).toBe('solved');
    expect((await planner('POST', `/api/plans/${planId}/submit`, {})).status).toBe(200);

    // Supervisor (in the UI): approve, then release to the floor.
    const supervisor = await WatchedPage.open(browser, server.url, suite, 'supervisor');
    try {
      const { page } = supervisor;
      await signIn(supervisor, demoPeople.supervisor);
      await page.goto(`/plans/${planId}/review`);
      await page.getByRole('button', { name: 'Approve' }).click();
      await page.getByText('Approved; the planner has been told by e-mail.').waitFor();
      await page.getByRole('button', { name: 'Release to the floor' }).click();
      await page.getByText('Released; the floor leads have been told by e-mail.').waitFor();
      await supervisor.shot('released');
      expect(supervisor.problems).toEqual([]);
    } finally {
      await supervisor.close();
    }

    // The floor lead's e-mail and its link.
    const mail = await waitForMail(env.mailCatcherUrl, demoPeople.floorLead, new RegExp(`New shift sheets: plan "${planName}" is released`));
    const link = mail.text.match(/Open your shift sheets: (\S+)/)?.[1];
    expect(link).toBe(`${server.url}/shift-sheets?plan=${planId}`);

    const floor = await WatchedPage.open(browser, server.url, suite, 'floor-lead');
    // window.print() would open the system dialog; count the calls instead
    await floor.context.addInitScript(() => {
      (window as unknown as { printCalls: number }).printCalls = 0;
      window.print = () => {
        (window as unknown as { printCalls: number }).printCalls += 1;
      };
    });
    try {
      const { page } = floor;
      // Not signed in yet: the link asks for the sign-in first and then opens the sheets.
      await page.goto(link!);
      await page.getByLabel('E-mail').fill(demoPeople.floorLead);
      await page.getByLabel('Password').fill(demoPassword);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('heading', { name: 'Shift sheets', level: 1 }).waitFor();
      expect(new URL(page.url()).searchParams.get('plan')).toBe(String(planId));
      await page.getByText(`#${planId} ${planName}`, { exact: true }).waitFor();
      await page.getByText('Released to the floor').first().waitFor();
      await expect.poll(() => page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Shift sheets' }).count()).toBe(1);

      // the week: timeline and lists; find a week with work
      const weekSelect = page.getByRole('combobox', { name: 'Week' });
      const weeks = await weekSelect.locator('option').evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
      let printLink = page.getByRole('link', { name: /^Print [A-Z0-9_-]+$/ }).first();
      for (const w of weeks) {
        await page.getByRole('figure', { name: /Timeline of the week starting/ }).waitFor();
        if ((await page.getByRole('link', { name: /^Print [A-Z0-9_-]+$/ }).count()) > 0) break;
        await weekSelect.selectOption(w);
        await page.getByRole('figure', { name: new RegExp(`Timeline of the week starting ${w}`) }).waitFor();
      }
      printLink = page.getByRole('link', { name: /^Print [A-Z0-9_-]+$/ }).first();
      await printLink.waitFor();
      await page.getByRole('heading', { name: 'Working time' }).waitFor();
      await page.getByText(/Local labour law, collective agreements and licensed practice take precedence/).first().waitFor();
      // nothing to edit for a floor lead
      expect(await page.getByRole('textbox').count()).toBe(0);
      await floor.shot('week');

      const code = (await printLink.textContent())!.replace(/^Print /, '').trim();
      await printLink.click();
      await page.locator('[data-print-state="ready"]').waitFor();
      const sheets = page.locator('section.printed-sheet');
      const count = await sheets.count();
      expect(count).toBeGreaterThan(0);
      for (let i = 0; i < count; i++) {
        const title = await sheets.nth(i).getByRole('heading', { level: 2 }).textContent();
        expect(title).toMatch(new RegExp(`^Shift sheet · ${code} .* · Shift \\d+$`));
        await sheets.nth(i).getByText('Initials').waitFor();
        await sheets.nth(i).getByText(`Sheet ${i + 1} of ${count}`).waitFor();
      }
      await floor.shot('print-view');
      await page.getByRole('button', { name: 'Print' }).click();
      expect(await page.evaluate(() => (window as unknown as { printCalls: number }).printCalls)).toBe(1);
      await page.emulateMedia({ media: 'print' });
      expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
      await floor.shot('print-media');
      await page.emulateMedia({ media: 'screen' });

      const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download PDF' }).click()]);
      const file = await download.path();
      expect(download.suggestedFilename()).toBe(`shift-sheets-plan-${planId}-${new URL(page.url()).searchParams.get('week')}-${code}.pdf`);
      const info = execFileSync('pdfinfo', [file], { encoding: 'utf8' });
      expect(Number(/^Pages:\s+(\d+)/m.exec(info)![1])).toBe(count);
      for (let p = 1; p <= count; p++) {
        const text = execFileSync('pdftotext', ['-f', String(p), '-l', String(p), '-layout', file, '-'], { encoding: 'utf8' });
        expect(text).toMatch(new RegExp(`Shift sheet · ${code} .* · Shift \\d+`));
        expect(text).toContain(`Page ${p} of ${count}`);
      }
      // keep the first page as a picture beside the screenshots, for people to look at
      const shots = resolve(screenshotRoot, suite);
      mkdirSync(shots, { recursive: true });
      execFileSync('pdftoppm', ['-png', '-r', '80', '-f', '1', '-l', '1', file, resolve(shots, 'floor-lead-pdf-page')]);
      expect(floor.problems).toEqual([]);
    } finally {
      await floor.close();
    }
  });
});
