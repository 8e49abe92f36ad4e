/**
 * The numeric kernel of the left-looking supernodal LDLᵀ factorisation (Ng & Peyton, "Block
 * sparse Cholesky algorithms on advanced uniprocessor computers", SIAM J. Sci. Comput. 14, 1993),
 * into the dense blocks laid out by supernodal-symbolic.ts. For each supernode s of the given
 * ranges, in order:
 *   1. assemble the columns of s from the lower triangle of C;
 *   2. subtract L_d D_d L_dᵀ restricted to s from every earlier supernode d with rows inside s
 *      (d waits in a linked list headed by the supernode of its next unused row);
 *   3. factorise the dense trapezoidal block: L D Lᵀ of its diagonal part, then the rows below.
 * Pivots are checked as in ldl.ts (relative to the assembled diagonal, optional signs, dynamic
 * regularisation).
 *
 * Self-contained functions with no imports, closures or nested functions (factorSupernodes calls
 * the step-2 and step-3 functions at the end of this file, and nothing else): the two-thread
 * factorisation (supernodal-ldl.ts) runs this very source in a helper thread on shared memory.
 * A call may do all three steps on Lx, or only steps 1–2 or only step 2 into another target
 * array: that is how each thread pushes its subtree's updates into the supernodes above both
 * subtrees (the `top`) before one thread finishes them. With `top` set, a descendant whose next
 * target is a top supernode is not linked but listed in `deferred`, for a later call's `link`.
 *
 * Returns and writes to out[0] the status (0 factorised, 1 zero pivot, 2 not finite,
 * 3 interrupted); out[1] the failing column, out[2] the replaced pivots, out[3] the deferred count;
 * out[4] counts up as the work goes on (watched by a thread waiting for this one).
 */

/** status codes of factorSupernodes */
export const KERNEL_FACTORISED = 0;
export const KERNEL_ZERO_PIVOT = 1;
export const KERNEL_NOT_FINITE = 2;
export const KERNEL_INTERRUPTED = 3;

/** the factor's arrays; in a parallel factorisation all of them live in shared memory */
export interface KernelShared {
  /** symbolic structure (supernodal-symbolic.ts) */
  sup: Int32Array;
  snode: Int32Array;
  rowPtr: Int32Array;
  rows: Int32Array;
  blockPtr: Int32Array;
  /** the lower triangle of the permuted matrix, CSC */
  Lp: Int32Array;
  Li: Int32Array;
  Ax: Float64Array;
  /** the factor */
  Lx: Float64Array;
  D: Float64Array;
  /** descendant lists: next descendant and next unused row, by descendant */
  next: Int32Array;
  nextRow: Int32Array;
}

/** what one call of factorSupernodes does */
export interface KernelCall {
  /** [start, end) pairs of supernodes, ascending */
  ranges: Int32Array;
  /** when set, descendants whose next target is marked here are listed in `deferred`, not linked */
  top: Uint8Array | null;
  deferred: Int32Array;
  /** heads of the descendant lists by target supernode (shared, or a thread's own) */
  head: Int32Array;
  /** descendants to link into `head` before starting (the `deferred` of an earlier call) */
  link: Int32Array | null;
  linkCount: number;
  /** step 1: assemble each block from C (else the target block already holds it) */
  assemble: boolean;
  /** step 3: factorise each block and link it (else only the updates of step 2 are made) */
  factor: boolean;
  /** where blocks are assembled and updated, and each supernode's offset in it */
  target: Float64Array;
  targetPtr: Int32Array;
}

/** one thread's own work arrays */
export interface KernelWork {
  relmap: Int32Array;
  tmp: Float64Array;
  rel: Int32Array;
  diag: Float64Array;
  /** two packed columns of multipliers, 2 × the widest supernode */
  pack: Float64Array;
}

export interface KernelOptions {
  pivotTolerance: number;
  dynamicRegularisation: boolean;
  bigPivot: number;
  sign: Int8Array | null;
  deadline: number;
}

