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

/** columns per panel of the dense block factorisation */
const PANEL = 32;

export class SupernodalLdl {
  readonly Lx: Float64Array;
  readonly D: Float64Array;
  private readonly relmap: Int32Array;
  private readonly tmp: Float64Array;
  private readonly tmp2: Float64Array;
  private readonly rel: Int32Array;
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
    this.tmp2 = new Float64Array(maxRows);
    this.rel = new Int32Array(maxRows);
    this.head = new Int32Array(sym.count);
    this.next = new Int32Array(sym.count);
    this.nextRow = new Int32Array(sym.count);
    this.diag = new Float64Array(sym.n);
  }

  /** Lp/Li/Lx: the lower triangle (rows ≥ column) of the permuted matrix in CSC form. */
  factorise(Lp: Int32Array, Li: Int32Array, Ax: Float64Array, opts: FactorOptions): FactorReport {
    const { count, super: sup, snode, rowPtr, rows, blockPtr } = this.sym;
    const { Lx, D, relmap, tmp, tmp2, rel, head, next, nextRow, diag } = this;
    const { pivotTolerance, dynamicRegularisation, bigPivot, sign } = opts;
    const deadline = opts.deadline ?? Infinity;
    head.fill(-1);
    let replaced = 0;
    for (let s = 0; s < count; s++) {
      if ((s & 31) === 0 && deadline < Infinity && performance.now() > deadline) {
        return { status: 'interrupted', column: sup[s], replacedPivots: replaced };
      }
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
        if (deadline < Infinity && performance.now() > deadline) {
          return { status: 'interrupted', column: sup[s], replacedPivots: replaced };
        }
        const dNext = next[d];
        const fd = sup[d];
        const wd = sup[d + 1] - fd;
        const rd0 = rowPtr[d];
        const nrd = rowPtr[d + 1] - rd0;
        const offd = blockPtr[d];
        const start = nextRow[d];
        let end = start;
        while (end < nrd && rows[rd0 + end] <= l) end++;
        // positions in s's block of d's rows from `start` on
        for (let r = start; r < nrd; r++) rel[r] = relmap[rows[rd0 + r]];
        if (wd <= 2) {
          // narrow descendant: subtract straight into the target column
          const b0 = offd;
          const b1 = offd + nrd;
          const d0 = D[fd];
          const d1 = wd === 2 ? D[fd + 1] : 0;
          for (let t = start; t < end; t++) {
            const a0 = Lx[b0 + t] * d0;
            const a1 = wd === 2 ? Lx[b1 + t] * d1 : 0;
            const cbase = off + (rows[rd0 + t] - f) * nrs;
            if (wd === 2) {
              for (let r = t; r < nrd; r++) Lx[cbase + rel[r]] -= Lx[b0 + r] * a0 + Lx[b1 + r] * a1;
            } else if (a0 !== 0) {
              for (let r = t; r < nrd; r++) Lx[cbase + rel[r]] -= Lx[b0 + r] * a0;
            }
          }
        } else {
          // wide descendant: two target columns at a time, so each value of d's block loaded
          // serves two multiply–adds (tmp for column t, tmp2 for column t + 1)
          let t = start;
          for (; t + 1 < end; t += 2) {
            tmp.fill(0, t, nrd);
            tmp2.fill(0, t + 1, nrd);
            let k = 0;
            for (; k + 3 < wd; k += 4) {
              const b0 = offd + k * nrd;
              const b1 = b0 + nrd;
              const b2 = b1 + nrd;
              const b3 = b2 + nrd;
              const e0 = D[fd + k];
              const e1 = D[fd + k + 1];
              const e2 = D[fd + k + 2];
              const e3 = D[fd + k + 3];
              const a0 = Lx[b0 + t] * e0;
              const a1 = Lx[b1 + t] * e1;
              const a2 = Lx[b2 + t] * e2;
              const a3 = Lx[b3 + t] * e3;
              const c0 = Lx[b0 + t + 1] * e0;
              const c1 = Lx[b1 + t + 1] * e1;
              const c2 = Lx[b2 + t + 1] * e2;
              const c3 = Lx[b3 + t + 1] * e3;
              tmp[t] += Lx[b0 + t] * a0 + Lx[b1 + t] * a1 + Lx[b2 + t] * a2 + Lx[b3 + t] * a3;
              for (let r = t + 1; r < nrd; r++) {
                const l0 = Lx[b0 + r];
                const l1 = Lx[b1 + r];
                const l2 = Lx[b2 + r];
                const l3 = Lx[b3 + r];
                tmp[r] += l0 * a0 + l1 * a1 + l2 * a2 + l3 * a3;
                tmp2[r] += l0 * c0 + l1 * c1 + l2 * c2 + l3 * c3;
              }
            }
            for (; k < wd; k++) {
              const b0 = offd + k * nrd;
              const a0 = Lx[b0 + t] * D[fd + k];
              const c0 = Lx[b0 + t + 1] * D[fd + k];
              tmp[t] += Lx[b0 + t] * a0;
              for (let r = t + 1; r < nrd; r++) {
                tmp[r] += Lx[b0 + r] * a0;
                tmp2[r] += Lx[b0 + r] * c0;
              }
            }
            const cbase = off + (rows[rd0 + t] - f) * nrs;
            for (let r = t; r < nrd; r++) Lx[cbase + rel[r]] -= tmp[r];
            const cbase2 = off + (rows[rd0 + t + 1] - f) * nrs;
            for (let r = t + 1; r < nrd; r++) Lx[cbase2 + rel[r]] -= tmp2[r];
          }
          for (; t < end; t++) {
            tmp.fill(0, t, nrd);
            for (let k = 0; k < wd; k++) {
              const b0 = offd + k * nrd;
              const a0 = Lx[b0 + t] * D[fd + k];
              if (a0 === 0) continue;
              for (let r = t; r < nrd; r++) tmp[r] += Lx[b0 + r] * a0;
            }
            const cbase = off + (rows[rd0 + t] - f) * nrs;
            for (let r = t; r < nrd; r++) Lx[cbase + rel[r]] -= tmp[r];
          }
        }
        nextRow[d] = end;
        if (end < nrd) {
          const target = snode[rows[rd0 + end]];
          next[d] = head[target];
          head[target] = d;
        }
        d = dNext;
      }
      // 3. dense LDLᵀ of the trapezoidal block, blocked right-looking: factorise a panel of up
      //    to PANEL columns, then update each trailing column with the whole panel (the panel
      //    stays in cache while the trailing columns stream past once)
      for (let k0 = 0; k0 < ws; k0 += PANEL) {
        if (deadline < Infinity && performance.now() > deadline) {
          return { status: 'interrupted', column: f + k0, replacedPivots: replaced };
        }
        const k1 = Math.min(k0 + PANEL, ws);
        for (let k = k0; k < k1; k++) {
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
          // the rest of the panel, with column k still unscaled (L·d)
          for (let c = k + 1; c < k1; c++) {
            const fct = Lx[kb + c] * inv;
            if (fct === 0) continue;
            const cb = off + c * nrs;
            for (let r = c; r < nrs; r++) Lx[cb + r] -= Lx[kb + r] * fct;
          }
        }
        // trailing columns: column c −= Σ_k (L·d)_k · L_ck over the panel, two columns at a time
        // so every panel value loaded serves two multiply–adds
        let c = k1;
        for (; c + 1 < ws; c += 2) {
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
        for (; c < ws; c++) {
          const cb = off + c * nrs;
          for (let k = k0; k < k1; k++) {
            const kb = off + k * nrs;
            const fct = Lx[kb + c] / D[f + k];
            if (fct === 0) continue;
            for (let r = c; r < nrs; r++) Lx[cb + r] -= Lx[kb + r] * fct;
          }
        }
        // scale the panel's columns: L = (L·d) / d
        for (let k = k0; k < k1; k++) {
          const kb = off + k * nrs;
          const inv = 1 / D[f + k];
          for (let r = k + 1; r < nrs; r++) Lx[kb + r] *= inv;
          Lx[kb + k] = 1;
        }
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

  /**
   * x ← (L D Lᵀ)⁻¹ x in the permuted numbering. Each supernode's rows start with its own
   * columns f..l (contiguous in x), so the diagonal block is solved in place and the rows below
   * are handled as one dense matrix–vector product into tmp, scattered (forward) or gathered
   * (backward) once per row instead of once per column.
   */
  solve(x: Float64Array): void {
    const { count, super: sup, rowPtr, rows, blockPtr } = this.sym;
    const { Lx, D, tmp } = this;
    for (let s = 0; s < count; s++) {
      const f = sup[s];
      const ws = sup[s + 1] - f;
      const r0 = rowPtr[s];
      const nrs = rowPtr[s + 1] - r0;
      const off = blockPtr[s];
      // diagonal block: unit lower triangular, in place
      for (let k = 0; k < ws; k++) {
        const xj = x[f + k];
        if (xj === 0) continue;
        const kb = off + k * nrs;
        for (let r = k + 1; r < ws; r++) x[f + r] -= Lx[kb + r] * xj;
      }
      if (nrs === ws) continue;
      // rows below: tmp = L_below · x_s, then scatter
      tmp.fill(0, ws, nrs);
      let k = 0;
      for (; k + 3 < ws; k += 4) {
        const x0 = x[f + k];
        const x1 = x[f + k + 1];
        const x2 = x[f + k + 2];
        const x3 = x[f + k + 3];
        if (x0 === 0 && x1 === 0 && x2 === 0 && x3 === 0) continue;
        const b0 = off + k * nrs;
        const b1 = b0 + nrs;
        const b2 = b1 + nrs;
        const b3 = b2 + nrs;
        for (let r = ws; r < nrs; r++) tmp[r] += Lx[b0 + r] * x0 + Lx[b1 + r] * x1 + Lx[b2 + r] * x2 + Lx[b3 + r] * x3;
      }
      for (; k < ws; k++) {
        const x0 = x[f + k];
        if (x0 === 0) continue;
        const b0 = off + k * nrs;
        for (let r = ws; r < nrs; r++) tmp[r] += Lx[b0 + r] * x0;
      }
      for (let r = ws; r < nrs; r++) x[rows[r0 + r]] -= tmp[r];
    }
    for (let j = 0; j < x.length; j++) x[j] /= D[j];
    for (let s = count - 1; s >= 0; s--) {
      const f = sup[s];
      const ws = sup[s + 1] - f;
      const r0 = rowPtr[s];
      const nrs = rowPtr[s + 1] - r0;
      const off = blockPtr[s];
      if (nrs > ws) {
        // rows below: gather once, then one dot product per column
        for (let r = ws; r < nrs; r++) tmp[r] = x[rows[r0 + r]];
        for (let k = 0; k < ws; k++) {
          const kb = off + k * nrs;
          let t = 0;
          for (let r = ws; r < nrs; r++) t += Lx[kb + r] * tmp[r];
          x[f + k] -= t;
        }
      }
      // diagonal block: unit upper triangular (Lᵀ), in place
      for (let k = ws - 1; k >= 0; k--) {
        const kb = off + k * nrs;
        let t = x[f + k];
        for (let r = k + 1; r < ws; r++) t -= Lx[kb + r] * x[f + r];
        x[f + k] = t;
      }
    }
  }
}
