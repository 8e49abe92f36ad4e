/**
 * This thread's side of the helper thread's share of the split system's products (the protocol
 * is in split-product-kernel.ts): a session per conjugate-gradient solve, in which each product
 * is asked for by raising a shared flag and waited for on another. If the helper fails or stops
 * answering it is given up for good and the caller does the whole product itself.
 */
import { STALLED_MS, giveUpHelper, helperThread } from '../sparse/factor-helper-thread';
import type { ColumnProductSession } from './split-product-kernel';

/**
 * loads of the flag the helper spins through between products before it sleeps (a product is
 * asked for every 1–3 ms on the models that use the helper; measured on XL at iteration 20, even
 * shares: with 500000 this thread waited 0.20 ms a product for the helper, with 2000000 0.12 ms),
 * and this thread spins through while it waits for the helper's share before it sleeps
 */
const HELPER_SPINS = 2_000_000;
const CALLER_SPINS = 2_000_000;

export interface SharedProductArrays {
  nPtr: Int32Array;
  nIdx: Int32Array;
  nVal: Float64Array;
  /** Ñ's groups of columns by length (copied to the helper, not shared) */
  nGroups: Int32Array;
  g: Float64Array;
  out: Float64Array;
  /** the helper's Σ (ñ_cᵀ g)² (one entry) */
  squares: Float64Array;
}

export class ColumnProductHelper {
  private readonly flags = new Int32Array(new SharedArrayBuffer(12));
  private asked = 0;
  private session = 0;
  private active = false;

  /** null when no helper thread can be had */
  static create(): ColumnProductHelper | null {
    return helperThread() ? new ColumnProductHelper() : null;
  }

  private constructor() {}

  /** starts a session in which the helper takes the columns c0..c1 of Ñ; false when the helper is gone */
  begin(arrays: SharedProductArrays, c0: number, c1: number): boolean {
    const w = helperThread();
    if (!w) return false;
    this.session++;
    const session: ColumnProductSession = { flags: this.flags, session: this.session, seen: this.asked, ...arrays, c0, c1, spins: HELPER_SPINS, idleMs: STALLED_MS };
    w.postMessage({ type: 'columnProducts', session });
    this.active = true;
    return true;
  }

  get inSession(): boolean {
    return this.active;
  }

  /** asks for the helper's share of a product (g must be in place) */
  ask(): void {
    Atomics.store(this.flags, 0, ++this.asked);
    Atomics.notify(this.flags, 0);
  }

  /**
   * Waits until the helper's share is in its `out`; false when it failed or nothing came for
   * STALLED_MS: the helper is then given up and the session ended.
   */
  wait(): boolean {
    const fl = this.flags;
    const token = this.asked;
    for (let spins = 0; spins < CALLER_SPINS; spins++) if (Atomics.load(fl, 1) === token) return true;
    const until = performance.now() + STALLED_MS;
    for (;;) {
      const v = Atomics.load(fl, 1);
      if (v === token) return true;
      if (v === -token || performance.now() > until) {
        giveUpHelper();
        this.active = false;
        return false;
      }
      Atomics.wait(fl, 1, v, 500);
    }
  }

  /** lets the helper leave the session */
  end(): void {
    if (!this.active) return;
    this.active = false;
    Atomics.store(this.flags, 2, this.session);
    Atomics.notify(this.flags, 0);
  }
}
