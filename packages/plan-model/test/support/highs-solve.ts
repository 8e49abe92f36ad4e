/**
 * Test helper: solve an lp-core Problem with HiGHS (the `highs` npm package, HiGHS compiled to
 * WebAssembly) and return lp-core's SolveResult shape. HiGHS reports duals with the same sign
 * convention as lp-core (reduced cost z = c + Qx − Aᵀy). Used as the reference solver in tests.
 */
import loadHighs from 'highs';
import type { Problem, SolveResult, SolveStatus } from '@millrace/lp-core';

type Highs = Awaited<ReturnType<typeof loadHighs>>;
let highsPromise: Promise<Highs> | undefined;
export const getHighs = (): Promise<Highs> => (highsPromise ??= loadHighs());

export async function solveWithHighsRef(problem: Problem): Promise<SolveResult> {
  const highs = await getHighs();
  const inf = (v: number) => (v === Infinity ? highs.infinity : v === -Infinity ? -highs.infinity : v);
  const n = problem.colNames.length;
  const m = problem.rowNames.length;
  const started = performance.now();
  const model = highs.createModel({
    numCols: n,
    numRows: m,
    offset: problem.c0,
    colCost: problem.c,
    colLower: Float64Array.from(problem.colLower, inf),
    colUpper: Float64Array.from(problem.colUpper, inf),
    rowLower: Float64Array.from(problem.rowLower, inf),
    rowUpper: Float64Array.from(problem.rowUpper, inf),
    matrix: { format: 'csc', numRows: m, numCols: n, starts: problem.A.colPtr, indices: problem.A.rowIdx, values: problem.A.values },
    ...(problem.Q
      ? { hessian: { format: 'triangular', dimension: n, starts: problem.Q.colPtr, indices: problem.Q.rowIdx, values: problem.Q.values } }
      : {}),
  } as never);
  try {
    model.options.set({ output_flag: false, presolve: 'off' } as never);
    model.run();
    const code = model.getModelStatus();
    const c = highs.constants.modelStatus;
    const status: SolveStatus =
      code === c.optimal ? 'optimal' : code === c.infeasible ? 'infeasible' : code === c.unbounded ? 'unbounded' : 'numerical_trouble';
    const sol = model.getSolution();
    const x = Float64Array.from(sol.colValue);
    const result: SolveResult = {
      status,
      objective: status === 'optimal' ? model.getObjectiveValue() : NaN,
      x,
      rowActivity: Float64Array.from(sol.rowValue),
      rowDuals: Float64Array.from(sol.rowDual),
      reducedCosts: Float64Array.from(sol.colDual),
      iterations: 0,
      seconds: (performance.now() - started) / 1000,
      certificate: { primalResidual: 0, dualResidual: 0, relativeGap: 0 },
    };
    if (status === 'infeasible') {
      const ray = model.getDualRay();
      if (ray) {
        result.ray = {
          kind: 'primal_infeasible',
          entries: Array.from((ray as { values: Float64Array }).values)
            .map((value, i) => ({ name: problem.rowNames[i], value }))
            .filter((e) => Math.abs(e.value) > 1e-9),
        };
      }
    }
    return result;
  } finally {
    model.dispose();
  }
}

/** Objective HiGHS finds for a model given as MPS text (HiGHS's own MPS reader). */
export async function highsObjectiveFromMps(mps: string): Promise<{ status: number; objective: number }> {
  const highs = await getHighs();
  const model = highs.createModel({ format: 'mps', data: new TextEncoder().encode(mps) } as never);
  try {
    model.options.set({ output_flag: false } as never);
    model.run();
    return { status: model.getModelStatus(), objective: model.getObjectiveValue() };
  } finally {
    model.dispose();
  }
}
