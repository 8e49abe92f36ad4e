/**
 * Ruiz equilibration (D. Ruiz, "A scaling algorithm to equilibrate both rows and columns norms
 * in matrices", RAL-TR-2001-034): repeatedly divide every row and column of A by the square
 * root of its largest magnitude, so all row and column ∞-norms approach 1. Factors are
 * rounded to powers of two so scaling adds no rounding error.
 *
 * The scaled problem is  A_s = R A C,  c_s = C c,  Q_s = C Q C,  x = C x_s,  row bounds · R,
 * column bounds / C;  duals map back as  y = R y_s,  z = z_s / C.
 */
import type { CscMatrix } from '../problem/problem';

export interface Scaling {
  /** C, length n */
  colScale: Float64Array;
  /** R, length m */
  rowScale: Float64Array;
}

export function identityScaling(m: number, n: number): Scaling {
  return { colScale: new Float64Array(n).fill(1), rowScale: new Float64Array(m).fill(1) };
}

export function ruizEquilibration(A: CscMatrix, passes: number): Scaling {
  const { m, n, colPtr: Ap, rowIdx: Ai, values: Ax } = A;
  const s = identityScaling(m, n);
  const C = s.colScale;
  const R = s.rowScale;
  const rowMax = new Float64Array(m);
  for (let pass = 0; pass < passes; pass++) {
    rowMax.fill(0);
    let worst = 0;
    for (let j = 0; j < n; j++) {
      let cmax = 0;
      for (let p = Ap[j]; p < Ap[j + 1]; p++) {
        const a = Math.abs(Ax[p] * R[Ai[p]] * C[j]);
        if (a > cmax) cmax = a;
        if (a > rowMax[Ai[p]]) rowMax[Ai[p]] = a;
      }
      if (cmax > 0) {
        C[j] *= powerOfTwo(1 / Math.sqrt(cmax));
        worst = Math.max(worst, Math.abs(1 - cmax));
      }
    }
    for (let i = 0; i < m; i++) {
      if (rowMax[i] > 0) {
        R[i] *= powerOfTwo(1 / Math.sqrt(rowMax[i]));
        worst = Math.max(worst, Math.abs(1 - rowMax[i]));
      }
    }
    if (worst < 0.5) break;
  }
  return s;
}

/** nearest power of two */
function powerOfTwo(x: number): number {
  return Math.pow(2, Math.round(Math.log2(x)));
}

/** R A C as a new matrix */
export function scaleMatrix(A: CscMatrix, R: Float64Array, C: Float64Array): CscMatrix {
  const values = new Float64Array(A.values.length);
  for (let j = 0; j < A.n; j++) {
    for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) values[p] = R[A.rowIdx[p]] * A.values[p] * C[j];
  }
  return { ...A, values };
}
