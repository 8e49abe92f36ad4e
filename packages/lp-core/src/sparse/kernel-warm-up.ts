/**
 * Runs every kind of call of the supernodal kernel on a small block arrowhead matrix (leaf
 * supernodes of widths 1 to 7, each coupled to a dense 41 × 41 root block), before this thread's
 * first factorisation.
 *
 * Why: V8 optimises factorSupernodes from the calls it has seen. If a thread has only made
 * one-thread calls, the first two-thread call reaches statements that never ran (the deferred
 * lists, the hand-over, updates only), the optimised code is thrown away in the middle of a long
 * call and the rest runs unoptimised: measured ~0.4–0.9 s lost once per thread. The same happens
 * on the first model with wide supernodes after small ones (a descendant wider than two columns,
 * a block of more than one panel): the bench's M model, solved after a size-S warm-up, took
 * 1.0–1.4 s against 0.7–0.8 s for the same solve repeated. After this warm-up every statement
 * of the kernel has run, so the optimised code covers all of them.
 */
import { supernodalSymbolic } from './supernodal-symbolic';
import { factorSupernodes, type KernelCall, type KernelOptions, type KernelShared, type KernelWork } from './supernodal-kernel';

/** widths of the leaf supernodes: narrow (1, 2) and wide descendants, odd and even */
const LEAF_WIDTHS = [1, 1, 2, 2, 3, 5, 4, 6, 1, 2, 3, 7, 1, 2, 5, 4];
const LEAVES = LEAF_WIDTHS.reduce((a, b) => a + b, 0);
/** more than one 32-column panel, odd, so paired loops also meet their remainders */
const ROOT = 41;
const ROUNDS = 3;

let warmed = false;

/** the tiny arrowhead factorisation: its shared arrays and the calls of a two-thread factorisation */
export interface WarmUpCase {
  S: KernelShared;
  n: number;
  maxRows: number;
  count: number;
  whole: KernelCall;
  /** the two halves, with `top` marking the root */
  halves: [KernelCall, KernelCall];
  /** the halves' updates into the root: straight into Lx (after assembling it), and into a buffer */
  pushes: [KernelCall, KernelCall];
  top: KernelCall;
  buffer: Float64Array;
  bufferPtr: Int32Array;
  topRange: [number, number];
}

/** Runs every kind of kernel call on this thread, once per thread. */
export function warmUpKernel(): void {
  if (warmed) return;
  warmed = true;
  const w = warmUpCase();
  const { S, count, maxRows, n } = w;
  const W: KernelWork = { relmap: new Int32Array(n), tmp: new Float64Array(maxRows), rel: new Int32Array(maxRows), diag: new Float64Array(n), pack: new Float64Array(2 * maxRows) };
  const opts: KernelOptions = { pivotTolerance: 1e-12, dynamicRegularisation: true, bigPivot: 1e128, sign: null, deadline: Infinity };
  const out = new Int32Array(5);
  const [firstTop] = w.topRange;
  const { rowPtr, sup, blockPtr } = S;
  for (let round = 0; round < ROUNDS; round++) {
    w.whole.head.fill(-1);
    factorSupernodes(S, W, w.whole, opts, out);
    w.whole.head.fill(-1);
    factorSupernodes(S, W, w.halves[0], opts, out);
    w.pushes[0].linkCount = out[3];
    factorSupernodes(S, W, w.halves[1], opts, out);
    w.pushes[1].linkCount = out[3];
    for (const push of w.pushes) {
      push.head.fill(-1);
      if (push.target === w.buffer) w.buffer.fill(0);
      factorSupernodes(S, W, push, opts, out);
    }
    for (let s = firstTop; s < count; s++) {
      const len = (rowPtr[s + 1] - rowPtr[s]) * (sup[s + 1] - sup[s]);
      for (let i = 0; i < len; i++) S.Lx[blockPtr[s] + i] += w.buffer[w.bufferPtr[s] + i];
    }
    factorSupernodes(S, W, w.top, opts, out);
  }
}

