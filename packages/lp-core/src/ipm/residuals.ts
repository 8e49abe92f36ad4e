/**
 * Residuals of the optimality conditions of the IPM form (ipm-problem.ts):
 *
 *   rp = −Â v = w − A x                                   (primal)
 *   rd = c + Q x − Âᵀ y − z_l + z_u   (0 for fixed v_j)    (dual)
 *   μ  = (Σ x_l z_l + Σ x_u z_u) / (number of finite bounds)
 *
 * and the measures used for termination, expressed in the units of the unscaled problem.
 */
import { multiplyAx, multiplySymLower } from '../sparse/csc';
import { FIXED, hasLower, hasUpper, type IpmProblem } from './ipm-problem';
import type { Iterate } from './iterate';

export interface Measures {
  primalObjective: number;
  dualObjective: number;
  primalResidual: number;
  dualResidual: number;
  relativeGap: number;
  mu: number;
}

export class Residuals {
  readonly rp: Float64Array;
  readonly rd: Float64Array;
  /** Q x (length n) */
  readonly Qx: Float64Array;
  private readonly bNorm: number;
  private readonly cNorm: number;
  readonly boundCount: number;

  constructor(
    private readonly prob: IpmProblem,
    private readonly kind: Uint8Array,
  ) {
    const { n, m } = prob;
    this.rp = new Float64Array(m);
    this.rd = new Float64Array(n + m);
    this.Qx = new Float64Array(n);
    let b = 0;
    let count = 0;
    for (let j = 0; j < n + m; j++) {
      const s = j < n ? prob.colScale[j] : 1 / prob.rowScale[j - n];
      if (prob.lower[j] > -Infinity) b = Math.max(b, Math.abs(prob.lower[j] * s));
      if (prob.upper[j] < Infinity) b = Math.max(b, Math.abs(prob.upper[j] * s));
      if (hasLower(kind[j])) count++;
      if (hasUpper(kind[j])) count++;
    }
    let c = 0;
    for (let j = 0; j < n; j++) c = Math.max(c, Math.abs(prob.c[j] / prob.colScale[j]));
    this.bNorm = b;
    this.cNorm = c;
    this.boundCount = count;
  }

  /** Fills rp, rd, Qx for the iterate and returns the measures. */
  compute(it: Iterate): Measures {
    const { n, m, A, c, lower, upper, colScale, rowScale } = this.prob;
    const { rp, rd, Qx, kind } = this;
    const { v, y, zl, zu } = it;
    for (let i = 0; i < m; i++) rp[i] = v[n + i];
    multiplyAx(A, v, rp, -1);
    Qx.fill(0);
    if (this.prob.Q) multiplySymLower(this.prob.Q, v, Qx);
    let xQx = 0;
    let cx = 0;
    for (let j = 0; j < n; j++) {
      xQx += v[j] * Qx[j];
      cx += c[j] * v[j];
    }
    // rd_x = c + Qx − Aᵀy − zl + zu ; rd_w = y − zl + zu
    const { colPtr: Ap, rowIdx: Ai, values: Ax } = A;
    let dualBound = 0;
    let comp = 0;
    let dualRes = 0;
    for (let j = 0; j < n + m; j++) {
      let g: number;
      if (j < n) {
        g = c[j] + Qx[j];
        for (let p = Ap[j]; p < Ap[j + 1]; p++) g -= Ax[p] * y[Ai[p]];
      } else g = y[j - n];
      const k = kind[j];
      if (k === FIXED) {
        rd[j] = 0;
        dualBound += lower[j] * g;
        continue;
      }
      const r = g - zl[j] + zu[j];
      rd[j] = r;
      const unscale = j < n ? 1 / colScale[j] : rowScale[j - n];
      dualRes = Math.max(dualRes, Math.abs(r * unscale));
      if (hasLower(k)) {
        dualBound += lower[j] * zl[j];
        comp += (v[j] - lower[j]) * zl[j];
      }
      if (hasUpper(k)) {
        dualBound -= upper[j] * zu[j];
        comp += (upper[j] - v[j]) * zu[j];
      }
    }
    let primalRes = 0;
    for (let i = 0; i < m; i++) primalRes = Math.max(primalRes, Math.abs(rp[i] / rowScale[i]));
    const c0 = this.prob.c0;
    const primalObjective = cx + 0.5 * xQx + c0;
    const dualObjective = dualBound - 0.5 * xQx + c0;
    return {
      primalObjective,
      dualObjective,
      primalResidual: primalRes / (1 + this.bNorm),
      dualResidual: dualRes / (1 + this.cNorm),
      relativeGap: Math.abs(primalObjective - dualObjective) / (1 + Math.abs(primalObjective)),
      mu: this.boundCount > 0 ? comp / this.boundCount : 0,
    };
  }
}
