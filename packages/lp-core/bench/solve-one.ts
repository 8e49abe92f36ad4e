/**
 * Benchmark child process: builds one problem, solves it with one solver, reports time, iterations,
 * objective and this process's peak memory over IPC, and exits. A warm-up solve comes first. One process per solve, so the peak
 * memory belongs to that solver alone (plus the problem and Node's own baseline, equal for all).
 */
import { readFileSync } from 'node:fs';
import solver from 'javascript-lp-solver';
import { fromLpSolverValues, toLpSolverModel } from '../src/adapters/lp-solver-model';
import { solveWithHighs } from '../src/adapters/solve-with-highs';
import { readMps } from '../src/mps/read-mps';
import type { Problem } from '../src/problem/problem';
import { solve } from '../src/solve';
import type { BenchOutcome, BenchRequest } from './bench-case';
import { PLANNING_SIZES, planningProblem } from './planning-lp';

process.once('message', async (request: BenchRequest) => {
  let outcome: BenchOutcome;
  try {
    outcome = await run(request);
  } catch (error) {
    outcome = { ...empty(), status: 'failed', message: error instanceof Error ? error.message : String(error) };
  }
  outcome.maxRssKb = process.resourceUsage().maxRSS;
  process.send!(outcome, () => process.exit(0));
});

function empty(): BenchOutcome {
  return { status: 'failed', objective: null, iterations: null, seconds: null, maxRssKb: null, rows: null, cols: null, nonzeros: null };
}

function buildProblem(request: BenchRequest): Problem {
  const p = request.problem;
  return p.kind === 'planning' ? planningProblem(PLANNING_SIZES[p.size], p.seed, `planning-${p.size}`) : readMps(readFileSync(p.file, 'utf8'));
}

/**
 * javascript-lp-solver keeps a dense simplex tableau (one float per constraint and variable; an
 * equality counts twice). On L it grew to 7 GB before its time limit, so larger models are skipped.
 */
const LP_SOLVER_MAX_TABLEAU_BYTES = 1.5 * 2 ** 30;

function denseTableauBytes(model: ReturnType<typeof toLpSolverModel>['model']): number {
  let constraints = 0;
  for (const bound of Object.values(model.constraints)) constraints += bound.equal !== undefined || (bound.min !== undefined && bound.max !== undefined) ? 2 : 1;
  return (constraints + 1) * (Object.keys(model.variables).length + 1) * 8;
}

/**
 * An LP solved once before timing, the same for every solver, so that neither JIT compilation nor
 * WebAssembly start-up is timed: the steady state a long-lived solver process (the API's solver
 * thread) runs in. A size-S planning LP of its own seed for the solvers that finish it (a tiny LP
 * of 3 products × 2 weeks left lp-core's kernels unoptimised: M's first solve took 1.3 s, its
 * second 0.97–1.05 s); lp-core solves it twice, by Cholesky and by conjugate gradients (M, solved
 * by CG, took 0.9–1.25 s after a Cholesky-only warm-up, 0.5–0.74 s when solved again);
 * javascript-lp-solver, which does not finish S, warms up on the tiny one.
 */
async function warmUp(request: BenchRequest): Promise<void> {
  const tiny = planningProblem({ products: 3, weeks: 2, workCenters: 1, materials: 2 }, 7, 'warm-up');
  const small = planningProblem(PLANNING_SIZES.S, WARM_UP_SEED, 'warm-up');
  if (request.solver === 'lp-core') {
    // both of its linear solvers: S itself is factorised; larger models take conjugate gradients
    solve(small, LP_CORE_AS_IN_THE_API);
    solve(small, { ...LP_CORE_AS_IN_THE_API, linearSolver: 'basis-cg' });
  }
  else if (request.solver === 'lp-solver') solver.Solve(toLpSolverModel(tiny).model);
  else await solveWithHighs(small, { method: request.solver === 'highs-ipm' ? 'ipm' : 'simplex', crossover: false });
}

/**
 * lp-core runs as the API's solver thread runs it (apps/api/src/solver-jobs/compute-plan.ts):
 * factorisations on two threads, the helper thread started once (here by the warm-up) and kept.
 * HiGHS-wasm runs on one thread.
 */
const LP_CORE_AS_IN_THE_API = { parallelFactorisation: true } as const;

/** seed of the warm-up LP, apart from the seeds the bench measures */
const WARM_UP_SEED = 9001;

async function run(request: BenchRequest): Promise<BenchOutcome> {
  const problem = buildProblem(request);
  await warmUp(request);
  const dims = { rows: problem.A.m, cols: problem.A.n, nonzeros: problem.A.colPtr[problem.A.n] };
  const limit = request.timeLimitSeconds;
  const finite = (v: number) => (Number.isFinite(v) ? v : null);
  switch (request.solver) {
    case 'lp-core': {
      const r = solve(problem, { ...LP_CORE_AS_IN_THE_API, timeLimitSeconds: limit });
      return { ...dims, status: r.status, objective: finite(r.objective), iterations: r.iterations, seconds: r.seconds, maxRssKb: null, message: r.message };
    }
    case 'highs-simplex':
    case 'highs-ipm': {
      const method = request.solver === 'highs-ipm' ? 'ipm' : 'simplex';
      // HiGHS's interior point without crossover, the closest match to lp-core's output
      const r = await solveWithHighs(problem, { method, crossover: false, timeLimitSeconds: limit });
      return { ...dims, status: r.status, objective: finite(r.objective), iterations: r.iterations, seconds: r.seconds, maxRssKb: null, message: r.message };
    }
    case 'lp-solver': {
      const { model, shifts } = toLpSolverModel(problem);
      const tableauBytes = denseTableauBytes(model);
      if (tableauBytes > LP_SOLVER_MAX_TABLEAU_BYTES) {
        return { ...dims, status: 'skipped', objective: null, iterations: null, seconds: null, maxRssKb: null, message: `its dense tableau would take about ${(tableauBytes / 2 ** 30).toFixed(1)} GiB (limit ${LP_SOLVER_MAX_TABLEAU_BYTES / 2 ** 30} GiB on this shared machine)` };
      }
      const start = performance.now();
      const raw = solver.Solve(model) as Record<string, number | boolean | undefined>;
      const seconds = (performance.now() - start) / 1000;
      fromLpSolverValues(raw, shifts);
      const status = raw.feasible !== true ? 'infeasible' : raw.bounded === false ? 'unbounded' : 'optimal';
      const minObjective = Number(raw.result) + shifts.constant + problem.c0;
      const objective = status === 'optimal' ? (problem.maximise ? -minObjective : minObjective) : null;
      return { ...dims, status, objective, iterations: null, seconds, maxRssKb: null };
    }
  }
}
