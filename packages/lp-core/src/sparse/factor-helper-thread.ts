/**
 * One helper thread per calling thread, for the two-thread supernodal factorisation and for a
 * share of the split system's products while conjugate gradients run (ipm/split-product-helper.ts).
 * It runs the very source of factorSupernodes (supernodal-kernel.ts) and of the products
 * (ipm/split-product-kernel.ts) on shared memory, so no module loading or TypeScript support is
 * needed inside it. The caller stays synchronous: it posts a job, works
 * on its own half, then blocks on a shared flag (Atomics.wait) until the helper reports back.
 *
 * A factorisation registers its shared arrays and the helper's two calls once ('setup'); the
 * helper keeps the last few and forgets one when its factorisation is garbage-collected ('drop').
 * If the helper cannot be started, or ever fails to answer, factorisations run on one thread.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { warmUpCase } from './kernel-warm-up';
import {
  denseTrailingUpdate,
  factorPanel,
  factorSupernodes,
  scalePanel,
  updateFromDescendant,
  type KernelCall,
  type KernelOptions,
  type KernelShared,
} from './supernodal-kernel';
import { backwardSolveRanges, forwardSolveRanges } from './supernodal-solve-kernel';
import { addColumnProducts, serveColumnProducts } from '../ipm/split-product-kernel';

/** contexts the helper keeps (one per live factorisation) */
const KEPT_CONTEXTS = 4;
/** a helper whose work shows no progress for this long is given up (ms) */
export const STALLED_MS = 20000;

export const HELPER_SOURCE = `
const { parentPort } = require('node:worker_threads');
const factorSupernodes = (${factorSupernodes.toString()});
const factorPanel = (${factorPanel.toString()});
const denseTrailingUpdate = (${denseTrailingUpdate.toString()});
const scalePanel = (${scalePanel.toString()});
const updateFromDescendant = (${updateFromDescendant.toString()});
const forwardSolveRanges = (${forwardSolveRanges.toString()});
const backwardSolveRanges = (${backwardSolveRanges.toString()});
const addColumnProducts = (${addColumnProducts.toString()});
const serveColumnProducts = (${serveColumnProducts.toString()});
const contexts = new Map();
// the updates into a root from its descendants, for the root's columns cs.. (the caller does the rest)
function rootUpdatesHalf(c, msg) {
  const S = c.S;
  const W = c.work;
  const fl = msg.flags;
  try {
    const f = msg.f;
    const cut = f + msg.cs;
    for (let r = 0; r < msg.nrs; r++) W.relmap[f + r] = r;
    for (let i = 0; i < msg.count; i++) {
      const d = msg.list[i];
      const rd0 = S.rowPtr[d];
      const nrd = S.rowPtr[d + 1] - rd0;
      let t = S.nextRow[d];
      while (t < nrd && S.rows[rd0 + t] < cut) t++;
      if (t < nrd) updateFromDescendant(S, W, S.Lx, msg.off, f, msg.nrs, d, t, nrd);
    }
    Atomics.store(fl, 0, msg.token);
  } catch (err) {
    Atomics.store(fl, 0, -msg.token);
  }
  Atomics.notify(fl, 0);
}
// a shared root factorisation: flags [0] panel token, [1] panel done (token, −token on failure),
// [2] the call that has ended, [3..5] the panel's k0, k1 and the first column of this thread's share
function denseHalf(c, msg) {
  const fl = msg.flags;
  let seen = msg.firstToken - 1;
  for (;;) {
    let cur = Atomics.load(fl, 0);
    while (cur === seen && Atomics.load(fl, 2) !== msg.call) {
      if (Atomics.wait(fl, 0, cur, ${STALLED_MS}) === 'timed-out' && Atomics.load(fl, 0) === cur) return;
      cur = Atomics.load(fl, 0);
    }
    if (cur === seen) return;
    seen = cur;
    try {
      denseTrailingUpdate(c.S.Lx, c.S.D, msg.off, msg.nrs, msg.f, fl[3], fl[4], fl[5], msg.nrs);
      Atomics.store(fl, 1, cur);
    } catch (err) {
      Atomics.store(fl, 1, -cur);
    }
    Atomics.notify(fl, 1);
  }
}
// flags of a shared solve: [0] forward half done (seq, or −seq on failure), [1] top done (seq), [2] backward half done
function solveHalf(c, seq) {
  const v = c.solve;
  const S = c.S;
  const f = v.flags;
  try {
    forwardSolveRanges(S.sup, S.rowPtr, S.rows, S.blockPtr, S.Lx, S.D, v.x, c.work.tmp, c.half.ranges, v.topOut, v.isTopCol);
  } catch (err) {
    Atomics.store(f, 0, -seq);
    Atomics.notify(f, 0);
    return;
  }
  Atomics.store(f, 0, seq);
  Atomics.notify(f, 0);
  for (;;) {
    const cur = Atomics.load(f, 1);
    if (cur === seq) break;
    if (Atomics.wait(f, 1, cur, ${STALLED_MS}) === 'timed-out' && Atomics.load(f, 1) !== seq) return;
  }
  try {
    backwardSolveRanges(S.sup, S.rowPtr, S.rows, S.blockPtr, S.Lx, v.x, c.work.tmp, c.half.ranges);
    Atomics.store(f, 2, seq);
  } catch (err) {
    Atomics.store(f, 2, -seq);
  }
  Atomics.notify(f, 2);
}
parentPort.on('message', (msg) => {
  if (msg.type === 'setup') {
    const c = msg.context;
    c.work = {
      relmap: new Int32Array(c.n),
      tmp: new Float64Array(c.maxRows),
      rel: new Int32Array(c.maxRows),
      diag: new Float64Array(c.n),
      pack: new Float64Array(2 * c.maxRows),
    };
    c.push.head = new Int32Array(c.count);
    c.push.linkCount = 0;
    c.out = msg.out;
    c.done = msg.done;
    contexts.set(msg.id, c);
    while (contexts.size > ${KEPT_CONTEXTS}) contexts.delete(contexts.keys().next().value);
    return;
  }
  if (msg.type === 'drop') {
    contexts.delete(msg.id);
    return;
  }
  if (msg.type === 'columnProducts') return serveColumnProducts(msg.session, addColumnProducts);
  const c = contexts.get(msg.id);
  if (!c) return;
  if (msg.type === 'solve') return solveHalf(c, msg.seq);
  if (msg.type === 'dense') return denseHalf(c, msg);
  if (msg.type === 'rootUpdates') return rootUpdatesHalf(c, msg);
  try {
    // its half, then its half's updates into the top, kept in its own buffer
    if (factorSupernodes(c.S, c.work, c.half, msg.opts, c.out) === 0) {
      const replaced = c.out[2];
      c.push.linkCount = c.out[3];
      c.push.head.fill(-1);
      c.push.target.fill(0);
      factorSupernodes(c.S, c.work, c.push, msg.opts, c.out);
      c.out[2] = replaced;
    }
  } catch (err) {
    c.out[0] = -1;
  }
  Atomics.store(c.done, 0, msg.seq);
  Atomics.notify(c.done, 0);
});
`;

