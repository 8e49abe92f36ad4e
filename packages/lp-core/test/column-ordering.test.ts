/**
 * The fill-reducing column order for sparse LU (sparse/column-ordering.ts) on the arrowhead
 * matrix, the textbook case for ordering (a dense first row and column: eliminated first it fills
 * the whole matrix, eliminated last it fills nothing; e.g. T. A. Davis, Direct Methods for Sparse
 * Linear Systems, SIAM 2006, ch. 7, recalled from memory), and on a seeded sparse matrix against
 * the natural order; and the triangular-first order for LP bases (sparse/triangular-first-order.ts)
 * on a permuted block-triangular matrix, whose LU without fill outside the diagonal block is a fact
 * of elimination (a triangular matrix is its own LU), solved against ml-matrix's dense LU.
 */
import { describe, expect, it } from 'vitest';
import { Matrix, solve as denseSolve } from 'ml-matrix';
import { columnOrder } from '../src/sparse/column-ordering';
import { triangularFirstOrder } from '../src/sparse/triangular-first-order';
import { SparseLu } from '../src/sparse/sparse-lu';
import { SeededRandom } from './support/seeded-random';

interface Columns {
  start: Int32Array;
  rows: Int32Array;
  vals: Float64Array;
}

function columns(list: { rows: number[]; vals: number[] }[]): Columns {
  const start = new Int32Array(list.length + 1);
  list.forEach((c, k) => (start[k + 1] = start[k] + c.rows.length));
  return { start, rows: Int32Array.from(list.flatMap((c) => c.rows)), vals: Float64Array.from(list.flatMap((c) => c.vals)) };
}

function factorNonzeros(m: number, cols: Columns, order: ArrayLike<number>): number {
  const lu = new SparseLu(m);
  for (let q = 0; q < order.length; q++) {
    const k = order[q];
    expect(lu.offer(cols.rows, cols.vals, cols.start[k], cols.start[k + 1], 1e-12)).toBe(true);
  }
  expect(lu.rank).toBe(m);
  return lu.nonzeros;
}

