/**
 * Measurement: how much of the demo plant's planned work the shift sheets leave unscheduled,
 * week by week, under several shift-sheet settings (transfer batches, lag). Prints numbers;
 * asserts nothing. The demo plant is invented (demo data only).
 *
 *   DB_HOST=127.0.0.1 DB_PORT=3418 DB_USER=… DB_PASSWORD=… DB_NAME=millrace_bench \
 *     node --import tsx apps/api/bench/shift-sheets-unscheduled.ts
 *
 * It seeds the demo plant into a throw-away database (DB_NAME plus a random suffix), reads the
 * planning data as a new plan version would, solves it with lp-core in whole units (the API's
 * default), then builds the shift sheets of every week. "Planned" hours are the plan's setup +
 * run clock hours of every routing step (the sheets' operation time); "unscheduled" hours are
 * what the sheets list as unscheduled (still open after the plan's last week); "carried over"
 * hours are jobs on the sheets of a later week than the plan week they belong to. It also prints
 * the plan's load against the sheets' open time per work-center week (the same capacity model).
 */
import { solve } from '@millrace/lp-core';
import { buildModel, buildShiftSheets, mapSolution, roundPlan, shiftWindows, weekOperations, type Plan, type PlanningData, type ShiftSheetSettings } from '@millrace/plan-model';
import { seedDemoPlant } from '../src/db/seed-demo';
import { demoWeeks } from '../src/db/demo-plant/demand';
import { loadPlanningData } from '../src/planning-data/load-planning-data';
import { createTestDatabase } from '../test/support/test-db';

const variants: Array<{ label: string; settings: Partial<ShiftSheetSettings> }> = [
  { label: 'whole quantity moves at once (no transfer batches)', settings: { transferBatchShare: 1 } },
  { label: 'transfer batches of 1/2 of the quantity', settings: { transferBatchShare: 0.5 } },
  { label: 'default settings (a quarter of the quantity)', settings: {} },
  { label: 'transfer batches of 1/10 of the quantity', settings: { transferBatchShare: 0.1 } },
  { label: 'one-unit transfer batches', settings: { transferBatchShare: 1e-9 } },
  { label: 'default settings + 60 min transfer lag', settings: { transferLagMinutes: 60 } },
  { label: 'default batches, earliest start only (base order breaks ties)', settings: { dispatchRule: 'earliest_start' } },
  { label: 'default batches, most work remaining first', settings: { dispatchRule: 'most_work_remaining' } },
  { label: 'default batches, most loaded downstream work center first', settings: { dispatchRule: 'bottleneck_first' } },
  { label: 'batches of 1/10, bottleneck first', settings: { dispatchRule: 'bottleneck_first', transferBatchShare: 0.1 } },
];

async function demoPlan(): Promise<{ data: PlanningData; plan: Plan }> {
  const db = await createTestDatabase();
  try {
    await seedDemoPlant(db.dataSource);
    const data = await db.dataSource.transaction((m) => loadPlanningData(m, demoWeeks));
    const built = buildModel(data, { horizonWeeks: demoWeeks, smoothing: { enabled: false, weight: 0 }, wholeUnits: true });
    const result = solve(built.problem);
    if (result.status !== 'optimal') throw new Error(`the demo plan did not solve: ${result.status}`);
    return { data, plan: roundPlan(data, mapSolution(data, built, result)).plan };
  } finally {
    await db.drop();
  }
}

function plannedHours(data: PlanningData, plan: Plan, week: number): Map<string, number> {
  const byWc = new Map<string, number>();
  for (const op of weekOperations(data, plan, week)) byWc.set(op.workCenter, (byWc.get(op.workCenter) ?? 0) + (op.setupMinutes + op.quantity * op.runMinutesPerUnit) / 60);
  return byWc;
}

const sum = (xs: Iterable<number>) => [...xs].reduce((a, b) => a + b, 0);

