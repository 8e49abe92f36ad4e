/**
 * Elimination tree and column counts of L for the upper triangle of a symmetric matrix C
 * (column k holds rows i ≤ k), as in QDLDL_etree:
 * the row pattern of L(k, :) is the set of nodes met walking up the tree from every i with
 * C(i, k) ≠ 0 until k is reached; each node met adds one entry to its column of L.
 */
export interface EliminationTree {
  /** parent of each node, −1 for a root */
  parent: Int32Array;
  /** number of strictly-lower entries in each column of L */
  colCount: Int32Array;
}

export function eliminationTree(n: number, Cp: Int32Array, Ci: Int32Array): EliminationTree {
  const parent = new Int32Array(n).fill(-1);
  const colCount = new Int32Array(n);
  const mark = new Int32Array(n).fill(-1);
  for (let k = 0; k < n; k++) {
    mark[k] = k;
    for (let p = Cp[k]; p < Cp[k + 1]; p++) {
      let i = Ci[p];
      if (i > k) throw new Error(`eliminationTree: entry (${i}, ${k}) lies below the diagonal; pass the upper triangle`);
      while (mark[i] !== k) {
        if (parent[i] === -1) parent[i] = k;
        colCount[i]++;
        mark[i] = k;
        i = parent[i];
      }
    }
  }
  return { parent, colCount };
}
