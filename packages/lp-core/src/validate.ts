/**
 * Checks a Problem before any iteration. Everything wrong is collected and reported in one
 * ProblemInputError naming the row, column or array at fault.
 */
import type { CscMatrix, Problem } from './problem/problem';
import { cscProblems } from './sparse/csc';
import { SymmetricFactorisation } from './sparse/symmetric-factorisation';

export class ProblemInputError extends Error {
  readonly problems: string[];
  constructor(problems: string[]) {
    super(`Invalid problem: ${problems.join('; ')}`);
    this.name = 'ProblemInputError';
    this.problems = problems;
  }
}

const MAX_REPORTED = 10;

export function validateProblem(p: Problem): void {
  const out: string[] = [];
  const add = (msg: string): void => {
    if (out.length < MAX_REPORTED) out.push(msg);
  };
  const n = p.c?.length ?? 0;
  const m = p.rowLower?.length ?? 0;
  if (!p.A || !p.c || !p.rowLower || !p.rowUpper || !p.colLower || !p.colUpper) {
    throw new ProblemInputError(['A, c, rowLower, rowUpper, colLower and colUpper are all required']);
  }
  if (n === 0) throw new ProblemInputError(['the problem is empty: it has no columns']);
  if (p.A.n !== n) add(`A has ${p.A.n} columns but c has ${n} entries`);
  if (p.A.m !== m) add(`A has ${p.A.m} rows but rowLower has ${m} entries`);
  if (p.rowUpper.length !== m) add(`rowUpper has ${p.rowUpper.length} entries, expected ${m}`);
  if (p.colLower.length !== n) add(`colLower has ${p.colLower.length} entries, expected ${n}`);
  if (p.colUpper.length !== n) add(`colUpper has ${p.colUpper.length} entries, expected ${n}`);
  if (p.colNames.length !== n) add(`colNames has ${p.colNames.length} names, expected ${n}`);
  if (p.rowNames.length !== m) add(`rowNames has ${p.rowNames.length} names, expected ${m}`);
  if (out.length > 0) throw new ProblemInputError(out);
  for (const msg of cscProblems(p.A, 'A')) add(msg);
  if (!Number.isFinite(p.c0)) add(`objective constant c0 is ${p.c0}`);
  const col = (j: number): string => `column ${p.colNames[j] || j}`;
  const row = (i: number): string => `row ${p.rowNames[i] || i}`;
  for (let j = 0; j < n; j++) {
    if (!Number.isFinite(p.c[j])) add(`${col(j)}: cost is ${p.c[j]}`);
    checkBounds(p.colLower[j], p.colUpper[j], col(j), add);
  }
  for (let i = 0; i < m; i++) checkBounds(p.rowLower[i], p.rowUpper[i], row(i), add);
  if (p.Q) checkQ(p.Q, n, col, add);
  if (out.length > 0) throw new ProblemInputError(out);
}

function checkBounds(lo: number, up: number, what: string, add: (m: string) => void): void {
  if (Number.isNaN(lo) || Number.isNaN(up)) add(`${what}: a bound is NaN`);
  else if (lo === Infinity) add(`${what}: lower bound is +Infinity`);
  else if (up === -Infinity) add(`${what}: upper bound is −Infinity`);
  else if (lo > up) add(`${what}: lower bound ${lo} exceeds upper bound ${up}`);
}

function checkQ(Q: CscMatrix, n: number, col: (j: number) => string, add: (m: string) => void): void {
  if (Q.m !== n || Q.n !== n) {
    add(`Q is ${Q.m} × ${Q.n}, expected ${n} × ${n}`);
    return;
  }
  const structural = cscProblems(Q, 'Q');
  structural.forEach(add);
  if (structural.length > 0) return;
  let maxDiag = 0;
  const { colPtr: Qp, rowIdx: Qi, values: Qx } = Q;
  let bad = false;
  for (let j = 0; j < n; j++) {
    for (let p = Qp[j]; p < Qp[j + 1]; p++) {
      if (Qi[p] < j) {
        add(`Q must be given by its lower triangle; entry (${Qi[p]}, ${j}) is above the diagonal`);
        bad = true;
      } else if (Qi[p] === j) {
        if (Qx[p] < 0) {
          add(`Q is not positive semidefinite: diagonal entry of ${col(j)} is ${Qx[p]}`);
          bad = true;
        }
        maxDiag = Math.max(maxDiag, Qx[p]);
      }
    }
  }
  if (bad) return;
  // a PSD Q gives Q + εI positive pivots; a failing pivot proves Q is not PSD
  const rows: number[] = [];
  const cols: number[] = [];
  for (let j = 0; j < n; j++) {
    rows.push(j);
    cols.push(j);
    for (let p = Qp[j]; p < Qp[j + 1]; p++) {
      if (Qi[p] === j) continue;
      rows.push(Qi[p]);
      cols.push(j);
    }
  }
  const F = new SymmetricFactorisation(n, Int32Array.from(rows), Int32Array.from(cols));
  const eps = 1e-9 * (1 + maxDiag);
  let t = 0;
  for (let j = 0; j < n; j++) {
    let d = eps;
    for (let p = Qp[j]; p < Qp[j + 1]; p++) if (Qi[p] === j) d += Qx[p];
    F.Cx[F.slot[t++]] += d;
    for (let p = Qp[j]; p < Qp[j + 1]; p++) if (Qi[p] !== j) F.Cx[F.slot[t++]] += Qx[p];
  }
  const sign = new Int8Array(n).fill(1);
  const r = F.factorise({ pivotTolerance: 1e-14, dynamicRegularisation: false, bigPivot: 0, sign });
  if (r.status !== 'factorised') {
    add(`Q is not positive semidefinite: its Cholesky factorisation fails at ${col(F.perm[r.column])}`);
  }
}
