/**
 * A symmetric sparse matrix M, given as a list of entries (i, j) in its original numbering,
 * factorised as P M Pᵀ = L D Lᵀ. The pattern, ordering and symbolic factor are fixed at
 * construction; afterwards a caller writes values through `slot` (entry t adds into
 * Cx[slot[t]]), calls factorise() and solves as often as needed. No allocation after the
 * constructor.
 */
import { approximateMinimumDegree } from './amd';
import { symbolicFactor, type SymbolicFactor } from './symbolic';
import {
  allocateNumericFactor,
  factorLdl,
  type FactorOptions,
  type FactorReport,
  type NumericFactor,
} from './ldl';
import { ldlSolve } from './triangular';

export type Ordering = 'amd' | 'natural';

export class SymmetricFactorisation {
  readonly n: number;
  /** perm[k] = original index at position k; pinv is its inverse */
  readonly perm: Int32Array;
  readonly pinv: Int32Array;
  /** permuted upper triangle, values rewritten before each factorise() */
  readonly Cp: Int32Array;
  readonly Ci: Int32Array;
  readonly Cx: Float64Array;
  /** Cx position of each input entry */
  readonly slot: Int32Array;
  /** Cx position of each diagonal entry, by original index (−1 if absent) */
  readonly diagSlot: Int32Array;
  readonly symbolic: SymbolicFactor;
  readonly factor: NumericFactor;
  private readonly work: Float64Array;
  private readonly permuted: Float64Array;

  constructor(n: number, rows: Int32Array, cols: Int32Array, ordering: Ordering = 'amd') {
    this.n = n;
    const T = rows.length;
    this.perm = ordering === 'amd' ? approximateMinimumDegree(n, ...patternCsc(n, rows, cols)) : identity(n);
    this.pinv = new Int32Array(n);
    for (let k = 0; k < n; k++) this.pinv[this.perm[k]] = k;
    const lo = new Int32Array(T);
    const hi = new Int32Array(T);
    for (let t = 0; t < T; t++) {
      const a = this.pinv[rows[t]];
      const b = this.pinv[cols[t]];
      lo[t] = a < b ? a : b;
      hi[t] = a < b ? b : a;
    }
    // order entries by (hi, lo) with two stable counting sorts, then merge duplicates
    const byLo = stableOrder(lo, n, null);
    const order = stableOrder(hi, n, byLo);
    this.slot = new Int32Array(T);
    const Cp = new Int32Array(n + 1);
    const CiFull = new Int32Array(T);
    let q = 0;
    let prevHi = -1;
    let prevLo = -1;
    for (let s = 0; s < T; s++) {
      const t = order[s];
      const h = hi[t];
      const l = lo[t];
      if (h !== prevHi || l !== prevLo) {
        CiFull[q++] = l;
        Cp[h + 1]++;
        prevHi = h;
        prevLo = l;
      }
      this.slot[t] = q - 1;
    }
    for (let k = 0; k < n; k++) Cp[k + 1] += Cp[k];
    this.Cp = Cp;
    this.Ci = CiFull.slice(0, q);
    this.Cx = new Float64Array(q);
    this.diagSlot = new Int32Array(n).fill(-1);
    for (let k = 0; k < n; k++) {
      const e = this.Cp[k + 1] - 1;
      if (e >= this.Cp[k] && this.Ci[e] === k) this.diagSlot[this.perm[k]] = e;
    }
    this.symbolic = symbolicFactor(n, this.Cp, this.Ci);
    this.factor = allocateNumericFactor(this.symbolic);
    this.work = new Float64Array(n);
    this.permuted = new Float64Array(n);
  }

  /** Numeric factorisation of the values now in Cx. */
  factorise(opts: FactorOptions): FactorReport {
    return factorLdl(this.symbolic, this.Cp, this.Ci, this.Cx, this.factor, this.work, opts);
  }

  /** x ← M⁻¹ x in the original numbering. */
  solve(x: Float64Array): void {
    const { perm, permuted, n } = this;
    for (let k = 0; k < n; k++) permuted[k] = x[perm[k]];
    ldlSolve(this.symbolic, this.factor, permuted);
    for (let k = 0; k < n; k++) x[perm[k]] = permuted[k];
  }

  /** y ← y + M x from the values in Cx (used for iterative refinement). */
  multiply(x: Float64Array, y: Float64Array): void {
    const { Cp, Ci, Cx, perm, n } = this;
    for (let k = 0; k < n; k++) {
      const gk = perm[k];
      const xk = x[gk];
      let s = 0;
      for (let p = Cp[k]; p < Cp[k + 1]; p++) {
        const gi = perm[Ci[p]];
        const v = Cx[p];
        if (gi === gk) s += v * xk;
        else {
          s += v * x[gi];
          y[gi] += v * xk;
        }
      }
      y[gk] += s;
    }
  }
}

function identity(n: number): Int32Array {
  const p = new Int32Array(n);
  for (let i = 0; i < n; i++) p[i] = i;
  return p;
}

/** Stable counting sort of entry indices by key (optionally starting from a prior order). */
function stableOrder(key: Int32Array, nkeys: number, prior: Int32Array | null): Int32Array {
  const T = key.length;
  const start = new Int32Array(nkeys + 1);
  for (let t = 0; t < T; t++) start[key[t] + 1]++;
  for (let k = 0; k < nkeys; k++) start[k + 1] += start[k];
  const out = new Int32Array(T);
  for (let s = 0; s < T; s++) {
    const t = prior ? prior[s] : s;
    out[start[key[t]]++] = t;
  }
  return out;
}

/** CSC pattern (colPtr, rowIdx) of the entries, for the ordering. */
function patternCsc(n: number, rows: Int32Array, cols: Int32Array): [Int32Array, Int32Array] {
  const T = rows.length;
  const Ap = new Int32Array(n + 1);
  for (let t = 0; t < T; t++) Ap[cols[t] + 1]++;
  for (let j = 0; j < n; j++) Ap[j + 1] += Ap[j];
  const fill = Ap.slice(0, n);
  const Ai = new Int32Array(T);
  for (let t = 0; t < T; t++) Ai[fill[cols[t]]++] = rows[t];
  return [Ap, Ai];
}
