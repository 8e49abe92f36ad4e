/**
 * A symmetric sparse matrix M, given as a list of entries (i, j) in its original numbering,
 * factorised as P M Pᵀ = L D Lᵀ. The pattern, the ordering (AMD or nested dissection, whichever
 * needs fewer flops, then an elimination-tree postorder) and the symbolic factor are fixed at
 * construction; afterwards a caller writes values
 * through `slot` (entry t adds into Cx[slot[t]]), calls factorise() and solves as often as
 * needed. No allocation after the constructor.
 *
 * Two numeric kernels: 'supernodal' (supernodal-ldl.ts, dense blocks, the fast one, on two
 * threads when `parallel` is set and the factorisation is big enough) and
 * 'simplicial' (ldl.ts, up-looking as in QDLDL). Cx holds the permuted lower triangle (CSC,
 * rows ≥ column) for the supernodal kernel and the permuted upper triangle for the simplicial one.
 */
import { approximateMinimumDegree, minimumDegreeOrder } from './amd';
import { nestedDissection } from './nested-dissection';
import { eliminationTree } from './etree';
import { postorder } from './postorder';
import { symbolicFactor, type SymbolicFactor } from './symbolic';
import { allocateNumericFactor, factorLdl, type FactorOptions, type FactorReport, type NumericFactor } from './ldl';
import { ldlSolve } from './triangular';
import { supernodalSymbolic, type SupernodalSymbolic } from './supernodal-symbolic';
import { SupernodalLdl } from './supernodal-ldl';

/** with parallel = 'auto', factorisations of at least this many multiply–adds use two threads */
const AUTO_PARALLEL_FLOPS = 1e9;

/** 'auto' computes both AMD and nested dissection and keeps the one with fewer factorisation flops */
export type Ordering = 'auto' | 'amd' | 'nd' | 'natural';

/** thrown by the constructor, before the numeric arrays are allocated, when L would be too large */
export class FactorTooLargeError extends Error {
  constructor(
    readonly entries: number,
    readonly limit: number,
  ) {
    super(`the Cholesky factor would hold ${entries} entries (${Math.round((entries * 8) / 2 ** 20)} MB), above the limit of ${limit} entries`);
    this.name = 'FactorTooLargeError';
  }
}
export type Kernel = 'supernodal' | 'simplicial';

export class SymmetricFactorisation {
  readonly n: number;
  readonly kernel: Kernel;
  /** the ordering actually used */
  readonly ordering: Ordering;
  /** perm[k] = original index at position k; pinv is its inverse */
  readonly perm: Int32Array;
  readonly pinv: Int32Array;
  readonly Cp: Int32Array;
  readonly Ci: Int32Array;
  readonly Cx: Float64Array;
  /** Cx position of each input entry */
  readonly slot: Int32Array;
  /** Cx position of each diagonal entry, by original index (−1 if absent) */
  readonly diagSlot: Int32Array;
  /** stored entries of L and the factorisation's multiply–add count */
  readonly nnzL: number;
  readonly flops: number;
  private readonly simplicial: { sym: SymbolicFactor; F: NumericFactor; work: Float64Array } | null;
  private readonly supernodal: { sym: SupernodalSymbolic; F: SupernodalLdl } | null;
  private readonly permuted: Float64Array;

