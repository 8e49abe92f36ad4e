/**
 * The matrix of the split system, I + W Wᵀ with W = Θ_B^{-1/2} B⁻¹ N Θ_N^{1/2} (basis-cg-solver.ts),
 * laid out for the product conjugate gradients takes at every step:
 *
 *   out = x + Θ_B^{-1/2} B⁻¹ N Θ_N Nᵀ B⁻ᵀ Θ_B^{-1/2} x.
 *
 * With P B = L U (sparse-lu.ts) and U = Ũ D (Ũ unit upper triangular, D its diagonal),
 * B⁻¹ = E⁻¹ D⁻¹ Ũ⁻¹ L⁻¹ P, E the basis's product-form updates. The system's vectors are numbered
 * by row: position (LU step) k is kept at the row pivoted there, P's row, so N's product needs no
 * permutation (rows in A's order also keep its accesses near each other: on XL 1.07–1.19 ms against
 * 1.44–1.64 ms with rows renumbered by step), and the triangular solves take their columns in step
 * order from a list, visiting only the columns with entries off the diagonal (most columns of L
 * have none: the basis's triangular parts come first, see triangular-first-order.ts). N is copied
 * with its columns scaled by √θ_j; its columns with a single entry and the nonbasic slacks only
 * add to a diagonal, N Θ_N Nᵀ = diag + Ñ Ñᵀ. Conjugate gradients take the right-hand side in and
 * the solution out through toSplit and fromSplit.
 *
 * Measured on the bench's L model (one product at iteration 15 and 22, 300 repeats): 0.49–0.52 ms
 * with the basis's own solves (rows in, positions out) and A's columns picked by an index list,
 * 0.39–0.46 ms laid out this way (N's product alone 0.19 → 0.15 ms: of its 15444 nonbasic columns
 * 4685 have a single entry). Whole solves: L 2.75 → 2.42 s; XL 89 → 50 s (runs within the hour).
 * With the triangular-first LU, a product on XL at iteration 20 (75905 rows): L's solves 0.02 ms,
 * Ũ's 0.41–0.49 ms (70427 columns, 108633 entries), N's 1.1 ms (336602 entries); in all 2.8 ms.
 * Numbered by step, the vector had to be permuted to rows and back around N's product (0.19 ms).
 * Ñ's columns are then grouped by length for straight-line code (addColumnProducts), and the
 * triangular solves take runs of single-entry columns without pointers (singleRuns): products of
 * XL's systems at its 6th, 18th and 30th preparation, one thread, 2.73 / 2.77 / 4.19 → 2.08 /
 * 2.04 / 2.92 ms; whole XL solves 3.3 → 2.4–2.6 ms a product.
 */
import type { CscMatrix } from '../problem/problem';
import type { BasisPreconditioner } from './basis-preconditioner';
import { applyUpdates, applyUpdatesTransposed, type UpdateFile } from './product-form';
import { ColumnProductHelper } from './split-product-helper';
import { groupColumns, OWN_MEMORY, type Allocator } from './column-groups';
import { addColumnProducts } from './split-product-kernel';

/**
 * Ñ's product is shared with the helper thread (split-product-helper.ts) from this many entries
 * on, unless the solve was told to stay on one thread: a product of XL's size (336602 entries,
 * ~1.2 ms) costs ~0.6 ms a half, while handing over costs 1–50 µs. Whole solves of XL, interleaved:
 * 48.9 s on one thread, 43.7 s with the helper.
 */
const HELPER_MIN_ENTRIES = 100_000;
/**
 * this thread's share of Ñ's entries (the helper also clears its result vector, and may answer
 * late by a wake-up). Measured on XL at iteration 20 (one product, this thread waiting for the
 * helper): 0.5 → 2.25–2.28 ms (waits 0.12 ms), 0.55 → 2.12–2.20 ms (0.10 ms), 0.6 → 2.34–2.94 ms;
 * without the helper 2.51–2.79 ms.
 */
const MAIN_SHARE = 0.55;

function sharedInt32(length: number): Int32Array {
  return new Int32Array(new SharedArrayBuffer(4 * Math.max(length, 1)), 0, length);
}

function sharedFloat64(length: number): Float64Array {
  return new Float64Array(new SharedArrayBuffer(8 * Math.max(length, 1)), 0, length);
}

/** Ñ's copy in memory the helper thread shares */
const SHARED_MEMORY: Allocator = { ints: sharedInt32, floats: sharedFloat64 };

