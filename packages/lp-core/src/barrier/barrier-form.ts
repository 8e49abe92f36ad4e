/**
 * The problem in the form the barrier method works on (standard barrier form; Fiacco & McCormick 1968, from memory):
 *
 *   minimise    f₀(x) = ½ xᵀPx + qᵀx
 *   subject to  G x ≤ h      (one row per finite row or column bound, strict inside)
 *               E x = d      (equality rows and fixed columns)
 *
 * over the variables x (the columns that are not fixed). Each inequality and equality remembers where
 * it came from, so multipliers map back to row duals and reduced costs. Every variable has a lower
 * and an upper inequality; a missing bound is replaced by an artificial one at ∓R (see boxRadius). P is dense and symmetric (n×n, row-major) or absent for an LP.
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
  /** number of variables: the problem's columns that are not fixed */
  n: number;
  /** form variable → problem column */
  columnOf: Int32Array;
  /** problem column → form variable, −1 for a fixed column */
  variableOf: Int32Array;
  /** value of each fixed column (problem indexing; 0 elsewhere) */
  fixedValue: Float64Array;
  /** objective constant: c₀ plus the fixed columns' share of the objective */
  constant: number;
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
  /** equality rows that fixed their only unfixed column, in the order applied */
  singletonFixings: { row: number; col: number }[];
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

/**
 * Fixed columns are substituted out (see fixedColumns): they are constants, not variables, so every
 * variable keeps two bounds (real or artificial) and H stays positive definite.
 */
