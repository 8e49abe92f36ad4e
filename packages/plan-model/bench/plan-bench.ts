/**
 * Planning-model benchmark (issue 4, "Speed"): for generated plants of several sizes, prints the
 * model size and the time to build the model, solve it with lp-core, map the solution back,
 * check the plan, round it to whole units and build the shift sheets of week 1.
 *
 *   node --import tsx packages/plan-model/bench/plan-bench.ts [finished×weeks ...]
 *   e.g. … plan-bench.ts 50x12 200x26 1000x52      (default: 50x12 200x26)
 *
 * Generated plants come from test/support/generate-plant.ts (invented data, seeded), loaded to
 * about 95 % of regular time with supply caps sized to their materials' use.
 */
import { solve } from '@millrace/lp-core';
import { buildModel, mapSolution, checkPlan, roundPlan, buildShiftSheets } from '../src/index';
import { generatePlant } from '../test/support/generate-plant';

const args = process.argv.slice(2);
const sizes = (args.length ? args : ['50x12', '200x26']).map((a) => {
  const [finished, weeks] = a.split('x').map(Number);
  if (!(finished > 0 && weeks > 0)) throw new Error(`size "${a}" is not FINISHEDxWEEKS`);
  return { finished, weeks };
});
const time = <T>(f: () => T): [T, number] => {
  const s = performance.now();
  const r = f();
  return [r, (performance.now() - s) / 1000];
};

for (const { finished, weeks } of sizes) {
  const size = {
    finished,
    subassemblies: Math.ceil(finished * 0.3),
    workCenters: Math.max(3, Math.ceil(finished / 10)),
    materials: Math.max(3, Math.ceil(finished * 0.4)),
    weeks,
    loadFactor: 0.95,
    // supply caps sized to what the materials' users need (about 100 units a week per user)
    supplyFactor: Math.max(1, ((finished * 1.3 * 2) / Math.max(3, Math.ceil(finished * 0.4))) * 100 / 240),
  };
  const data = generatePlant(7, size);
  const [built, tBuild] = time(() => buildModel(data, { horizonWeeks: weeks }));
  const [result, tSolve] = time(() => solve(built.problem));
  const head = `${finished}+${size.subassemblies} products × ${weeks} weeks: ${built.problem.colNames.length} columns, ${built.problem.rowNames.length} rows`;
  if (result.status !== 'optimal') {
    console.log(`${head}\n  build ${tBuild.toFixed(3)} s | solve ${tSolve.toFixed(3)} s ended ${result.status}: ${result.message ?? ''}`);
    continue;
  }
  const [plan, tMap] = time(() => mapSolution(data, built, result));
  const [violations, tCheck] = time(() => checkPlan(data, plan));
  const [rounded, tRound] = time(() => roundPlan(data, plan));
  const [sheets, tSheets] = time(() => buildShiftSheets(data, rounded.plan, { weeks: [1] }));
  console.log(
    [
      head,
      `  build ${tBuild.toFixed(3)} s | solve ${tSolve.toFixed(3)} s (${result.status}, ${result.iterations} iterations, gap ${result.certificate.relativeGap.toExponential(1)})`,
      `  map ${tMap.toFixed(3)} s | check ${tCheck.toFixed(3)} s (${violations.length} violations) | round ${tRound.toFixed(3)} s (gap ${rounded.report.gapPct?.toFixed(2)} %) | shift sheets week 1 ${tSheets.toFixed(3)} s (${sheets.sheets.length} sheets)`,
    ].join('\n'),
  );
}