export class SplitSystem {
  private readonly m: number;
  // L's and Ũ's off-diagonal entries by column, for the columns that have any, in step order:
  // the row of each column's step, and the rows of its entries
  private lCols = new Int32Array(0);
  private lPtr = new Int32Array(1);
  private lIdx = new Int32Array(0);
  private lVal = new Float64Array(0);
  private uCols = new Int32Array(0);
  private uPtr = new Int32Array(1);
  private uIdx = new Int32Array(0);
  private uVal = new Float64Array(0);
  /** runs of columns with a single off-diagonal entry, as [first, end) pairs (see singleRuns) */
  private lSingles = new Int32Array(0);
  private uSingles = new Int32Array(0);
  /** by row: 1/d of the step pivoted there, 1/√θ of the column basic there, and their product */
  private readonly invDiag: Float64Array;
  private readonly invSqrtBasic: Float64Array;
  private readonly scale: Float64Array;
  /** the row pivoted at each step (basis position) */
  private readonly pivotRow: Int32Array;
  /** the basis's product-form updates, positions given as rows */
  private updates: UpdateFile = { count: 0, pos: new Int32Array(0), pivot: new Float64Array(0), ptr: new Int32Array(1), idx: new Int32Array(0), val: new Float64Array(0) };
  /** Ñ = N Θ_N^{1/2}, columns with two or more entries, grouped by length (see addColumnProducts) */
  private nGroups: Int32Array<ArrayBufferLike> = new Int32Array(0);
  private nPtr: Int32Array<ArrayBufferLike> = new Int32Array(1);
  private nIdx: Int32Array<ArrayBufferLike> = new Int32Array(0);
  private nVal: Float64Array<ArrayBufferLike> = new Float64Array(0);
  /** the rest of N Θ_N Nᵀ: single-entry columns and nonbasic slacks */
  private readonly nDiag: Float64Array;
  /** B⁻ᵀ Θ_B^{-1/2} x (shared with the helper when it takes part) */
  private g: Float64Array<ArrayBufferLike>;
  // the helper thread's share of Ñ's product: its columns cut.., and its result
  private helper: ColumnProductHelper | null = null;
  private helperOut: Float64Array | null = null;
  private helperSquares: Float64Array | null = null;
  private cut = 0;
  /** nonzeros a product touches (for the solver's work count) */
  nonzeros = 0;

  constructor(
    m: number,
    /** settings.parallelFactorisation: false keeps the products on this thread */
    private readonly parallel: boolean | 'auto' = false,
    private readonly helperMinEntries = HELPER_MIN_ENTRIES,
  ) {
    this.m = m;
    this.invDiag = new Float64Array(m);
    this.invSqrtBasic = new Float64Array(m);
    this.scale = new Float64Array(m);
    this.pivotRow = new Int32Array(m);
    this.nDiag = new Float64Array(m);
    this.g = new Float64Array(m);
  }

