/**
 * The form the interior-point method works on (after presolve and scaling):
 *
 *   minimise  cᵀx + ½ xᵀQx + c₀   subject to   Â v = 0,   lower ≤ v ≤ upper,
 *
 * with v = (x, w) ∈ Rⁿ⁺ᵐ, Â = [A  −I] and w = A x the row activities, so row bounds become
 * bounds on w and an equality row is a fixed w. Every bound is handled as a bound.
 */
import type { CscMatrix } from '../problem/problem';

export interface IpmProblem {
  n: number;
  m: number;
  A: CscMatrix;
  c: Float64Array;
  c0: number;
  /** lower triangle of Q (n × n) or undefined for an LP */
  Q?: CscMatrix;
  /** bounds of v = (x, w), length n + m */
  lower: Float64Array;
  upper: Float64Array;
  /** x_original = colScale · x, row activity_original = w / rowScale (ones when unscaled) */
  colScale: Float64Array;
  rowScale: Float64Array;
}

/** How each entry of v is bounded. */
export const FREE = 0;
export const LOWER = 1;
export const UPPER = 2;
export const BOXED = 3;
export const FIXED = 4;

export function boundKinds(lower: Float64Array, upper: Float64Array): Uint8Array {
  const N = lower.length;
  const kind = new Uint8Array(N);
  for (let j = 0; j < N; j++) {
    const hasL = lower[j] > -Infinity;
    const hasU = upper[j] < Infinity;
    if (hasL && hasU && lower[j] === upper[j]) kind[j] = FIXED;
    else kind[j] = (hasL ? LOWER : 0) | (hasU ? UPPER : 0);
  }
  return kind;
}

export const hasLower = (k: number): boolean => k === LOWER || k === BOXED;
export const hasUpper = (k: number): boolean => k === UPPER || k === BOXED;

/** diagonal of a lower-triangular Q (zeros when Q is absent) */
export function qDiagonal(n: number, Q?: CscMatrix): Float64Array {
  const d = new Float64Array(n);
  if (!Q) return d;
  for (let j = 0; j < n; j++) {
    for (let p = Q.colPtr[j]; p < Q.colPtr[j + 1]; p++) if (Q.rowIdx[p] === j) d[j] += Q.values[p];
  }
  return d;
}

/** true when Q has an entry off its diagonal */
export function hasOffDiagonalQ(Q?: CscMatrix): boolean {
  if (!Q) return false;
  for (let j = 0; j < Q.n; j++) {
    for (let p = Q.colPtr[j]; p < Q.colPtr[j + 1]; p++) if (Q.rowIdx[p] !== j && Q.values[p] !== 0) return true;
  }
  return false;
}
