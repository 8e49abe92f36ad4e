/**
 * Postsolve: undoes the presolve reductions in reverse order, restoring x and the row duals y
 * so that the reduced costs z = c + Qx − Aᵀy of the original problem carry the right signs:
 *  - fixed column: x_j = its value;
 *  - empty / redundant row: y_i = 0;
 *  - singleton row a·x_j: if x_j sits at a bound that came from the row, the column's reduced
 *    cost is moved onto the row: y_i = z_j / a;
 *  - forcing row at its upper bound: y_i = min(0, min_j z̃_j / a_ij), at its lower bound
 *    y_i = max(0, max_j z̃_j / a_ij), where z̃ are the reduced costs without row i; this is the
 *    smallest multiplier giving every fixed column a reduced cost of the right sign.
 */
import type { Problem } from '../problem/problem';
import type { Reduction } from './reductions';

export function postsolve(
  p: Problem,
  q: Float64Array,
  stack: Reduction[],
  cols: Int32Array,
  rows: Int32Array,
  xr: Float64Array,
  yr: Float64Array,
): { x: Float64Array; y: Float64Array } {
  const n = p.c.length;
  const m = p.rowLower.length;
  const x = new Float64Array(n);
  const y = new Float64Array(m);
  cols.forEach((j, k) => (x[j] = xr[k]));
  rows.forEach((i, k) => (y[i] = yr[k]));
  const reducedCost = (j: number): number => {
    let z = p.c[j] + q[j] * x[j];
    for (let t = p.A.colPtr[j]; t < p.A.colPtr[j + 1]; t++) z -= p.A.values[t] * y[p.A.rowIdx[t]];
    return z;
  };
  for (let s = stack.length - 1; s >= 0; s--) {
    const r = stack[s];
    switch (r.kind) {
      case 'fixed_column':
        x[r.j] = r.value;
        break;
      case 'empty_row':
      case 'redundant_row':
        y[r.i] = 0;
        break;
      case 'singleton_row': {
        y[r.i] = 0;
        const z = reducedCost(r.j);
        // z > 0 presses on the column's lower bound, z < 0 on its upper; if that bound is the row's, the row carries it
        if ((z > 0 && r.lowerFromRow) || (z < 0 && r.upperFromRow)) y[r.i] = z / r.a;
        break;
      }
      case 'forcing_row': {
        y[r.i] = 0;
        let yi = 0;
        for (let k = 0; k < r.cols.length; k++) {
          const ratio = reducedCost(r.cols[k]) / r.coefs[k];
          yi = r.side === 'upper' ? Math.min(yi, ratio) : Math.max(yi, ratio);
        }
        y[r.i] = yi;
        break;
      }
    }
  }
  return { x, y };
}
