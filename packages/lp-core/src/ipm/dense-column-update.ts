/**
 * Dense columns of A are kept out of the normal-equations matrix: with U = A_d Θ_d^½,
 *   (M_s + U Uᵀ)⁻¹ r = M_s⁻¹ r − W (I + Uᵀ W)⁻¹ Uᵀ M_s⁻¹ r,   W = M_s⁻¹ U
 * (Sherman–Morrison–Woodbury). The small k × k capacitance matrix is factorised densely.
 */
import type { CscMatrix } from '../problem/problem';

export class DenseColumnUpdate {
  readonly k: number;
  private readonly m: number;
  /** U and W stored column after column (m × k) */
  private readonly U: Float64Array;
  private readonly W: Float64Array;
  /** Cholesky factor of I + UᵀW, row-major k × k */
  private readonly S: Float64Array;
  private readonly g: Float64Array;

  constructor(
    m: number,
    private readonly A: CscMatrix,
    readonly columns: Int32Array,
  ) {
    this.m = m;
    this.k = columns.length;
    this.U = new Float64Array(m * this.k);
    this.W = new Float64Array(m * this.k);
    this.S = new Float64Array(this.k * this.k);
    this.g = new Float64Array(this.k);
  }

  /** Builds U, W = M_s⁻¹U and factorises the capacitance matrix; false if it is not positive definite. */
  update(thetaX: Float64Array, solveSparse: (x: Float64Array) => void): boolean {
    const { m, k, U, W, S, A } = this;
    U.fill(0);
    for (let c = 0; c < k; c++) {
      const j = this.columns[c];
      const s = Math.sqrt(thetaX[j]);
      for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) U[c * m + A.rowIdx[p]] = s * A.values[p];
    }
    W.set(U);
    for (let c = 0; c < k; c++) solveSparse(W.subarray(c * m, (c + 1) * m));
    for (let a = 0; a < k; a++) {
      for (let b = 0; b <= a; b++) {
        let s = a === b ? 1 : 0;
        for (let i = 0; i < m; i++) s += U[a * m + i] * W[b * m + i];
        S[a * k + b] = s;
        S[b * k + a] = s;
      }
    }
    return denseCholesky(S, k);
  }

  /** t holds M_s⁻¹ r on entry and M⁻¹ r on exit */
  correct(t: Float64Array): void {
    const { m, k, U, W, S, g } = this;
    for (let a = 0; a < k; a++) {
      let s = 0;
      for (let i = 0; i < m; i++) s += U[a * m + i] * t[i];
      g[a] = s;
    }
    choleskySolve(S, k, g);
    for (let a = 0; a < k; a++) {
      const ga = g[a];
      for (let i = 0; i < m; i++) t[i] -= W[a * m + i] * ga;
    }
  }
}

/** In-place lower Cholesky of a row-major k × k matrix; false when a pivot is not positive. */
function denseCholesky(S: Float64Array, k: number): boolean {
  for (let j = 0; j < k; j++) {
    let d = S[j * k + j];
    for (let p = 0; p < j; p++) d -= S[j * k + p] * S[j * k + p];
    if (!(d > 0)) return false;
    const l = Math.sqrt(d);
    S[j * k + j] = l;
    for (let i = j + 1; i < k; i++) {
      let s = S[i * k + j];
      for (let p = 0; p < j; p++) s -= S[i * k + p] * S[j * k + p];
      S[i * k + j] = s / l;
    }
  }
  return true;
}

function choleskySolve(L: Float64Array, k: number, x: Float64Array): void {
  for (let i = 0; i < k; i++) {
    let s = x[i];
    for (let p = 0; p < i; p++) s -= L[i * k + p] * x[p];
    x[i] = s / L[i * k + i];
  }
  for (let i = k - 1; i >= 0; i--) {
    let s = x[i];
    for (let p = i + 1; p < k; p++) s -= L[p * k + i] * x[p];
    x[i] = s / L[i * k + i];
  }
}