async function main(): Promise<void> {
  const { data, plan } = await demoPlan();
  const weeks = Array.from({ length: demoWeeks }, (_, i) => i + 1);
  const planned = weeks.map((w) => sum(plannedHours(data, plan, w).values()));
  console.log(`demo plant, ${demoWeeks} weeks, whole units: ${sum(planned).toFixed(1)} planned h (setup + run, clock hours)`);
  // the plan's load against the open time of the sheets (capacity.ts clock hours + the plan's overtime, the same time)
  let over = 0;
  let setups = 0;
  const overLines: string[] = [];
  for (const w of weeks)
    for (const [wc, hours] of plannedHours(data, plan, w)) {
      const center = data.workCenters.find((c) => c.code === wc)!;
      const overtime = plan.workCenters.find((l) => l.workCenter === wc && l.week === w)?.overtimeHours ?? 0;
      const open = sum(shiftWindows(center, w, overtime).windows.map((x) => (x.overtimeEnd - x.start) / 60));
      const setup = sum(weekOperations(data, plan, w).filter((o) => o.workCenter === wc).map((o) => o.setupMinutes / 60));
      setups += setup;
      if (hours > open + 1e-6) {
        over += hours - open;
        overLines.push(`wk ${w} ${wc} ${hours.toFixed(1)}/${open.toFixed(1)}`);
      }
    }
  console.log(`setups on the sheets: ${setups.toFixed(1)} h, which the weekly plan leaves to the floor (routing-load.ts, batch multiple 1)`);
  console.log(`load above the week's open time (setups the plan does not count): ${over.toFixed(1)} h in ${overLines.length} work-center weeks: ${overLines.join(', ')}`);
  for (const v of variants) {
    const result = buildShiftSheets(data, plan, v.settings);
    const perWeek = weeks.map((w) => sum(result.unscheduled.filter((u) => u.week === w).map((u) => u.hours)));
    const total = sum(perWeek);
    console.log(`\n${v.label} (transferBatchShare ${result.settings.transferBatchShare}, lag ${result.settings.transferLagMinutes} min, ${result.settings.dispatchRule})`);
    console.log(`  unscheduled: ${total.toFixed(1)} h of ${sum(planned).toFixed(1)} h = ${((100 * total) / sum(planned)).toFixed(1)} %`);
    console.log(`  per week (h): ${perWeek.map((x) => x.toFixed(1)).join(' ')}`);
    const w1 = plannedHours(data, plan, 1);
    const line = [...w1.keys()].sort().map((wc) => {
      const un = sum(result.unscheduled.filter((u) => u.week === 1 && u.workCenter === wc).map((u) => u.hours));
      return `${wc} ${Math.max(0, w1.get(wc)! - un).toFixed(1)}/${w1.get(wc)!.toFixed(1)}`;
    });
    console.log(`  week 1's production on the sheets (any week)/planned h: ${line.join(', ')}`);
    const reasons = new Map<string, number>();
    for (const u of result.unscheduled) reasons.set(u.reason, (reasons.get(u.reason) ?? 0) + u.hours);
    console.log(`  unscheduled by reason (h): ${[...reasons].map(([r, x]) => `${r}: ${x.toFixed(1)}`).join('; ') || 'none'}`);
    // carried over: setup + run hours on the sheets of a later week than the plan week they belong to
    const carriedJobs = result.sheets.flatMap((s) => s.jobs.filter((j) => j.carriedFromWeek !== null).map((j) => ({ j, s })));
    const carried = sum(carriedJobs.map(({ j }) => (j.endMinute - j.setupStartMinute) / 60));
    const lateness = sum(carriedJobs.map(({ j, s }) => ((j.endMinute - j.setupStartMinute) / 60) * (s.week - j.carriedFromWeek!)));
    console.log(`  carried over into a later week: ${carried.toFixed(1)} h = ${((100 * carried) / sum(planned)).toFixed(1)} % (on average ${carried > 0 ? (lateness / carried).toFixed(2) : '0'} weeks later)`);
    const outOf = weeks.map((w) => sum(result.carriedOver.filter((c) => c.outOfWeek === w).map((c) => c.hours)));
    console.log(`  open at the end of each week, carried into the next (h): ${outOf.map((x) => x.toFixed(1)).join(' ')}`);
  }
}

main().catch((err) => {
  console.error(err);
  process.exitCode = 1;
});
