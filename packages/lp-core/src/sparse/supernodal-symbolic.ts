/**
 * Supernodal symbolic factorisation (Liu, Ng & Peyton, "On finding supernodes for sparse matrix
 * computations", SIAM J. Matrix Anal. Appl. 14, 1993). Columns j−1 and j belong to one
 * fundamental supernode when j is the only child of j−1's... parent chain (parent[j−1] = j, j has
 * one child) and their columns of L share a structure (count[j−1] = count[j] + 1). Small
 * supernodes are merged with their parent when the explicit zeros this adds stay few
 * (relaxed amalgamation, Ashcraft & Grimes 1989). Each supernode s stores the row indices of its
 * first column (rows[rowPtr[s]..rowPtr[s+1]−1], ascending, its own columns first) and a dense
 * column-major block of nrows × ncols values at blockPtr[s].
 *
 * Requires a postordered numbering (see postorder.ts) so supernodes are consecutive columns.
 */
import { eliminationTree } from './etree';

export interface SupernodalSymbolic {
  n: number;
  /** number of supernodes */
  count: number;
  /** first column of each supernode, length count + 1 */
  super: Int32Array;
  /** supernode of each column */
  snode: Int32Array;
  rowPtr: Int32Array;
  rows: Int32Array;
  /** offset of each dense block in Lx, length count + 1 */
  blockPtr: Int32Array;
  /** stored entries of the factor (explicit zeros included) */
  nnzL: number;
  /** multiply–add operations of one numeric factorisation */
  flops: number;
}

/** maximum explicit zeros a merge may add, as a fraction of the merged block */
const RELAX_FRACTION = 0.1;
/** supernodes narrower than this are always merged into a single-child parent */
const RELAX_SMALL = 4;

export function supernodalSymbolic(n: number, Cp: Int32Array, Ci: Int32Array): SupernodalSymbolic {
  const { parent, colCount } = eliminationTree(n, Cp, Ci);
  const childCount = new Int32Array(n);
  for (let j = 0; j < n; j++) if (parent[j] !== -1) childCount[parent[j]]++;
  // fundamental supernodes
  const starts: number[] = [];
  for (let j = 0; j < n; j++) {
    const joins = j > 0 && parent[j - 1] === j && childCount[j] === 1 && colCount[j - 1] === colCount[j] + 1;
    if (!joins) starts.push(j);
  }
  starts.push(n);
  // relaxed amalgamation (as in CHOLMOD): merge a supernode A into the next one B when B is
  // A's parent in the tree and the explicit zeros this adds stay few. Heights count the rows of a
  // supernode's first column including its own columns; merging gives B's columns plus A's on top.
  const merged: number[] = [0];
  let aStart = 0;
  let aHeight = colCount[0] + 1;
  let aZeros = 0;
  for (let s = 1; s < starts.length - 1; s++) {
    const b0 = starts[s];
    const b1 = starts[s + 1];
    const wa = b0 - aStart;
    const wb = b1 - b0;
    const bHeight = colCount[b0] + 1;
    if (parent[b0 - 1] === b0) {
      const height = wa + bHeight;
      const zeros = aZeros + (height - aHeight) * wa;
      const w = wa + wb;
      const entries = height * w - (w * (w - 1)) / 2;
      const frac = zeros / entries;
      if (w <= RELAX_SMALL || (w <= 16 && frac < 0.8) || (w <= 48 && frac < RELAX_FRACTION) || frac < 0.05) {
        aHeight = height;
        aZeros = zeros;
        continue;
      }
    }
    merged.push(b0);
    aStart = b0;
    aHeight = bHeight;
    aZeros = 0;
  }
  merged.push(n);
  const count = merged.length - 1;
  const sup = Int32Array.from(merged);
  const snode = new Int32Array(n);
  for (let s = 0; s < count; s++) for (let j = sup[s]; j < sup[s + 1]; j++) snode[j] = s;

  // structure of each supernode: its columns, C's entries below them, and its children's rows
  const lowerPtr = new Int32Array(n + 1);
  for (let k = 0; k < n; k++) for (let p = Cp[k]; p < Cp[k + 1]; p++) lowerPtr[Ci[p] + 1]++;
  for (let j = 0; j < n; j++) lowerPtr[j + 1] += lowerPtr[j];
  const fill = lowerPtr.slice(0, n);
  const lowerRows = new Int32Array(lowerPtr[n]);
  for (let k = 0; k < n; k++) for (let p = Cp[k]; p < Cp[k + 1]; p++) lowerRows[fill[Ci[p]]++] = k;

  const sparent = new Int32Array(count).fill(-1);
  const rowPtr = new Int32Array(count + 1);
  const rowLists: Int32Array[] = new Array(count);
  const childHead = new Int32Array(count).fill(-1);
  const childNext = new Int32Array(count).fill(-1);
  const mark = new Int32Array(n).fill(-1);
  const buf = new Int32Array(n);
  let flops = 0;
  for (let s = 0; s < count; s++) {
    const f = sup[s];
    const l = sup[s + 1] - 1;
    let len = 0;
    for (let j = f; j <= l; j++) {
      mark[j] = s;
      buf[len++] = j;
    }
    for (let j = f; j <= l; j++) {
      for (let p = lowerPtr[j]; p < lowerPtr[j + 1]; p++) {
        const i = lowerRows[p];
        if (i > l && mark[i] !== s) {
          mark[i] = s;
          buf[len++] = i;
        }
      }
    }
    for (let c = childHead[s]; c !== -1; c = childNext[c]) {
      const rc = rowLists[c];
      for (let t = 0; t < rc.length; t++) {
        const i = rc[t];
        if (i > l && mark[i] !== s) {
          mark[i] = s;
          buf[len++] = i;
        }
      }
    }
    const list = buf.slice(0, len);
    list.sort();
    rowLists[s] = list;
    rowPtr[s + 1] = rowPtr[s] + len;
    const w = l - f + 1;
    for (let k = 0; k < w; k++) flops += (len - k) * (len - k);
    if (len > w) {
      const ps = snode[list[w]];
      sparent[s] = ps;
      childNext[s] = childHead[ps];
      childHead[ps] = s;
    }
  }
  const rows = new Int32Array(rowPtr[count]);
  const blockPtr = new Int32Array(count + 1);
  for (let s = 0; s < count; s++) {
    rows.set(rowLists[s], rowPtr[s]);
    blockPtr[s + 1] = blockPtr[s] + (rowPtr[s + 1] - rowPtr[s]) * (sup[s + 1] - sup[s]);
  }
  return { n, count, super: sup, snode, rowPtr, rows, blockPtr, nnzL: blockPtr[count], flops };
}
