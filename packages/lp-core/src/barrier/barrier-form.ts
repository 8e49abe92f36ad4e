/**
 * The problem in the form the barrier method works on (Boyd & Vandenberghe §11.1):
 *
 *   minimise    f₀(x) = ½ xᵀPx + qᵀx
 *   subject to  G x ≤ h      (one row per finite row or column bound, strict inside)
 *               E x = d      (equality rows and fixed columns)
 *
 * Each inequality and equality remembers where it came from, so multipliers map back to row duals
 * and reduced costs. Columns without a finite bound get an artificial one at ±R (see boxRadius). P is dense and symmetric (n×n, row-major) or absent for an LP.
 */
import type { Problem } from '../problem/problem';

export interface SparseRows {
  count: number;
  ptr: Int32Array;
  idx: Int32Array;
  val: Float64Array;
}

/** Origin of a constraint: a row or a column of the Problem, and which bound. */
export interface ConstraintOrigin {
  kind: 'row' | 'col';
  index: number;
  side: 'lower' | 'upper' | 'equal';
  /** an artificial bound of the box ±R, not a bound of the problem */
  artificial?: boolean;
}

export interface BarrierForm {
  n: number;
  P?: Float64Array;
  q: Float64Array;
  G: SparseRows;
  h: Float64Array;
  E: SparseRows;
  d: Float64Array;
  inequalityOrigin: ConstraintOrigin[];
  equalityOrigin: ConstraintOrigin[];
  /** equality rows dropped as linear combinations of the rows in E (their consistency is checked in phase I) */
  dependentEqualities: SparseRows;
  dependentRhs: Float64Array;
  /** R of the artificial box ±R on columns without finite bounds */
  boxRadius: number;
}

class RowsBuilder {
  private ptr: number[] = [0];
  private idx: number[] = [];
  private val: number[] = [];
  readonly rhs: number[] = [];

  add(indices: ArrayLike<number>, values: ArrayLike<number>, sign: number, rhs: number): void {
    for (let k = 0; k < indices.length; k++) {
      this.idx.push(indices[k]);
      this.val.push(sign * values[k]);
    }
    this.ptr.push(this.idx.length);
    this.rhs.push(rhs);
  }

  build(): SparseRows {
    return { count: this.rhs.length, ptr: Int32Array.from(this.ptr), idx: Int32Array.from(this.idx), val: Float64Array.from(this.val) };
  }
}

export function barrierForm(problem: Problem, boxRadius: number): BarrierForm {
  const { A } = problem;
  const n = A.n;
  const rows = rowsOf(problem);
  const G = new RowsBuilder();
  const E = new RowsBuilder();
  const inequalityOrigin: ConstraintOrigin[] = [];
  const equalityOrigin: ConstraintOrigin[] = [];
  for (let i = 0; i < A.m; i++) {
    const l = problem.rowLower[i];
    const u = problem.rowUpper[i];
    const r = rows[i];
    if (l === u) {
      E.add(r.idx, r.val, 1, l);
      equalityOrigin.push({ kind: 'row', index: i, side: 'equal' });
      continue;
    }
    if (l > -Infinity) {
      G.add(r.idx, r.val, -1, -l);
      inequalityOrigin.push({ kind: 'row', index: i, side: 'lower' });
    }
    if (u < Infinity) {
      G.add(r.idx, r.val, 1, u);
      inequalityOrigin.push({ kind: 'row', index: i, side: 'upper' });
    }
  }
  const R = boxRadius * Math.max(1, largestFiniteBound(problem));
  for (let j = 0; j < n; j++) {
    const l = problem.colLower[j];
    const u = problem.colUpper[j];
    if (l === -Infinity) {
      G.add([j], [1], -1, R);
      inequalityOrigin.push({ kind: 'col', index: j, side: 'lower', artificial: true });
    }
    if (u === Infinity) {
      G.add([j], [1], 1, R);
      inequalityOrigin.push({ kind: 'col', index: j, side: 'upper', artificial: true });
    }
    if (l === u) {
      E.add([j], [1], 1, l);
      equalityOrigin.push({ kind: 'col', index: j, side: 'equal' });
      continue;
    }
    if (l > -Infinity) {
      G.add([j], [1], -1, -l);
      inequalityOrigin.push({ kind: 'col', index: j, side: 'lower' });
    }
    if (u < Infinity) {
      G.add([j], [1], 1, u);
      inequalityOrigin.push({ kind: 'col', index: j, side: 'upper' });
    }
  }
  const allE = E.build();
  const box = { radius: R };
  const keep = independentRows(allE, n);
  return {
    n,
    P: problem.Q ? denseSymmetric(problem) : undefined,
    q: Float64Array.from(problem.c),
    G: G.build(),
    h: Float64Array.from(G.rhs),
    E: selectRows(allE, keep),
    d: Float64Array.from(keep, (e) => E.rhs[e]),
    inequalityOrigin,
    equalityOrigin: keep.map((e) => equalityOrigin[e]),
    dependentEqualities: selectRows(allE, complement(keep, allE.count)),
    dependentRhs: Float64Array.from(complement(keep, allE.count), (e) => E.rhs[e]),
    boxRadius: box.radius,
  };
}

