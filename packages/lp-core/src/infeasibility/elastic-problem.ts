/**
 * The elastic (phase-one) problem used to settle feasibility when the interior-point method
 * stalls without converging: every row gets two non-negative violation columns,
 *
 *   minimise Σ (p_i + q_i)   subject to  rowLower ≤ A x + p − q ≤ rowUpper,  colLower ≤ x ≤ colUpper,
 *
 * which is always feasible and bounded. Its optimal value is the least total row violation;
 * when it is positive the original problem is infeasible and the optimal row duals y (with
 * the column reduced costs z) form a Farkas certificate: Aᵀy + z = 0 on x, and
 * Σ (l_r y⁺ − u_r y⁻) + Σ (l z⁺ − u z⁻) equals the positive optimal value (LP duality).
 */
import type { Problem } from '../problem/problem';

export function elasticProblem(p: Problem): Problem {
  const n = p.c.length;
  const m = p.rowLower.length;
  const A = p.A;
  const nnz = A.colPtr[n];
  const colPtr = new Int32Array(n + 2 * m + 1);
  colPtr.set(A.colPtr);
  const rowIdx = new Int32Array(nnz + 2 * m);
  const values = new Float64Array(nnz + 2 * m);
  rowIdx.set(A.rowIdx.subarray(0, nnz));
  values.set(A.values.subarray(0, nnz));
  for (let i = 0; i < m; i++) {
    for (const [k, sign] of [[0, 1], [1, -1]] as const) {
      const j = n + 2 * i + k;
      rowIdx[colPtr[j]] = i;
      values[colPtr[j]] = sign;
      colPtr[j + 1] = colPtr[j] + 1;
    }
  }
  const c = new Float64Array(n + 2 * m);
  c.fill(1, n);
  const colLower = new Float64Array(n + 2 * m);
  colLower.set(p.colLower);
  const colUpper = new Float64Array(n + 2 * m).fill(Infinity);
  colUpper.set(p.colUpper);
  const colNames = p.colNames.slice();
  for (let i = 0; i < m; i++) colNames.push(`${p.rowNames[i]}+`, `${p.rowNames[i]}-`);
  return {
    name: `${p.name ?? 'problem'} (elastic)`,
    colNames,
    rowNames: p.rowNames,
    c,
    c0: 0,
    A: { m, n: n + 2 * m, colPtr, rowIdx, values },
    rowLower: p.rowLower,
    rowUpper: p.rowUpper,
    colLower,
    colUpper,
  };
}
