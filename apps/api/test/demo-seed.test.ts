import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { validatePlanningData } from '@millrace/plan-model';
import { createApp } from '../src/app';
import { loadConfig } from '../src/config';
import { seedDemoPlant } from '../src/db/seed-demo';
import { demoWorkCenterAssignments } from '../src/db/demo-plant/plant';
import { getHomeSummary } from '../src/home/get-home-summary.use-case';
import { loadPlanningData } from '../src/planning-data/load-planning-data';
import { createTestDatabase, type TestDatabase } from './support/test-db';
import { countRows } from './support/master-data';

let db: TestDatabase;
beforeAll(async () => {
  db = await createTestDatabase();
});
afterAll(async () => db?.drop());

const tables = ['person', 'product', 'bom_line', 'routing_step', 'work_center', 'work_center_week', 'material', 'scheduled_receipt', 'firm_order', 'demand_forecast'];
async function counts(): Promise<Record<string, number>> {
  return Object.fromEntries(await Promise.all(tables.map(async (t) => [t, await countRows(db.dataSource, t)] as const)));
}

describe('demo plant loader', () => {
  it('when the database is empty, then it loads once, and a second run changes nothing', async () => {
    expect(await seedDemoPlant(db.dataSource)).toBe('loaded');
    const first = await counts();
    expect(await seedDemoPlant(db.dataSource)).toBe('skipped_not_empty');
    expect(await counts()).toEqual(first);
  });

  it('when loaded, then it has the size issue 2 asks for: ≥ 20 products with sub-assemblies, ≥ 8 work centers on 1–3 shifts, ≥ 30 materials, 13 weeks of firm and forecast demand', async () => {
    const c = await counts();
    expect(c.person).toBe(4);
    expect(c.product).toBeGreaterThanOrEqual(20);
    expect(c.work_center).toBeGreaterThanOrEqual(8);
    expect(c.material).toBeGreaterThanOrEqual(30);
    expect(c.scheduled_receipt).toBeGreaterThan(0);
    const shifts = (await db.dataSource.query('SELECT DISTINCT shifts_per_day AS s FROM work_center ORDER BY s')) as Array<{ s: number }>;
    expect(shifts.map((r) => r.s)).toEqual([1, 2, 3]);
    const capped = (await db.dataSource.query('SELECT COUNT(*) AS n FROM material WHERE weekly_supply_cap IS NOT NULL')) as Array<{ n: string }>;
    expect(Number(capped[0].n)).toBeGreaterThan(0);

    const data = await db.dataSource.transaction((m) => loadPlanningData(m, 13));
    expect(data.products.filter((p) => p.kind === 'subassembly').length).toBeGreaterThan(0);
    // the current week and the 12 after it carry firm and forecast demand
    expect(new Set(data.demand.map((d) => d.week))).toEqual(new Set(Array.from({ length: 13 }, (_, i) => i + 1)));
    expect(data.demand.some((d) => d.kind === 'firm') && data.demand.some((d) => d.kind === 'forecast')).toBe(true);
    // a multi-level BOM: some product three product levels deep
    const children = new Map<string, string[]>();
    for (const l of data.bom) if (l.componentProduct) children.set(l.parent, [...(children.get(l.parent) ?? []), l.componentProduct]);
    const depth = (code: string): number => 1 + Math.max(0, ...(children.get(code) ?? []).map(depth));
    expect(Math.max(...data.products.map((p) => depth(p.code)))).toBeGreaterThanOrEqual(3);
    // the planning model accepts the data as it is
    expect(validatePlanningData(data, 13)).toEqual([]);
  });

  it('when the home summary checks the 13 weeks, then two or three work centers are over-loaded in some weeks, not everywhere', async () => {
    const summary = await getHomeSummary(db.dataSource, { weeks: 13 });
    const overLoaded = summary.workCenters.filter((w) => w.cells.some((c) => c.status === 'over_loaded')).map((w) => w.code);
    expect(overLoaded.length).toBeGreaterThanOrEqual(2);
    expect(overLoaded.length).toBeLessThanOrEqual(3);
    for (const code of overLoaded) {
      const cells = summary.workCenters.find((w) => w.code === code)!.cells;
      expect(cells.some((c) => c.status === 'within_capacity')).toBe(true);
    }
  });

  it('when a demo person signs in with the demo password, then the role comes back', async () => {
    const config = { ...loadConfig({ ...process.env, NODE_ENV: 'test', DB_NAME: db.config.name, DB_USER: db.config.user }), plannerDist: undefined, db: db.config };
    const app = createApp({ dataSource: db.dataSource, config });
    for (const [email, role] of [
      ['admin@millrace.test', 'admin'],
      ['planner@millrace.test', 'planner'],
      ['supervisor@millrace.test', 'supervisor'],
      ['floor@millrace.test', 'floor_lead'],
    ]) {
      const res = await request(app).post('/api/auth/sign-in').set('Origin', config.http.publicUrl).send({ email, password: 'millrace-demo' });
      expect(res.status).toBe(200);
      expect(res.body.role).toBe(role);
    }
  });

  it('when loaded, then the demo floor lead is assigned the work centers the demo data names, and nobody else any', async () => {
    const rows: { email: string; code: string }[] = await db.dataSource.query(
      'SELECT p.email, w.code FROM person_work_center l JOIN person p ON p.id = l.person_id JOIN work_center w ON w.id = l.work_center_id ORDER BY p.email, w.code',
    );
    const expected = Object.entries(demoWorkCenterAssignments).flatMap(([email, codes]) => [...codes].sort().map((code) => ({ email, code })));
    expect(rows).toEqual(expected);
    expect(rows.every((r) => r.email === 'floor@millrace.test')).toBe(true);
  });
});
