/**
 * Supernodal LDLᵀ factorisation into the dense blocks laid out by supernodal-symbolic.ts; the
 * numeric kernel is supernodal-kernel.ts. A factorisation big enough to gain from it runs on two
 * threads: the elimination tree is split into two halves of nearly equal work and the top above
 * them (subtree-split.ts). Each thread factorises its half, then pushes its half's updates into
 * the top: this thread straight into the top's blocks, the helper thread
 * (factor-helper-thread.ts) into a buffer of its own that is added afterwards. Then this thread
 * factorises the top. A wide dense root (often the largest single piece of work on planning
 * models) is shared: the updates into it split by its columns, its dense block panel by panel;
 * a tree that cannot be split (its top would hold most of the work) still shares its root that
 * way. The solves with a split factor are shared too: each thread solves its half (forward, then
 * backward after this thread has done the top). All arrays are allocated once in the
 * constructor, in shared memory.
 */
import { HelperLink, type SharedSolve } from './factor-helper-thread';
import { warmUpKernel } from './kernel-warm-up';
import type { FactorOptions, FactorReport, FactorStatus } from './ldl';
import { splitSubtrees, type SubtreeSplit } from './subtree-split';
import {
  denseTrailingUpdate,
  factorPanel,
  factorSupernodes,
  scalePanel,
  updateFromDescendant,
  type KernelCall,
  type KernelOptions,
  type KernelShared,
  type KernelWork,
} from './supernodal-kernel';
import { backwardSolveRanges, forwardSolveRanges } from './supernodal-solve-kernel';
import type { SupernodalSymbolic } from './supernodal-symbolic';

/** factorisations with fewer multiply–adds stay on one thread (the hand-over costs ~0.1 ms) */
const PARALLEL_MIN_FLOPS = 2e7;
/** a root supernode at least this wide has its dense factorisation shared by both threads */
const SHARED_ROOT_MIN_WIDTH = 192;
/** columns per panel of a shared root factorisation */
const ROOT_PANEL = 32;

const STATUS: FactorStatus[] = ['factorised', 'zero_pivot', 'not_finite', 'interrupted'];

/** the calls of a two-thread factorisation made on this thread */
interface ParallelCalls {
  split: SubtreeSplit;
  helper: HelperLink;
  /** this thread's half */
  half: KernelCall;
  /** its updates into the top, after assembling the top's blocks */
  push: KernelCall;
  /** the top, once the helper's updates are added */
  top: KernelCall;
  /** when the top ends in a wide root: the top without it, and the root (see factorRoot) */
  root: { rest: KernelCall | null; s: number; list: Int32Array } | null;
  /** the helper's updates, block by block of the top */
  buffer: Float64Array;
  bufferPtr: Int32Array;
  /** two-thread solves: the shared vector and the top's columns */
  solve: SharedSolve;
  topCols: Int32Array;
}

export class SupernodalLdl {
  readonly Lx: Float64Array;
  readonly D: Float64Array;
  private readonly S: KernelShared;
  private readonly W: KernelWork;
  private readonly tmp: Float64Array;
  private readonly head: Int32Array;
  private readonly whole: KernelCall;
  private readonly out = new Int32Array(5);
  private parallel: ParallelCalls | null;
  /**
   * when the tree cannot be split (its top would hold most of the work: one wide dense root, as in
   * planning models with shared materials and subassemblies) but the root is wide: everything
   * below the root on this thread, then the root's dense block on both threads
   */
  private rootOnly: { helper: HelperLink; below: KernelCall | null; assemble: KernelCall; s: number; list: Int32Array } | null = null;

