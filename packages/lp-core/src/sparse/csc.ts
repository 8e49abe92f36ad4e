/**
 * Compressed-sparse-column helpers: building from triplets, transposing, multiplying and
 * checking a CscMatrix (Ap = colPtr, Ai = rowIdx, Ax = values in the usual CSC names).
 */
import type { CscMatrix } from '../problem/problem';

/** Builds an m × n CSC matrix from (row, col, value) triplets; duplicates are summed, rows sorted. */
export function cscFromTriplets(
  m: number,
  n: number,
  rows: ArrayLike<number>,
  cols: ArrayLike<number>,
  vals: ArrayLike<number>,
): CscMatrix {
  const nz = rows.length;
  if (cols.length !== nz || vals.length !== nz) {
    throw new Error(`triplets: rows (${nz}), cols (${cols.length}) and values (${vals.length}) differ in length`);
  }
  const count = new Int32Array(n + 1);
  for (let k = 0; k < nz; k++) {
    const i = rows[k];
    const j = cols[k];
    if (!Number.isInteger(i) || i < 0 || i >= m) throw new Error(`triplet ${k}: row index ${i} outside 0..${m - 1}`);
    if (!Number.isInteger(j) || j < 0 || j >= n) throw new Error(`triplet ${k}: column index ${j} outside 0..${n - 1}`);
    count[j + 1]++;
  }
  for (let j = 0; j < n; j++) count[j + 1] += count[j];
  const next = count.slice(0, n);
  const ri = new Int32Array(nz);
  const rv = new Float64Array(nz);
  for (let k = 0; k < nz; k++) {
    const p = next[cols[k]]++;
    ri[p] = rows[k];
    rv[p] = vals[k];
  }
  // sort rows within each column (by transposing twice) and sum duplicates
  return sumDuplicates(transpose(transpose({ m, n, colPtr: count, rowIdx: ri, values: rv })));
}

/** Sums entries with equal (row, col) in a matrix whose columns have sorted row indices. */
function sumDuplicates(A: CscMatrix): CscMatrix {
  const { n, colPtr: Ap, rowIdx: Ai, values: Ax } = A;
  const Bp = new Int32Array(n + 1);
  let q = 0;
  for (let j = 0; j < n; j++) {
    const start = q;
    for (let p = Ap[j]; p < Ap[j + 1]; p++) {
      if (q > start && Ai[q - 1] === Ai[p]) Ax[q - 1] += Ax[p];
      else {
        Ai[q] = Ai[p];
        Ax[q] = Ax[p];
        q++;
      }
    }
    Bp[j + 1] = q;
  }
  return { m: A.m, n, colPtr: Bp, rowIdx: Ai.slice(0, q), values: Ax.slice(0, q) };
}

/**
 * The pattern of Aᵀ for a pattern given by columns (column j has rows rowIdx[colPtr[j] ..
 * colPtr[j + 1]) of m rows): row i's columns are idx[ptr[i] .. ptr[i + 1]), in rising order.
 */
export function transposePattern(m: number, n: number, colPtr: Int32Array, rowIdx: Int32Array): { ptr: Int32Array; idx: Int32Array } {
  const ptr = new Int32Array(m + 1);
  for (let p = 0; p < colPtr[n]; p++) ptr[rowIdx[p] + 1]++;
  for (let i = 0; i < m; i++) ptr[i + 1] += ptr[i];
  const next = ptr.slice(0, m);
  const idx = new Int32Array(colPtr[n]);
  for (let j = 0; j < n; j++) for (let p = colPtr[j]; p < colPtr[j + 1]; p++) idx[next[rowIdx[p]]++] = j;
  return { ptr, idx };
}

