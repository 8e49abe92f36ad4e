/**
 * Benchmark: a plan version through the API from POST /api/plans/:id/solve to its final state
 * (the job claimed from the table, solved in the solver thread, mapped back, rounded, checked
 * and stored), for the demo plant and for generated plants. Prints numbers; asserts nothing
 * (speed goals live here, not in tests; issue 4: demo plant under 2 s, 200 × 26 under 5 s).
 *
 *   DB_HOST=127.0.0.1 DB_PORT=3418 DB_USER=… DB_PASSWORD=… DB_NAME=millrace_bench \
 *     node --import tsx apps/api/bench/plan-solve-e2e.ts [demo,200x26,1000x52]
 *
 * MEASURED_ROUNDS=N (default 3) sets how many measured runs follow the warm-up; WARM_UP=0 leaves the
 * warm-up out (for the largest plants, where one solve takes minutes and JIT start-up is noise).
 *
 * With SAVE_MPS=DIR set, each measured case's model.mps is saved there (for lp-core's CLI and bench).
 *
 * Besides the totals it prints each stage of the job (the solver thread's stages, reading the job's
 * inputs, passing work to and from the thread, storing the outcome) and what is left of the
 * POST solve → final time beyond them ("other": the HTTP calls, the job queue's poll, commits),
 * and the whole-units margin against the LP bound. The warm-up's cross-check is waited for
 * before the measured round, so it does not share the CPU with the measured solve.
 *
 * Each case gets its own throw-away database (DB_NAME plus a random suffix). Generated plants
 * are invented: N finished products on 2 routing steps over N/10 work centers, 1–2 materials each.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { addDays } from '@millrace/contracts';
import { createApp } from '../src/app';
import { loadConfig } from '../src/config';
import { seedDemoPlant } from '../src/db/seed-demo';
import { demoWeeks } from '../src/db/demo-plant/demand';
import { currentWeekStart } from '../src/master-data/weeks';
import { SolverJobRunner } from '../src/solver-jobs/solver-job-runner';
import { createTestDatabase } from '../test/support/test-db';
import { seedPeople, testPassword, testPeople } from '../test/support/seed-people';

/**
 * How often the bench asks for the run's state (the planner UI asks every 700 ms). Each poll is an
 * HTTP request and a database read on the same 2 cores as the solve (every 10 ms slowed the solve),
 * so the bench asks seldom and takes the end time from the run itself: POST solve → final is the
 * run's finishedAt (written by the API when the plan reaches its final state, same clock) minus
 * the wall-clock time just before the POST. The time the poller saw it is printed beside it.
 */
const POLL_MS = 250;

/**
 * Measured rounds per case (MEASURED_ROUNDS, default 3): single runs on this shared 2-core machine
 * vary by ±20 %, so the bench prints each run and their min, median and max.
 */
const MEASURED_ROUNDS = Number(process.env.MEASURED_ROUNDS ?? 3);
if (!Number.isInteger(MEASURED_ROUNDS) || MEASURED_ROUNDS < 1) {
  throw new Error(`MEASURED_ROUNDS must be a whole number of at least 1, got "${process.env.MEASURED_ROUNDS}"`);
}
const WARM_UP = (process.env.WARM_UP ?? '1') !== '0';

interface Case {
  label: string;
  horizonWeeks: number;
  seed(ds: DataSource): Promise<{ email: string; password: string }>;
}

function parseCases(arg: string | undefined): Case[] {
  return (arg ?? 'demo,200x26').split(',').map((c) => {
    if (c === 'demo') {
      return {
        label: 'demo plant',
        horizonWeeks: demoWeeks,
        seed: async (ds) => {
          await seedDemoPlant(ds);
          return { email: 'planner@millrace.test', password: 'millrace-demo' };
        },
      };
    }
    const m = /^(\d+)x(\d+)$/.exec(c);
    if (!m) throw new Error(`unknown case "${c}": use demo or <products>x<weeks>`);
    const [products, weeks] = [Number(m[1]), Number(m[2])];
    return { label: `${products} products × ${weeks} weeks`, horizonWeeks: weeks, seed: (ds) => seedGenerated(ds, products, weeks) };
  });
}