  /**
   * Lp/Li/Ax: the lower triangle (rows ≥ column) of the permuted matrix in CSC form; Ax is read
   * at every factorise() (write new values into it in between; keep it in shared memory, see
   * SymmetricFactorisation). parallel: allow a helper thread.
   */
  constructor(
    private readonly sym: SupernodalSymbolic,
    Lp: Int32Array,
    Li: Int32Array,
    Ax: Float64Array,
    parallel = false,
  ) {
    const { n, count, rowPtr } = sym;
    let maxRows = 0;
    for (let s = 0; s < count; s++) maxRows = Math.max(maxRows, rowPtr[s + 1] - rowPtr[s]);
    const split = parallel && sym.flops >= PARALLEL_MIN_FLOPS && Ax.buffer instanceof SharedArrayBuffer ? splitSubtrees(sym) : null;
    // Shared memory whether or not a helper is used: the kernel then always meets one kind of
    // typed array (V8 deoptimises a hot function that meets a second kind mid-run, ~1 s once).
    const int32 = (a: Int32Array): Int32Array => sharedInt32(a.length, a);
    this.Lx = sharedFloat64(sym.nnzL);
    this.D = sharedFloat64(n);
    this.head = sharedInt32(count);
    this.S = {
      sup: int32(sym.super),
      snode: int32(sym.snode),
      rowPtr: int32(sym.rowPtr),
      rows: int32(sym.rows),
      blockPtr: int32(sym.blockPtr),
      Lp: int32(Lp),
      Li: int32(Li),
      Ax,
      Lx: this.Lx,
      D: this.D,
      next: sharedInt32(count),
      nextRow: sharedInt32(count),
    };
    this.W = {
      relmap: new Int32Array(n),
      tmp: new Float64Array(maxRows),
     
      rel: new Int32Array(maxRows),
      diag: new Float64Array(n),
      pack: new Float64Array(2 * maxRows),
    };
    this.tmp = this.W.tmp;
    const onLx = { target: this.Lx, targetPtr: this.S.blockPtr };
    this.whole = { ranges: Int32Array.from([0, count]), top: null, deferred: sharedInt32(1), head: this.head, link: null, linkCount: 0, assemble: true, factor: true, ...onLx };
    warmUpKernel();
    this.parallel = split ? this.parallelCalls(split, n, maxRows, onLx) : null;
    if (!this.parallel && parallel && sym.flops >= PARALLEL_MIN_FLOPS && Ax.buffer instanceof SharedArrayBuffer) {
      this.rootOnly = this.rootOnlyCalls(n, maxRows, onLx);
    }
  }

  /** the calls of both threads; null when no helper thread can be had */
  private parallelCalls(split: SubtreeSplit, n: number, maxRows: number, onLx: Pick<KernelCall, 'target' | 'targetPtr'>): ParallelCalls | null {
    const { count, super: sup, rowPtr } = this.sym;
    const bufferPtr = sharedInt32(count);
    let size = 0;
    for (let s = 0; s < count; s++) {
      if (!split.isTop[s]) continue;
      bufferPtr[s] = size;
      size += (rowPtr[s + 1] - rowPtr[s]) * (sup[s + 1] - sup[s]);
    }
    const buffer = sharedFloat64(size);
    const isTop = sharedBytes(split.isTop);
    const helperDeferred = sharedInt32(count);
    const isTopCol = new Uint8Array(new SharedArrayBuffer(Math.max(1, n)), 0, n);
    const topColList: number[] = [];
    for (let q = 0; q < split.top.length; q += 2) {
      for (let c = sup[split.top[q]]; c < sup[split.top[q + 1]]; c++) {
        isTopCol[c] = 1;
        topColList.push(c);
      }
    }
    const solve: SharedSolve = { x: sharedFloat64(n), topOut: sharedFloat64(n), isTopCol, flags: sharedInt32(3) };
    const helper = HelperLink.create(this, {
      S: this.S,
      n,
      maxRows,
      count,
      half: { ranges: split.second, top: isTop, deferred: helperDeferred, head: this.head, link: null, linkCount: 0, assemble: true, factor: true, ...onLx },
      push: { ranges: split.top, top: null, deferred: helperDeferred, link: helperDeferred, assemble: false, factor: false, target: buffer, targetPtr: bufferPtr },
      solve,
    });
    if (!helper) return null;
    const deferred = sharedInt32(count);
    return {
      split,
      helper,
      half: { ranges: split.first, top: isTop, deferred, head: this.head, link: null, linkCount: 0, assemble: true, factor: true, ...onLx },
      push: { ranges: split.top, top: null, deferred, head: sharedInt32(count), link: deferred, linkCount: 0, assemble: true, factor: false, ...onLx },
      top: { ranges: split.top, top: null, deferred, head: this.head, link: null, linkCount: 0, assemble: false, factor: true, ...onLx },
      root: this.sharedRoot(split.top, deferred, onLx),
      buffer,
      bufferPtr,
      solve,
      topCols: Int32Array.from(topColList),
    };
  }

