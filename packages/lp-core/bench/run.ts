/**
 * Benchmark: seeded production-planning LPs (sizes S, M, L, XL; see planning-lp.ts) and the Netlib
 * problems afiro, brandy, e226, finnis, each solved by lp-core, HiGHS-wasm's dual simplex, HiGHS-wasm's
 * interior point (no crossover) and javascript-lp-solver, every solve in its own child process with a
 * time limit. Prints rows, columns, non-zeros, time, iterations, objective, relative difference to
 * HiGHS, peak memory and the time ratio lp-core / faster HiGHS method, then the issue's targets.
 *
 *   npm run bench -w packages/lp-core -- [--sizes S,M,L,XL] [--no-netlib] [--solvers lp-core,highs-simplex,highs-ipm,lp-solver]
 *                                        [--seed 1] [--time-limit 300] [--time-limit-lp-solver 60]
 */
import { fork } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { netlibRoot } from '../test/support/netlib';
import { BENCH_SOLVERS, type BenchOutcome, type BenchProblem, type BenchRequest, type BenchSolver, problemLabel } from './bench-case';

interface BenchOptions {
  sizes: ('S' | 'M' | 'L' | 'XL')[];
  netlib: boolean;
  solvers: BenchSolver[];
  seed: number;
  timeLimit: number;
  timeLimitLpSolver: number;
}

const NETLIB = ['afiro', 'brandy', 'e226', 'finnis'];
const childScript = fileURLToPath(new URL('./solve-one.ts', import.meta.url));
const tsxLoader = pathToFileURL(createRequire(import.meta.url).resolve('tsx')).href;
/** seconds a child may run past its own time limit before it is killed */
const GRACE_SECONDS = 15;

function parseOptions(argv: string[]): BenchOptions {
  const options: BenchOptions = { sizes: ['S', 'M', 'L', 'XL'], netlib: true, solvers: [...BENCH_SOLVERS], seed: 1, timeLimit: 300, timeLimitLpSolver: 60 };
  for (let k = 0; k < argv.length; k++) {
    const arg = argv[k];
    const value = () => {
      const v = argv[++k];
      if (v === undefined) throw new Error(`${arg} needs a value`);
      return v;
    };
    const positive = (v: string) => {
      const x = Number(v);
      if (!(x > 0)) throw new Error(`${arg} needs a positive number, got '${v}'`);
      return x;
    };
    if (arg === '--sizes') {
      options.sizes = value().split(',').map((s) => s.trim().toUpperCase()) as BenchOptions['sizes'];
      for (const s of options.sizes) if (!['S', 'M', 'L', 'XL'].includes(s)) throw new Error(`unknown size '${s}' (S, M, L, XL)`);
    } else if (arg === '--no-netlib') options.netlib = false;
    else if (arg === '--solvers') {
      options.solvers = value().split(',') as BenchSolver[];
      for (const s of options.solvers) if (!BENCH_SOLVERS.includes(s)) throw new Error(`unknown solver '${s}' (${BENCH_SOLVERS.join(', ')})`);
    } else if (arg === '--seed') options.seed = positive(value());
    else if (arg === '--time-limit') options.timeLimit = positive(value());
    else if (arg === '--time-limit-lp-solver') options.timeLimitLpSolver = positive(value());
    else throw new Error(`unknown option '${arg}'`);
  }
  return options;
}

function runChild(request: BenchRequest): Promise<BenchOutcome> {
  return new Promise((resolve) => {
    const child = fork(childScript, [], { execArgv: ['--import', tsxLoader, '--max-old-space-size=4096'], stdio: ['ignore', 'ignore', 'pipe', 'ipc'] });
    let stderr = '';
    let done = false;
    const finish = (outcome: BenchOutcome) => {
      if (done) return;
      done = true;
      clearTimeout(timer);
      if (child.exitCode === null) child.kill('SIGKILL');
      resolve(outcome);
    };
    const killAfter = request.solver === 'lp-solver' ? request.timeLimitSeconds : request.timeLimitSeconds + GRACE_SECONDS;
    const timer = setTimeout(() => {
      finish({ ...blank(), status: 'killed', maxRssKb: peakOf(child.pid), message: `stopped after ${killAfter} s` });
    }, killAfter * 1000);
    child.stderr?.on('data', (chunk) => (stderr += String(chunk)));
    child.on('message', (outcome: BenchOutcome) => finish(outcome));
    child.on('exit', (code, signal) => finish({ ...blank(), status: 'failed', message: `process ended (${signal ?? code}): ${lastLine(stderr)}` }));
    child.send(request);
  });
}

