/**
 * Solves a Problem with HiGHS compiled to WebAssembly (npm package `highs`), for reference checks,
 * benchmarks and background cross-checks. The model is passed as arrays (CSC matrix, lower-triangle
 * Hessian), so no file format stands between the two solvers. The `highs` module is loaded lazily on
 * first use, so importing lp-core does not need it.
 *
 * HiGHS's row duals follow the same sign convention as lp-core (c + Qx − Aᵀy − z = 0 when
 * minimising), so they are passed through unchanged.
 */
import type { Problem } from '../problem/problem';
import { certify } from '../solution/certificate';
import type { SolveStatus } from '../solution/result';
import type { ReferenceResult, ReferenceSolverName } from './reference-result';

export interface HighsSettings {
  /** HiGHS method: its dual simplex, its interior point (IPX) or its own choice; default 'choose' */
  method?: 'simplex' | 'ipm' | 'choose';
  /** HiGHS presolve; default true */
  presolve?: boolean;
  /** crossover to a basic solution after the interior point; default true (HiGHS's default) */
  crossover?: boolean;
  /** wall-clock limit handed to HiGHS; default none */
  timeLimitSeconds?: number;
}

// HiGHS model status codes (types.d.ts of the highs package, ModelStatusCode).
const HIGHS_OPTIMAL = 7;
const HIGHS_INFEASIBLE = 8;
const HIGHS_UNBOUNDED_OR_INFEASIBLE = 9;
const HIGHS_UNBOUNDED = 10;
const HIGHS_TIME_LIMIT = 13;
const HIGHS_ITERATION_LIMIT = 14;
const HIGHS_EMPTY = 6;

type HighsRuntime = Awaited<ReturnType<typeof import('highs').default>>;
let runtime: Promise<HighsRuntime> | undefined;

function loadHighs(): Promise<HighsRuntime> {
  runtime ??= import('highs').then((module) => module.default());
  return runtime;
}

export async function solveWithHighs(problem: Problem, settings: HighsSettings = {}): Promise<ReferenceResult> {
  const highs = await loadHighs();
  const method = settings.method ?? 'choose';
  const start = performance.now();
  let outcome = runOnce(highs, problem, settings, settings.presolve ?? true);
  // HiGHS's presolve may only say "unbounded or infeasible"; without presolve the simplex tells which.
  if (outcome.modelStatus === HIGHS_UNBOUNDED_OR_INFEASIBLE && (settings.presolve ?? true)) {
    outcome = runOnce(highs, problem, { ...settings, method: 'simplex' }, false);
  }
  const seconds = (performance.now() - start) / 1000;
  const status = mapStatus(outcome.modelStatus);
  const sense = problem.maximise ? -1 : 1;
  const result: ReferenceResult = {
    solver: `highs-${method}` as ReferenceSolverName,
    status,
    objective: status === 'optimal' ? sense * outcome.objective : NaN,
    x: outcome.solution.colValue,
    iterations: outcome.iterations,
    seconds,
  };
  if (status === 'optimal') {
    const measured = certify(problem, outcome.solution.colValue, outcome.solution.rowDual);
    result.rowActivity = outcome.solution.rowValue;
    result.rowDuals = outcome.solution.rowDual;
    result.reducedCosts = outcome.solution.colDual;
    result.certificate = measured.certificate;
  } else {
    result.message = `HiGHS model status ${outcome.modelStatus}`;
  }
  return result;
}

interface HighsOutcome {
  modelStatus: number;
  objective: number;
  iterations: number;
  solution: { colValue: Float64Array; rowValue: Float64Array; colDual: Float64Array; rowDual: Float64Array };
}

function runOnce(highs: HighsRuntime, problem: Problem, settings: HighsSettings, presolve: boolean): HighsOutcome {
  const model = highs.createModel(toHighsModel(problem));
  try {
    model.options.set({
      output_flag: false,
      presolve: presolve ? 'on' : 'off',
      solver: settings.method ?? 'choose',
      run_crossover: settings.crossover === false ? 'off' : 'on',
      ...(settings.timeLimitSeconds !== undefined ? { time_limit: settings.timeLimitSeconds } : {}),
    });
    const run = model.run();
    const iterations =
      settings.method === 'ipm'
        ? Number(model.info.get('ipm_iteration_count'))
        : Number(model.info.get('simplex_iteration_count'));
    return {
      modelStatus: run.modelStatus,
      objective: model.getObjectiveValue(),
      iterations: Math.max(0, iterations),
      solution: model.getSolution(),
    };
  } finally {
    model.dispose();
  }
}

function toHighsModel(problem: Problem) {
  const { A } = problem;
  return {
    numCols: A.n,
    numRows: A.m,
    offset: problem.c0,
    colCost: problem.c,
    colLower: problem.colLower,
    colUpper: problem.colUpper,
    rowLower: problem.rowLower,
    rowUpper: problem.rowUpper,
    matrix: { format: 'csc' as const, numRows: A.m, numCols: A.n, starts: A.colPtr, indices: A.rowIdx, values: A.values },
    ...(problem.Q
      ? {
          hessian: {
            format: 'triangular' as const,
            dimension: A.n,
            starts: problem.Q.colPtr,
            indices: problem.Q.rowIdx,
            values: problem.Q.values,
          },
        }
      : {}),
  };
}

function mapStatus(code: number): SolveStatus {
  switch (code) {
    case HIGHS_OPTIMAL:
    case HIGHS_EMPTY:
      return 'optimal';
    case HIGHS_INFEASIBLE:
      return 'infeasible';
    case HIGHS_UNBOUNDED:
      return 'unbounded';
    case HIGHS_TIME_LIMIT:
      return 'time_limit';
    case HIGHS_ITERATION_LIMIT:
      return 'iteration_limit';
    default:
      return 'numerical_trouble';
  }
}