  /** the calls of a root-only two-thread factorisation; null without a wide root or a helper */
  private rootOnlyCalls(n: number, maxRows: number, onLx: Pick<KernelCall, 'target' | 'targetPtr'>): SupernodalLdl['rootOnly'] {
    const { count, super: sup, rowPtr } = this.sym;
    const r = count - 1;
    const ws = sup[r + 1] - sup[r];
    if (ws < SHARED_ROOT_MIN_WIDTH || rowPtr[r + 1] - rowPtr[r] !== ws) return null;
    const none = { ranges: new Int32Array(0), top: null, deferred: sharedInt32(1), link: null, assemble: false, factor: false, ...onLx };
    const helper = HelperLink.create(this, { S: this.S, n, maxRows, count, half: { ...none, head: this.head, linkCount: 0 }, push: none });
    if (!helper) return null;
    const call = (ranges: Int32Array, factor: boolean): KernelCall => ({ ranges, top: null, deferred: sharedInt32(1), head: this.head, link: null, linkCount: 0, assemble: true, factor, ...onLx });
    return { helper, below: r > 0 ? call(Int32Array.from([0, r]), true) : null, assemble: call(Int32Array.from([r, r + 1]), false), s: r, list: sharedInt32(count) };
  }

  /**
   * The updates into root r from its descendants (list), split by the root's columns where
   * the work (rows at and below each column) halves: the helper takes the right part. Returns 0,
   * or −1 when the helper failed (the caller starts over on one thread).
   */
  private sharedRootUpdates(link: HelperLink, r: number, list: Int32Array, count: number): number {
    const { super: sup, rowPtr, rows, blockPtr } = this.sym;
    const { S, W, Lx } = this;
    const f = sup[r];
    const ws = sup[r + 1] - f;
    const off = blockPtr[r];
    for (let i = 0; i < ws; i++) W.relmap[f + i] = i;
    const total = (ws * (ws + 1)) / 2;
    let acc = 0;
    let cs = 0;
    while (cs < ws && acc < total / 2) acc += ws - cs++;
    const shared = link.startRootUpdates(list, count, cs, f, ws, off);
    const cut = shared ? f + cs : f + ws;
    for (let i = 0; i < count; i++) {
      const d = list[i];
      const rd0 = rowPtr[d];
      const nrd = rowPtr[d + 1] - rd0;
      const t0 = S.nextRow[d];
      let t1 = t0;
      while (t1 < nrd && rows[rd0 + t1] < cut) t1++;
      if (t1 > t0) updateFromDescendant(S, W, Lx, off, f, ws, d, t0, t1);
    }
    if (shared && !link.waitRootUpdates()) return -1;
    for (let i = 0; i < count; i++) {
      const d = list[i];
      S.nextRow[d] = rowPtr[d + 1] - rowPtr[d];
    }
    return 0;
  }

  /** the calls of a shared root factorisation, or null when the top does not end in a wide root */
  private sharedRoot(top: Int32Array, deferred: Int32Array, onLx: Pick<KernelCall, 'target' | 'targetPtr'>): ParallelCalls['root'] {
    const { super: sup, rowPtr } = this.sym;
    const r = top[top.length - 1] - 1;
    const ws = sup[r + 1] - sup[r];
    if (ws < SHARED_ROOT_MIN_WIDTH || rowPtr[r + 1] - rowPtr[r] !== ws) return null;
    const cut = Int32Array.from(top);
    cut[cut.length - 1] = r;
    const ranges = cut[cut.length - 2] === r ? cut.subarray(0, cut.length - 2) : cut;
    const rest: KernelCall | null = ranges.length > 0 ? { ranges, top: null, deferred, head: this.head, link: null, linkCount: 0, assemble: false, factor: true, ...onLx } : null;
    return { rest, s: r, list: sharedInt32(this.sym.count) };
  }

