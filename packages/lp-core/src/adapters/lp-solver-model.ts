/**
 * Translation of a Problem into the JSON model of javascript-lp-solver (LP only).
 *
 * javascript-lp-solver's variables are ≥ 0 unless listed as unrestricted, and it has no column
 * bounds. Its simplex misreports some feasible models with unrestricted variables as infeasible
 * (seen with version 1.0.3), so columns are shifted to the standard form it handles best:
 *   l finite:            x = l + x',  x' ≥ 0  (and x' ≤ u − l as a one-column constraint when u is finite)
 *   l = −∞, u finite:    x = u − x',  x' ≥ 0
 *   free:                x unrestricted
 * Row bounds and the objective constant absorb the shifts; fromLpSolverValues undoes them.
 * Keys are generated (x0…, r0…, b0…) so problem names can never collide with the objective key.
 */
import type { Problem } from '../problem/problem';

export interface LpSolverModel {
  optimize: string;
  opType: 'min';
  constraints: Record<string, { min?: number; max?: number; equal?: number }>;
  variables: Record<string, Record<string, number>>;
  unrestricted: Record<string, 1>;
}

export type LpSolverReply =
  | { kind: 'solved'; raw: Record<string, number | boolean | undefined>; seconds: number; maxRssKb: number }
  | { kind: 'failed'; message: string };

export const OBJECTIVE_KEY = 'objective';

/** How column j of the Problem is written: x_j = shift + sign · x'_j. */
export interface ColumnShift {
  shift: Float64Array;
  sign: Float64Array;
  /** objective constant added by the shifts (cᵀ shift) */
  constant: number;
}

export function toLpSolverModel(problem: Problem): { model: LpSolverModel; shifts: ColumnShift } {
  if (problem.Q && problem.Q.colPtr[problem.Q.n] > 0) {
    throw new Error('javascript-lp-solver solves linear problems only; this problem has a quadratic objective');
  }
  const { A } = problem;
  const shift = new Float64Array(A.n);
  const sign = new Float64Array(A.n).fill(1);
  const model: LpSolverModel = { optimize: OBJECTIVE_KEY, opType: 'min', constraints: {}, variables: {}, unrestricted: {} };
  for (let j = 0; j < A.n; j++) {
    const l = problem.colLower[j];
    const u = problem.colUpper[j];
    if (l > -Infinity) shift[j] = l;
    else if (u < Infinity) {
      shift[j] = u;
      sign[j] = -1;
    }
  }
  const rowShift = new Float64Array(A.m);
  let constant = 0;
  for (let j = 0; j < A.n; j++) {
    constant += problem.c[j] * shift[j];
    for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) rowShift[A.rowIdx[p]] += A.values[p] * shift[j];
  }
  for (let i = 0; i < A.m; i++) {
    const bound = rangeOf(problem.rowLower[i] - rowShift[i], problem.rowUpper[i] - rowShift[i], problem.rowLower[i] === problem.rowUpper[i]);
    if (bound) model.constraints[`r${i}`] = bound;
  }
  for (let j = 0; j < A.n; j++) {
    const key = `x${j}`;
    const coefficients: Record<string, number> = { [OBJECTIVE_KEY]: sign[j] * problem.c[j] };
    for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) {
      const row = `r${A.rowIdx[p]}`;
      if (row in model.constraints) coefficients[row] = sign[j] * A.values[p];
    }
    const l = problem.colLower[j];
    const u = problem.colUpper[j];
    if (l === -Infinity && u === Infinity) model.unrestricted[key] = 1;
    else if (l > -Infinity && u < Infinity) {
      const width = u - l;
      model.constraints[`b${j}`] = width === 0 ? { equal: 0 } : { max: width };
      coefficients[`b${j}`] = 1;
    }
    model.variables[key] = coefficients;
  }
  return { model, shifts: { shift, sign, constant } };
}

/** x_j = shift_j + sign_j · x'_j from the solver's variable values (absent = 0). */
export function fromLpSolverValues(raw: Record<string, unknown>, shifts: ColumnShift): Float64Array {
  return Float64Array.from(shifts.shift, (s, j) => s + shifts.sign[j] * Number(raw[`x${j}`] ?? 0));
}

function rangeOf(lower: number, upper: number, equality: boolean): { min?: number; max?: number; equal?: number } | undefined {
  if (equality) return { equal: lower };
  const bound: { min?: number; max?: number } = {};
  if (lower > -Infinity) bound.min = lower;
  if (upper < Infinity) bound.max = upper;
  return bound.min === undefined && bound.max === undefined ? undefined : bound;
}
