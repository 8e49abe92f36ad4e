/**
 * The certificate of a primal–dual point, measured on the original problem (see Certificate):
 *
 *   primal residual  ‖ violation of l_r ≤ Ax ≤ u_r and l ≤ x ≤ u ‖∞ / (1 + ‖finite bounds‖∞)
 *   dual residual    ‖ c + Qx − Aᵀy − z ‖∞ / (1 + ‖c‖∞), where y is first clipped to the signs its
 *                    row bounds allow (y_i > 0 needs a finite l_r, y_i < 0 a finite u_r) and z is the
 *                    part of c + Qx − Aᵀy that the column bounds can carry the same way; what is left
 *                    over (plus the clipped-off part of y) is the residual
 *   relative gap     |primal − dual objective| / (1 + |primal objective|), with the dual objective
 *                    −½xᵀQx + Σ (y⁺ l_r − y⁻ u_r) + Σ (z⁺ l − z⁻ u) + c₀   (finite bounds only)
 *
 * All in the minimisation form of the problem (c + Qx − Aᵀy − z = 0).
 */
import type { CscMatrix, Problem } from '../problem/problem';
import type { Certificate } from './result';

export interface MeasuredPoint {
  certificate: Certificate;
  /** primal objective cᵀx + ½xᵀQx + c₀ of the minimisation form */
  primalObjective: number;
  dualObjective: number;
  rowActivity: Float64Array;
  /** z = c + Qx − Aᵀy */
  reducedCosts: Float64Array;
}

export function measureCertificate(problem: Problem, x: Float64Array, y: Float64Array): MeasuredPoint {
  const { A, c, rowLower, rowUpper, colLower, colUpper } = problem;
  const rowActivity = multiply(A, x);
  const Qx = problem.Q ? symmetricMultiply(problem.Q, x) : new Float64Array(A.n);

  let boundNorm = 0;
  let primalViolation = 0;
  for (let i = 0; i < A.m; i++) {
    primalViolation = Math.max(primalViolation, rowLower[i] - rowActivity[i], rowActivity[i] - rowUpper[i]);
    boundNorm = Math.max(boundNorm, finiteAbs(rowLower[i]), finiteAbs(rowUpper[i]));
  }
  for (let j = 0; j < A.n; j++) {
    primalViolation = Math.max(primalViolation, colLower[j] - x[j], x[j] - colUpper[j]);
    boundNorm = Math.max(boundNorm, finiteAbs(colLower[j]), finiteAbs(colUpper[j]));
  }

  let dualViolation = 0;
  let dualObjective = problem.c0;
  const yClipped = new Float64Array(A.m);
  for (let i = 0; i < A.m; i++) {
    const v = clipToBounds(y[i], rowLower[i], rowUpper[i]);
    dualViolation = Math.max(dualViolation, Math.abs(y[i] - v));
    yClipped[i] = v;
    dualObjective += v > 0 ? v * rowLower[i] : v < 0 ? v * rowUpper[i] : 0;
  }
  const reducedCosts = new Float64Array(A.n);
  let cNorm = 0;
  let xQx = 0;
  for (let j = 0; j < A.n; j++) {
    let aty = 0;
    let atyClipped = 0;
    for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) {
      aty += A.values[p] * y[A.rowIdx[p]];
      atyClipped += A.values[p] * yClipped[A.rowIdx[p]];
    }
    reducedCosts[j] = c[j] + Qx[j] - aty;
    const zFree = c[j] + Qx[j] - atyClipped;
    const z = clipToBounds(zFree, colLower[j], colUpper[j]);
    dualViolation = Math.max(dualViolation, Math.abs(zFree - z));
    dualObjective += z > 0 ? z * colLower[j] : z < 0 ? z * colUpper[j] : 0;
    cNorm = Math.max(cNorm, Math.abs(c[j]));
    xQx += x[j] * Qx[j];
  }
  dualObjective -= 0.5 * xQx;
  let primalObjective = problem.c0 + 0.5 * xQx;
  for (let j = 0; j < A.n; j++) primalObjective += c[j] * x[j];

  return {
    certificate: {
      primalResidual: Math.max(0, primalViolation) / (1 + boundNorm),
      dualResidual: dualViolation / (1 + cNorm),
      relativeGap: Math.abs(primalObjective - dualObjective) / (1 + Math.abs(primalObjective)),
    },
    primalObjective,
    dualObjective,
    rowActivity,
    reducedCosts,
  };
}

/** A multiplier may be positive only against a finite lower bound and negative only against a finite upper one. */
function clipToBounds(v: number, lower: number, upper: number): number {
  if (v > 0 && lower === -Infinity) return 0;
  if (v < 0 && upper === Infinity) return 0;
  return v;
}

function finiteAbs(v: number): number {
  return Number.isFinite(v) ? Math.abs(v) : 0;
}

export function multiply(A: CscMatrix, x: Float64Array): Float64Array {
  const out = new Float64Array(A.m);
  for (let j = 0; j < A.n; j++) {
    const xj = x[j];
    if (xj === 0) continue;
    for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) out[A.rowIdx[p]] += A.values[p] * xj;
  }
  return out;
}

/** Q x for Q given by its lower triangle. */
export function symmetricMultiply(Q: CscMatrix, x: Float64Array): Float64Array {
  const out = new Float64Array(Q.n);
  for (let j = 0; j < Q.n; j++) {
    for (let p = Q.colPtr[j]; p < Q.colPtr[j + 1]; p++) {
      const i = Q.rowIdx[p];
      out[i] += Q.values[p] * x[j];
      if (i !== j) out[j] += Q.values[p] * x[i];
    }
  }
  return out;
}