  /**
   * The dense LDLᵀ of the root's block, right-looking by panels as in the kernel's step 3; this
   * thread factorises and scales each panel, and the trailing update is split between the two
   * threads in halves of equal work. Returns the status code (out[1] the failing column) and adds
   * the replaced pivots to out[2]; −1 when the helper failed (the caller starts over on one thread).
   */
  private factorSharedRoot(link: HelperLink, r: number, opts: KernelOptions): number {
    const { super: sup, blockPtr } = this.sym;
    const { Lx, D, out } = this;
    const f = sup[r];
    const ws = sup[r + 1] - f;
    const nrs = ws;
    const off = blockPtr[r];
    const panel = (k0: number, k1: number): number =>
      factorPanel(Lx, D, this.W.diag, opts.sign, off, nrs, f, k0, k1, opts.pivotTolerance, opts.dynamicRegularisation, opts.bigPivot, out);
    const shared = link.startDense(off, nrs, f);
    let code = panel(0, Math.min(ROOT_PANEL, ws));
    let replaced = out[2];
    // panel k0..k1 is factorised (unscaled) at the top of each round; with look-ahead, this thread
    // updates and factorises the next panel while the helper updates its share of the rest
    for (let k0 = 0; code === 0 && k0 < ws; k0 += ROOT_PANEL) {
      out[4]++;
      if (opts.deadline < Infinity && performance.now() > opts.deadline) {
        out[1] = f + k0;
        code = 3;
        break;
      }
      const k1 = Math.min(k0 + ROOT_PANEL, ws);
      const k2 = Math.min(k1 + ROOT_PANEL, ws);
      // split the trailing columns k1..ws where the work (rows nrs − c per column) halves, this
      // thread's share counting the next panel's factorisation (about half a panel of updates);
      // the next panel k1..k2 stays on this thread
      let cs = ws;
      if (shared) {
        const total = ((ws - k1) * (2 * nrs - k1 - ws + 1)) / 2;
        const lookAhead = ((k2 - k1) / 2) * (nrs - k1);
        let acc = lookAhead;
        cs = k1;
        while (cs < ws && acc < (total + lookAhead) / 2) acc += nrs - cs++;
        cs = Math.max(cs, k2);
        link.panelReady(k0, k1, cs);
      }
      denseTrailingUpdate(Lx, D, off, nrs, f, k0, k1, k1, k2);
      if (k2 > k1) {
        code = panel(k1, k2);
        if (code === 0) replaced += out[2];
      }
      if (code === 0) denseTrailingUpdate(Lx, D, off, nrs, f, k0, k1, k2, cs);
      if (shared && !link.waitPanel()) return -1;
      scalePanel(Lx, D, off, nrs, f, k0, k1);
    }
    if (shared) link.endDense();
    out[2] = replaced;
    return code;
  }

  /**
   * Root r on both threads, once everything below it is factorised: its descendants are taken
   * off its list (so `assemble`, when given, only assembles its block), their updates into it
   * shared, then its dense block shared. Returns the status code with the root's replaced pivots
   * in out[2], or −1 when the helper failed.
   */
  private factorRoot(link: HelperLink, r: number, list: Int32Array, assemble: KernelCall | null, opts: KernelOptions): number {
    const { S, W, out } = this;
    let count = 0;
    for (let d = this.head[r]; d !== -1; d = S.next[d]) list[count++] = d;
    this.head[r] = -1;
    let code = assemble ? factorSupernodes(S, W, assemble, opts, out) : 0;
    if (code === 0) code = this.sharedRootUpdates(link, r, list, count);
    if (code === 0) code = this.factorSharedRoot(link, r, opts);
    return code;
  }

  /** whether factorise() runs on two threads */
  get threads(): number {
    return this.parallel || this.rootOnly ? 2 : 1;
  }