  /**
   * Lays out the system for the basis's current factors and updates and the weights of the
   * columns of [A I] (θ_x, then the slacks'): columns of weight 0 are left out of N.
   */
  prepare(basis: BasisPreconditioner, A: CscMatrix, weight: Float64Array): void {
    const { m, pivotRow } = this;
    const { n, colPtr: Ap, rowIdx: Ai, values: Ax } = A;
    const { Lp, Li, Lx, Up, Ui, Ux } = basis.factors;
    pivotRow.set(basis.factors.pivotRow);
    const { basic, position } = basis;
    // L: the first entry of each column is its unit pivot; the others are stored by row already
    let lCount = 0;
    for (let s = 0; s < m; s++) if (Lp[s + 1] - Lp[s] > 1) lCount++;
    const lEntries = Lp[m] - m;
    this.lCols = new Int32Array(lCount);
    this.lPtr = new Int32Array(lCount + 1);
    this.lIdx = new Int32Array(lEntries);
    this.lVal = new Float64Array(lEntries);
    let c = 0;
    let q = 0;
    for (let s = 0; s < m; s++) {
      if (Lp[s + 1] - Lp[s] <= 1) continue;
      for (let p = Lp[s] + 1; p < Lp[s + 1]; p++) {
        this.lIdx[q] = Li[p];
        this.lVal[q++] = Lx[p];
      }
      this.lCols[c++] = pivotRow[s];
      this.lPtr[c] = q;
    }
    this.lSingles = singleRuns(this.lPtr);
    // U: the diagonal entry is the last of each column, the others stored by step; Ũ = U D⁻¹
    let uCount = 0;
    for (let k = 0; k < m; k++) if (Up[k + 1] - Up[k] > 1) uCount++;
    const uEntries = Up[m] - m;
    this.uCols = new Int32Array(uCount);
    this.uPtr = new Int32Array(uCount + 1);
    this.uIdx = new Int32Array(uEntries);
    this.uVal = new Float64Array(uEntries);
    c = 0;
    q = 0;
    for (let k = 0; k < m; k++) {
      const last = Up[k + 1] - 1;
      const d = Ux[last];
      const r = pivotRow[k];
      this.invDiag[r] = 1 / d;
      this.invSqrtBasic[r] = 1 / Math.sqrt(weight[basic[k]]);
      this.scale[r] = this.invDiag[r] * this.invSqrtBasic[r];
      if (last === Up[k]) continue;
      for (let p = Up[k]; p < last; p++) {
        this.uIdx[q] = pivotRow[Ui[p]];
        this.uVal[q++] = Ux[p] / d;
      }
      this.uCols[c++] = r;
      this.uPtr[c] = q;
    }
    this.uSingles = singleRuns(this.uPtr);
    // the updates, positions as rows
    const file = basis.updateFile;
    const eEntries = file.ptr[file.count];
    this.updates = {
      count: file.count,
      pos: Int32Array.from(file.pos.subarray(0, file.count), (k) => pivotRow[k]),
      pivot: file.pivot.slice(0, file.count),
      ptr: file.ptr.slice(0, file.count + 1),
      idx: Int32Array.from(file.idx.subarray(0, eEntries), (k) => pivotRow[k]),
      val: file.val.slice(0, eEntries),
    };
    // N Θ_N Nᵀ: nonbasic slacks and single-entry columns on the diagonal, the rest copied
    const { nDiag } = this;
    for (let i = 0; i < m; i++) nDiag[i] = position[n + i] < 0 ? weight[n + i] : 0;
    for (let j = 0; j < n; j++) {
      if (position[j] < 0 && weight[j] > 0 && Ap[j + 1] - Ap[j] === 1) nDiag[Ai[Ap[j]]] += weight[j] * Ax[Ap[j]] * Ax[Ap[j]];
    }
    let shared = false;
    const grouped = groupColumns(
      A,
      (j) => (position[j] >= 0 ? 0 : Math.sqrt(weight[j])),
      (entries) => {
        shared = this.parallel !== false && entries >= this.helperMinEntries && this.helperReady();
        return shared ? SHARED_MEMORY : OWN_MEMORY;
      },
    );
    this.nPtr = grouped.ptr;
    this.nIdx = grouped.idx;
    this.nVal = grouped.val;
    this.nGroups = grouped.groups;
    const nCols = grouped.columns;
    const nEntries = grouped.entries;
    // the helper takes the columns from the one where MAIN_SHARE of the entries are passed
    this.cut = nCols;
    if (shared) {
      this.cut = 0;
      while (this.cut < nCols && this.nPtr[this.cut] < nEntries * MAIN_SHARE) this.cut++;
    }
    this.nonzeros = 2 * (lEntries + uEntries + nEntries + eEntries) + 5 * m;
  }

  /** out ← Θ_B^{-1/2} v, v by basis position, out by row: a right-hand side for the split system */
  toSplit(v: Float64Array, out: Float64Array): void {
    const { m, pivotRow, invSqrtBasic } = this;
    for (let k = 0; k < m; k++) {
      const r = pivotRow[k];
      out[r] = v[k] * invSqrtBasic[r];
    }
  }

  /** out ← Θ_B^{-1/2} u, u by row, out by basis position: Bᵀ dy = out gives the normal equations' dy */
  fromSplit(u: Float64Array, out: Float64Array): void {
    const { m, pivotRow, invSqrtBasic } = this;
    for (let k = 0; k < m; k++) {
      const r = pivotRow[k];
      out[k] = u[r] * invSqrtBasic[r];
    }
  }

  /** out ← (I + W Wᵀ) x, x and out by row; returns xᵀ out */
  apply(x: Float64Array, out: Float64Array): number {
    const { m, g, invSqrtBasic, invDiag, scale } = this;
    // g = D⁻¹ E⁻ᵀ Θ_B^{-1/2} x
    if (this.updates.count > 0) {
      for (let i = 0; i < m; i++) g[i] = x[i] * invSqrtBasic[i];
      applyUpdatesTransposed(this.updates, g);
      for (let i = 0; i < m; i++) g[i] *= invDiag[i];
    } else for (let i = 0; i < m; i++) g[i] = x[i] * scale[i];
    this.applyInner(out);
    // out = x + Θ_B^{-1/2} E⁻¹ D⁻¹ out
    let xOut = 0;
    if (this.updates.count > 0) {
      for (let i = 0; i < m; i++) out[i] *= invDiag[i];
      applyUpdates(this.updates, out);
      for (let i = 0; i < m; i++) {
        const v = x[i] + out[i] * invSqrtBasic[i];
        out[i] = v;
        xOut += x[i] * v;
      }
    } else
      for (let i = 0; i < m; i++) {
        const v = x[i] + out[i] * scale[i];
        out[i] = v;
        xOut += x[i] * v;
      }
    return xOut;
  }

