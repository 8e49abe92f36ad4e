/**
 * Splits the supernodal elimination tree for a factorisation on two threads (subtree-to-thread
 * mapping, as in proportional mapping: Pothen & Sun, "A mapping algorithm for parallel sparse
 * Cholesky factorization", SIAM J. Sci. Comput. 14, 1993). Starting from the roots, the heaviest
 * subtree is opened (its root joins the `top`, its children join the frontier) until the
 * frontier's subtrees pack into two bins of nearly equal work. Each thread factorises its bin;
 * the top, which depends on both, follows on one thread.
 *
 * The supernodes are numbered in postorder, so every subtree is a run of consecutive numbers:
 * the subtree of r is first[r]..r.
 */
import type { SupernodalSymbolic } from './supernodal-symbolic';

export interface SubtreeSplit {
  /** [start, end) pairs of supernodes for each part, ascending */
  first: Int32Array;
  second: Int32Array;
  top: Int32Array;
  /** 1 for a top supernode */
  isTop: Uint8Array;
  /** share of the factorisation's multiply–adds in each part */
  shares: { first: number; second: number; top: number };
}

/** the two bins may differ by this fraction of their total */
const BALANCE = 0.1;
/** no split when the top would hold more than this share of the work */
const MAX_TOP_SHARE = 0.6;
const MAX_OPENED = 256;

export function splitSubtrees(sym: SupernodalSymbolic): SubtreeSplit | null {
  const { count, super: sup, rowPtr, rows, snode } = sym;
  const parent = new Int32Array(count).fill(-1);
  const own = new Float64Array(count);
  for (let s = 0; s < count; s++) {
    const w = sup[s + 1] - sup[s];
    const len = rowPtr[s + 1] - rowPtr[s];
    for (let k = 0; k < w; k++) own[s] += (len - k) * (len - k);
    if (len > w) parent[s] = snode[rows[rowPtr[s] + w]];
  }
  const work = Float64Array.from(own);
  const first = Int32Array.from({ length: count }, (_, s) => s);
  const size = new Int32Array(count).fill(1);
  const children: number[][] = Array.from({ length: count }, () => []);
  for (let s = 0; s < count; s++) {
    const p = parent[s];
    if (p < 0) continue;
    if (p <= s) return null; // not a postordered tree
    work[p] += work[s];
    size[p] += size[s];
    first[p] = Math.min(first[p], first[s]);
    children[p].push(s);
  }
  // every subtree must be a run of consecutive supernodes
  for (let s = 0; s < count; s++) if (s - first[s] + 1 !== size[s]) return null;
  let total = 0;
  for (let s = 0; s < count; s++) total += own[s];
  if (!(total > 0)) return null;

  const isTop = new Uint8Array(count);
  let frontier: number[] = [];
  for (let s = 0; s < count; s++) if (parent[s] < 0) frontier.push(s);
  for (let opened = 0; opened <= MAX_OPENED; opened++) {
    const bins = packTwo(frontier, work);
    const sum = bins.a + bins.b;
    if (sum > 0 && Math.abs(bins.a - bins.b) <= BALANCE * sum) {
      const topShare = (total - sum) / total;
      if (topShare > MAX_TOP_SHARE) return null;
      const topList: number[] = [];
      for (let s = 0; s < count; s++) if (isTop[s]) topList.push(s);
      return {
        first: rangesOf(bins.first.map((r) => [first[r], r + 1])),
        second: rangesOf(bins.second.map((r) => [first[r], r + 1])),
        top: rangesOf(topList.map((s) => [s, s + 1])),
        isTop,
        shares: { first: bins.a / total, second: bins.b / total, top: topShare },
      };
    }
    // open the heaviest subtree
    let h = 0;
    for (let i = 1; i < frontier.length; i++) if (work[frontier[i]] > work[frontier[h]]) h = i;
    const r = frontier[h];
    if (children[r].length === 0) return null;
    isTop[r] = 1;
    frontier = frontier.filter((_, i) => i !== h).concat(children[r]);
  }
  return null;
}

/** greedy largest-first packing of subtrees into two bins */
function packTwo(roots: number[], work: Float64Array): { first: number[]; second: number[]; a: number; b: number } {
  const sorted = [...roots].sort((x, y) => work[y] - work[x]);
  const first: number[] = [];
  const second: number[] = [];
  let a = 0;
  let b = 0;
  for (const r of sorted) {
    if (a <= b) {
      first.push(r);
      a += work[r];
    } else {
      second.push(r);
      b += work[r];
    }
  }
  return { first, second, a, b };
}

/** sorted, merged [start, end) pairs */
function rangesOf(pairs: number[][]): Int32Array {
  pairs.sort((x, y) => x[0] - y[0]);
  const out: number[] = [];
  for (const [s, e] of pairs) {
    if (out.length > 0 && out[out.length - 1] === s) out[out.length - 1] = e;
    else out.push(s, e);
  }
  return Int32Array.from(out);
}