  constructor(
    n: number,
    rows: Int32Array,
    cols: Int32Array,
    ordering: Ordering = 'auto',
    kernel: Kernel = 'supernodal',
    maxEntries = Infinity,
    parallel: boolean | 'auto' = false,
    /** the AMD order of this pattern, if already computed (estimateFactorFlops) */
    amdOrder: Int32Array | null = null,
  ) {
    this.n = n;
    this.kernel = kernel;
    const T = rows.length;
    const candidates: Int32Array[] = [];
    if (ordering === 'natural') candidates.push(identity(n));
    else {
      const [Ap, Ai] = patternCsc(n, rows, cols);
      if (ordering === 'amd' || ordering === 'auto') candidates.push(amdOrder ?? approximateMinimumDegree(n, Ap, Ai));
      if (ordering === 'nd' || ordering === 'auto') candidates.push(nestedDissection(n, Ap, Ai));
    }
    let first = candidates[0];
    let up0 = permutedPattern(n, rows, cols, first, 'upper');
    let tree = eliminationTree(n, up0.Cp, up0.Ci);
    for (let c = 1; c < candidates.length; c++) {
      const up = permutedPattern(n, rows, cols, candidates[c], 'upper');
      const t = eliminationTree(n, up.Cp, up.Ci);
      if (flopsOf(t.colCount) < flopsOf(tree.colCount)) {
        first = candidates[c];
        up0 = up;
        tree = t;
      }
    }
    this.ordering = first === candidates[0] ? (ordering === 'auto' ? 'amd' : ordering) : 'nd';
    // postorder the elimination tree so supernodes are runs of consecutive columns
    // fail fast: the column counts give nnz(L) before any symbolic structure is built
    let count = n;
    for (let j = 0; j < n; j++) count += tree.colCount[j];
    if (count > maxEntries) throw new FactorTooLargeError(count, maxEntries);
    const post = postorder(tree.parent);
    this.perm = new Int32Array(n);
    for (let k = 0; k < n; k++) this.perm[k] = first[post[k]];
    this.pinv = new Int32Array(n);
    for (let k = 0; k < n; k++) this.pinv[this.perm[k]] = k;
    void T;
    const pat = permutedPattern(n, rows, cols, this.perm, kernel === 'supernodal' ? 'lower' : 'upper');
    this.Cp = pat.Cp;
    this.Ci = pat.Ci;
    this.slot = pat.slot;
    // the supernodal kernel reads values from shared memory (a helper thread may share the work)
    this.Cx = kernel === 'supernodal' ? new Float64Array(new SharedArrayBuffer(8 * Math.max(1, pat.Ci.length)), 0, pat.Ci.length) : new Float64Array(pat.Ci.length);
    this.diagSlot = new Int32Array(n).fill(-1);
    for (let k = 0; k < n; k++) {
      const e = kernel === 'supernodal' ? this.Cp[k] : this.Cp[k + 1] - 1;
      if (e >= this.Cp[k] && e < this.Cp[k + 1] && this.Ci[e] === k) this.diagSlot[this.perm[k]] = e;
    }
    if (kernel === 'supernodal') {
      const upper = upperPattern(n, this.Cp, this.Ci);
      const sym = supernodalSymbolic(n, upper.Cp, upper.Ci);
      if (sym.nnzL > maxEntries) throw new FactorTooLargeError(sym.nnzL, maxEntries);
      const twoThreads = parallel === true || (parallel === 'auto' && sym.flops >= AUTO_PARALLEL_FLOPS);
      this.supernodal = { sym, F: new SupernodalLdl(sym, this.Cp, this.Ci, this.Cx, twoThreads) };
      this.simplicial = null;
      this.nnzL = sym.nnzL;
      this.flops = sym.flops;
    } else {
      const sym = symbolicFactor(n, this.Cp, this.Ci);
      if (sym.nnzL > maxEntries) throw new FactorTooLargeError(sym.nnzL, maxEntries);
      this.simplicial = { sym, F: allocateNumericFactor(sym), work: new Float64Array(n) };
      this.supernodal = null;
      this.nnzL = sym.nnzL + n;
      this.flops = sym.flops;
    }
    this.permuted = new Float64Array(n);
  }

  /** threads the numeric factorisation runs on */
  get threads(): number {
    return this.supernodal ? this.supernodal.F.threads : 1;
  }

  /** D of the last factorisation, in permuted order */
  get D(): Float64Array {
    return this.supernodal ? this.supernodal.F.D : this.simplicial!.F.D;
  }

  /** Numeric factorisation of the values now in Cx. */
  factorise(opts: FactorOptions): FactorReport {
    if (this.supernodal) return this.supernodal.F.factorise(opts);
    const s = this.simplicial!;
    return factorLdl(s.sym, this.Cp, this.Ci, this.Cx, s.F, s.work, opts);
  }