  /**
   * The product taken apart, for a caller that folds its ends into its own vector passes
   * (krylov.ts): with no updates pending, (I + W Wᵀ) x = x + s ∘ R(s ∘ x) for s = fusedScale and
   * R = Ũ⁻¹ L⁻¹ N Θ_N Nᵀ L⁻ᵀ Ũ⁻ᵀ. The caller writes s ∘ x into `input`; applyToInput(out) leaves
   * R(s ∘ x) in out and returns (s ∘ x)ᵀ R (s ∘ x) = xᵀ(I + W Wᵀ)x − xᵀx. Null while updates are
   * pending (apply() then serves).
   */
  get fusedScale(): Float64Array | null {
    return this.updates.count > 0 ? null : this.scale;
  }

  /** where the caller of applyToInput puts s ∘ x */
  get input(): Float64Array {
    return this.g as Float64Array;
  }

  /** out ← R(input), destroying input; returns inputᵀ R input (see fusedScale) */
  applyToInput(out: Float64Array): number {
    return this.applyInner(out);
  }

  /**
   * The middle of the product: g ← L⁻ᵀ Ũ⁻ᵀ g, out = N Θ_N Nᵀ g (the helper
   * taking its share of Ñ's columns), out ← Ũ⁻¹ L⁻¹ out; returns gᵀ N Θ_N Nᵀ g (the diagonal's
   * part and Σ (ñ_cᵀ g)² from the column products)
   */
  private applyInner(out: Float64Array): number {
    const { m, g, nDiag } = this;
    this.solveUnitUpperTransposed(g);
    this.solveLowerTransposed(g);
    const { nPtr, nIdx, nVal } = this;
    const columns = nPtr.length - 1;
    const helper = this.helper?.inSession && this.cut < columns ? this.helper : null;
    helper?.ask();
    let squares = 0;
    for (let i = 0; i < m; i++) {
      const d = nDiag[i] * g[i];
      out[i] = d;
      squares += d * g[i];
    }
    squares += addColumnProducts(nPtr, nIdx, nVal, this.nGroups, g, out, 0, helper ? this.cut : columns);
    if (helper && helper.wait()) {
      const helperOut = this.helperOut!;
      for (let i = 0; i < m; i++) out[i] += helperOut[i];
      squares += this.helperSquares![0];
    } else if (helper) squares += addColumnProducts(nPtr, nIdx, nVal, this.nGroups, g, out, this.cut, columns); // it failed on the way
    this.solveLower(out);
    this.solveUnitUpper(out);
    return squares;
  }

  /**
   * Brackets a run of products (one conjugate-gradient solve): the helper thread, if it takes a
   * share, spins between the products while the run lasts. end() must follow begin().
   */
  begin(): void {
    if (this.cut < this.nPtr.length - 1 && this.helper && this.helperOut) {
      this.helper.begin({ nPtr: this.nPtr, nIdx: this.nIdx, nVal: this.nVal, nGroups: this.nGroups, g: this.g, out: this.helperOut, squares: this.helperSquares! }, this.cut, this.nPtr.length - 1);
    }
  }

  end(): void {
    this.helper?.end();
  }

  /** the helper thread and the shared vectors, made on first use; false when there is no helper */
  private helperReady(): boolean {
    if (!this.helper) {
      this.helper = ColumnProductHelper.create();
      if (!this.helper) return false;
      this.g = sharedFloat64(this.m);
      this.helperOut = sharedFloat64(this.m);
      this.helperSquares = sharedFloat64(1);
    }
    return true;
  }

  /** y ← L⁻¹y */
  private solveLower(y: Float64Array): void {
    forwardColumns(this.lCols, this.lPtr, this.lIdx, this.lVal, this.lSingles, y);
  }

  /** y ← L⁻ᵀy */
  private solveLowerTransposed(y: Float64Array<ArrayBufferLike>): void {
    backwardDots(this.lCols, this.lPtr, this.lIdx, this.lVal, this.lSingles, y);
  }

  /** y ← Ũ⁻¹y */
  private solveUnitUpper(y: Float64Array): void {
    backwardColumns(this.uCols, this.uPtr, this.uIdx, this.uVal, this.uSingles, y);
  }

