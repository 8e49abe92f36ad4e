/**
 * The product with Ñ Ñᵀ (split-system.ts) over a range of Ñ's columns, and the loop in which the
 * helper thread (sparse/factor-helper-thread.ts) serves its share of those products while
 * conjugate gradients run. Both are self-contained functions: the helper runs their very source.
 *
 * The loop's flags (shared Int32Array): [0] the product asked for (a sequence number, rising);
 * [1] the product done (its number, or minus it when it failed); [2] the session that has ended.
 * Between products the helper spins on the flag for a while (a product is asked for every few
 * milliseconds; waking a sleeping thread took ~50 µs here, a spinning one ~1 µs), then sleeps.
 */

/**
 * out += Σ_{c0 ≤ c < c1} ñ_c (ñ_cᵀ g) for the columns ñ_c of Ñ (compressed by column); returns
 * Σ (ñ_cᵀ g)² over those columns, so that gᵀ Ñ Ñᵀ g comes with the product. Ñ's columns
 * come grouped by their number of entries, groups = (first column, end column, length) triples,
 * length 0 for a group of mixed lengths: a group of one short length runs as straight-line code
 * with no inner loop. Most of Ñ's columns are short (on XL 80457 columns, 326441 entries: 40811
 * of 2 entries, 4336 of 4, 7728 of 5 …); one product with every column in its own loop took
 * 1.21–1.54 ms, grouped and written out for lengths 2–8 0.47–0.65 ms (dumped systems of
 * iterations 6 and 30, the best of 15 runs each). In the order of A's columns within a group,
 * the rows a column touches stay near those of the next.
 */
export function addColumnProducts(nPtr: Int32Array, nIdx: Int32Array, nVal: Float64Array, groups: Int32Array, g: Float64Array, out: Float64Array, c0: number, c1: number): number {
  let squares = 0;
  for (let k = 0; k < groups.length; k += 3) {
    const first = Math.max(groups[k], c0);
    const end = Math.min(groups[k + 1], c1);
    if (first >= end) continue;
    const len = groups[k + 2];
    let p = nPtr[first];
    if (len === 2)
      for (let c = first; c < end; c++, p += 2) {
        const i0 = nIdx[p], i1 = nIdx[p + 1];
        const v0 = nVal[p], v1 = nVal[p + 1];
        const s = v0 * g[i0] + v1 * g[i1];
        squares += s * s;
        out[i0] += v0 * s;
        out[i1] += v1 * s;
      }
    else if (len === 3)
      for (let c = first; c < end; c++, p += 3) {
        const i0 = nIdx[p], i1 = nIdx[p + 1], i2 = nIdx[p + 2];
        const v0 = nVal[p], v1 = nVal[p + 1], v2 = nVal[p + 2];
        const s = v0 * g[i0] + v1 * g[i1] + v2 * g[i2];
        squares += s * s;
        out[i0] += v0 * s;
        out[i1] += v1 * s;
        out[i2] += v2 * s;
      }
    else if (len === 4)
      for (let c = first; c < end; c++, p += 4) {
        const i0 = nIdx[p], i1 = nIdx[p + 1], i2 = nIdx[p + 2], i3 = nIdx[p + 3];
        const v0 = nVal[p], v1 = nVal[p + 1], v2 = nVal[p + 2], v3 = nVal[p + 3];
        const s = v0 * g[i0] + v1 * g[i1] + v2 * g[i2] + v3 * g[i3];
        squares += s * s;
        out[i0] += v0 * s;
        out[i1] += v1 * s;
        out[i2] += v2 * s;
        out[i3] += v3 * s;
      }
    else if (len === 5)
      for (let c = first; c < end; c++, p += 5) {
        const i0 = nIdx[p], i1 = nIdx[p + 1], i2 = nIdx[p + 2], i3 = nIdx[p + 3], i4 = nIdx[p + 4];
        const v0 = nVal[p], v1 = nVal[p + 1], v2 = nVal[p + 2], v3 = nVal[p + 3], v4 = nVal[p + 4];
        const s = v0 * g[i0] + v1 * g[i1] + v2 * g[i2] + v3 * g[i3] + v4 * g[i4];
        squares += s * s;
        out[i0] += v0 * s;
        out[i1] += v1 * s;
        out[i2] += v2 * s;
        out[i3] += v3 * s;
        out[i4] += v4 * s;
      }
    else if (len === 6)
      for (let c = first; c < end; c++, p += 6) {
        const i0 = nIdx[p], i1 = nIdx[p + 1], i2 = nIdx[p + 2], i3 = nIdx[p + 3], i4 = nIdx[p + 4], i5 = nIdx[p + 5];
        const v0 = nVal[p], v1 = nVal[p + 1], v2 = nVal[p + 2], v3 = nVal[p + 3], v4 = nVal[p + 4], v5 = nVal[p + 5];
        const s = v0 * g[i0] + v1 * g[i1] + v2 * g[i2] + v3 * g[i3] + v4 * g[i4] + v5 * g[i5];
        squares += s * s;
        out[i0] += v0 * s;
        out[i1] += v1 * s;
        out[i2] += v2 * s;
        out[i3] += v3 * s;
        out[i4] += v4 * s;
        out[i5] += v5 * s;
      }
    else if (len === 7)
      for (let c = first; c < end; c++, p += 7) {
        const i0 = nIdx[p], i1 = nIdx[p + 1], i2 = nIdx[p + 2], i3 = nIdx[p + 3], i4 = nIdx[p + 4], i5 = nIdx[p + 5], i6 = nIdx[p + 6];
        const v0 = nVal[p], v1 = nVal[p + 1], v2 = nVal[p + 2], v3 = nVal[p + 3], v4 = nVal[p + 4], v5 = nVal[p + 5], v6 = nVal[p + 6];
        const s = v0 * g[i0] + v1 * g[i1] + v2 * g[i2] + v3 * g[i3] + v4 * g[i4] + v5 * g[i5] + v6 * g[i6];
        squares += s * s;
        out[i0] += v0 * s;
        out[i1] += v1 * s;
        out[i2] += v2 * s;
        out[i3] += v3 * s;
        out[i4] += v4 * s;
        out[i5] += v5 * s;
        out[i6] += v6 * s;
      }
    else if (len === 8)
      for (let c = first; c < end; c++, p += 8) {
        const i0 = nIdx[p], i1 = nIdx[p + 1], i2 = nIdx[p + 2], i3 = nIdx[p + 3], i4 = nIdx[p + 4], i5 = nIdx[p + 5], i6 = nIdx[p + 6], i7 = nIdx[p + 7];
        const v0 = nVal[p], v1 = nVal[p + 1], v2 = nVal[p + 2], v3 = nVal[p + 3], v4 = nVal[p + 4], v5 = nVal[p + 5], v6 = nVal[p + 6], v7 = nVal[p + 7];
        const s = v0 * g[i0] + v1 * g[i1] + v2 * g[i2] + v3 * g[i3] + v4 * g[i4] + v5 * g[i5] + v6 * g[i6] + v7 * g[i7];
        squares += s * s;
        out[i0] += v0 * s;
        out[i1] += v1 * s;
        out[i2] += v2 * s;
        out[i3] += v3 * s;
        out[i4] += v4 * s;
        out[i5] += v5 * s;
        out[i6] += v6 * s;
        out[i7] += v7 * s;
      }
    else
      for (let c = first; c < end; c++) {
        const p0 = nPtr[c];
        const p1 = nPtr[c + 1];
        let s = 0;
        for (let q = p0; q < p1; q++) s += nVal[q] * g[nIdx[q]];
        squares += s * s;
        for (let q = p0; q < p1; q++) out[nIdx[q]] += nVal[q] * s;
      }
  }
  return squares;
}