describe('column order for sparse LU', () => {
  it('arrowhead matrix: the dense column goes last and nothing fills in (its dense row is left out of the graph, as in COLAMD)', () => {
    const m = 400;
    // column 0 dense, row 0 dense, a dominant first entry (partial pivoting keeps row 0 first)
    const list = Array.from({ length: m }, (_, k) =>
      k === 0 ? { rows: [...Array(m).keys()], vals: [10 * m, ...Array(m - 1).fill(1)] } : { rows: [0, k], vals: [1, 2] },
    );
    const cols = columns(list);
    const natural = factorNonzeros(m, cols, [...Array(m).keys()]);
    const order = columnOrder(m, m, cols.start, cols.rows);
    expect(order[m - 1]).toBe(0);
    expect([...order].sort((a, b) => a - b)).toEqual([...Array(m).keys()]);
    const ordered = factorNonzeros(m, cols, order);
    // natural order: L and U full (about m²); ordered: no fill, nonzeros of B (3m − 2) plus the unit diagonal
    expect(natural).toBeGreaterThan((m * m) / 2);
    expect(ordered).toBeLessThanOrEqual(3 * m - 2 + m);
  });

  it('a seeded sparse matrix: never more fill than the natural order', () => {
    const rng = new SeededRandom(3);
    const m = 300;
    const list = Array.from({ length: m }, (_, k) => {
      const rows = new Set<number>([k]);
      const extra = rng.integer(0, 3);
      while (rows.size < 1 + extra) rows.add(rng.integer(0, m - 1));
      const r = [...rows];
      return { rows: r, vals: r.map((i) => (i === k ? 8 : rng.uniform(-1, 1))) };
    });
    const cols = columns(list);
    const natural = factorNonzeros(m, cols, [...Array(m).keys()]);
    const ordered = factorNonzeros(m, cols, columnOrder(m, m, cols.start, cols.rows));
    expect(ordered).toBeLessThanOrEqual(natural);
  });

  it('triangular-first order: a permuted block-triangular matrix [T1 X Y; 0 K Z; 0 0 T3] finds T1 (column singletons) and T3 (row singletons), leaves the 8 × 8 block K as the bump, and its LU fills only in K\'s rows', () => {
    const rng = new SeededRandom(11);
    const t1 = 40;
    const k = 8;
    const t3 = 30;
    const m = t1 + k + t3;
    // dense by block position first: T1 upper triangular, K dense, T3 lower triangular, X, Y, Z sparse
    const B = Matrix.zeros(m, m);
    for (let c = 0; c < m; c++) {
      B.set(c, c, rng.uniform(2, 4));
      for (let r = 0; r < c; r++) {
        const inT1 = c < t1;
        const inK = c >= t1 && c < t1 + k && r >= t1;
        if (inK || (inT1 && rng.chance(0.1)) || (c >= t1 && r < t1 && rng.chance(0.1))) B.set(r, c, rng.uniform(-1, 1));
      }
      if (c >= t1 && c < t1 + k) for (let r = c + 1; r < t1 + k; r++) B.set(r, c, rng.uniform(-1, 1));
      if (c >= t1 + k) {
        // Z: at least one entry in K's rows, so no T3 column is a column singleton
        B.set(t1 + rng.integer(0, k - 1), c, rng.uniform(-1, 1));
        for (let r = c + 1; r < m; r++) if (rng.chance(0.1)) B.set(r, c, rng.uniform(-1, 1)); // T3 lower triangular
      }
    }
    // then rows and columns shuffled
    const shuffle = (n: number) => {
      const p = [...Array(n).keys()];
      for (let i = n - 1; i > 0; i--) {
        const j = rng.integer(0, i);
        [p[i], p[j]] = [p[j], p[i]];
      }
      return p;
    };
    const rowPerm = shuffle(m);
    const colPerm = shuffle(m);
    const P = Matrix.zeros(m, m);
    for (let r = 0; r < m; r++) for (let c = 0; c < m; c++) P.set(rowPerm[r], colPerm[c], B.get(r, c));
    const list = Array.from({ length: m }, (_, c) => {
      const rows: number[] = [];
      const vals: number[] = [];
      for (let r = 0; r < m; r++)
        if (P.get(r, c) !== 0) {
          rows.push(r);
          vals.push(P.get(r, c));
        }
      return { rows, vals };
    });
    const cols = columns(list);
    const nonzeros = cols.start[m];
    const { order, bump } = triangularFirstOrder(m, m, cols.start, cols.rows);
    expect(bump).toBe(k);
    expect([...order].sort((a, b) => a - b)).toEqual([...Array(m).keys()]);
    // L holds its m unit pivots and U the matrix's entries; fill only in K's rows, in K and in Z
    // (U's part there is L_K⁻¹ Z): at most k entries more in each of the last k + t3 columns
    const lu = new SparseLu(m);
    for (const c of order) expect(lu.offer(cols.rows, cols.vals, cols.start[c], cols.start[c + 1], 1e-12)).toBe(true);
    expect(lu.nonzeros).toBeLessThanOrEqual(nonzeros + m + k * (k + t3));
    expect(lu.nonzeros).toBeGreaterThanOrEqual(nonzeros + m);
    // and it solves: x (by position) against ml-matrix with the columns in that order
    const b = Array.from({ length: m }, () => rng.uniform(-1, 1));
    const x = Float64Array.from(b);
    lu.solve(x, new Float64Array(m));
    const ordered = new Matrix(m, m);
    order.forEach((c, q) => list[c].rows.forEach((r, t) => ordered.set(r, q, list[c].vals[t])));
    denseSolve(ordered, Matrix.columnVector(b)).to1DArray().forEach((v, q) => expect(x[q]).toBeCloseTo(v, 9));
  });
});