/** what a factorisation registers with the helper: shared arrays and the helper's two calls */
export interface HelperContext {
  S: KernelShared;
  n: number;
  maxRows: number;
  count: number;
  /** its half of the tree */
  half: KernelCall;
  /** its half's updates into the top, into a buffer of its own (its list heads are made in the helper) */
  push: Omit<KernelCall, 'head' | 'linkCount'>;
  /** for shared solves: the vector, the helper's contributions to the top's rows, and the flags */
  solve?: SharedSolve;
}

/** the shared memory of a two-thread triangular solve (see supernodal-solve-kernel.ts) */
export interface SharedSolve {
  x: Float64Array;
  topOut: Float64Array;
  isTopCol: Uint8Array;
  /** [0] the helper's forward half done, [1] the top done, [2] the helper's backward half done */
  flags: Int32Array;
}

let helper: Worker | null | undefined;
let nextId = 1;
const dropper = new FinalizationRegistry<number>((id) => helper?.postMessage({ type: 'drop', id }));

/** the helper thread, started on first use; null when there is none (one core, or it failed) */
export function helperThread(): Worker | null {
  if (helper !== undefined) return helper;
  if (availableParallelism() < 2) return (helper = null);
  try {
    // plain JavaScript: no loaders or flags of the parent (a TypeScript loader alone takes ~0.5 s to start)
    helper = new Worker(HELPER_SOURCE, { eval: true, execArgv: [] });
    helper.unref();
    helper.on('error', () => (helper = null));
    warmUpHelper(helper);
  } catch {
    helper = null;
  }
  return helper;
}

/** gives the helper up for good (it failed or stopped answering): the callers work alone */
export function giveUpHelper(): void {
  void helper?.terminate();
  helper = null;
}

/**
 * The helper's first calls, on a tiny case, so that its optimised code covers every kind of call
 * it will make (see kernel-warm-up.ts); nobody waits for them.
 */
function warmUpHelper(w: Worker): void {
  const c = warmUpCase();
  c.halves[1].head.fill(-1);
  const context: HelperContext = { S: c.S, n: c.n, maxRows: c.maxRows, count: c.count, half: c.halves[1], push: c.pushes[1] };
  const opts: KernelOptions = { pivotTolerance: 1e-12, dynamicRegularisation: true, bigPivot: 1e128, sign: null, deadline: Infinity };
  w.postMessage({ type: 'setup', id: 0, context, out: new Int32Array(new SharedArrayBuffer(20)), done: new Int32Array(new SharedArrayBuffer(4)) });
  for (let seq = 1; seq <= 3; seq++) w.postMessage({ type: 'run', id: 0, seq, opts });
  w.postMessage({ type: 'drop', id: 0 });
}

/** A factorisation's link to the helper thread. */
export class HelperLink {
  private readonly id = nextId++;
  private readonly done = new Int32Array(new SharedArrayBuffer(4));
  private readonly out = new Int32Array(new SharedArrayBuffer(20));
  private seq = 0;
  private solveSeq = 0;
  private denseCall = 0;
  private denseToken = 0;
  private readonly denseFlags = new Int32Array(new SharedArrayBuffer(24));
  private rootToken = 0;
  private readonly rootFlags = new Int32Array(new SharedArrayBuffer(4));
  private setUpOn: Worker | null = null;

