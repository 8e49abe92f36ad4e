/**
 * One helper thread per calling thread, for the two-thread supernodal factorisation. It runs the
 * very source of factorSupernodes (supernodal-kernel.ts) on shared memory, so no module loading
 * or TypeScript support is needed inside it. The caller stays synchronous: it posts a job, works
 * on its own half, then blocks on a shared flag (Atomics.wait) until the helper reports back.
 *
 * A factorisation registers its shared arrays once ('setup'); the helper keeps the last few and
 * forgets one when its factorisation is garbage-collected ('drop'). If the helper cannot be
 * started, or ever fails to answer, factorisations run on one thread.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { factorSupernodes, type KernelOptions, type KernelShared } from './supernodal-kernel';

/** contexts the helper keeps (one per live factorisation) */
const KEPT_CONTEXTS = 4;
/** after the deadline has passed, how long to wait for a late helper before giving up on it (ms) */
const LATE_GRACE_MS = 5000;

const HELPER_SOURCE = `
const { parentPort } = require('node:worker_threads');
const factorSupernodes = (${factorSupernodes.toString()});
const contexts = new Map();
parentPort.on('message', (msg) => {
  if (msg.type === 'setup') {
    const n = msg.n;
    const work = {
      relmap: new Int32Array(n),
      tmp: new Float64Array(msg.maxRows),
      tmp2: new Float64Array(msg.maxRows),
      rel: new Int32Array(msg.maxRows),
      diag: new Float64Array(n),
    };
    contexts.set(msg.id, { S: msg.S, work, ranges: msg.ranges, isTop: msg.isTop, deferred: msg.deferred, out: msg.out, done: msg.done });
    while (contexts.size > ${KEPT_CONTEXTS}) contexts.delete(contexts.keys().next().value);
    return;
  }
  if (msg.type === 'drop') {
    contexts.delete(msg.id);
    return;
  }
  const c = contexts.get(msg.id);
  if (!c) return;
  try {
    factorSupernodes(c.S, c.work, c.ranges, c.ranges.length / 2, c.isTop, c.deferred, msg.opts, c.out);
  } catch (err) {
    c.out[0] = -1;
  }
  Atomics.store(c.done, 0, msg.seq);
  Atomics.notify(c.done, 0);
});
`;

export interface HelperJob {
  /** helper's outcome: out[0] status (−1: it failed), out[1] column, out[2] replaced pivots, out[3] deferred count */
  out: Int32Array;
  deferred: Int32Array;
}

/** what a factorisation registers with the helper */
export interface HelperContext {
  S: KernelShared;
  n: number;
  maxRows: number;
  ranges: Int32Array;
  isTop: Uint8Array;
}

let helper: Worker | null | undefined;
let nextId = 1;
const dropper = new FinalizationRegistry<number>((id) => helper?.postMessage({ type: 'drop', id }));

function theHelper(): Worker | null {
  if (helper !== undefined) return helper;
  if (availableParallelism() < 2) return (helper = null);
  try {
    helper = new Worker(HELPER_SOURCE, { eval: true });
    helper.unref();
    helper.on('error', () => (helper = null));
  } catch {
    helper = null;
  }
  return helper;
}

/** A factorisation's link to the helper thread. */
export class HelperLink {
  private readonly id = nextId++;
  private readonly done = new Int32Array(new SharedArrayBuffer(4));
  private readonly out = new Int32Array(new SharedArrayBuffer(16));
  private readonly deferred: Int32Array;
  private seq = 0;
  private setUpOn: Worker | null = null;

  /** null when no helper thread can be had */
  static create(owner: object, context: HelperContext): HelperLink | null {
    if (!theHelper()) return null;
    const link = new HelperLink(context);
    dropper.register(owner, link.id);
    return link;
  }

  private constructor(private readonly context: HelperContext) {
    this.deferred = new Int32Array(new SharedArrayBuffer(4 * Math.max(1, context.isTop.length)));
  }

  /** posts the helper's half; false when the helper is gone */
  start(opts: KernelOptions): boolean {
    const w = theHelper();
    if (!w) return false;
    if (this.setUpOn !== w) {
      const { S, n, maxRows, ranges, isTop } = this.context;
      w.postMessage({ type: 'setup', id: this.id, S, n, maxRows, ranges, isTop, deferred: this.deferred, out: this.out, done: this.done });
      this.setUpOn = w;
    }
    this.seq++;
    this.out[0] = -1;
    w.postMessage({ type: 'run', id: this.id, seq: this.seq, opts });
    return true;
  }

  /** blocks until the helper has finished its half; null if it never answered */
  finish(deadline: number): HelperJob | null {
    for (;;) {
      const v = Atomics.load(this.done, 0);
      if (v === this.seq) return { out: this.out, deferred: this.deferred };
      Atomics.wait(this.done, 0, v, 1000);
      if (Atomics.load(this.done, 0) !== this.seq && performance.now() > deadline + LATE_GRACE_MS) {
        void helper?.terminate();
        helper = null;
        return null;
      }
    }
  }
}
