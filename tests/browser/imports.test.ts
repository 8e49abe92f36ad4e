import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readBrowserEnv } from './support/browser-env';
import { demoPeople, signIn } from './support/sign-in';
import { startTestServer, type TestServer } from './support/test-server';
import { launchBrowser, WatchedPage } from './support/watched-page';

/**
 * Issue 7's browser flow on the real server with the demo plant: a planner uploads a bill of
 * materials workbook whose suggested quantity column holds text on two rows, sees both rows
 * flagged, points the quantity at the right column, applies, and finds the new quantities in
 * the product editor. Any console error, failed request or error answer fails the flow.
 */
const suite = 'imports';
let server: TestServer;
let browser: Browser;
let dir: string;
let workbookPath: string;

beforeAll(async () => {
  const env = readBrowserEnv();
  dir = mkdtempSync(join(tmpdir(), 'millrace-import-flow-'));
  // The drawer box's BOM as purchasing keeps it: a merged title, the header on row 3, a pack
  // quantity column ("qty") beside the usage per unit. The demo plant stores PLY-BIRCH-12 0.45
  // (scrap 6 %), SLD-450 1, SCR-4X40 12, GLU-PVA 0.03.
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet('Drawer box');
  ws.getCell('A1').value = 'Drawer box — bill of materials (purchasing copy)';
  ws.mergeCells('A1:E1');
  ws.getRow(3).values = ['parent', 'component', 'qty', 'usage per unit', 'scrap %'];
  ws.addRow(['DRW-BOX', 'PLY-BIRCH-12', 'sheet of 4', 0.5, 6]);
  ws.addRow(['DRW-BOX', 'SLD-450', 1, 1, 0]);
  ws.addRow(['DRW-BOX', 'SCR-4X40', 'box of 100', 16, 0]);
  ws.addRow(['DRW-BOX', 'GLU-PVA', 1, 0.03, 0]);
  workbookPath = join(dir, 'drawer-box-bom.xlsx');
  await wb.xlsx.writeFile(workbookPath);
  server = await startTestServer(env);
  browser = await launchBrowser(env.chromiumPath);
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
  if (dir) rmSync(dir, { recursive: true, force: true });
});

describe('spreadsheet import in the browser', () => {
  it('when a planner uploads a BOM workbook with two bad rows, fixes the column mapping and applies, then the product editor shows the new BOM', async () => {
    const w = await WatchedPage.open(browser, server.url, suite, 'planner');
    const { page } = w;
    try {
      await signIn(w, demoPeople.planner);
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Imports' }).click();
      await page.getByLabel('What the file holds').selectOption({ label: 'Bills of materials' });
      await page.getByLabel(/^File \(CSV or XLSX/).setInputFiles(workbookPath);
      await page.getByRole('button', { name: 'Check file' }).click();

      // Two rows flagged: the pack quantities are text, said in words beside the cells.
      await page.getByText('2 of 4 rows have problems', { exact: false }).waitFor();
      const table = page.getByRole('table').filter({ hasText: 'DRW-BOX' });
      await expect.poll(() => table.getByText('sheet of 4 is not a number.', { exact: false }).count()).toBeGreaterThan(0);
      await expect.poll(() => table.getByText('box of 100 is not a number.', { exact: false }).count()).toBeGreaterThan(0);
      expect(await page.getByRole('button', { name: 'Import 4 rows' }).isDisabled()).toBe(true);
      await w.shot('two-rows-flagged');

      // The right column for the quantity per unit.
      await page.getByLabel(/^quantity per/).selectOption('usage per unit');
      await page.getByRole('button', { name: 'Check again with this mapping' }).click();
      await page.getByText('Applying would add 0, change 2, leave 2 as they are', { exact: false }).waitFor();
      await w.shot('mapping-fixed');

      await page.getByRole('button', { name: 'Import 4 rows' }).click();
      await page.getByText('Imported: 0 new, 2 changed, 2 unchanged', { exact: false }).waitFor();
      await page.getByRole('table').filter({ hasText: 'drawer-box-bom.xlsx' }).waitFor();
      await w.shot('applied-history');

      // The product editor shows the imported bill of materials.
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Products' }).click();
      await page.getByRole('link', { name: 'DRW-BOX', exact: true }).click();
      await page.getByRole('tab', { name: /Bill of materials \(4\)/ }).click();
      const qty = (line: number) => page.getByLabel(`Quantity per unit, line ${line}`).inputValue();
      await page.getByLabel('Quantity per unit, line 1').waitFor();
      expect([await qty(1), await qty(2), await qty(3), await qty(4)]).toEqual(['0.5', '1', '16', '0.03']);
      const component = (line: number) => page.getByLabel(`Component, line ${line}`).locator('option:checked').textContent();
      expect(await component(1)).toContain('PLY-BIRCH-12');
      expect(await component(3)).toContain('SCR-4X40');
      await w.shot('product-editor-bom');

      expect(w.problems).toEqual([]);
    } finally {
      await w.close();
    }
  });
});
