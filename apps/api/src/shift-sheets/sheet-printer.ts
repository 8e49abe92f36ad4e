import { existsSync } from 'node:fs';
import { chromium, type Browser } from 'playwright-core';
import type { Paper } from '@millrace/contracts';
import { AppError } from '../http/app-error';

/** Launch arguments from STACK.md ("Chromium for browser tests and PDFs"). */
export const chromiumLaunchArgs = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/** Longest wait for the print view to say it is ready (it loads the sheets over the API). */
const printViewTimeoutMs = 30_000;

/** Page margins of the PDF; the bottom one leaves room for the "page N of M" footer. */
const pdfMargin = { top: '9mm', right: '9mm', bottom: '13mm', left: '9mm' };

export interface PrintRequest {
  /** the print view's URL on this server */
  url: string;
  /** the session cookie the print view reads the sheets with */
  cookie: { name: string; value: string };
  paper: Paper;
}

/**
 * Renders the print view to PDF with Debian's Chromium through playwright-core. One browser per
 * process, launched on the first PDF and closed on shutdown; each PDF gets its own browser
 * context (cookies never shared between people). The print view marks its root with
 * `data-print-state="ready"` (or `"error"` with the reason) once the sheets and fonts are in.
 */
export class SheetPrinter {
  private browser: Promise<Browser> | null = null;

  constructor(private readonly executablePath: string) {}

  private launch(): Promise<Browser> {
    if (!this.browser) {
      if (!existsSync(this.executablePath)) {
        throw new AppError(503, 'internal_error', `PDFs are drawn by Chromium, which is not installed at ${this.executablePath}. Install Debian's chromium package or set CHROMIUM_PATH.`);
      }
      const launching = chromium.launch({ executablePath: this.executablePath, headless: true, args: chromiumLaunchArgs });
      this.browser = launching.then((b) => {
        b.on('disconnected', () => {
          if (this.browser === launching) this.browser = null;
        });
        return b;
      });
      this.browser.catch(() => {
        if (this.browser !== null) this.browser = null;
      });
    }
    return this.browser;
  }

  async print(req: PrintRequest): Promise<Buffer> {
    const browser = await this.launch();
    const origin = new URL(req.url).origin;
    const context = await browser.newContext({ viewport: { width: 1123, height: 794 } });
    try {
      await context.addCookies([{ name: req.cookie.name, value: req.cookie.value, url: origin, httpOnly: true, sameSite: 'Lax' }]);
      const page = await context.newPage();
      await page.emulateMedia({ media: 'print' });
      await page.goto(req.url, { waitUntil: 'load' });
      const root = page.locator('[data-print-state="ready"], [data-print-state="error"]').first();
      await root.waitFor({ timeout: printViewTimeoutMs }).catch((err: Error) => {
        if (err.name !== 'TimeoutError') throw err;
        throw new AppError(503, 'internal_error', `The print view did not show the sheets within ${printViewTimeoutMs / 1000} s; try again in a moment.`);
      });
      if ((await root.getAttribute('data-print-state')) === 'error') {
        throw new AppError(502, 'internal_error', `The print view could not show the sheets: ${(await root.innerText()).trim()}`);
      }
      await page.evaluate('document.fonts.ready.then(() => true)');
      return await page.pdf({
        format: req.paper === 'letter' ? 'Letter' : 'A4',
        landscape: true,
        printBackground: true,
        preferCSSPageSize: false,
        margin: pdfMargin,
        displayHeaderFooter: true,
        headerTemplate: '<span></span>',
        footerTemplate:
          '<div style="width:100%;font-family:\'IBM Plex Sans\',sans-serif;font-size:8px;color:#000;text-align:right;padding:0 9mm;">Page <span class="pageNumber"></span> of <span class="totalPages"></span></div>',
      });
    } finally {
      await context.close().catch(() => undefined);
    }
  }

  /** Closes the browser if one was launched (server shutdown, end of a test file). */
  async close(): Promise<void> {
    const launching = this.browser;
    this.browser = null;
    if (!launching) return;
    const browser = await launching.catch(() => null);
    await browser?.close().catch(() => undefined);
  }
}

const printers = new Map<string, SheetPrinter>();

/** The process's printer for one Chromium (created lazily; the browser itself launches on first use). */
export function sheetPrinterFor(executablePath: string): SheetPrinter {
  let printer = printers.get(executablePath);
  if (!printer) {
    printer = new SheetPrinter(executablePath);
    printers.set(executablePath, printer);
  }
  return printer;
}

/** Closes every browser this process launched for PDFs. */
export async function closeSheetPrinters(): Promise<void> {
  await Promise.all([...printers.values()].map((p) => p.close()));
}