export function factorSupernodes(S: KernelShared, W: KernelWork, call: KernelCall, opts: KernelOptions, out: Int32Array): number {
  /** columns per panel of the dense block factorisation */
  const PANEL = 32;
  const { sup, snode, rowPtr, rows, Lp, Li, Ax, Lx, D, next, nextRow } = S;
  const { relmap, diag } = W;
  const { pivotTolerance, dynamicRegularisation, bigPivot, sign, deadline } = opts;
  const { ranges, top, deferred, head, assemble, factor, target: T, targetPtr } = call;
  const rangeCount = ranges.length / 2;
  // descendants handed over by an earlier call wait for their next target
  for (let i = 0; i < call.linkCount; i++) {
    const d = call.link![i];
    const t = snode[rows[rowPtr[d] + nextRow[d]]];
    next[d] = head[t];
    head[t] = d;
  }
  let replaced = 0;
  let deferredCount = 0;
  for (let q = 0; q < rangeCount; q++) for (let s = ranges[2 * q]; s < ranges[2 * q + 1]; s++) {
    out[4]++;
    if ((s & 31) === 0 && deadline < Infinity && performance.now() > deadline) {
      out[0] = 3;
      out[1] = sup[s];
      out[2] = replaced;
      out[3] = deferredCount;
      return 3;
    }
    const f = sup[s];
    const l = sup[s + 1] - 1;
    const ws = l - f + 1;
    const r0 = rowPtr[s];
    const nrs = rowPtr[s + 1] - r0;
    // s's block in the target array (Lx itself, or a thread's own buffer of updates)
    const off = targetPtr[s];
    for (let r = 0; r < nrs; r++) relmap[rows[r0 + r]] = r;
    // 1. assemble
    if (assemble) {
      T.fill(0, off, off + nrs * ws);
      for (let j = f; j <= l; j++) {
        const base = off + (j - f) * nrs;
        let dj = 0;
        for (let p = Lp[j]; p < Lp[j + 1]; p++) {
          const i = Li[p];
          T[base + relmap[i]] += Ax[p];
          if (i === j) dj += Ax[p];
        }
        diag[j] = dj;
      }
    }
    // 2. updates from descendants
    let d = head[s];
    head[s] = -1;
    while (d !== -1) {
      if (deadline < Infinity && performance.now() > deadline) {
        out[0] = 3;
        out[1] = sup[s];
        out[2] = replaced;
        out[3] = deferredCount;
        return 3;
      }
      const dNext = next[d];
      const rd0 = rowPtr[d];
      const nrd = rowPtr[d + 1] - rd0;
      const start = nextRow[d];
      let end = start;
      while (end < nrd && rows[rd0 + end] <= l) end++;
      updateFromDescendant(S, W, T, off, f, nrs, d, start, end);
      nextRow[d] = end;
      if (end < nrd) {
        const target = snode[rows[rd0 + end]];
        if (top !== null && top[target] === 1) deferred[deferredCount++] = d;
        else {
          next[d] = head[target];
          head[target] = d;
        }
      }
      d = dNext;
    }
    if (!factor) continue;
    // 3. dense LDLᵀ of the trapezoidal block (the target array is Lx here), blocked right-looking:
    //    factorise a panel of up to PANEL columns, update the trailing columns with the whole
    //    panel (the panel stays in cache while the trailing columns stream past once), scale
    for (let k0 = 0; k0 < ws; k0 += PANEL) {
      out[4]++;
      if (deadline < Infinity && performance.now() > deadline) {
        out[0] = 3;
        out[1] = f + k0;
        out[2] = replaced;
        out[3] = deferredCount;
        return 3;
      }
      const k1 = Math.min(k0 + PANEL, ws);
      const code = factorPanel(Lx, D, diag, sign, off, nrs, f, k0, k1, pivotTolerance, dynamicRegularisation, bigPivot, out);
      if (code !== 0) {
        out[0] = code;
        out[2] = replaced;
        out[3] = deferredCount;
        return code;
      }
      replaced += out[2];
      denseTrailingUpdate(Lx, D, off, nrs, f, k0, k1, k1, ws);
      scalePanel(Lx, D, off, nrs, f, k0, k1);
    }
    if (nrs > ws) {
      nextRow[s] = ws;
      const target = snode[rows[r0 + ws]];
      if (top !== null && top[target] === 1) deferred[deferredCount++] = s;
      else {
        next[s] = head[target];
        head[target] = s;
      }
    }
  }
  out[0] = 0;
  out[1] = -1;
  out[2] = replaced;
  out[3] = deferredCount;
  return 0;
}

/**
 * Step 3's panel: LDLᵀ of columns k0..k1 of the dense block at `off` (nrs rows, first column f),
 * with the pivot checks; the columns are left unscaled (L·d). Returns the status code (0, or 1
 * zero pivot, 2 not finite, with out[1] the column); out[2] = pivots replaced in the panel.
 */
