#!/usr/bin/env node
/**
 * Benchmark: how the planner's tables behave with 2,000 products (issue 5 item 3, "smooth with
 * 2,000 rows"). Drives Debian's Chromium with playwright-core against a running Millrace
 * (API + built planner) and prints timings; it asserts nothing.
 *
 *   node apps/planner/scripts/bench-tables.mjs [--url http://127.0.0.1:8080] [--seed]
 *
 * --seed tops the product list up to 2,000 with BULK-nnnn products and four weeks of forecast
 * each, through the API as the demo planner. It WRITES to that database: use a throw-away one.
 */
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const { chromium } = require('playwright-core');

const args = process.argv.slice(2);
const url = (args.includes('--url') ? args[args.indexOf('--url') + 1] : 'http://127.0.0.1:8080').replace(/\/+$/, '');
const seed = args.includes('--seed');
const email = process.env.BENCH_EMAIL ?? 'planner@millrace.test';
const password = process.env.BENCH_PASSWORD ?? 'millrace-demo';
/** Rows the issue asks to stay smooth with. */
const targetRows = 2000;
/** Scroll steps and their size for the frame-time measurement. */
const scrollSteps = 120;
const scrollStepPx = 250;
/** Key moves timed in the demand grid. */
const keyMoves = 60;

async function seedProducts() {
  const signIn = await fetch(`${url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: url },
    body: JSON.stringify({ email, password }),
  });
  if (!signIn.ok) throw new Error(`Sign-in as ${email} failed: ${signIn.status}`);
  const cookie = signIn.headers.get('set-cookie').split(';')[0];
  const headers = { 'Content-Type': 'application/json', Origin: url, cookie };
  const { total } = await (await fetch(`${url}/api/products?pageSize=1`, { headers })).json();
  const { weeks } = await (await fetch(`${url}/api/demand?weeks=4&pageSize=1`, { headers })).json();
  const ids = [];
  for (let n = total + 1; n <= targetRows; n++) {
    const r = await fetch(`${url}/api/products`, {
      method: 'POST',
      headers,
      body: JSON.stringify({ code: `BULK-${String(n).padStart(4, '0')}`, name: `Bulk item ${n}`, unit: 'pcs', kind: 'finished' }),
    });
    if (!r.ok) throw new Error(`Creating BULK-${n} failed: ${r.status} ${await r.text()}`);
    ids.push((await r.json()).id);
  }
  for (let i = 0; i < ids.length; i += 500) {
    const changes = ids.slice(i, i + 500).flatMap((id, k) => weeks.map((w, j) => ({ kind: 'forecast', productId: id, weekStart: w, qty: ((k + j) % 7) + 1, version: null })));
    const r = await fetch(`${url}/api/demand`, { method: 'PUT', headers, body: JSON.stringify({ changes }) });
    if (!r.ok) throw new Error(`Saving forecasts failed: ${r.status} ${await r.text()}`);
  }
  console.log(`seeded ${ids.length} products (now ${Math.max(total, targetRows)})`);
}

/** Scrolls the scroll container around `tableSelector` step by step and times the frames. */
async function scrollFrames(page, tableSelector) {
  return page.evaluate(
    async ({ selector, steps, px }) => {
      const el = document.querySelector(selector).parentElement;
      const times = [];
      let last = performance.now();
      for (let i = 0; i < steps; i++) {
        el.scrollTop += px;
        await new Promise((r) => requestAnimationFrame(r));
        const now = performance.now();
        times.push(now - last);
        last = now;
      }
      times.sort((a, b) => a - b);
      return { mean: times.reduce((s, t) => s + t, 0) / times.length, p95: times[Math.floor(times.length * 0.95)], max: times[times.length - 1] };
    },
    { selector: tableSelector, steps: scrollSteps, px: scrollStepPx },
  );
}
const frameLine = (f) => `frame mean ${f.mean.toFixed(1)} ms, p95 ${f.p95.toFixed(1)} ms, max ${f.max.toFixed(1)} ms`;

if (seed) await seedProducts();

const browser = await chromium.launch({
  executablePath: '/usr/bin/chromium',
  headless: true,
  args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
});
try {
  const page = await (await browser.newContext({ viewport: { width: 1024, height: 800 } })).newPage();
  await page.goto(`${url}/sign-in`);
  await page.getByRole('textbox', { name: 'E-mail' }).fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('navigation', { name: 'Main' }).waitFor();

  let t = Date.now();
  await page.getByRole('link', { name: 'Products' }).click();
  await page.getByText(/^\d+ rows$/).waitFor();
  const count = (await page.getByText(/^\d+ rows$/).textContent()).split(' ')[0];
  console.log(`products: ${count} rows listed ${Date.now() - t} ms after the click (request + render)`);
  if (Number(count) < targetRows) console.log(`  (fewer than ${targetRows} products: run with --seed on a throw-away database)`);
  console.log(`products: ${await page.locator('table[aria-label="Products"] tbody tr').count()} rows in the DOM`);
  console.log(`products: scroll ${scrollSteps} × ${scrollStepPx} px: ${frameLine(await scrollFrames(page, 'table[aria-label="Products"]'))}`);
  t = Date.now();
  await page.getByRole('button', { name: /^Name/ }).click();
  await page.waitForFunction(() => location.search.includes('sort=name'));
  console.log(`products: sort by name ${Date.now() - t} ms`);
  t = Date.now();
  await page.getByRole('searchbox', { name: 'Search products' }).fill('9');
  await page.getByText(/rows match$/).waitFor();
  console.log(`products: search "9" ${Date.now() - t} ms`);

  t = Date.now();
  await page.getByRole('link', { name: 'Demand' }).click();
  await page.locator('[data-cell="0:0"]').waitFor();
  console.log(`demand: grid shown ${Date.now() - t} ms after the click (request + render)`);
  console.log(`demand: ${await page.locator('[role=grid] tbody td[role=gridcell]').count()} cells in the DOM`);
  await page.locator('[data-cell="0:0"]').click();
  t = Date.now();
  for (let i = 0; i < keyMoves; i++) await page.keyboard.press('ArrowDown');
  await page.waitForFunction((n) => document.activeElement?.getAttribute('data-cell') === `${n}:0`, keyMoves);
  const moves = Date.now() - t;
  console.log(`demand: ${keyMoves} × ArrowDown ${moves} ms (${(moves / keyMoves).toFixed(1)} ms a move, focus following)`);
  t = Date.now();
  await page.keyboard.type('42');
  await page.keyboard.press('Enter');
  await page.getByText('• 1 unsaved change').waitFor();
  console.log(`demand: type a quantity + Enter until totals and counter update ${Date.now() - t} ms`);
  console.log(`demand: scroll ${scrollSteps} × ${scrollStepPx} px: ${frameLine(await scrollFrames(page, '[role=grid]'))}`);
} finally {
  await browser.close();
}
