/**
 * The pieces of the normal equations that every solver of them shares (normal-equations.ts with a
 * Cholesky factor, basis-cg-solver.ts with conjugate gradients). With Θ = (Q + D)⁻¹ split into
 * Θ_x (columns) and Θ_w (row slacks), eliminating dv from the Newton system leaves
 *
 *   (A Θ_x Aᵀ + Θ_w) dy = rp − A Θ_x r̂_x + Θ_w r̂_w,     dv = Θ (r̂ + Âᵀ dy).
 */
import type { CscMatrix } from '../problem/problem';

/** out ← diag ⊙ x + A Θ_x Aᵀ x */
export function multiplyNormal(A: CscMatrix, thetaX: Float64Array, diag: Float64Array, x: Float64Array, out: Float64Array): void {
  const { n, m, colPtr: Ap, rowIdx: Ai, values: Ax } = A;
  for (let i = 0; i < m; i++) out[i] = diag[i] * x[i];
  for (let j = 0; j < n; j++) {
    const p1 = Ap[j + 1];
    let s = 0;
    for (let p = Ap[j]; p < p1; p++) s += Ax[p] * x[Ai[p]];
    s *= thetaX[j];
    if (s === 0) continue;
    for (let p = Ap[j]; p < p1; p++) out[Ai[p]] += Ax[p] * s;
  }
}

/** rhs ← rp − A Θ_x r̂_x + Θ_w r̂_w */
export function normalRightHandSide(A: CscMatrix, thetaX: Float64Array, thetaW: Float64Array, rhat: Float64Array, rp: Float64Array, rhs: Float64Array): void {
  const { n, m, colPtr: Ap, rowIdx: Ai, values: Ax } = A;
  for (let i = 0; i < m; i++) rhs[i] = rp[i] + thetaW[i] * rhat[n + i];
  for (let j = 0; j < n; j++) {
    const s = thetaX[j] * rhat[j];
    if (s === 0) continue;
    for (let p = Ap[j]; p < Ap[j + 1]; p++) rhs[Ai[p]] -= Ax[p] * s;
  }
}

/** dv ← Θ (r̂ + Âᵀ dy), Â = [A −I] */
export function recoverDirection(A: CscMatrix, thetaX: Float64Array, thetaW: Float64Array, rhat: Float64Array, dy: Float64Array, dv: Float64Array): void {
  const { n, m, colPtr: Ap, rowIdx: Ai, values: Ax } = A;
  for (let j = 0; j < n; j++) {
    let s = rhat[j];
    for (let p = Ap[j]; p < Ap[j + 1]; p++) s += Ax[p] * dy[Ai[p]];
    dv[j] = thetaX[j] * s;
  }
  for (let i = 0; i < m; i++) dv[n + i] = thetaW[i] * (rhat[n + i] - dy[i]);
}

/** ‖x‖∞, Infinity when x holds a NaN */
export function maxAbs(x: Float64Array): number {
  let r = 0;
  for (let i = 0; i < x.length; i++) {
    const a = Math.abs(x[i]);
    if (a > r || a !== a) r = a !== a ? Infinity : a;
  }
  return r;
}
