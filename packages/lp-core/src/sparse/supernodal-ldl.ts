/**
 * Left-looking supernodal LDLᵀ factorisation (Ng & Peyton, "Block sparse Cholesky algorithms on
 * advanced uniprocessor computers", SIAM J. Sci. Comput. 14, 1993), into the dense blocks laid
 * out by supernodal-symbolic.ts. For each supernode s in order:
 *   1. assemble the columns of s from the lower triangle of C;
 *   2. subtract L_d D_d L_dᵀ restricted to s from every earlier supernode d with rows inside s
 *      (d waits in a linked list headed by the supernode of its next unused row);
 *   3. factorise the dense trapezoidal block: L D Lᵀ of its diagonal part, then the rows below.
 * Pivots are checked as in ldl.ts (relative to the assembled diagonal, optional signs, dynamic
 * regularisation). All work arrays are allocated once in the constructor.
 */
import type { FactorOptions, FactorReport } from './ldl';
import type { SupernodalSymbolic } from './supernodal-symbolic';

export class SupernodalLdl {
  readonly Lx: Float64Array;
  readonly D: Float64Array;
  private readonly relmap: Int32Array;
  private readonly tmp: Float64Array;
  private readonly head: Int32Array;
  private readonly next: Int32Array;
  private readonly nextRow: Int32Array;
  private readonly diag: Float64Array;

  constructor(private readonly sym: SupernodalSymbolic) {
    this.Lx = new Float64Array(sym.nnzL);
    this.D = new Float64Array(sym.n);
    this.relmap = new Int32Array(sym.n);
    let maxRows = 0;
    for (let s = 0; s < sym.count; s++) maxRows = Math.max(maxRows, sym.rowPtr[s + 1] - sym.rowPtr[s]);
    this.tmp = new Float64Array(maxRows);
    this.head = new Int32Array(sym.count);
    this.next = new Int32Array(sym.count);
    this.nextRow = new Int32Array(sym.count);
    this.diag = new Float64Array(sym.n);
  }