export function barrierForm(problem: Problem, boxRadius: number): BarrierForm {
  const { A } = problem;
  const { isFixed, fixedValue, singletonFixings } = fixedColumns(problem);
  const variableOf = new Int32Array(A.n).fill(-1);
  const columns: number[] = [];
  for (let j = 0; j < A.n; j++) {
    if (!isFixed[j]) {
      variableOf[j] = columns.length;
      columns.push(j);
    }
  }
  const n = columns.length;
  const rows = rowsOf(problem, variableOf, fixedValue);
  const G = new RowsBuilder();
  const E = new RowsBuilder();
  const inequalityOrigin: ConstraintOrigin[] = [];
  const equalityOrigin: ConstraintOrigin[] = [];
  for (let i = 0; i < A.m; i++) {
    const r = rows[i];
    const l = problem.rowLower[i] - r.offset;
    const u = problem.rowUpper[i] - r.offset;
    if (problem.rowLower[i] === problem.rowUpper[i]) {
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
  for (let v = 0; v < n; v++) {
    const j = columns[v];
    const l = problem.colLower[j];
    const u = problem.colUpper[j];
    G.add([v], [1], -1, l > -Infinity ? -l : R);
    inequalityOrigin.push({ kind: 'col', index: j, side: 'lower', ...(l > -Infinity ? {} : { artificial: true }) });
    G.add([v], [1], 1, u < Infinity ? u : R);
    inequalityOrigin.push({ kind: 'col', index: j, side: 'upper', ...(u < Infinity ? {} : { artificial: true }) });
  }
  const { P, q, constant } = objectiveOnVariables(problem, columns, variableOf, fixedValue);
  const allE = E.build();
  const keep = independentRows(allE, n);
  const dropped = complement(keep, allE.count);
  return {
    n,
    columnOf: Int32Array.from(columns),
    variableOf,
    fixedValue,
    constant,
    P,
    q,
    G: G.build(),
    h: Float64Array.from(G.rhs),
    E: selectRows(allE, keep),
    d: Float64Array.from(keep, (e) => E.rhs[e]),
    inequalityOrigin,
    equalityOrigin: keep.map((e) => equalityOrigin[e]),
    dependentEqualities: selectRows(allE, dropped),
    dependentRhs: Float64Array.from(dropped, (e) => E.rhs[e]),
    boxRadius: R,
    singletonFixings,
  };
}

/**
 * Columns that are constants: fixed by their bounds (l = u), or the only unfixed column of an
 * equality row (x_j = (b − fixed part)/a_ij, when that lies within the column's bounds), repeated
 * until no such row is left.
 */
function fixedColumns(problem: Problem) {
  const { A } = problem;
  const isFixed = new Uint8Array(A.n);
  const fixedValue = new Float64Array(A.n);
  for (let j = 0; j < A.n; j++) {
    if (problem.colLower[j] === problem.colUpper[j]) {
      isFixed[j] = 1;
      fixedValue[j] = problem.colLower[j];
    }
  }
  const rowEntries: { col: number; value: number }[][] = Array.from({ length: A.m }, () => []);
  for (let j = 0; j < A.n; j++) {
    for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) rowEntries[A.rowIdx[p]].push({ col: j, value: A.values[p] });
  }
  const singletonFixings: { row: number; col: number }[] = [];
  for (let changed = true; changed; ) {
    changed = false;
    for (let i = 0; i < A.m; i++) {
      if (problem.rowLower[i] !== problem.rowUpper[i]) continue;
      let offset = 0;
      let free: { col: number; value: number } | undefined;
      let freeCount = 0;
      for (const e of rowEntries[i]) {
        if (isFixed[e.col]) offset += e.value * fixedValue[e.col];
        else if (e.value !== 0) {
          free = e;
          freeCount++;
        }
      }
      if (freeCount !== 1 || !free) continue;
      const value = (problem.rowLower[i] - offset) / free.value;
      if (!(value >= problem.colLower[free.col] && value <= problem.colUpper[free.col])) continue;
      isFixed[free.col] = 1;
      fixedValue[free.col] = value;
      singletonFixings.push({ row: i, col: free.col });
      changed = true;
    }
  }
  return { isFixed, fixedValue, singletonFixings };
}

/** The problem's x for a vector of form variables. */
export function expandToColumns(form: BarrierForm, x: Float64Array): Float64Array {
  const full = Float64Array.from(form.fixedValue);
  for (let v = 0; v < form.n; v++) full[form.columnOf[v]] = x[v];
  return full;
}

/** ½xᵀPx + qᵀx + constant over the variables, with the fixed columns substituted. */
function objectiveOnVariables(problem: Problem, columns: number[], variableOf: Int32Array, fixedValue: Float64Array) {
  const n = columns.length;
  const q = Float64Array.from(columns, (j) => problem.c[j]);
  let constant = problem.c0;
  for (let j = 0; j < problem.A.n; j++) if (variableOf[j] < 0) constant += problem.c[j] * fixedValue[j];
  const Q = problem.Q;
  if (!Q) return { P: undefined, q, constant };
  const P = new Float64Array(n * n);
  const add = (i: number, j: number, value: number) => {
    const [vi, vj] = [variableOf[i], variableOf[j]];
    if (vi >= 0 && vj >= 0) P[vi * n + vj] += value;
    else if (vi >= 0) q[vi] += value * fixedValue[j];
    else if (vj < 0) constant += 0.5 * value * fixedValue[i] * fixedValue[j];
  };
  for (let j = 0; j < Q.n; j++) {
    for (let p = Q.colPtr[j]; p < Q.colPtr[j + 1]; p++) {
      const i = Q.rowIdx[p];
      add(i, j, Q.values[p]);
      if (i !== j) add(j, i, Q.values[p]);
    }
  }
  return { P, q, constant };
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

/** Row-wise copy of A over the variables, and each row's activity from the fixed columns. */
function rowsOf(problem: Problem, variableOf: Int32Array, fixedValue: Float64Array): { idx: number[]; val: number[]; offset: number }[] {
  const { A } = problem;
  const rows = Array.from({ length: A.m }, () => ({ idx: [] as number[], val: [] as number[], offset: 0 }));
  for (let j = 0; j < A.n; j++) {
    const v = variableOf[j];
    for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) {
      const row = rows[A.rowIdx[p]];
      if (v >= 0) {
        row.idx.push(v);
        row.val.push(A.values[p]);
      } else row.offset += A.values[p] * fixedValue[j];
    }
  }
  return rows;
}

/**
 * Phase I form (the usual 'minimise the largest violation' start; Nocedal & Wright, Numerical Optimization, from memory): variables (x, s),
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
    columnOf: form.columnOf,
    variableOf: form.variableOf,
    fixedValue: form.fixedValue,
    constant: 0,
    singletonFixings: form.singletonFixings,
  };
}

function largestFiniteBound(problem: Problem): number {
  let largest = 0;
  for (const bounds of [problem.rowLower, problem.rowUpper, problem.colLower, problem.colUpper]) {
    for (const v of bounds) if (Number.isFinite(v)) largest = Math.max(largest, Math.abs(v));
  }
  return largest;
}
