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

/** out += Σ_{c0 ≤ c < c1} ñ_c (ñ_cᵀ g) for the columns ñ_c of Ñ (compressed by column) */
export function addColumnProducts(nPtr: Int32Array, nIdx: Int32Array, nVal: Float64Array, g: Float64Array, out: Float64Array, c0: number, c1: number): void {
  for (let c = c0; c < c1; c++) {
    const p0 = nPtr[c];
    const p1 = nPtr[c + 1];
    let s = 0;
    for (let p = p0; p < p1; p++) s += nVal[p] * g[nIdx[p]];
    if (s === 0) continue;
    for (let p = p0; p < p1; p++) out[nIdx[p]] += nVal[p] * s;
  }
}

/** what the helper is handed for a session: the shared arrays, its columns, and where the session starts */
export interface ColumnProductSession {
  flags: Int32Array;
  session: number;
  /** the last product asked for before the session began */
  seen: number;
  nPtr: Int32Array;
  nIdx: Int32Array;
  nVal: Float64Array;
  g: Float64Array;
  /** the helper's own result (zeroed by it before each product) */
  out: Float64Array;
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
      product(s.nPtr, s.nIdx, s.nVal, s.g, s.out, s.c0, s.c1);
      Atomics.store(fl, 1, asked);
    } catch {
      Atomics.store(fl, 1, -asked);
    }
    Atomics.notify(fl, 1);
  }
}
