/**
 * Benchmark: master-data lists, the demand grid and the home summary with 2,000 products,
 * 2,000 materials, 50 work centers and 13 weeks of demand for every product. Prints the median
 * and worst time of each request; it asserts nothing (speed goals live here, not in tests).
 *
 *   DB_HOST=127.0.0.1 DB_PORT=3418 DB_USER=… DB_PASSWORD=… DB_NAME=millrace_bench \
 *     node --import tsx apps/api/bench/master-data-lists.ts
 *
 * It creates and drops its own throw-away database (DB_NAME plus a random suffix).
 */
import { performance } from 'node:perf_hooks';
import request from 'supertest';
import { addDays, weekStartOf } from '@millrace/contracts';
import { createApp } from '../src/app';
import { loadConfig } from '../src/config';
import { createTestDatabase } from '../test/support/test-db';
import { seedPeople, testPassword, testPeople } from '../test/support/seed-people';

const productCount = 2000;
const materialCount = 2000;
const workCenterCount = 50;
const weeks = 13;
const runs = 7;

async function main(): Promise<void> {
  const db = await createTestDatabase();
  try {
    const ds = db.dataSource;
    await seedPeople(ds);
    const now = '2026-01-01 00:00:00.000';
    const values = (n: number, row: (i: number) => string) => Array.from({ length: n }, (_, i) => row(i)).join(',');
    await ds.query(
      `INSERT INTO work_center (code, name, efficiency, overtime_cap_hours, overtime_cost_per_hour, shifts_per_day, hours_per_shift, days_per_week, shift_starts, version, created_at, updated_at) VALUES ${values(workCenterCount, (i) => `('WC-${i}', 'Work center ${i}', 0.9, 8, 40, 2, 8, 5, '06:00,14:00', 1, '${now}', '${now}')`)}`,
    );
    await ds.query(
      `INSERT INTO material (code, name, unit, unit_cost, on_hand, lead_time_weeks, weekly_supply_cap, lot_rule, lot_size, version, created_at, updated_at) VALUES ${values(materialCount, (i) => `('M-${String(i).padStart(5, '0')}', 'Material ${(i * 7919) % materialCount}', 'kg', ${1 + (i % 50)}, ${i % 300}, ${i % 6}, NULL, 'lot_for_lot', NULL, 1, '${now}', '${now}')`)}`,
    );
    await ds.query(
      `INSERT INTO product (code, name, unit, kind, price, holding_cost_rate_pct, safety_stock, batch_multiple, opening_stock, late_penalty, family, active, version, created_at, updated_at) VALUES ${values(productCount, (i) => `('P-${String(i).padStart(5, '0')}', 'Product ${(i * 7919) % productCount}', 'pcs', 'finished', ${10 + (i % 90)}, 24, 0, 1, 0, 1, 'F${i % 20}', 1, 1, '${now}', '${now}')`)}`,
    );
    await ds.query(`INSERT INTO routing_step (product_id, sequence, work_center_id, hours_per_unit, setup_hours) SELECT p.id, 10, 1 + (p.id % ${workCenterCount}), 0.05, 0 FROM product p`);
    await ds.query(`INSERT INTO bom_line (parent_product_id, position, component_product_id, material_id, qty_per, scrap_pct) SELECT p.id, 1, NULL, 1 + (p.id % ${materialCount}), 1, 0 FROM product p`);
    const week0 = weekStartOf(new Date().toISOString().slice(0, 10), 'monday');
    for (let k = 0; k < weeks; k++) {
      const w = addDays(week0, 7 * k);
      await ds.query(`INSERT INTO demand_forecast (product_id, week_start, qty, version, created_at, updated_at) SELECT p.id, '${w}', 5 + (p.id % 7), 1, '${now}', '${now}' FROM product p`);
      if (k < 6) await ds.query(`INSERT INTO firm_order (product_id, week_start, order_ref, qty, version, created_at, updated_at) SELECT p.id, '${w}', CONCAT('SO-', p.id, '-${k}'), 3, 1, '${now}', '${now}' FROM product p`);
    }

    const config = { ...loadConfig({ ...process.env, NODE_ENV: 'test', DB_NAME: db.config.name, DB_USER: db.config.user }), plannerDist: undefined, db: db.config };
    const app = createApp({ dataSource: ds, config });
    const agent = request.agent(app).set('Origin', config.http.publicUrl);
    await agent.post('/api/auth/sign-in').send({ email: testPeople.planner.email, password: testPassword }).expect(200);

    const cases: Array<[string, string]> = [
      ['products, page 1 of 50 by code', '/api/products?pageSize=50'],
      ['products, page 20 of 50 by name desc', '/api/products?pageSize=50&page=20&sort=name&dir=desc'],
      ['products, search "Product 19"', '/api/products?q=Product%2019&pageSize=50'],
      ['products, all 2,000 in one page', '/api/products?pageSize=2000'],
      ['materials, page 1 of 50 by lead time', '/api/materials?pageSize=50&sort=leadTimeWeeks'],
      ['materials, all 2,000 in one page', '/api/materials?pageSize=2000'],
      ['work centers, all', '/api/work-centers?pageSize=100'],
      ['demand grid, 200 products × 13 weeks', '/api/demand?weeks=13&pageSize=200'],
      ['demand grid, 2,000 products × 13 weeks', '/api/demand?weeks=13&pageSize=2000'],
      ['home summary, 6 weeks', '/api/home?weeks=6'],
      ['home summary, 13 weeks', '/api/home?weeks=13'],
    ];
    console.log(`data: ${productCount} products, ${materialCount} materials, ${workCenterCount} work centers, ${weeks} weeks of demand (${productCount * weeks} forecasts, ${productCount * 6} firm orders)`);
    for (const [label, url] of cases) {
      const times: number[] = [];
      let bytes = 0;
      for (let r = 0; r < runs; r++) {
        const t0 = performance.now();
        const res = await agent.get(url);
        times.push(performance.now() - t0);
        if (res.status !== 200) throw new Error(`${url} answered ${res.status}: ${JSON.stringify(res.body).slice(0, 300)}`);
        bytes = res.text.length;
      }
      times.sort((a, b) => a - b);
      console.log(`${label.padEnd(42)} median ${times[Math.floor(runs / 2)].toFixed(1).padStart(7)} ms   worst ${times[runs - 1].toFixed(1).padStart(7)} ms   ${(bytes / 1024).toFixed(0).padStart(6)} kB`);
    }
  } finally {
    await db.drop();
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