  /** x ← M⁻¹ x in the original numbering. */
  solve(x: Float64Array): void {
    const { perm, permuted, n } = this;
    for (let k = 0; k < n; k++) permuted[k] = x[perm[k]];
    if (this.supernodal) this.supernodal.F.solve(permuted);
    else ldlSolve(this.simplicial!.sym, this.simplicial!.F, permuted);
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

/**
 * Multiply–adds of factorising the pattern (entries (rows[t], cols[t])) in the approximate minimum
 * degree order, from the elimination tree's column counts alone: no symbolic factor, no arrays for
 * values. An estimate of what the constructor will need: it may pick nested dissection instead,
 * and its supernodes may carry explicit zeros (bench S: 4.3e5 estimated, 5.8e5 built; L: 4.8e10
 * estimated, 7.3e9 built with nested dissection). The order is returned for the constructor.
 *
 * flopLimit: the ordering stops once its own count reaches the limit (see minimumDegreeOrder);
 * flops is then that lower bound (atLeast) and there is no order. A caller that only asks "at
 * least this much?" skips the densest part of the work: on the bench's XL model (75905 rows,
 * 4.9e8 entries in L, 8.0e12 multiply–adds) the whole count took 2.9 s, up to 1.2e9 1.05 s.
 */
export function estimateFactorFlops(
  n: number,
  rows: Int32Array,
  cols: Int32Array,
  flopLimit = Infinity,
): { flops: number; order: Int32Array | null; atLeast: boolean } {
  const [Ap, Ai] = patternCsc(n, rows, cols);
  const order = minimumDegreeOrder(n, Ap, Ai, flopLimit);
  if (!order) return { flops: flopLimit, order: null, atLeast: true };
  const up = permutedPattern(n, rows, cols, order, 'upper');
  const { colCount } = eliminationTree(n, up.Cp, up.Ci);
  // as the supernodal symbolic factor counts them: (entries of column j with its diagonal)²
  let flops = 0;
  for (let j = 0; j < n; j++) flops += (colCount[j] + 1) * (colCount[j] + 1);
  return { flops, order, atLeast: false };
}

/** the upper-triangle pattern (CSC) of a lower-triangle pattern, i.e. its transpose */
export function upperPattern(n: number, Lp: Int32Array, Li: Int32Array): { Cp: Int32Array; Ci: Int32Array } {
  const Cp = new Int32Array(n + 1);
  for (let p = 0; p < Li.length; p++) Cp[Li[p] + 1]++;
  for (let k = 0; k < n; k++) Cp[k + 1] += Cp[k];
  const fill = Cp.slice(0, n);
  const Ci = new Int32Array(Li.length);
  for (let j = 0; j < n; j++) for (let p = Lp[j]; p < Lp[j + 1]; p++) Ci[fill[Li[p]]++] = j;
  return { Cp, Ci };
}

/** multiply–adds of a factorisation with these column counts */
function flopsOf(colCount: Int32Array): number {
  let f = 0;
  for (let j = 0; j < colCount.length; j++) f += colCount[j] * colCount[j];
  return f;
}

function identity(n: number): Int32Array {
  const p = new Int32Array(n);
  for (let i = 0; i < n; i++) p[i] = i;
  return p;
}

/**
 * Pattern of P M Pᵀ restricted to one triangle, in CSC with sorted, merged rows, and the
 * position (slot) of every input entry in it.
 */
function permutedPattern(
  n: number,
  rows: Int32Array,
  cols: Int32Array,
  perm: Int32Array,
  triangle: 'upper' | 'lower',
): { Cp: Int32Array; Ci: Int32Array; slot: Int32Array } {
  const T = rows.length;
  const pinv = new Int32Array(n);
  for (let k = 0; k < n; k++) pinv[perm[k]] = k;
  const major = new Int32Array(T);
  const minor = new Int32Array(T);
  for (let t = 0; t < T; t++) {
    const a = pinv[rows[t]];
    const b = pinv[cols[t]];
    const lo = a < b ? a : b;
    const hi = a < b ? b : a;
    // upper: column = hi, row = lo; lower: column = lo, row = hi
    major[t] = triangle === 'upper' ? hi : lo;
    minor[t] = triangle === 'upper' ? lo : hi;
  }
  const order = stableOrder(major, n, stableOrder(minor, n, null));
  const slot = new Int32Array(T);
  const Cp = new Int32Array(n + 1);
  const Ci = new Int32Array(T);
  let q = 0;
  let prevMajor = -1;
  let prevMinor = -1;
  for (let s = 0; s < T; s++) {
    const t = order[s];
    if (major[t] !== prevMajor || minor[t] !== prevMinor) {
      Ci[q++] = minor[t];
      Cp[major[t] + 1]++;
      prevMajor = major[t];
      prevMinor = minor[t];
    }
    slot[t] = q - 1;
  }
  for (let k = 0; k < n; k++) Cp[k + 1] += Cp[k];
  return { Cp, Ci: Ci.slice(0, q), slot };
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
