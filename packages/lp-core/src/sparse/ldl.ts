/**
 * Numeric LDLᵀ factorisation, up-looking (row by row) as in QDLDL, into arrays sized by the
 * symbolic phase. For row k:  y = L(0:k−1, 0:k−1) \ C(0:k−1, k)  gives L(k, j) = y_j / D_j and
 * D_k = C_kk − Σ_j L(k, j) y_j.
 *
 * Pivots: a quasidefinite matrix has D_k > 0 on its positive block and D_k < 0 on its negative
 * block (sign[k] = ±1). A pivot whose magnitude falls below pivotTolerance · (1 + |C_kk|) is either
 * reported (status 'zero_pivot') or, with dynamic regularisation on, replaced by sign[k] · bigPivot so
 * that the corresponding unknown is effectively dropped (the usual treatment of dependent rows in
 * interior-point normal equations).
 */
import type { SymbolicFactor } from './symbolic';

export type FactorStatus = 'factorised' | 'zero_pivot' | 'not_finite' | 'interrupted';

export interface NumericFactor {
  Lx: Float64Array;
  D: Float64Array;
  /** 1 / D */
  Dinv: Float64Array;
}

export interface FactorOptions {
  /** relative pivot threshold */
  pivotTolerance: number;
  /** replace tiny pivots instead of failing */
  dynamicRegularisation: boolean;
  /** value given to a replaced pivot */
  bigPivot: number;
  /** expected pivot signs (+1 / −1) by permuted position; when omitted any sign is accepted */
  sign?: Int8Array;
  /** performance.now() value after which a long factorisation gives up ('interrupted') */
  deadline?: number;
}

export interface FactorReport {
  status: FactorStatus;
  /** the failing column for 'zero_pivot' / 'not_finite', else −1 */
  column: number;
  /** pivots replaced by dynamic regularisation */
  replacedPivots: number;
}

export function allocateNumericFactor(sym: SymbolicFactor): NumericFactor {
  return { Lx: new Float64Array(sym.nnzL), D: new Float64Array(sym.n), Dinv: new Float64Array(sym.n) };
}

/**
 * Factorises the permuted upper triangle C (same pattern as given to the symbolic phase).
 * work: Float64Array of length n, all zero on entry and on exit.
 */
export function factorLdl(
  sym: SymbolicFactor,
  Cp: Int32Array,
  Ci: Int32Array,
  Cx: Float64Array,
  F: NumericFactor,
  work: Float64Array,
  opts: FactorOptions,
): FactorReport {
  const { n, Lp, Li, rowPtr, rowCol, rowPos } = sym;
  const { Lx, D, Dinv } = F;
  const y = work;
  const { pivotTolerance, dynamicRegularisation, bigPivot, sign } = opts;
  let replaced = 0;
  for (let k = 0; k < n; k++) {
    let ckk = 0;
    for (let p = Cp[k]; p < Cp[k + 1]; p++) {
      const i = Ci[p];
      if (i === k) ckk += Cx[p];
      else y[i] = Cx[p];
    }
    let dk = ckk;
    const r1 = rowPtr[k + 1];
    for (let q = rowPtr[k]; q < r1; q++) {
      const j = rowCol[q];
      const yj = y[j];
      y[j] = 0;
      const pend = rowPos[q];
      for (let p = Lp[j]; p < pend; p++) y[Li[p]] -= Lx[p] * yj;
      const lkj = yj * Dinv[j];
      Lx[pend] = lkj;
      dk -= lkj * yj;
    }
    if (!Number.isFinite(dk)) {
      return { status: 'not_finite', column: k, replacedPivots: replaced };
    }
    // with signs given, a pivot of the wrong sign is as bad as a zero one
    const s = sign ? sign[k] : dk < 0 ? -1 : 1;
    if (dk * s <= pivotTolerance * (1 + Math.abs(ckk))) {
      if (!dynamicRegularisation) return { status: 'zero_pivot', column: k, replacedPivots: replaced };
      dk = s * bigPivot;
      replaced++;
    }
    D[k] = dk;
    Dinv[k] = 1 / dk;
  }
  return { status: 'factorised', column: -1, replacedPivots: replaced };
}
