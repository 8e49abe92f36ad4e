/**
 * A fill-reducing column order for the LU factorisation of an unsymmetric sparse matrix B: the
 * approximate minimum degree order of the pattern of BᵀB. Whatever rows partial pivoting picks,
 * the factors of P B Q fit in the Cholesky factor of (BQ)ᵀ(BQ) (A. George & E. Ng, "Symbolic
 * factorization for sparse Gaussian elimination with partial pivoting", SIAM J. Sci. Stat.
 * Comput. 8, 1987), so an order that keeps that factor sparse keeps the LU sparse; this is the
 * idea behind COLAMD, here with our AMD on the explicit column-intersection graph. As in COLAMD,
 * rows with more than DENSE_ROW_FACTOR·√(columns) entries are left out of the graph: they would
 * make it complete and hide every other structure (their fill comes at the end either way).
 */
import { approximateMinimumDegree } from './amd';
import { transposePattern } from './csc';

/** COLAMD's default for dense rows (T. A. Davis et al., ACM TOMS 30(3), 2004; recalled from memory) */
const DENSE_ROW_FACTOR = 10;

/**
 * Columns given as patterns: column k has rows rowIdx[colStart[k] .. colStart[k + 1]) of an
 * m-row matrix. Returns order[q] = the column to factorise q-th.
 */
export function columnOrder(m: number, colCount: number, colStart: Int32Array, rowIdx: Int32Array): Int32Array {
  // the columns of each row
  const { ptr: rowPtr, idx: rowCols } = transposePattern(m, colCount, colStart, rowIdx);
  // pattern of BᵀB (upper triangle, without the diagonal): columns sharing a row
  const denseRow = Math.max(16, DENSE_ROW_FACTOR * Math.sqrt(colCount));
  const mark = new Int32Array(colCount).fill(-1);
  const ptr = new Int32Array(colCount + 1);
  let idx = new Int32Array(Math.max(16, 4 * colStart[colCount]));
  let nz = 0;
  for (let k = 0; k < colCount; k++) {
    mark[k] = k;
    for (let p = colStart[k]; p < colStart[k + 1]; p++) {
      const i = rowIdx[p];
      if (rowPtr[i + 1] - rowPtr[i] > denseRow) continue;
      for (let q = rowPtr[i]; q < rowPtr[i + 1]; q++) {
        const l = rowCols[q];
        if (l <= k || mark[l] === k) continue;
        mark[l] = k;
        if (nz === idx.length) {
          const bigger = new Int32Array(2 * idx.length);
          bigger.set(idx);
          idx = bigger;
        }
        idx[nz++] = l;
      }
    }
    ptr[k + 1] = nz;
  }
  return approximateMinimumDegree(colCount, ptr, idx.subarray(0, nz));
}
