/**
 * Translation of a Problem into the JSON model of javascript-lp-solver (LP only).
 *
 * javascript-lp-solver's variables are ≥ 0 unless listed as unrestricted, and it has no column
 * bounds, so: a column keeps the implicit x ≥ 0 when its lower bound is 0; otherwise it is
 * unrestricted, and any finite bound other than that implicit one becomes a one-column constraint.
 * Keys are generated (x0…, r0…, b0…) so problem names can never collide with the objective key.
 */
import type { Problem } from '../problem/problem';

export interface LpSolverModel {
  optimize: string;
  opType: 'min';
  constraints: Record<string, { min?: number; max?: number; equal?: number }>;
  variables: Record<string, Record<string, number>>;
  unrestricted: Record<string, 1>;
  options?: { timeout?: number };
}

export type LpSolverReply =
  | { kind: 'solved'; raw: Record<string, number | boolean | undefined>; seconds: number; maxRssKb: number }
  | { kind: 'failed'; message: string };

export const OBJECTIVE_KEY = 'objective';

export function toLpSolverModel(problem: Problem): LpSolverModel {
  if (problem.Q && problem.Q.colPtr[problem.Q.n] > 0) {
    throw new Error('javascript-lp-solver solves linear problems only; this problem has a quadratic objective');
  }
  const { A } = problem;
  const model: LpSolverModel = { optimize: OBJECTIVE_KEY, opType: 'min', constraints: {}, variables: {}, unrestricted: {} };
  for (let i = 0; i < A.m; i++) {
    const bound = rangeOf(problem.rowLower[i], problem.rowUpper[i]);
    if (bound) model.constraints[`r${i}`] = bound;
  }
  for (let j = 0; j < A.n; j++) {
    const key = `x${j}`;
    const coefficients: Record<string, number> = { [OBJECTIVE_KEY]: problem.c[j] };
    for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) {
      const row = `r${A.rowIdx[p]}`;
      if (row in model.constraints) coefficients[row] = A.values[p];
    }
    const l = problem.colLower[j];
    const u = problem.colUpper[j];
    if (l !== 0) model.unrestricted[key] = 1;
    const bound = rangeOf(l === 0 ? -Infinity : l, u);
    if (bound) {
      model.constraints[`b${j}`] = bound;
      coefficients[`b${j}`] = 1;
    }
    model.variables[key] = coefficients;
  }
  return model;
}

function rangeOf(lower: number, upper: number): { min?: number; max?: number; equal?: number } | undefined {
  if (lower === upper) return { equal: lower };
  const bound: { min?: number; max?: number } = {};
  if (lower > -Infinity) bound.min = lower;
  if (upper < Infinity) bound.max = upper;
  return bound.min === undefined && bound.max === undefined ? undefined : bound;
}