  /** Lp/Li/Lx: the lower triangle (rows ≥ column) of the permuted matrix in CSC form. */
  factorise(Lp: Int32Array, Li: Int32Array, Ax: Float64Array, opts: FactorOptions): FactorReport {
    const { count, super: sup, snode, rowPtr, rows, blockPtr } = this.sym;
    const { Lx, D, relmap, tmp, head, next, nextRow, diag } = this;
    const { pivotTolerance, dynamicRegularisation, bigPivot, sign } = opts;
    head.fill(-1);
    let replaced = 0;
    for (let s = 0; s < count; s++) {
      const f = sup[s];
      const l = sup[s + 1] - 1;
      const ws = l - f + 1;
      const r0 = rowPtr[s];
      const nrs = rowPtr[s + 1] - r0;
      const off = blockPtr[s];
      for (let r = 0; r < nrs; r++) relmap[rows[r0 + r]] = r;
      Lx.fill(0, off, off + nrs * ws);
      // 1. assemble
      for (let j = f; j <= l; j++) {
        const base = off + (j - f) * nrs;
        let dj = 0;
        for (let p = Lp[j]; p < Lp[j + 1]; p++) {
          const i = Li[p];
          Lx[base + relmap[i]] += Ax[p];
          if (i === j) dj += Ax[p];
        }
        diag[j] = dj;
      }
      // 2. updates from descendants
      let d = head[s];
      head[s] = -1;
      while (d !== -1) {
        const dNext = next[d];
        const fd = sup[d];
        const wd = sup[d + 1] - fd;
        const rd0 = rowPtr[d];
        const nrd = rowPtr[d + 1] - rd0;
        const offd = blockPtr[d];
        const start = nextRow[d];
        let end = start;
        while (end < nrd && rows[rd0 + end] <= l) end++;
        for (let t = start; t < end; t++) {
          for (let r = t; r < nrd; r++) tmp[r] = 0;
          let k = 0;
          for (; k + 1 < wd; k += 2) {
            const b0 = offd + k * nrd;
            const b1 = b0 + nrd;
            const a0 = Lx[b0 + t] * D[fd + k];
            const a1 = Lx[b1 + t] * D[fd + k + 1];
            if (a0 === 0 && a1 === 0) continue;
            for (let r = t; r < nrd; r++) tmp[r] += Lx[b0 + r] * a0 + Lx[b1 + r] * a1;
          }
          for (; k < wd; k++) {
            const b0 = offd + k * nrd;
            const a0 = Lx[b0 + t] * D[fd + k];
            if (a0 === 0) continue;
            for (let r = t; r < nrd; r++) tmp[r] += Lx[b0 + r] * a0;
          }
          const cbase = off + (rows[rd0 + t] - f) * nrs;
          for (let r = t; r < nrd; r++) Lx[cbase + relmap[rows[rd0 + r]]] -= tmp[r];
        }
        nextRow[d] = end;
        if (end < nrd) {
          const target = snode[rows[rd0 + end]];
          next[d] = head[target];
          head[target] = d;
        }
        d = dNext;
      }
      // 3. dense LDLᵀ of the trapezoidal block (right-looking inside the supernode)
      for (let k = 0; k < ws; k++) {
        const j = f + k;
        const kb = off + k * nrs;
        let dk = Lx[kb + k];
        if (!Number.isFinite(dk)) return { status: 'not_finite', column: j, replacedPivots: replaced };
        const sg = sign ? sign[j] : dk < 0 ? -1 : 1;
        if (dk * sg <= pivotTolerance * (1 + Math.abs(diag[j]))) {
          if (!dynamicRegularisation) return { status: 'zero_pivot', column: j, replacedPivots: replaced };
          dk = sg * bigPivot;
          replaced++;
        }
        D[j] = dk;
        const inv = 1 / dk;
        for (let c = k + 1; c < ws; c++) {
          const fct = Lx[kb + c] * inv;
          if (fct === 0) continue;
          const cb = off + c * nrs;
          for (let r = c; r < nrs; r++) Lx[cb + r] -= Lx[kb + r] * fct;
        }
        for (let r = k + 1; r < nrs; r++) Lx[kb + r] *= inv;
        Lx[kb + k] = 1;
      }
      if (nrs > ws) {
        nextRow[s] = ws;
        const target = snode[rows[r0 + ws]];
        next[s] = head[target];
        head[target] = s;
      }
    }
    return { status: 'factorised', column: -1, replacedPivots: replaced };
  }

  /** x ← (L D Lᵀ)⁻¹ x in the permuted numbering */
  solve(x: Float64Array): void {
    const { count, super: sup, rowPtr, rows, blockPtr } = this.sym;
    const { Lx, D } = this;
    for (let s = 0; s < count; s++) {
      const f = sup[s];
      const ws = sup[s + 1] - f;
      const r0 = rowPtr[s];
      const nrs = rowPtr[s + 1] - r0;
      const off = blockPtr[s];
      for (let k = 0; k < ws; k++) {
        const xj = x[f + k];
        if (xj === 0) continue;
        const kb = off + k * nrs;
        for (let r = k + 1; r < nrs; r++) x[rows[r0 + r]] -= Lx[kb + r] * xj;
      }
    }
    for (let j = 0; j < x.length; j++) x[j] /= D[j];
    for (let s = count - 1; s >= 0; s--) {
      const f = sup[s];
      const ws = sup[s + 1] - f;
      const r0 = rowPtr[s];
      const nrs = rowPtr[s + 1] - r0;
      const off = blockPtr[s];
      for (let k = ws - 1; k >= 0; k--) {
        const kb = off + k * nrs;
        let t = x[f + k];
        for (let r = k + 1; r < nrs; r++) t -= Lx[kb + r] * x[rows[r0 + r]];
        x[f + k] = t;
      }
    }
  }
}