function largestFiniteBound(problem: Problem): number {
  let largest = 0;
  for (const bounds of [problem.rowLower, problem.rowUpper, problem.colLower, problem.colUpper]) {
    for (const v of bounds) if (Number.isFinite(v)) largest = Math.max(largest, Math.abs(v));
  }
  return largest;
}

/** Relative norm below which an equality row counts as a combination of earlier ones. */
const DEPENDENCE_TOLERANCE = 1e-9;

/**
 * Indices of a maximal set of linearly independent equality rows, in order, by modified
 * Gram–Schmidt applied twice (Golub & Van Loan §5.2.8). Dependent rows are dropped from E: the KKT
 * system stays nonsingular and their multipliers are zero; phase I checks that they are consistent.
 */
function independentRows(E: SparseRows, n: number): number[] {
  const basis: Float64Array[] = [];
  const keep: number[] = [];
  const v = new Float64Array(n);
  for (let e = 0; e < E.count; e++) {
    v.fill(0);
    let norm0 = 0;
    for (let p = E.ptr[e]; p < E.ptr[e + 1]; p++) {
      v[E.idx[p]] = E.val[p];
      norm0 += E.val[p] * E.val[p];
    }
    for (let pass = 0; pass < 2; pass++) {
      for (const b of basis) {
        let proj = 0;
        for (let j = 0; j < n; j++) proj += b[j] * v[j];
        if (proj !== 0) for (let j = 0; j < n; j++) v[j] -= proj * b[j];
      }
    }
    let norm = 0;
    for (let j = 0; j < n; j++) norm += v[j] * v[j];
    if (norm0 === 0 || Math.sqrt(norm) <= DEPENDENCE_TOLERANCE * Math.sqrt(norm0)) continue;
    const inv = 1 / Math.sqrt(norm);
    basis.push(Float64Array.from(v, (x) => x * inv));
    keep.push(e);
  }
  return keep;
}

function selectRows(rows: SparseRows, pick: number[]): SparseRows {
  const b = new RowsBuilder();
  for (const e of pick) b.add(rows.idx.subarray(rows.ptr[e], rows.ptr[e + 1]), rows.val.subarray(rows.ptr[e], rows.ptr[e + 1]), 1, 0);
  return b.build();
}

function complement(keep: number[], count: number): number[] {
  const kept = new Set(keep);
  return Array.from({ length: count }, (_, e) => e).filter((e) => !kept.has(e));
}

/** Row-wise copy of A (each row's column indices and values). */
function rowsOf(problem: Problem): { idx: number[]; val: number[] }[] {
  const { A } = problem;
  const rows = Array.from({ length: A.m }, () => ({ idx: [] as number[], val: [] as number[] }));
  for (let j = 0; j < A.n; j++) {
    for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) {
      rows[A.rowIdx[p]].idx.push(j);
      rows[A.rowIdx[p]].val.push(A.values[p]);
    }
  }
  return rows;
}

function denseSymmetric(problem: Problem): Float64Array {
  const Q = problem.Q!;
  const n = Q.n;
  const P = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    for (let p = Q.colPtr[j]; p < Q.colPtr[j + 1]; p++) {
      const i = Q.rowIdx[p];
      P[i * n + j] = Q.values[p];
      P[j * n + i] = Q.values[p];
    }
  }
  return P;
}

/**
 * Phase I form (Boyd & Vandenberghe §11.4.1): variables (x, s),
 *   minimise s  subject to  G x − s ≤ h,  −s ≤ 1,  E x = d.
 * Any (x, s) with s > max(Gx − h) and s > −1 is strictly feasible for it. The floor s ≥ −1 keeps the
 * phase I problem bounded, so its central points exist and lie well inside when s < 0.
 */
export function phaseOneForm(form: BarrierForm): BarrierForm {
  const { G, n } = form;
  const nnz = G.ptr[G.count];
  const count = G.count + 1;
  const ptr = new Int32Array(count + 1);
  const idx = new Int32Array(nnz + count);
  const val = new Float64Array(nnz + count);
  let p = 0;
  for (let k = 0; k < G.count; k++) {
    for (let q = G.ptr[k]; q < G.ptr[k + 1]; q++) {
      idx[p] = G.idx[q];
      val[p++] = G.val[q];
    }
    idx[p] = n;
    val[p++] = -1;
    ptr[k + 1] = p;
  }
  idx[p] = n;
  val[p++] = -1;
  ptr[count] = p;
  const h = new Float64Array(count);
  h.set(form.h);
  h[G.count] = 1;
  const q = new Float64Array(n + 1);
  q[n] = 1;
  return {
    n: n + 1,
    q,
    G: { count, ptr, idx, val },
    h,
    E: form.E,
    d: form.d,
    inequalityOrigin: [],
    equalityOrigin: form.equalityOrigin,
    dependentEqualities: form.dependentEqualities,
    dependentRhs: form.dependentRhs,
    boxRadius: form.boxRadius,
  };
}