export function factorPanel(
  Lx: Float64Array,
  D: Float64Array,
  diag: Float64Array,
  sign: Int8Array | null,
  off: number,
  nrs: number,
  f: number,
  k0: number,
  k1: number,
  pivotTolerance: number,
  dynamicRegularisation: boolean,
  bigPivot: number,
  out: Int32Array,
): number {
  let replaced = 0;
  out[2] = 0;
  for (let k = k0; k < k1; k++) {
    const j = f + k;
    const kb = off + k * nrs;
    let dk = Lx[kb + k];
    if (!Number.isFinite(dk)) {
      out[1] = j;
      return 2;
    }
    const sg = sign ? sign[j] : dk < 0 ? -1 : 1;
    if (dk * sg <= pivotTolerance * (1 + Math.abs(diag[j]))) {
      if (!dynamicRegularisation) {
        out[1] = j;
        return 1;
      }
      // the unknown is dropped: a huge pivot and no coupling (a zero column, rather than
      // entries of ~1/bigPivot whose products would underflow into slow subnormal numbers)
      dk = sg * bigPivot;
      replaced++;
      for (let r = k + 1; r < nrs; r++) Lx[kb + r] = 0;
    }
    D[j] = dk;
    const inv = 1 / dk;
    // the rest of the panel, with column k still unscaled (L·d)
    for (let c = k + 1; c < k1; c++) {
      const fct = Lx[kb + c] * inv;
      if (fct === 0) continue;
      const cb = off + c * nrs;
      for (let r = c; r < nrs; r++) Lx[cb + r] -= Lx[kb + r] * fct;
    }
  }
  out[2] = replaced;
  return 0;
}

/**
 * Step 3's trailing update: columns c0..c1 (of a block of ws columns) −= Σ_k (L·d)_k · L_ck over
 * the panel k0..k1, two columns at a time so every panel value loaded serves two multiply–adds.
 * Columns are independent, so two threads may update disjoint ranges at once.
 */
export function denseTrailingUpdate(Lx: Float64Array, D: Float64Array, off: number, nrs: number, f: number, k0: number, k1: number, c0: number, c1: number): void {
  let c = c0;
  for (; c + 1 < c1; c += 2) {
    const cb0 = off + c * nrs;
    const cb1 = cb0 + nrs;
    let k = k0;
    for (; k + 3 < k1; k += 4) {
      const p0 = off + k * nrs;
      const p1 = p0 + nrs;
      const p2 = p1 + nrs;
      const p3 = p2 + nrs;
      const i0 = 1 / D[f + k];
      const i1 = 1 / D[f + k + 1];
      const i2 = 1 / D[f + k + 2];
      const i3 = 1 / D[f + k + 3];
      const f00 = Lx[p0 + c] * i0;
      const f10 = Lx[p1 + c] * i1;
      const f20 = Lx[p2 + c] * i2;
      const f30 = Lx[p3 + c] * i3;
      const f01 = Lx[p0 + c + 1] * i0;
      const f11 = Lx[p1 + c + 1] * i1;
      const f21 = Lx[p2 + c + 1] * i2;
      const f31 = Lx[p3 + c + 1] * i3;
      Lx[cb0 + c] -= Lx[p0 + c] * f00 + Lx[p1 + c] * f10 + Lx[p2 + c] * f20 + Lx[p3 + c] * f30;
      for (let r = c + 1; r < nrs; r++) {
        const a0 = Lx[p0 + r];
        const a1 = Lx[p1 + r];
        const a2 = Lx[p2 + r];
        const a3 = Lx[p3 + r];
        Lx[cb0 + r] -= a0 * f00 + a1 * f10 + a2 * f20 + a3 * f30;
        Lx[cb1 + r] -= a0 * f01 + a1 * f11 + a2 * f21 + a3 * f31;
      }
    }
    for (; k < k1; k++) {
      const kb = off + k * nrs;
      const inv = 1 / D[f + k];
      const g0 = Lx[kb + c] * inv;
      const g1 = Lx[kb + c + 1] * inv;
      Lx[cb0 + c] -= Lx[kb + c] * g0;
      for (let r = c + 1; r < nrs; r++) {
        const a = Lx[kb + r];
        Lx[cb0 + r] -= a * g0;
        Lx[cb1 + r] -= a * g1;
      }
    }
  }
  for (; c < c1; c++) {
    const cb = off + c * nrs;
    for (let k = k0; k < k1; k++) {
      const kb = off + k * nrs;
      const fct = Lx[kb + c] / D[f + k];
      if (fct === 0) continue;
      for (let r = c; r < nrs; r++) Lx[cb + r] -= Lx[kb + r] * fct;
    }
  }
}

/** Step 3's scaling of the panel's columns: L = (L·d) / d, unit diagonal. */
export function scalePanel(Lx: Float64Array, D: Float64Array, off: number, nrs: number, f: number, k0: number, k1: number): void {
  for (let k = k0; k < k1; k++) {
    const kb = off + k * nrs;
    const inv = 1 / D[f + k];
    for (let r = k + 1; r < nrs; r++) Lx[kb + r] *= inv;
    Lx[kb + k] = 1;
  }
}

/**
 * Step 2 for one descendant d: subtracts L_d D_d L_dᵀ from the target block at `off` (nrs rows,
 * first column f; relmap holds the target's row positions) for the target columns given by d's
 * rows t0..t1 (rows below them included). Target columns are independent, so two threads may
 * update disjoint column ranges of one target at once.
 */