/** the longest columns addColumnProducts writes out; longer ones form one group of mixed lengths */
export const WRITTEN_OUT_LENGTH = 8;

/** what the helper is handed for a session: the shared arrays, its columns, and where the session starts */
export interface ColumnProductSession {
  flags: Int32Array;
  session: number;
  /** the last product asked for before the session began */
  seen: number;
  nPtr: Int32Array;
  nIdx: Int32Array;
  nVal: Float64Array;
  nGroups: Int32Array;
  g: Float64Array;
  /** the helper's own result (zeroed by it before each product), and its share's Σ (ñ_cᵀ g)² in squares[0] */
  out: Float64Array;
  squares: Float64Array;
  c0: number;
  c1: number;
  /** spins before sleeping, and how long a sleep may last before the session is given up (ms) */
  spins: number;
  idleMs: number;
}

/** The helper's side: serves products until the session ends (or nothing is asked for idleMs). */
export function serveColumnProducts(s: ColumnProductSession, product: typeof addColumnProducts): void {
  const fl = s.flags;
  let seen = s.seen;
  let spins = 0;
  for (;;) {
    // checked first: a product asked for after the session ended belongs to the next session
    if (Atomics.load(fl, 2) === s.session) return;
    const asked = Atomics.load(fl, 0);
    if (asked === seen) {
      if (++spins > s.spins) {
        if (Atomics.wait(fl, 0, seen, s.idleMs) === 'timed-out' && Atomics.load(fl, 0) === seen) return;
        spins = 0;
      }
      continue;
    }
    spins = 0;
    seen = asked;
    try {
      s.out.fill(0);
      s.squares[0] = product(s.nPtr, s.nIdx, s.nVal, s.nGroups, s.g, s.out, s.c0, s.c1);
      Atomics.store(fl, 1, asked);
    } catch {
      Atomics.store(fl, 1, -asked);
    }
    Atomics.notify(fl, 1);
  }
}
