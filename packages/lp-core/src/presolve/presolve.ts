/**
 * Presolve: empty rows and columns, fixed columns, singleton rows (turned into column bounds),
 * forcing rows (every column fixed at a bound) and redundant rows (activity bounds inside the
 * row bounds), repeated until nothing changes. Returns the reduced problem and a postsolve
 * that restores x, row activities and the duals (postsolve.ts). A QP whose Q has off-diagonal
 * entries is passed through unchanged.
 */
import type { Problem } from '../problem/problem';
import { transpose } from '../sparse/csc';
import { hasOffDiagonalQ, qDiagonal } from '../ipm/ipm-problem';
import type { Reduction } from './reductions';
import { postsolve } from './postsolve';

export interface PresolveOutcome {
  status: 'reduced' | 'infeasible' | 'unbounded';
  reduced: Problem;
  postsolve: (x: Float64Array, y: Float64Array) => { x: Float64Array; y: Float64Array };
  message?: string;
}

const MAX_PASSES = 20;
/** feasibility tolerance of presolve decisions, relative to 1 + |bound| */
const FEAS_TOL = 1e-9;

export function presolve(p: Problem, enabled: boolean): PresolveOutcome {
  if (!enabled || hasOffDiagonalQ(p.Q)) {
    return { status: 'reduced', reduced: p, postsolve: (x, y) => ({ x: Float64Array.from(x), y: Float64Array.from(y) }) };
  }
  const n = p.c.length;
  const m = p.rowLower.length;
  const A = p.A;
  const At = transpose(A);
  const q = qDiagonal(n, p.Q);
  const colLower = Float64Array.from(p.colLower);
  const colUpper = Float64Array.from(p.colUpper);
  const rowLower = Float64Array.from(p.rowLower);
  const rowUpper = Float64Array.from(p.rowUpper);
  const rowActive = new Uint8Array(m).fill(1);
  const colActive = new Uint8Array(n).fill(1);
  const stack: Reduction[] = [];
  let c0 = p.c0;
  let failure: { status: 'infeasible' | 'unbounded'; message: string } | null = null;

  const near = (a: number, b: number): boolean => Math.abs(a - b) <= FEAS_TOL * (1 + Math.abs(b));
  const fixColumn = (j: number, value: number): void => {
    colActive[j] = 0;
    stack.push({ kind: 'fixed_column', j, value });
    c0 += p.c[j] * value + 0.5 * q[j] * value * value;
    for (let t = A.colPtr[j]; t < A.colPtr[j + 1]; t++) {
      const i = A.rowIdx[t];
      if (!rowActive[i]) continue;
      rowLower[i] -= A.values[t] * value;
      rowUpper[i] -= A.values[t] * value;
    }
  };

  for (let pass = 0; pass < MAX_PASSES && !failure; pass++) {
    let changed = false;
    // columns: fixed and empty
    for (let j = 0; j < n && !failure; j++) {
      if (!colActive[j]) continue;
      if (colLower[j] === colUpper[j]) {
        fixColumn(j, colLower[j]);
        changed = true;
        continue;
      }
      let count = 0;
      for (let t = A.colPtr[j]; t < A.colPtr[j + 1]; t++) if (rowActive[A.rowIdx[t]] && A.values[t] !== 0) count++;
      if (count > 0) continue;
      const value = bestValueOfEmptyColumn(p.c[j], q[j], colLower[j], colUpper[j]);
      if (!Number.isFinite(value)) {
        failure = { status: 'unbounded', message: `presolve: column ${p.colNames[j]} appears in no row and its cost decreases without bound` };
        break;
      }
      fixColumn(j, value);
      changed = true;
    }
    // rows: empty, singleton, forcing, redundant
    for (let i = 0; i < m && !failure; i++) {
      if (!rowActive[i]) continue;
      let count = 0;
      let lastCol = -1;
      let lastA = 0;
      let minAct = 0;
      let maxAct = 0;
      for (let t = At.colPtr[i]; t < At.colPtr[i + 1]; t++) {
        const j = At.rowIdx[t];
        const a = At.values[t];
        if (!colActive[j] || a === 0) continue;
        count++;
        lastCol = j;
        lastA = a;
        minAct += a > 0 ? a * colLower[j] : a * colUpper[j];
        maxAct += a > 0 ? a * colUpper[j] : a * colLower[j];
      }
      const lo = rowLower[i];
      const up = rowUpper[i];
      if (count === 0) {
        if (lo > FEAS_TOL * (1 + Math.abs(lo)) || up < -FEAS_TOL * (1 + Math.abs(up))) {
          failure = { status: 'infeasible', message: `presolve: row ${p.rowNames[i]} has no entries left but needs activity in [${lo}, ${up}]` };
          break;
        }
        rowActive[i] = 0;
        stack.push({ kind: 'empty_row', i });
        changed = true;
        continue;
      }
      if (count === 1) {
        const j = lastCol;
        const a = lastA;
        const bl = a > 0 ? lo / a : up / a;
        const bu = a > 0 ? up / a : lo / a;
        const lowerFromRow = bl > colLower[j];
        const upperFromRow = bu < colUpper[j];
        if (lowerFromRow) colLower[j] = bl;
        if (upperFromRow) colUpper[j] = bu;
        if (colLower[j] > colUpper[j]) {
          if (near(colLower[j], colUpper[j])) colUpper[j] = colLower[j];
          else {
            failure = { status: 'infeasible', message: `presolve: row ${p.rowNames[i]} and the bounds of ${p.colNames[j]} cannot both hold` };
            break;
          }
        }
        rowActive[i] = 0;
        stack.push({ kind: 'singleton_row', i, j, a, lowerFromRow, upperFromRow });
        changed = true;
        continue;
      }
      if (minAct > up + FEAS_TOL * (1 + Math.abs(up)) || maxAct < lo - FEAS_TOL * (1 + Math.abs(lo))) {
        failure = { status: 'infeasible', message: `presolve: row ${p.rowNames[i]} activity lies in [${minAct}, ${maxAct}], outside its bounds [${lo}, ${up}]` };
        break;
      }
      const upperForcing = Number.isFinite(up) && near(minAct, up);
      const lowerForcing = !upperForcing && Number.isFinite(lo) && near(maxAct, lo);
      if (upperForcing || lowerForcing) {
        const cols: number[] = [];
        const coefs: number[] = [];
        for (let t = At.colPtr[i]; t < At.colPtr[i + 1]; t++) {
          const j = At.rowIdx[t];
          const a = At.values[t];
          if (!colActive[j] || a === 0) continue;
          cols.push(j);
          coefs.push(a);
        }
        rowActive[i] = 0;
        stack.push({ kind: 'forcing_row', i, side: upperForcing ? 'upper' : 'lower', cols: Int32Array.from(cols), coefs: Float64Array.from(coefs) });
        cols.forEach((j, k) => {
          const atLower = upperForcing === coefs[k] > 0;
          fixColumn(j, atLower ? colLower[j] : colUpper[j]);
        });
        changed = true;
        continue;
      }
      if (minAct >= lo - FEAS_TOL * (1 + Math.abs(lo)) && maxAct <= up + FEAS_TOL * (1 + Math.abs(up))) {
        rowActive[i] = 0;
        stack.push({ kind: 'redundant_row', i });
        changed = true;
      }
    }
    if (!changed) break;
  }

  if (failure) {
    return { status: failure.status, reduced: p, postsolve: (x, y) => ({ x, y }), message: failure.message };
  }
  const reduced = buildReduced(p, rowActive, colActive, { colLower, colUpper, rowLower, rowUpper, c0 });
  return {
    status: 'reduced',
    reduced: reduced.problem,
    postsolve: (xr, yr) => postsolve(p, q, stack, reduced.cols, reduced.rows, xr, yr),
  };
}