  /** null when no helper thread can be had */
  static create(owner: object, context: HelperContext): HelperLink | null {
    if (!helperThread()) return null;
    const link = new HelperLink(context);
    dropper.register(owner, link.id);
    return link;
  }

  private constructor(private readonly context: HelperContext) {}

  /** posts the helper's part; false when the helper is gone */
  start(opts: KernelOptions): boolean {
    const w = this.helperSetUp();
    if (!w) return false;
    this.seq++;
    this.out[0] = -1;
    this.out[4] = 0;
    w.postMessage({ type: 'run', id: this.id, seq: this.seq, opts });
    return true;
  }

  /** the helper, with this factorisation's context registered on it; null when it is gone */
  private helperSetUp(): Worker | null {
    const w = helperThread();
    if (w && this.setUpOn !== w) {
      w.postMessage({ type: 'setup', id: this.id, context: this.context, out: this.out, done: this.done });
      this.setUpOn = w;
    }
    return w;
  }

  /**
   * Blocks until flags[index] holds token (the helper's part is done); false when it holds −token
   * (the helper's part failed) or nothing came for STALLED_MS: the helper is then given up for good.
   */
  private awaitFlag(flags: Int32Array, index: number, token: number): boolean {
    const until = performance.now() + STALLED_MS;
    for (;;) {
      const v = Atomics.load(flags, index);
      if (v === token) return true;
      if (v === -token || performance.now() > until) {
        giveUpHelper();
        return false;
      }
      Atomics.wait(flags, index, v, 500);
    }
  }

  /** posts the helper's half of a solve; false when the helper is gone */
  startSolve(): boolean {
    const w = this.context.solve ? this.helperSetUp() : null;
    if (!w) return false;
    this.solveSeq++;
    w.postMessage({ type: 'solve', id: this.id, seq: this.solveSeq });
    return true;
  }

  /** blocks until the helper's forward half (stage 0) or backward half (stage 2) is done; false when it failed or stalled (then it is given up) */
  waitSolve(stage: 0 | 2): boolean {
    return this.awaitFlag(this.context.solve!.flags, stage, this.solveSeq);
  }

  /** posts the helper's share of a root factorisation (see SupernodalLdl); false when the helper is gone */
  startDense(off: number, nrs: number, f: number): boolean {
    const w = this.helperSetUp();
    if (!w) return false;
    this.denseCall++;
    w.postMessage({ type: 'dense', id: this.id, call: this.denseCall, firstToken: this.denseToken + 1, off, nrs, f, flags: this.denseFlags });
    return true;
  }

  /** posts the helper's share of the updates into a root (its columns cs..); false when the helper is gone */
  startRootUpdates(list: Int32Array, count: number, cs: number, f: number, nrs: number, off: number): boolean {
    const w = this.helperSetUp();
    if (!w) return false;
    w.postMessage({ type: 'rootUpdates', id: this.id, token: ++this.rootToken, list, count, cs, f, nrs, off, flags: this.rootFlags });
    return true;
  }

  /** blocks until the helper's share of the root's updates is done; false when it failed or stalled (it is then given up) */
  waitRootUpdates(): boolean {
    return this.awaitFlag(this.rootFlags, 0, this.rootToken);
  }

  /** hands the helper the trailing columns cs.. of panel k0..k1 (this thread takes the rest) */
  panelReady(k0: number, k1: number, cs: number): void {
    const fl = this.denseFlags;
    fl[3] = k0;
    fl[4] = k1;
    fl[5] = cs;
    Atomics.store(fl, 0, ++this.denseToken);
    Atomics.notify(fl, 0);
  }

  /** blocks until the helper has done its share of the panel; false when it failed or stalled (it is then given up) */
  waitPanel(): boolean {
    return this.awaitFlag(this.denseFlags, 1, this.denseToken);
  }

  /** lets the helper leave the root factorisation */
  endDense(): void {
    Atomics.store(this.denseFlags, 2, this.denseCall);
    Atomics.notify(this.denseFlags, 0);
  }

  /** lets the helper go on with its backward half once the top is solved */
  topSolved(): void {
    const f = this.context.solve!.flags;
    Atomics.store(f, 1, this.solveSeq);
    Atomics.notify(f, 1);
  }

  /**
   * Blocks until the helper has finished; its outcome [status (−1: it failed), failing column,
   * replaced pivots], or null when it stopped making progress (it is then given up for good and
   * the caller does the work itself).
   */
  finish(): Int32Array | null {
    let progress = Atomics.load(this.out, 4);
    let since = performance.now();
    for (;;) {
      const v = Atomics.load(this.done, 0);
      if (v === this.seq) return this.out;
      Atomics.wait(this.done, 0, v, 500);
      const p = Atomics.load(this.out, 4);
      if (p !== progress) {
        progress = p;
        since = performance.now();
      } else if (performance.now() - since > STALLED_MS) {
        giveUpHelper();
        return null;
      }
    }
  }
}