/** VmHWM (peak resident set) of a running process, from /proc; null where unavailable. */
function peakOf(pid: number | undefined): number | null {
  try {
    const match = /VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return match ? Number(match[1]) : null;
  } catch {
    return null;
  }
}

function blank(): BenchOutcome {
  return { status: 'failed', objective: null, iterations: null, seconds: null, maxRssKb: null, rows: null, cols: null, nonzeros: null };
}

function lastLine(text: string): string {
  const lines = text.trim().split('\n').filter((l) => l.trim() !== '');
  return (lines.find((l) => /heap out of memory|Error/.test(l)) ?? lines[lines.length - 1] ?? '').slice(0, 160);
}

interface Row {
  problem: BenchProblem;
  solver: BenchSolver;
  outcome: BenchOutcome;
}

const fmt = {
  time: (s: number | null) => (s === null ? '—' : s < 10 ? s.toFixed(3) : s.toFixed(1)),
  int: (v: number | null) => (v === null ? '—' : String(v)),
  obj: (v: number | null) => (v === null ? '—' : v.toPrecision(12)),
  rel: (v: number | null) => (v === null ? '—' : v.toExponential(1)),
  mb: (kb: number | null) => (kb === null ? '—' : (kb / 1024).toFixed(0)),
};

function referenceObjective(rows: Row[]): number | null {
  const optimal = (s: BenchSolver) => rows.find((r) => r.solver === s && r.outcome.status === 'optimal')?.outcome.objective ?? null;
  return optimal('highs-simplex') ?? optimal('highs-ipm');
}

function fasterHighs(rows: Row[]): number | null {
  const times = rows.filter((r) => r.solver.startsWith('highs') && r.outcome.status === 'optimal' && r.outcome.seconds !== null).map((r) => r.outcome.seconds!);
  return times.length > 0 ? Math.min(...times) : null;
}

function printProblem(rows: Row[]): void {
  const dims = rows.find((r) => r.outcome.rows !== null)?.outcome;
  const reference = referenceObjective(rows);
  const fastest = fasterHighs(rows);
  console.log(`\n${problemLabel(rows[0].problem)}: ${dims?.rows ?? '?'} rows, ${dims?.cols ?? '?'} cols, ${dims?.nonzeros ?? '?'} nnz`);
  console.log(`  ${'solver'.padEnd(14)}${'status'.padEnd(19)}${'time s'.padStart(9)}${'iters'.padStart(7)}${'objective'.padStart(20)}${'rel.diff'.padStart(10)}${'peak MB'.padStart(9)}${'vs HiGHS'.padStart(10)}`);
  for (const { solver, outcome } of rows) {
    const rel = reference !== null && outcome.objective !== null && outcome.status === 'optimal' ? Math.abs(outcome.objective - reference) / Math.max(1, Math.abs(reference)) : null;
    const ratio = solver === 'lp-core' && fastest !== null && outcome.seconds !== null && outcome.status === 'optimal' ? `${(outcome.seconds / fastest).toFixed(2)}×` : '';
    console.log(
      `  ${solver.padEnd(14)}${outcome.status.padEnd(19)}${fmt.time(outcome.seconds).padStart(9)}${fmt.int(outcome.iterations).padStart(7)}${fmt.obj(outcome.objective).padStart(20)}${fmt.rel(rel).padStart(10)}${fmt.mb(outcome.maxRssKb).padStart(9)}${ratio.padStart(10)}`,
    );
    if (outcome.message && outcome.status !== 'optimal') console.log(`  ${''.padEnd(14)}↳ ${outcome.message.slice(0, 110)}`);
  }
}