async function seedGenerated(ds: DataSource, products: number, weeks: number): Promise<{ email: string; password: string }> {
  await seedPeople(ds);
  const now = '2026-01-01 00:00:00.000';
  const wcs = Math.max(4, Math.round(products / 10));
  const mats = Math.max(3, Math.round(products / 8));
  const rows = (n: number, row: (i: number) => string) => Array.from({ length: n }, (_, i) => row(i)).join(',');
  await ds.query(
    `INSERT INTO work_center (code, name, efficiency, overtime_cap_hours, overtime_cost_per_hour, shifts_per_day, hours_per_shift, days_per_week, shift_starts, version, created_at, updated_at) VALUES ${rows(wcs, (i) => `('W${i}', 'Station ${i}', 0.9, 16, ${40 + (i % 5) * 5}, 2, 8, 5, '06:00,14:00', 1, '${now}', '${now}')`)}`,
  );
  await ds.query(
    `INSERT INTO material (code, name, unit, unit_cost, on_hand, lead_time_weeks, weekly_supply_cap, lot_rule, lot_size, version, created_at, updated_at) VALUES ${rows(mats, (i) => `('M${i}', 'Stock ${i}', 'kg', ${1 + (i % 9)}, ${100 + (i % 7) * 50}, ${i % 3}, ${i % 4 === 0 ? 2000 : 'NULL'}, 'lot_for_lot', NULL, 1, '${now}', '${now}')`)}`,
  );
  await ds.query(
    `INSERT INTO product (code, name, unit, kind, price, holding_cost_rate_pct, safety_stock, batch_multiple, opening_stock, late_penalty, family, active, version, created_at, updated_at) VALUES ${rows(products, (i) => `('P${String(i).padStart(5, '0')}', 'Part ${i}', 'pcs', 'finished', ${60 + ((i * 37) % 140)}, 24, ${i % 5}, 1, ${i % 11}, 5, NULL, 1, 1, '${now}', '${now}')`)}`,
  );
  await ds.query(`INSERT INTO routing_step (product_id, sequence, work_center_id, hours_per_unit, setup_hours) SELECT p.id, 10, 1 + (p.id % ${wcs}), 0.2 + (p.id % 7) / 10, 0 FROM product p`);
  await ds.query(`INSERT INTO routing_step (product_id, sequence, work_center_id, hours_per_unit, setup_hours) SELECT p.id, 20, 1 + ((p.id + 3) % ${wcs}), 0.1 + (p.id % 5) / 10, 0 FROM product p`);
  await ds.query(`INSERT INTO bom_line (parent_product_id, position, material_id, qty_per, scrap_pct) SELECT p.id, 1, 1 + (p.id % ${mats}), 1 + (p.id % 3) / 2, 2 FROM product p`);
  await ds.query(`INSERT INTO bom_line (parent_product_id, position, material_id, qty_per, scrap_pct) SELECT p.id, 2, 1 + ((p.id * 7) % ${mats}), 0.5, 0 FROM product p WHERE p.id % 2 = 0`);
  const first = currentWeekStart('monday');
  for (let k = 0; k < weeks; k++) {
    const w = addDays(first, 7 * k);
    await ds.query(`INSERT INTO firm_order (product_id, week_start, order_ref, qty, version, created_at, updated_at) SELECT p.id, '${w}', CONCAT('SO-', p.id, '-${k}'), 4 + ((p.id + ${k}) % 9), 1, '${now}', '${now}' FROM product p`);
    await ds.query(`INSERT INTO demand_forecast (product_id, week_start, qty, version, created_at, updated_at) SELECT p.id, '${w}', (p.id * ${k + 1}) % 8, 1, '${now}', '${now}' FROM product p`);
  }
  return { email: testPeople.planner.email, password: testPassword };
}