/** minimiser of c x + ½ q x² over [l, u]; ±Infinity when unbounded below */
function bestValueOfEmptyColumn(c: number, q: number, l: number, u: number): number {
  if (q > 0) return Math.min(Math.max(-c / q, l), u);
  if (c > 0) return l;
  if (c < 0) return u;
  return Math.min(Math.max(0, l), u);
}

function buildReduced(
  p: Problem,
  rowActive: Uint8Array,
  colActive: Uint8Array,
  b: { colLower: Float64Array; colUpper: Float64Array; rowLower: Float64Array; rowUpper: Float64Array; c0: number },
): { problem: Problem; rows: Int32Array; cols: Int32Array } {
  const n = p.c.length;
  const m = p.rowLower.length;
  const rowMap = new Int32Array(m).fill(-1);
  const rows: number[] = [];
  for (let i = 0; i < m; i++) if (rowActive[i]) rowMap[i] = rows.push(i) - 1;
  const cols: number[] = [];
  for (let j = 0; j < n; j++) if (colActive[j]) cols.push(j);
  const nr = cols.length;
  const colPtr = new Int32Array(nr + 1);
  const ri: number[] = [];
  const rv: number[] = [];
  cols.forEach((j, k) => {
    for (let t = p.A.colPtr[j]; t < p.A.colPtr[j + 1]; t++) {
      const i = rowMap[p.A.rowIdx[t]];
      if (i < 0 || p.A.values[t] === 0) continue;
      ri.push(i);
      rv.push(p.A.values[t]);
    }
    colPtr[k + 1] = ri.length;
  });
  let Q: Problem['Q'];
  if (p.Q) {
    const qd = qDiagonal(n, p.Q);
    const Qp = new Int32Array(nr + 1);
    const qi: number[] = [];
    const qv: number[] = [];
    cols.forEach((j, k) => {
      if (qd[j] !== 0) {
        qi.push(k);
        qv.push(qd[j]);
      }
      Qp[k + 1] = qi.length;
    });
    Q = { m: nr, n: nr, colPtr: Qp, rowIdx: Int32Array.from(qi), values: Float64Array.from(qv) };
  }
  const pick = (a: Float64Array, idx: number[]): Float64Array => Float64Array.from(idx, (k) => a[k]);
  return {
    problem: {
      name: p.name,
      colNames: cols.map((j) => p.colNames[j]),
      rowNames: rows.map((i) => p.rowNames[i]),
      c: pick(p.c, cols),
      c0: b.c0,
      A: { m: rows.length, n: nr, colPtr, rowIdx: Int32Array.from(ri), values: Float64Array.from(rv) },
      rowLower: pick(b.rowLower, rows),
      rowUpper: pick(b.rowUpper, rows),
      colLower: pick(b.colLower, cols),
      colUpper: pick(b.colUpper, cols),
      Q,
    },
    rows: Int32Array.from(rows),
    cols: Int32Array.from(cols),
  };
}