function printTargets(all: Row[][]): void {
  console.log('\nTargets (issue 3), from this run:');
  const lpCore = all.flatMap((rows) => rows.filter((r) => r.solver === 'lp-core').map((r) => ({ rows, r })));
  const diffs = lpCore.map(({ rows, r }) => {
    const ref = referenceObjective(rows);
    return r.outcome.status === 'optimal' && ref !== null && r.outcome.objective !== null ? Math.abs(r.outcome.objective - ref) / Math.max(1, Math.abs(ref)) : Infinity;
  });
  const worst = diffs.length ? Math.max(...diffs) : NaN;
  console.log(`  every objective within 1e-6 of HiGHS: worst ${Number.isFinite(worst) ? worst.toExponential(1) : 'not all solved'} → ${worst <= 1e-6 ? 'met' : 'NOT met'}`);
  const iterations = lpCore.map(({ r }) => (r.outcome.status === 'optimal' ? r.outcome.iterations ?? Infinity : Infinity));
  const maxIt = iterations.length ? Math.max(...iterations) : NaN;
  console.log(`  at most 60 iterations: max ${Number.isFinite(maxIt) ? maxIt : '— (not all solved)'} → ${maxIt <= 60 ? 'met' : 'NOT met'}`);
  for (const { rows, r } of lpCore) {
    const p = r.problem;
    if (p.kind !== 'planning' || !['M', 'L', 'XL'].includes(p.size)) continue;
    const fastest = fasterHighs(rows);
    const ratio = fastest !== null && r.outcome.seconds !== null && r.outcome.status === 'optimal' ? r.outcome.seconds / fastest : null;
    const limit = p.size === 'XL' ? 1 : 1.5;
    const text = p.size === 'XL' ? 'faster than both HiGHS methods' : 'at most 1.5× the faster HiGHS method';
    console.log(`  ${p.size}: ${text}: ratio ${ratio === null ? '— (no pair of optimal solves)' : `${ratio.toFixed(2)}×`} → ${ratio !== null && ratio < limit + (p.size === 'XL' ? 0 : 1e-12) ? 'met' : 'NOT met'}`);
    if (p.size === 'XL') {
      // only a finished solve has a peak; a killed one shows its peak so far, which proves nothing
      const mb = r.outcome.maxRssKb === null || r.outcome.status !== 'optimal' ? null : r.outcome.maxRssKb / 1024;
      console.log(`  XL: peak memory under 2 GiB: ${mb === null ? '— (not solved)' : `${mb.toFixed(0)} MB`} → ${mb !== null && mb < 2048 ? 'met' : 'NOT met'}`);
    }
  }
}

async function main(): Promise<void> {
  const options = parseOptions(process.argv.slice(2));
  const problems: BenchProblem[] = options.sizes.map((size) => ({ kind: 'planning', size, seed: options.seed }));
  if (options.netlib) {
    const dir = join(netlibRoot(), 'usr/share/coin/Data/Sample');
    for (const name of NETLIB) problems.push({ kind: 'netlib', name, file: join(dir, `${name}.mps`) });
  }
  console.log(`lp-core benchmark — ${new Date().toISOString()}, Node ${process.version}, seed ${options.seed}, time limit ${options.timeLimit} s (javascript-lp-solver ${options.timeLimitLpSolver} s)`);
  console.log('each solve in its own child process; time = solver only; peak MB = the child process (problem and Node baseline included)');
  const all: Row[][] = [];
  for (const problem of problems) {
    const rows: Row[] = [];
    for (const solver of options.solvers) {
      const timeLimitSeconds = solver === 'lp-solver' ? options.timeLimitLpSolver : options.timeLimit;
      rows.push({ problem, solver, outcome: await runChild({ problem, solver, timeLimitSeconds }) });
    }
    printProblem(rows);
    all.push(rows);
  }
  printTargets(all);
}

main().catch((error) => {
  console.error(`bench: ${error instanceof Error ? error.message : String(error)}`);
  process.exitCode = 2;
});