async function runCase(c: Case): Promise<void> {
  const db = await createTestDatabase();
  // the runner's production settings: a queued job wakes its lane at once, polling is the fallback
  const runner = new SolverJobRunner(db.dataSource);
  try {
    const credentials = await c.seed(db.dataSource);
    const config = { ...loadConfig({ ...process.env, NODE_ENV: 'test', DB_NAME: db.config.name }), db: db.config };
    const app = createApp({ dataSource: db.dataSource, config });
    const agent = request.agent(app).set('Origin', config.http.publicUrl);
    const signIn = await agent.post('/api/auth/sign-in').send(credentials);
    if (signIn.status !== 200) throw new Error(`sign-in failed: ${signIn.status}`);
    runner.start();
    // Warm-up: the first solve in a process loads the solver thread; measure the next ones.
    const rounds = [...(WARM_UP ? ['warm-up'] : []), ...Array.from({ length: MEASURED_ROUNDS }, (_, i) => `run ${i + 1}`)];
    const totals: number[] = [];
    for (const round of rounds) {
      const t0 = performance.now();
      const created = await agent.post('/api/plans').send({ name: `${c.label} ${round}`, horizonWeeks: c.horizonWeeks, wholeUnits: true });
      if (created.status !== 201) throw new Error(`create failed: ${created.status} ${JSON.stringify(created.body).slice(0, 300)}`);
      const t1 = performance.now();
      const postedAt = Date.now();
      const { runId } = (await agent.post(`/api/plans/${created.body.id}/solve`)).body;
      let run;
      do {
        await new Promise((r) => setTimeout(r, POLL_MS));
        run = (await agent.get(`/api/plans/${created.body.id}/runs/${runId}`)).body;
      } while (run.state === 'queued' || run.state === 'running');
      const t2 = performance.now();
      const endToEnd = Date.parse(run.finishedAt) - postedAt;
      if (!(endToEnd >= 0 && endToEnd <= t2 - t1 + 5)) {
        throw new Error(`the run's finishedAt (${run.finishedAt}) is not between the POST and the poll that saw it: clocks disagree`);
      }
      // the background cross-check would share the CPU with the next round's solve
      await crossCheckEnded(agent, created.body.id);
      if (round === 'warm-up') continue;
      totals.push(endToEnd);
      const plan = (await agent.get(`/api/plans/${created.body.id}`)).body;
      if (process.env.SAVE_MPS && round === 'run 1') {
        const mps = await agent.get(`/api/plans/${created.body.id}/model.mps`).buffer(true).parse((res, cb) => {
          let text = '';
          res.on('data', (chunk: Buffer) => (text += chunk.toString('utf8')));
          res.on('end', () => cb(null, text));
        });
        const file = join(process.env.SAVE_MPS, `${c.label.replace(/[^a-z0-9]+/gi, '-')}.mps`);
        writeFileSync(file, mps.body as string);
        console.log(`saved ${file}`);
      }
      const size = plan.modelSize;
      console.log(
        [
          `${`${c.label}, ${round}`.padEnd(26)}`,
          `rows ${size?.rows} cols ${size?.columns} nnz ${size?.nonzeros}`,
          `create ${(t1 - t0).toFixed(0)} ms`,
          `solver ${(plan.certificate?.seconds * 1000).toFixed(0)} ms (${plan.certificate?.iterations} it)`,
          `job ${(run.elapsedSeconds * 1000).toFixed(0)} ms`,
          `POST solve → final ${endToEnd.toFixed(0)} ms (seen by the poller after ${(t2 - t1).toFixed(0)} ms)`,
          `status ${plan.solveStatus}`,
        ].join(' | '),
      );
      const stages = parseStages(run.message);
      const other = endToEnd / 1000 - stages.reduce((a, s) => a + s.seconds, 0);
      console.log(`${''.padEnd(26)} stages: ${[...stages, { name: 'other', seconds: other }].map((s) => `${s.name} ${s.seconds.toFixed(2)} s`).join(', ')}`);
      const r = plan.rounding;
      if (r) console.log(`${''.padEnd(26)} whole units: margin ${r.margin.toFixed(2)}, LP bound ${r.lpBound.toFixed(2)}, gap ${r.gap.toFixed(2)} (${(100 * r.relativeGap).toFixed(3)} %), ${r.outcome}`);
    }
    const sorted = [...totals].sort((a, b) => a - b);
    console.log(
      `${c.label.padEnd(26)} POST solve → final over ${sorted.length} runs: min ${sorted[0].toFixed(0)} ms, median ${sorted[Math.floor(sorted.length / 2)].toFixed(0)} ms, max ${sorted[sorted.length - 1].toFixed(0)} ms`,
    );
  } finally {
    await runner.stop();
    await db.drop();
  }
}

/** The job's "Stages: build 0.24 s, mps 0.25 s, …." as name and seconds. */
function parseStages(message: string | null | undefined): { name: string; seconds: number }[] {
  const list = /Stages: (.*)\.$/.exec(message ?? '')?.[1];
  if (!list) throw new Error(`the run's message names no stages: ${message}`);
  return list.split(', ').map((part) => {
    const m = /^(\S+) ([\d.]+) s$/.exec(part);
    if (!m) throw new Error(`unreadable stage "${part}" in: ${message}`);
    return { name: m[1], seconds: Number(m[2]) };
  });
}

/** Waits until the plan's background cross-check has ended (or up to 5 minutes). */
async function crossCheckEnded(agent: ReturnType<typeof request.agent>, planId: number): Promise<void> {
  const until = performance.now() + 300_000;
  while (performance.now() < until) {
    const status = (await agent.get(`/api/plans/${planId}`)).body.certificate?.crossCheck?.status;
    if (status !== 'running') return;
    await new Promise((r) => setTimeout(r, 100));
  }
}

async function main(): Promise<void> {
  for (const c of parseCases(process.argv[2])) await runCase(c);
}

main().then(
  // the solver threads and the database pools are closed; exit even if a handle lingers
  () => process.exit(0),
  (err: unknown) => {
    console.error(err);
    process.exit(1);
  },
);