  /** y ← Ũ⁻ᵀy */
  private solveUnitUpperTransposed(y: Float64Array<ArrayBufferLike>): void {
    forwardDots(this.uCols, this.uPtr, this.uIdx, this.uVal, this.uSingles, y);
  }
}

/**
 * The runs of consecutive columns with exactly one entry, as pairs [first, end) in one array,
 * between the empty runs (0, 0) and (columns, columns), so that a pass either way ends on a run.
 * Within a run column c's entry sits at ptr[first] + c − first, so the solves below take it
 * without reading ptr. Most columns of the basis's factors have
 * one entry off the diagonal (on XL 71323 of 71831 columns of Ũ early in the solve, 50072 of 62637
 * late: the stock carried from one week to the next), and reading two pointers and setting up a
 * loop for one entry cost more than the entry.
 */
function singleRuns(ptr: Int32Array): Int32Array<ArrayBuffer> {
  const columns = ptr.length - 1;
  const runs: number[] = [0, 0];
  for (let c = 0; c < columns; ) {
    if (ptr[c + 1] - ptr[c] !== 1) {
      c++;
      continue;
    }
    const first = c;
    while (c < columns && ptr[c + 1] - ptr[c] === 1) c++;
    runs.push(first, c);
  }
  runs.push(columns, columns);
  return Int32Array.from(runs);
}

/** y ← y − Σ_c y[cols[c]] · (column c), columns taken first to last */
function forwardColumns(cols: Int32Array, ptr: Int32Array, idx: Int32Array, val: Float64Array, singles: Int32Array, y: Float64Array<ArrayBufferLike>): void {
  let c = 0;
  for (let r = 0; r < singles.length; r += 2) {
    const first = singles[r];
    const end = singles[r + 1];
    for (; c < first; c++) {
      const t = y[cols[c]];
      if (t === 0) continue;
      for (let p = ptr[c]; p < ptr[c + 1]; p++) y[idx[p]] -= val[p] * t;
    }
    for (let p = end > first ? ptr[first] : 0; c < end; c++, p++) y[idx[p]] -= val[p] * y[cols[c]];
  }
}

/** y ← y − Σ_c y[cols[c]] · (column c), columns taken last to first */
function backwardColumns(cols: Int32Array, ptr: Int32Array, idx: Int32Array, val: Float64Array, singles: Int32Array, y: Float64Array<ArrayBufferLike>): void {
  let c = cols.length - 1;
  for (let r = singles.length - 2; r >= 0; r -= 2) {
    const first = singles[r];
    const end = singles[r + 1];
    for (; c >= end; c--) {
      const t = y[cols[c]];
      if (t === 0) continue;
      for (let p = ptr[c]; p < ptr[c + 1]; p++) y[idx[p]] -= val[p] * t;
    }
    for (let p = end > first ? ptr[end - 1] : 0; c >= first; c--, p--) y[idx[p]] -= val[p] * y[cols[c]];
  }
}

/** y[cols[c]] ← y[cols[c]] − (column c)ᵀ y, columns taken first to last */
function forwardDots(cols: Int32Array, ptr: Int32Array, idx: Int32Array, val: Float64Array, singles: Int32Array, y: Float64Array<ArrayBufferLike>): void {
  let c = 0;
  for (let r = 0; r < singles.length; r += 2) {
    const first = singles[r];
    const end = singles[r + 1];
    for (; c < first; c++) {
      let s = y[cols[c]];
      for (let p = ptr[c]; p < ptr[c + 1]; p++) s -= val[p] * y[idx[p]];
      y[cols[c]] = s;
    }
    for (let p = end > first ? ptr[first] : 0; c < end; c++, p++) y[cols[c]] -= val[p] * y[idx[p]];
  }
}

/** y[cols[c]] ← y[cols[c]] − (column c)ᵀ y, columns taken last to first */
function backwardDots(cols: Int32Array, ptr: Int32Array, idx: Int32Array, val: Float64Array, singles: Int32Array, y: Float64Array<ArrayBufferLike>): void {
  let c = cols.length - 1;
  for (let r = singles.length - 2; r >= 0; r -= 2) {
    const first = singles[r];
    const end = singles[r + 1];
    for (; c >= end; c--) {
      let s = y[cols[c]];
      for (let p = ptr[c]; p < ptr[c + 1]; p++) s -= val[p] * y[idx[p]];
      y[cols[c]] = s;
    }
    for (let p = end > first ? ptr[end - 1] : 0; c >= first; c--, p--) y[cols[c]] -= val[p] * y[idx[p]];
  }
}