export function updateFromDescendant(S: KernelShared, W: KernelWork, T: Float64Array, off: number, f: number, nrs: number, d: number, t0: number, t1: number): void {
  const { sup, rowPtr, rows, blockPtr, Lx, D } = S;
  const { relmap, tmp, rel, pack } = W;
  const fd = sup[d];
  const wd = sup[d + 1] - fd;
  const rd0 = rowPtr[d];
  const nrd = rowPtr[d + 1] - rd0;
  const offd = blockPtr[d];
  // positions in s's block of d's rows from `t0` on
  for (let r = t0; r < nrd; r++) rel[r] = relmap[rows[rd0 + r]];
  if (wd <= 2) {
    // narrow descendant: subtract straight into the target column
    const b0 = offd;
    const b1 = offd + nrd;
    const d0 = D[fd];
    const d1 = wd === 2 ? D[fd + 1] : 0;
    for (let t = t0; t < t1; t++) {
      const a0 = Lx[b0 + t] * d0;
      const a1 = wd === 2 ? Lx[b1 + t] * d1 : 0;
      const cbase = off + (rows[rd0 + t] - f) * nrs;
      if (wd === 2) {
        for (let r = t; r < nrd; r++) T[cbase + rel[r]] -= Lx[b0 + r] * a0 + Lx[b1 + r] * a1;
      } else if (a0 !== 0) {
        for (let r = t; r < nrd; r++) T[cbase + rel[r]] -= Lx[b0 + r] * a0;
      }
    }
  } else {
    // wide descendant: two target columns (t, t + 1) at a time. Their multipliers
    // L(t, k)·D(k) and L(t + 1, k)·D(k) are packed side by side; then four rows of d's
    // block at a time are multiplied by them, the eight sums held in registers over all k
    // and subtracted from the target once.
    let t = t0;
    for (; t + 1 < t1; t += 2) {
      for (let k = 0, b = offd; k < wd; k++, b += nrd) {
        const e = D[fd + k];
        pack[2 * k] = Lx[b + t] * e;
        pack[2 * k + 1] = Lx[b + t + 1] * e;
      }
      const cbase = off + (rows[rd0 + t] - f) * nrs;
      const cbase2 = off + (rows[rd0 + t + 1] - f) * nrs;
      let d0 = 0;
      for (let k = 0, b = offd + t; k < wd; k++, b += nrd) d0 += Lx[b] * pack[2 * k];
      T[cbase + rel[t]] -= d0;
      let r = t + 1;
      for (; r + 3 < nrd; r += 4) {
        let a00 = 0;
        let a01 = 0;
        let a10 = 0;
        let a11 = 0;
        let a20 = 0;
        let a21 = 0;
        let a30 = 0;
        let a31 = 0;
        for (let k = 0, b = offd + r; k < wd; k++, b += nrd) {
          const x0 = pack[2 * k];
          const x1 = pack[2 * k + 1];
          const l0 = Lx[b];
          const l1 = Lx[b + 1];
          const l2 = Lx[b + 2];
          const l3 = Lx[b + 3];
          a00 += l0 * x0;
          a01 += l0 * x1;
          a10 += l1 * x0;
          a11 += l1 * x1;
          a20 += l2 * x0;
          a21 += l2 * x1;
          a30 += l3 * x0;
          a31 += l3 * x1;
        }
        T[cbase + rel[r]] -= a00;
        T[cbase2 + rel[r]] -= a01;
        T[cbase + rel[r + 1]] -= a10;
        T[cbase2 + rel[r + 1]] -= a11;
        T[cbase + rel[r + 2]] -= a20;
        T[cbase2 + rel[r + 2]] -= a21;
        T[cbase + rel[r + 3]] -= a30;
        T[cbase2 + rel[r + 3]] -= a31;
      }
      for (; r < nrd; r++) {
        let a0 = 0;
        let a1 = 0;
        for (let k = 0, b = offd + r; k < wd; k++, b += nrd) {
          const l = Lx[b];
          a0 += l * pack[2 * k];
          a1 += l * pack[2 * k + 1];
        }
        T[cbase + rel[r]] -= a0;
        T[cbase2 + rel[r]] -= a1;
      }
    }
    for (; t < t1; t++) {
      tmp.fill(0, t, nrd);
      for (let k = 0; k < wd; k++) {
        const b0 = offd + k * nrd;
        const a0 = Lx[b0 + t] * D[fd + k];
        if (a0 === 0) continue;
        for (let r = t; r < nrd; r++) tmp[r] += Lx[b0 + r] * a0;
      }
      const cbase = off + (rows[rd0 + t] - f) * nrs;
      for (let r = t; r < nrd; r++) T[cbase + rel[r]] -= tmp[r];
    }
  }
}
