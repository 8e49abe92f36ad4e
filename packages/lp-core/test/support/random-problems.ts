/**
 * Seeded random LPs and QPs for cross-checks against reference solvers. Optimal instances are built
 * from a chosen KKT point (x*, y*, z*): bounds are made active where a multiplier is non-zero, and
 * c = Aᵀy* + z* − Qx*, so an optimum exists by construction (the optimum itself is left to the
 * reference solvers to compute). Variants:
 *   'feasible'    – mixed row types (≤, ≥, =, ranges, free rows) and column types (bounded, free, fixed)
 *   'degenerate'  – additionally bounds active with a zero multiplier (primal degeneracy)
 *   'infeasible'  – a feasible instance plus a copy of a row with a disjoint bound range
 *   'unbounded'   – a feasible instance plus a column with negative cost whose increase keeps every row feasible
 */
import type { Problem } from '../../src/problem/problem';
import { SeededRandom } from './seeded-random';

export type RandomKind = 'feasible' | 'degenerate' | 'infeasible' | 'unbounded';

export interface RandomProblemOptions {
  rows: number;
  cols: number;
  /** expected non-zeros per column (at least one per column) */
  perColumn?: number;
  kind?: RandomKind;
  /** add a positive semidefinite Q (lower triangle) */
  quadratic?: boolean;
  /** share of free columns (no bounds), default 0.1 */
  freeShare?: number;
  /** share of range rows, default 0.15 */
  rangeShare?: number;
}

export function randomProblem(seed: number, options: RandomProblemOptions): Problem {
  const rng = new SeededRandom(seed);
  const { rows: m, cols: n } = options;
  const kind = options.kind ?? 'feasible';
  const perColumn = options.perColumn ?? Math.min(m, 3);
  const freeShare = options.freeShare ?? 0.1;
  const rangeShare = options.rangeShare ?? 0.15;

  // A: every column gets 1..2·perColumn entries; every row at least one.
  const cols: Map<number, number>[] = Array.from({ length: n }, () => new Map());
  for (let j = 0; j < n; j++) {
    const count = rng.integer(1, Math.max(1, 2 * perColumn - 1));
    for (let k = 0; k < count; k++) cols[j].set(rng.integer(0, m - 1), rng.round2(-5, 5) || 1);
  }
  for (let i = 0; i < m; i++) {
    if (!cols.some((c) => c.has(i))) cols[rng.integer(0, n - 1)].set(i, rng.round2(0.5, 5));
  }

  const x = Float64Array.from({ length: n }, () => rng.round2(-3, 6));
  const r = new Float64Array(m);
  cols.forEach((c, j) => c.forEach((v, i) => (r[i] += v * x[j])));

  const degenerate = kind === 'degenerate';
  const rowLower = new Float64Array(m);
  const rowUpper = new Float64Array(m);
  const y = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const gap = () => rng.round2(0.5, 4);
    const kindOfRow = rng.next();
    if (kindOfRow < 0.2) {
      rowLower[i] = rowUpper[i] = r[i];
      y[i] = rng.round2(-2, 2);
    } else if (kindOfRow < 0.2 + rangeShare) {
      const active = rng.pick(['lower', 'upper', 'none'] as const);
      rowLower[i] = active === 'lower' ? r[i] : r[i] - gap();
      rowUpper[i] = active === 'upper' ? r[i] : r[i] + gap();
      y[i] = active === 'lower' ? rng.round2(0.1, 2) : active === 'upper' ? -rng.round2(0.1, 2) : 0;
    } else if (kindOfRow < 0.25 + rangeShare) {
      rowLower[i] = -Infinity;
      rowUpper[i] = Infinity;
    } else if (rng.chance(0.5)) {
      const active = rng.chance(0.5);
      rowLower[i] = -Infinity;
      rowUpper[i] = active ? r[i] : r[i] + gap();
      y[i] = active && !(degenerate && rng.chance(0.5)) ? -rng.round2(0.1, 2) : 0;
    } else {
      const active = rng.chance(0.5);
      rowLower[i] = active ? r[i] : r[i] - gap();
      rowUpper[i] = Infinity;
      y[i] = active && !(degenerate && rng.chance(0.5)) ? rng.round2(0.1, 2) : 0;
    }
  }

  const colLower = new Float64Array(n);
  const colUpper = new Float64Array(n);
  const z = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const gap = () => rng.round2(0.5, 4);
    const t = rng.next();
    if (t < freeShare) {
      colLower[j] = -Infinity;
      colUpper[j] = Infinity;
    } else if (t < freeShare + 0.05) {
      colLower[j] = colUpper[j] = x[j];
      z[j] = rng.round2(-1, 1);
    } else {
      const active = rng.pick(['lower', 'upper', 'none', 'none'] as const);
      const withUpper = active === 'upper' || rng.chance(0.5);
      colLower[j] = active === 'lower' ? x[j] : x[j] - gap();
      colUpper[j] = active === 'upper' ? x[j] : withUpper ? x[j] + gap() : Infinity;
      const zeroMultiplier = degenerate && rng.chance(0.5);
      z[j] = zeroMultiplier ? 0 : active === 'lower' ? rng.round2(0.1, 2) : active === 'upper' ? -rng.round2(0.1, 2) : 0;
    }
  }

  let Q: Problem['Q'];
  const qx = new Float64Array(n);
  if (options.quadratic) {
    Q = randomPsdLower(rng, n);
    for (let j = 0; j < n; j++) {
      for (let p = Q.colPtr[j]; p < Q.colPtr[j + 1]; p++) {
        const i = Q.rowIdx[p];
        qx[i] += Q.values[p] * x[j];
        if (i !== j) qx[j] += Q.values[p] * x[i];
      }
    }
  }
  // c + Qx − Aᵀy − z = 0 at x*
  const c = Float64Array.from({ length: n }, (_, j) => {
    let aty = 0;
    cols[j].forEach((v, i) => (aty += v * y[i]));
    return aty + z[j] - qx[j];
  });

  const problem = assemble(`random-${kind}-${seed}`, cols, m, c, rowLower, rowUpper, colLower, colUpper, Q);
  if (kind === 'infeasible') return withContradictingRow(problem, rng);
  if (kind === 'unbounded') return withUnboundedColumn(problem, rng);
  return problem;
}

