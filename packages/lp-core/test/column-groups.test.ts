/**
 * The copy of a matrix's columns that conjugate gradients multiply with at every step
 * (ipm/column-groups.ts, ipm/split-product-kernel.ts): grouped by length, with the short lengths
 * written out, the product must still be Σ_j f_j² a_j a_jᵀ g over the columns of two or more
 * entries. Reference: the same sum formed densely with ml-matrix (a linear-algebra identity;
 * common practice, no source).
 */
import { Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { groupColumns } from '../src/ipm/column-groups';
import { addColumnProducts, WRITTEN_OUT_LENGTH } from '../src/ipm/split-product-kernel';
import { cscFromTriplets } from '../src/sparse/csc';
import { SeededRandom } from './support/seeded-random';

describe('columns grouped by length', () => {
  it('give the product Σ f_j² a_j a_jᵀ g of the dense matrix, over any range of the grouped columns', () => {
    const rng = new SeededRandom(21);
    const m = 40;
    const n = 120;
    const rows: number[] = [];
    const cols: number[] = [];
    const vals: number[] = [];
    for (let j = 0; j < n; j++) {
      // lengths 0..14: empty, single-entry, every written-out length, and longer
      const len = j % 15;
      const picked = new Set<number>();
      while (picked.size < len) picked.add(Math.floor(rng.uniform(0, m)));
      for (const i of picked) {
        rows.push(i);
        cols.push(j);
        vals.push(rng.uniform(-2, 2));
      }
    }
    const A = cscFromTriplets(m, n, rows, cols, vals);
    // some columns left out (factor 0 or NaN), the rest scaled
    const factor = Float64Array.from({ length: n }, (_, j) => (j % 7 === 3 ? 0 : j % 11 === 5 ? NaN : rng.uniform(0.1, 3)));
    const grouped = groupColumns(A, (j) => factor[j]);
    const g = Float64Array.from({ length: m }, () => rng.uniform(-1, 1));

    const dense = new Matrix(m, m);
    let taken = 0;
    let entries = 0;
    for (let j = 0; j < n; j++) {
      const len = A.colPtr[j + 1] - A.colPtr[j];
      if (len < 2 || !(factor[j] > 0)) continue;
      taken++;
      entries += len;
      const a = new Matrix(m, 1);
      for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) a.set(A.rowIdx[p], 0, A.values[p] * factor[j]);
      dense.add(a.mmul(a.transpose()));
    }
    expect(grouped.columns).toBe(taken);
    expect(grouped.entries).toBe(entries);
    // one group for each written-out length 2..WRITTEN_OUT_LENGTH, then one for the longer columns
    const writtenOut = WRITTEN_OUT_LENGTH - 1;
    expect(grouped.groups.length / 3).toBe(writtenOut + 1);
    const reference = dense.mmul(Matrix.columnVector(Array.from(g))).to1DArray();

    const whole = new Float64Array(m);
    addColumnProducts(grouped.ptr, grouped.idx, grouped.val, grouped.groups, g, whole, 0, grouped.columns);
    // split at a column inside a group, as the helper thread's share is
    const cut = Math.floor(grouped.columns * 0.45);
    const parts = new Float64Array(m);
    addColumnProducts(grouped.ptr, grouped.idx, grouped.val, grouped.groups, g, parts, 0, cut);
    addColumnProducts(grouped.ptr, grouped.idx, grouped.val, grouped.groups, g, parts, cut, grouped.columns);
    for (let i = 0; i < m; i++) {
      expect(whole[i]).toBeCloseTo(reference[i], 10);
      expect(parts[i]).toBeCloseTo(reference[i], 10);
    }
  });
});