/** Aᵀ in CSC form (rows of the result come out sorted). */
export function transpose(A: CscMatrix): CscMatrix {
  const { m, n, colPtr: Ap, rowIdx: Ai, values: Ax } = A;
  const nz = Ap[n];
  const Tp = new Int32Array(m + 1);
  for (let p = 0; p < nz; p++) Tp[Ai[p] + 1]++;
  for (let i = 0; i < m; i++) Tp[i + 1] += Tp[i];
  const next = Tp.slice(0, m);
  const Ti = new Int32Array(nz);
  const Tx = new Float64Array(nz);
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]; p < Ap[j + 1]; p++) {
      const q = next[Ai[p]]++;
      Ti[q] = j;
      Tx[q] = Ax[p];
    }
  }
  return { m: n, n: m, colPtr: Tp, rowIdx: Ti, values: Tx };
}

/** y ← y + alpha · A x */
export function multiplyAx(A: CscMatrix, x: ArrayLike<number>, y: Float64Array, alpha = 1): void {
  const { n, colPtr: Ap, rowIdx: Ai, values: Ax } = A;
  for (let j = 0; j < n; j++) {
    const xj = alpha * x[j];
    if (xj === 0) continue;
    for (let p = Ap[j]; p < Ap[j + 1]; p++) y[Ai[p]] += Ax[p] * xj;
  }
}

/** x ← x + alpha · Aᵀ y */
export function multiplyATy(A: CscMatrix, y: ArrayLike<number>, x: Float64Array, alpha = 1): void {
  const { n, colPtr: Ap, rowIdx: Ai, values: Ax } = A;
  for (let j = 0; j < n; j++) {
    let s = 0;
    for (let p = Ap[j]; p < Ap[j + 1]; p++) s += Ax[p] * y[Ai[p]];
    x[j] += alpha * s;
  }
}

/** y ← y + alpha · Q x for a symmetric Q stored as its lower triangle. */
export function multiplySymLower(Q: CscMatrix, x: ArrayLike<number>, y: Float64Array, alpha = 1): void {
  const { n, colPtr: Qp, rowIdx: Qi, values: Qx } = Q;
  for (let j = 0; j < n; j++) {
    const xj = x[j];
    let s = 0;
    for (let p = Qp[j]; p < Qp[j + 1]; p++) {
      const i = Qi[p];
      y[i] += alpha * Qx[p] * xj;
      if (i !== j) s += Qx[p] * x[i];
    }
    y[j] += alpha * s;
  }
}

/** Problems found in a CSC structure, each as a readable sentence; empty when valid. */
export function cscProblems(A: CscMatrix, what: string): string[] {
  const out: string[] = [];
  const { m, n, colPtr: Ap, rowIdx: Ai, values: Ax } = A;
  if (!Number.isInteger(m) || m < 0 || !Number.isInteger(n) || n < 0) {
    return [`${what}: dimensions ${m} × ${n} are not non-negative integers`];
  }
  if (Ap.length !== n + 1) return [`${what}: colPtr has length ${Ap.length}, expected n + 1 = ${n + 1}`];
  if (Ap[0] !== 0) out.push(`${what}: colPtr[0] is ${Ap[0]}, expected 0`);
  const nz = Ap[n];
  if (Ai.length < nz || Ax.length < nz) {
    return [`${what}: colPtr[n] = ${nz} but rowIdx has ${Ai.length} and values ${Ax.length} entries`];
  }
  for (let j = 0; j < n; j++) {
    if (Ap[j + 1] < Ap[j]) {
      out.push(`${what}: colPtr decreases at column ${j}`);
      return out;
    }
    for (let p = Ap[j]; p < Ap[j + 1]; p++) {
      const i = Ai[p];
      if (i < 0 || i >= m) out.push(`${what}: entry in column ${j} has row index ${i} outside 0..${m - 1}`);
      else if (p > Ap[j] && Ai[p - 1] >= i) out.push(`${what}: column ${j} has unsorted or duplicate row index ${i}`);
      if (!Number.isFinite(Ax[p])) out.push(`${what}: entry (${i}, ${j}) is ${Ax[p]}`);
      if (out.length >= 5) return out;
    }
  }
  return out;
}