/** Q = BᵀB + diag(d) with a sparse B, as a lower triangle. */
function randomPsdLower(rng: SeededRandom, n: number): NonNullable<Problem['Q']> {
  const dense = new Float64Array(n * n);
  const k = Math.max(1, Math.floor(n / 2));
  for (let r = 0; r < k; r++) {
    const entries: [number, number][] = [];
    for (let t = 0; t < 3; t++) entries.push([rng.integer(0, n - 1), rng.round2(-2, 2)]);
    for (const [a, va] of entries) for (const [b, vb] of entries) dense[a * n + b] += va * vb;
  }
  for (let j = 0; j < n; j++) if (rng.chance(0.5)) dense[j * n + j] += rng.round2(0.1, 2);
  const colPtr = new Int32Array(n + 1);
  const rowIdx: number[] = [];
  const values: number[] = [];
  for (let j = 0; j < n; j++) {
    for (let i = j; i < n; i++) {
      if (dense[i * n + j] !== 0) {
        rowIdx.push(i);
        values.push(dense[i * n + j]);
      }
    }
    colPtr[j + 1] = rowIdx.length;
  }
  return { m: n, n, colPtr, rowIdx: Int32Array.from(rowIdx), values: Float64Array.from(values) };
}

function assemble(
  name: string, cols: Map<number, number>[], m: number, c: Float64Array, rowLower: Float64Array, rowUpper: Float64Array,
  colLower: Float64Array, colUpper: Float64Array, Q?: Problem['Q'],
): Problem {
  const n = cols.length;
  const colPtr = new Int32Array(n + 1);
  const rowIdx: number[] = [];
  const values: number[] = [];
  cols.forEach((col, j) => {
    [...col.entries()].sort((a, b) => a[0] - b[0]).forEach(([i, v]) => {
      rowIdx.push(i);
      values.push(v);
    });
    colPtr[j + 1] = rowIdx.length;
  });
  return {
    name,
    colNames: Array.from({ length: n }, (_, j) => `x${j}`),
    rowNames: Array.from({ length: m }, (_, i) => `r${i}`),
    c,
    c0: 0,
    A: { m, n, colPtr, rowIdx: Int32Array.from(rowIdx), values: Float64Array.from(values) },
    rowLower,
    rowUpper,
    colLower,
    colUpper,
    ...(Q ? { Q } : {}),
  };
}

/** Copies a row with a finite bound and gives the copy a range that misses the original's. */
function withContradictingRow(p: Problem, rng: SeededRandom): Problem {
  const candidates = [...Array(p.A.m).keys()].filter((i) => Number.isFinite(p.rowLower[i]) || Number.isFinite(p.rowUpper[i]));
  const i = rng.pick(candidates);
  const cols = columnsOf(p);
  cols.forEach((col) => {
    const v = col.get(i);
    if (v !== undefined) col.set(p.A.m, v);
  });
  const [lower, upper] = Number.isFinite(p.rowLower[i]) ? [-Infinity, p.rowLower[i] - 1] : [p.rowUpper[i] + 1, Infinity];
  const out = assemble(p.name!.replace('feasible', 'infeasible'), cols, p.A.m + 1, p.c, append(p.rowLower, lower), append(p.rowUpper, upper), p.colLower, p.colUpper, p.Q);
  return { ...out, name: `${p.name}-infeasible` };
}

/** Adds a column with cost −1 and x ≥ 0 whose entries only push rows away from their finite bound. */
function withUnboundedColumn(p: Problem, rng: SeededRandom): Problem {
  const cols = columnsOf(p);
  const ray = new Map<number, number>();
  for (let i = 0; i < p.A.m && ray.size < 3; i++) {
    if (p.rowUpper[i] === Infinity && rng.chance(0.6)) ray.set(i, rng.round2(0.5, 3));
    else if (p.rowLower[i] === -Infinity && rng.chance(0.6)) ray.set(i, -rng.round2(0.5, 3));
  }
  cols.push(ray);
  const n = p.A.n + 1;
  const Q = p.Q ? { ...p.Q, m: n, n, colPtr: append(p.Q.colPtr, p.Q.colPtr[p.Q.n]) as unknown as Int32Array } : undefined;
  const out = assemble(`${p.name}-unbounded`, cols, p.A.m, append(p.c, -1), p.rowLower, p.rowUpper, append(p.colLower, 0), append(p.colUpper, Infinity), Q);
  return out;
}

function columnsOf(p: Problem): Map<number, number>[] {
  return Array.from({ length: p.A.n }, (_, j) => {
    const col = new Map<number, number>();
    for (let q = p.A.colPtr[j]; q < p.A.colPtr[j + 1]; q++) col.set(p.A.rowIdx[q], p.A.values[q]);
    return col;
  });
}

function append<T extends Float64Array | Int32Array>(a: T, v: number): T {
  const out = new (a.constructor as { new (n: number): T })(a.length + 1);
  out.set(a);
  out[a.length] = v;
  return out;
}