  factorise(opts: FactorOptions): FactorReport {
    const kernelOpts: KernelOptions = {
      pivotTolerance: opts.pivotTolerance,
      dynamicRegularisation: opts.dynamicRegularisation,
      bigPivot: opts.bigPivot,
      sign: opts.sign ?? null,
      deadline: opts.deadline ?? Infinity,
    };
    const { S, W, out } = this;
    this.head.fill(-1);
    const par = this.parallel;
    const ro = this.rootOnly;
    if (ro) {
      // everything below the root here, then the root's updates, then its dense block on both threads
      let code = ro.below ? factorSupernodes(S, W, ro.below, kernelOpts, out) : 0;
      let replaced = ro.below ? out[2] : 0;
      if (code === 0) code = this.factorRoot(ro.helper, ro.s, ro.list, ro.assemble, kernelOpts);
      if (code === -1) {
        this.rootOnly = null;
        return this.factorise(opts);
      }
      if (code === 0) replaced += out[2];
      return { status: STATUS[code], column: out[1], replacedPivots: replaced };
    }
    if (!par || !par.helper.start(kernelOpts)) {
      const code = factorSupernodes(S, W, this.whole, kernelOpts, out);
      return { status: STATUS[code], column: out[1], replacedPivots: out[2] };
    }
    // this thread's half, then its updates into the top (assembling the top's blocks first)
    let mine = factorSupernodes(S, W, par.half, kernelOpts, out);
    let mineColumn = out[1];
    let replaced = out[2];
    if (mine === 0) {
      par.push.linkCount = out[3];
      par.push.head.fill(-1);
      mine = factorSupernodes(S, W, par.push, kernelOpts, out);
      mineColumn = out[1];
    }
    // the helper's half and updates; a helper that stalls or fails is given up and its part
    // redone here, as a whole one-thread factorisation
    const theirs = par.helper.finish();
    if (theirs === null || theirs[0] < 0) {
      this.parallel = null;
      return this.factorise(opts);
    }
    const [theirCode, theirColumn, theirReplaced] = theirs;
    replaced += theirReplaced;
    if (mine !== 0) return { status: STATUS[mine], column: mineColumn, replacedPivots: replaced };
    if (theirCode !== 0) return { status: STATUS[theirCode], column: theirColumn, replacedPivots: replaced };
    // add the helper's updates, then finish the top
    const { buffer, bufferPtr } = par;
    const { top } = par.split;
    const { super: sup, rowPtr, blockPtr } = this.sym;
    const Lx = this.Lx;
    for (let q = 0; q < top.length; q += 2) {
      for (let s = top[q]; s < top[q + 1]; s++) {
        const size = (rowPtr[s + 1] - rowPtr[s]) * (sup[s + 1] - sup[s]);
        const a = blockPtr[s];
        const b = bufferPtr[s];
        for (let i = 0; i < size; i++) Lx[a + i] += buffer[b + i];
      }
    }
    if (!par.root) {
      const code = factorSupernodes(S, W, par.top, kernelOpts, out);
      return { status: STATUS[code], column: out[1], replacedPivots: replaced + out[2] };
    }
    // the top without its root here, then the root on both threads (its block already assembled)
    const { rest, s, list } = par.root;
    let code = rest ? factorSupernodes(S, W, rest, kernelOpts, out) : 0;
    if (rest) replaced += out[2];
    if (code === 0) {
      code = this.factorRoot(par.helper, s, list, null, kernelOpts);
      if (code === -1) {
        this.parallel = null;
        return this.factorise(opts);
      }
      if (code === 0) replaced += out[2];
    }
    return { status: STATUS[code], column: out[1], replacedPivots: replaced };
  }

  /**
   * x ← (L D Lᵀ)⁻¹ x in the permuted numbering (supernodal-solve-kernel.ts). After a two-thread
   * factorisation the helper solves its half of the tree in both directions while this thread
   * solves the other half and the top; a helper that fails is given up and the solve redone here.
   */
  solve(x: Float64Array): void {
    const { super: sup, rowPtr, rows, blockPtr } = this.sym;
    const { Lx, D, tmp } = this;
    const par = this.parallel;
    // the vector is in shared memory before the helper is told to start
    if (par) par.solve.x.set(x);
    if (par && par.helper.startSolve()) {
      const v = par.solve;
      const xs = v.x;
      forwardSolveRanges(sup, rowPtr, rows, blockPtr, Lx, D, xs, tmp, par.half.ranges, null, null);
      if (par.helper.waitSolve(0)) {
        const { topCols } = par;
        const topOut = v.topOut;
        for (let t = 0; t < topCols.length; t++) {
          const c = topCols[t];
          xs[c] += topOut[c];
          topOut[c] = 0;
        }
        forwardSolveRanges(sup, rowPtr, rows, blockPtr, Lx, D, xs, tmp, par.top.ranges, null, null);
        backwardSolveRanges(sup, rowPtr, rows, blockPtr, Lx, xs, tmp, par.top.ranges);
        par.helper.topSolved();
        backwardSolveRanges(sup, rowPtr, rows, blockPtr, Lx, xs, tmp, par.half.ranges);
        if (par.helper.waitSolve(2)) {
          x.set(xs);
          return;
        }
      }
      this.parallel = null;
    }
    forwardSolveRanges(sup, rowPtr, rows, blockPtr, Lx, D, x, tmp, this.whole.ranges, null, null);
    backwardSolveRanges(sup, rowPtr, rows, blockPtr, Lx, x, tmp, this.whole.ranges);
  }
}

function sharedInt32(length: number, from?: Int32Array): Int32Array {
  const c = new Int32Array(new SharedArrayBuffer(4 * Math.max(1, length)), 0, length);
  if (from) c.set(from);
  return c;
}

function sharedFloat64(length: number): Float64Array {
  return new Float64Array(new SharedArrayBuffer(8 * Math.max(1, length)), 0, length);
}

function sharedBytes(a: Uint8Array): Uint8Array {
  const c = new Uint8Array(new SharedArrayBuffer(Math.max(1, a.length)), 0, a.length);
  c.set(a);
  return c;
}
