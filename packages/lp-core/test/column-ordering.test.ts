/**
 * The fill-reducing column order for sparse LU (sparse/column-ordering.ts) on the arrowhead
 * matrix, the textbook case for ordering (a dense first row and column: eliminated first it fills
 * the whole matrix, eliminated last it fills nothing; e.g. T. A. Davis, Direct Methods for Sparse
 * Linear Systems, SIAM 2006, ch. 7, recalled from memory), and on a seeded sparse matrix against
 * the natural order.
 */
import { describe, expect, it } from 'vitest';
import { columnOrder } from '../src/sparse/column-ordering';
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
});
