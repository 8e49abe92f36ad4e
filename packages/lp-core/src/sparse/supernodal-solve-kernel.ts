/**
 * The triangular solves with a supernodal factor L D Lᵀ (supernodal-ldl.ts), over ranges of
 * supernodes, so that two threads can share one solve: the two halves of the elimination tree
 * (subtree-split.ts) are independent in both directions, and only the top depends on both.
 *
 * Forward (L z = b, then z ← D⁻¹ z) over the given supernodes in ascending order: each
 * supernode's diagonal block is solved in place and the rows below are handled as one dense
 * matrix–vector product into tmp, scattered once per row. A thread working on a half may not
 * write the top's entries of x while the other half does too: with `topOut` set, what it would
 * subtract from a top row (isTopCol[row] = 1) goes into topOut instead, to be added afterwards.
 * Backward (Lᵀ x = z) over the given supernodes in descending order: gather the rows below once,
 * then four dot products at a time.
 *
 * Self-contained functions (no imports, closures or nested functions): the helper thread
 * (factor-helper-thread.ts) runs their very source.
 */

export function forwardSolveRanges(
  sup: Int32Array,
  rowPtr: Int32Array,
  rows: Int32Array,
  blockPtr: Int32Array,
  Lx: Float64Array,
  D: Float64Array,
  x: Float64Array,
  tmp: Float64Array,
  ranges: Int32Array,
  topOut: Float64Array | null,
  isTopCol: Uint8Array | null,
): void {
  for (let q = 0; q < ranges.length; q += 2) {
    for (let s = ranges[q]; s < ranges[q + 1]; s++) {
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
      if (nrs > ws) {
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
        if (topOut === null || isTopCol === null) {
          for (let r = ws; r < nrs; r++) x[rows[r0 + r]] -= tmp[r];
        } else {
          for (let r = ws; r < nrs; r++) {
            const i = rows[r0 + r];
            if (isTopCol[i] === 1) topOut[i] -= tmp[r];
            else x[i] -= tmp[r];
          }
        }
      }
      // the columns of s are final: divide by D
      for (let k = 0; k < ws; k++) x[f + k] /= D[f + k];
    }
  }
}

export function backwardSolveRanges(
  sup: Int32Array,
  rowPtr: Int32Array,
  rows: Int32Array,
  blockPtr: Int32Array,
  Lx: Float64Array,
  x: Float64Array,
  tmp: Float64Array,
  ranges: Int32Array,
): void {
  for (let q = ranges.length - 2; q >= 0; q -= 2) {
    for (let s = ranges[q + 1] - 1; s >= ranges[q]; s--) {
      const f = sup[s];
      const ws = sup[s + 1] - f;
      const r0 = rowPtr[s];
      const nrs = rowPtr[s + 1] - r0;
      const off = blockPtr[s];
      if (nrs > ws) {
        // rows below: gather once, then dot products, four columns at a time (four independent
        // sums share each gathered value)
        for (let r = ws; r < nrs; r++) tmp[r] = x[rows[r0 + r]];
        let k = 0;
        for (; k + 3 < ws; k += 4) {
          const b0 = off + k * nrs;
          const b1 = b0 + nrs;
          const b2 = b1 + nrs;
          const b3 = b2 + nrs;
          let t0 = 0;
          let t1 = 0;
          let t2 = 0;
          let t3 = 0;
          for (let r = ws; r < nrs; r++) {
            const v = tmp[r];
            t0 += Lx[b0 + r] * v;
            t1 += Lx[b1 + r] * v;
            t2 += Lx[b2 + r] * v;
            t3 += Lx[b3 + r] * v;
          }
          x[f + k] -= t0;
          x[f + k + 1] -= t1;
          x[f + k + 2] -= t2;
          x[f + k + 3] -= t3;
        }
        for (; k < ws; k++) {
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