/** Builds the tiny case (fresh arrays each time). */
export function warmUpCase(): WarmUpCase {
  const n = LEAVES + ROOT;
  // leaf columns come in dense groups (one supernode each), every leaf column coupled to every root
  // column; upper triangle (rows ≤ column) for the symbolic phase, lower (rows ≥ column) for values
  const groupStart = new Int32Array(LEAVES);
  for (let g = 0, j = 0; g < LEAF_WIDTHS.length; j += LEAF_WIDTHS[g++]) groupStart.fill(j, j, j + LEAF_WIDTHS[g]);
  const range = (a: number, b: number) => Array.from({ length: b - a }, (_, k) => a + k);
  const groupEnd = (j: number) => {
    let e = j;
    while (e < LEAVES && groupStart[e] === groupStart[j]) e++;
    return e;
  };
  const up: number[][] = Array.from({ length: n }, (_, j) => (j < LEAVES ? range(groupStart[j], j + 1) : range(0, j + 1)));
  const low: number[][] = Array.from({ length: n }, (_, j) => (j < LEAVES ? [...range(j, groupEnd(j)), ...range(LEAVES, n)] : range(j, n)));
  const csc = (cols: number[][]) => {
    const p = new Int32Array(n + 1);
    cols.forEach((c, j) => (p[j + 1] = p[j] + c.length));
    return { p, i: Int32Array.from(cols.flat()) };
  };
  const U = csc(up);
  const L = csc(low);
  const sym = supernodalSymbolic(n, U.p, U.i);
  const { count, rowPtr, super: sup } = sym;
  const sharedI = (a: Int32Array | number) => {
    const len = typeof a === 'number' ? a : a.length;
    const c = new Int32Array(new SharedArrayBuffer(4 * Math.max(1, len)), 0, len);
    if (typeof a !== 'number') c.set(a);
    return c;
  };
  const sharedF = (len: number) => new Float64Array(new SharedArrayBuffer(8 * Math.max(1, len)), 0, len);
  const Ax = sharedF(L.i.length);
  for (let j = 0; j < n; j++) for (let q = L.p[j]; q < L.p[j + 1]; q++) Ax[q] = L.i[q] === j ? 2 * n : 0.5;
  const S: KernelShared = {
    sup: sharedI(sym.super),
    snode: sharedI(sym.snode),
    rowPtr: sharedI(sym.rowPtr),
    rows: sharedI(sym.rows),
    blockPtr: sharedI(sym.blockPtr),
    Lp: sharedI(L.p),
    Li: sharedI(L.i),
    Ax,
    Lx: sharedF(sym.nnzL),
    D: sharedF(n),
    next: sharedI(count),
    nextRow: sharedI(count),
  };
  let maxRows = 0;
  for (let s = 0; s < count; s++) maxRows = Math.max(maxRows, rowPtr[s + 1] - rowPtr[s]);
  // the top: supernodes holding root columns; the leaves split in two halves
  const isTop = new Uint8Array(new SharedArrayBuffer(count));
  let firstTop = count;
  for (let s = count - 1; s >= 0 && sup[s] >= LEAVES; s--) {
    isTop[s] = 1;
    firstTop = s;
  }
  const mid = Math.floor(firstTop / 2);
  const bufferPtr = sharedI(count);
  let size = 0;
  for (let s = firstTop; s < count; s++) {
    bufferPtr[s] = size;
    size += (rowPtr[s + 1] - rowPtr[s]) * (sup[s + 1] - sup[s]);
  }
  const buffer = sharedF(size);
  const head = sharedI(count);
  const deferredA = sharedI(count);
  const deferredB = sharedI(count);
  const onLx = { target: S.Lx, targetPtr: S.blockPtr };
  const call = (c: Partial<KernelCall> & Pick<KernelCall, 'ranges'>): KernelCall => ({ top: null, deferred: deferredA, head, link: null, linkCount: 0, assemble: true, factor: true, ...onLx, ...c });
  const topRanges = Int32Array.from([firstTop, count]);
  return {
    S,
    n,
    maxRows,
    count,
    whole: call({ ranges: Int32Array.from([0, count]) }),
    halves: [call({ ranges: Int32Array.from([0, mid]), top: isTop, deferred: deferredA }), call({ ranges: Int32Array.from([mid, firstTop]), top: isTop, deferred: deferredB })],
    pushes: [
      call({ ranges: topRanges, head: sharedI(count), link: deferredA, factor: false }),
      call({ ranges: topRanges, head: sharedI(count), link: deferredB, assemble: false, factor: false, target: buffer, targetPtr: bufferPtr }),
    ],
    top: call({ ranges: topRanges, assemble: false }),
    buffer,
    bufferPtr,
    topRange: [firstTop, count],
  };
}
