import { mkdirSync, rmSync } from 'node:fs';
import { resolve } from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { repoRoot } from './browser-env';

/** Launch arguments from STACK.md ("Chromium for browser tests and PDFs"). */
const launchArgs = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

export function launchBrowser(executablePath: string): Promise<Browser> {
  return chromium.launch({ executablePath, headless: true, args: launchArgs });
}

/** Where screenshots go (git-ignored). */
export const screenshotRoot = resolve(repoRoot, '.millrace/screenshots');

/** Empties a suite's screenshot folder, so only this run's steps are there to look at. */
export function clearScreenshots(suite: string): void {
  rmSync(resolve(screenshotRoot, suite), { recursive: true, force: true });
}

/**
 * A browser page that records every console error, page error, failed request and error
 * answer, so a flow can fail on any of them, on the sign-in page too: the app asks who is
 * signed in through the open GET /api/session (200 either way), so no error is expected by design.
 */
export class WatchedPage {
  readonly problems: string[] = [];
  private step = 0;

  private constructor(
    readonly context: BrowserContext,
    readonly page: Page,
    private readonly shots: string,
  ) {}

  static async open(browser: Browser, baseURL: string, suite: string, who: string): Promise<WatchedPage> {
    // 1024 px wide: the narrowest width the planner promises to be usable at.
    const context = await browser.newContext({ baseURL, viewport: { width: 1024, height: 900 }, acceptDownloads: true });
    const page = await context.newPage();
    const shots = resolve(screenshotRoot, suite);
    mkdirSync(shots, { recursive: true });
    const w = new WatchedPage(context, page, `${shots}/${who}`);
    page.on('console', (msg) => {
      if (msg.type() !== 'error') return;
      w.problems.push(`console error: ${msg.text()} (${msg.location().url})`);
    });
    page.on('pageerror', (err) => w.problems.push(`page error: ${err.message}`));
    page.on('requestfailed', (req) => {
      // A file the browser saves as a download ends its navigation request as aborted.
      if (req.failure()?.errorText === 'net::ERR_ABORTED' && /\.(mps|csv|pdf)$/.test(new URL(req.url()).pathname)) return;
      // A read the app itself cancels (TanStack Query aborts a query whose page was left) is not a failure.
      if (req.failure()?.errorText === 'net::ERR_ABORTED' && req.method() === 'GET' && req.resourceType() === 'fetch') return;
      w.problems.push(`request failed: ${req.method()} ${req.url()} ${req.failure()?.errorText ?? ''}`);
    });
    page.on('response', (res) => {
      if (res.status() < 400) return;
      w.problems.push(`error answer: ${res.status()} ${res.request().method()} ${res.url()}`);
    });
    return w;
  }

  /** Saves a full-page screenshot named by its step number and name. */
  async shot(name: string): Promise<void> {
    this.step += 1;
    await this.page.screenshot({ path: `${this.shots}-${String(this.step).padStart(2, '0')}-${name}.png`, fullPage: true });
  }

  async close(): Promise<void> {
    await this.context.close();
  }
}
