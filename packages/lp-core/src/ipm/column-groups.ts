/**
 * A matrix's columns copied for the products Σ_j ã_j (ã_jᵀ g) that conjugate gradients take at
 * every step (split-system.ts with N, basis-cg-solver.ts with A itself while the diagonal
 * preconditioner serves): each column scaled by a factor, grouped by its number of entries so that
 * addColumnProducts (split-product-kernel.ts) runs each short length as straight-line code, and in
 * A's order within a group. Columns with a single entry only add to a diagonal; the caller keeps
 * them apart.
 */
import type { CscMatrix } from '../problem/problem';
import { WRITTEN_OUT_LENGTH } from './split-product-kernel';

export interface ColumnGroups {
  ptr: Int32Array;
  idx: Int32Array;
  val: Float64Array;
  /** (first column, end column, length) triples; length 0 for the group of longer columns */
  groups: Int32Array;
  columns: number;
  entries: number;
}

/** where the copy's arrays are made, told the number of entries first (e.g. shared memory for a helper thread) */
export interface Allocator {
  ints(length: number): Int32Array;
  floats(length: number): Float64Array;
}

/** this thread's own memory */
export const OWN_MEMORY: Allocator = { ints: (length) => new Int32Array(length), floats: (length) => new Float64Array(length) };

/**
 * The columns j of A with two or more entries and factor(j) > 0, each scaled by factor(j)
 * (called once per column).
 */
export function groupColumns(A: CscMatrix, factor: (j: number) => number, allocatorFor: (entries: number) => Allocator = () => OWN_MEMORY): ColumnGroups {
  const { n, colPtr: Ap, rowIdx: Ai, values: Ax } = A;
  const scale = new Float64Array(n);
  // lengths 2..WRITTEN_OUT_LENGTH each in a group of their own, longer ones after them
  const groupOf = (j: number) => Math.min(Ap[j + 1] - Ap[j], WRITTEN_OUT_LENGTH + 1);
  const inGroup = new Int32Array(WRITTEN_OUT_LENGTH + 2);
  let columns = 0;
  let entries = 0;
  for (let j = 0; j < n; j++) {
    const len = Ap[j + 1] - Ap[j];
    if (len < 2) continue;
    const f = factor(j);
    if (!(f > 0)) continue;
    scale[j] = f;
    inGroup[groupOf(j)]++;
    columns++;
    entries += len;
  }
  const groups: number[] = [];
  const next = new Int32Array(WRITTEN_OUT_LENGTH + 2);
  for (let len = 2, first = 0; len <= WRITTEN_OUT_LENGTH + 1; first += inGroup[len++]) {
    next[len] = first;
    if (inGroup[len] > 0) groups.push(first, first + inGroup[len], len <= WRITTEN_OUT_LENGTH ? len : 0);
  }
  const allocator = allocatorFor(entries);
  const ptr = allocator.ints(columns + 1);
  const idx = allocator.ints(entries);
  const val = allocator.floats(entries);
  // each column's place: its length at ptr[place + 1], summed into starts below
  const place = new Int32Array(n).fill(-1);
  for (let j = 0; j < n; j++) {
    if (scale[j] === 0) continue;
    const c = next[groupOf(j)]++;
    place[j] = c;
    ptr[c + 1] = Ap[j + 1] - Ap[j];
  }
  ptr[0] = 0;
  for (let c = 0; c < columns; c++) ptr[c + 1] += ptr[c];
  for (let j = 0; j < n; j++) {
    const c = place[j];
    if (c < 0) continue;
    const f = scale[j];
    for (let p = Ap[j], q = ptr[c]; p < Ap[j + 1]; p++, q++) {
      idx[q] = Ai[p];
      val[q] = Ax[p] * f;
    }
  }
  return { ptr, idx, val, groups: Int32Array.from(groups), columns, entries };
}
