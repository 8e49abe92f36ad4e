/**
 * Symbolic Cholesky factorisation, done once per sparsity pattern: from the elimination tree
 * it lays out L column by column (Lp, Li with rows ascending) and the same entries row by row
 * (rowPtr, rowCol, rowPos = where L(k, j) lives in Li/Lx), so the numeric phase never searches.
 */
import { eliminationTree } from './etree';

export interface SymbolicFactor {
  n: number;
  /** column pointers of L (strictly lower part), length n + 1 */
  Lp: Int32Array;
  /** row indices of L, ascending within each column */
  Li: Int32Array;
  /** row k of L: columns rowCol[rowPtr[k]..rowPtr[k+1]−1], ascending */
  rowPtr: Int32Array;
  rowCol: Int32Array;
  /** position in Li/Lx of each row entry */
  rowPos: Int32Array;
  parent: Int32Array;
  /** nnz(L) without the unit diagonal */
  nnzL: number;
  /** floating-point operations of one numeric factorisation (Σ colCount²) */
  flops: number;
}

/** C is the upper triangle (rows i ≤ k in column k) of the already permuted matrix. */
export function symbolicFactor(n: number, Cp: Int32Array, Ci: Int32Array): SymbolicFactor {
  const { parent, colCount } = eliminationTree(n, Cp, Ci);
  const Lp = new Int32Array(n + 1);
  let flops = 0;
  for (let j = 0; j < n; j++) {
    Lp[j + 1] = Lp[j] + colCount[j];
    flops += colCount[j] * colCount[j];
  }
  const nnzL = Lp[n];
  const Li = new Int32Array(nnzL);
  const rowPtr = new Int32Array(n + 1);
  const rowCol = new Int32Array(nnzL);
  const rowPos = new Int32Array(nnzL);
  const fill = Lp.slice(0, n);
  const mark = new Int32Array(n).fill(-1);
  // row k's pattern: walk up from each C(i, k); column j receives row k in increasing k
  let q = 0;
  for (let k = 0; k < n; k++) {
    mark[k] = k;
    const start = q;
    for (let p = Cp[k]; p < Cp[k + 1]; p++) {
      let i = Ci[p];
      while (mark[i] !== k) {
        mark[i] = k;
        rowCol[q++] = i;
        i = parent[i];
      }
    }
    const row = rowCol.subarray(start, q);
    row.sort();
    for (let t = start; t < q; t++) {
      const j = rowCol[t];
      const pos = fill[j]++;
      Li[pos] = k;
      rowPos[t] = pos;
    }
    rowPtr[k + 1] = q;
  }
  return { n, Lp, Li, rowPtr, rowCol, rowPos, parent, nnzL, flops };
}
