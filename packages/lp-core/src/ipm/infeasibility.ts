/**
 * Divergence tests that turn an iterate into a certificate (Farkas' lemma for the IPM form).
 *
 * Primal infeasible: a dual ray (y, z_l, z_u ≥ 0) with  −Âᵀy − z_l + z_u ≈ 0  on the free part and
 *   η = Σ lower·z_l − Σ upper·z_u − Σ_fixed lower_j (Âᵀy)_j > 0,
 * accepted when ‖−Âᵀy − z_l + z_u‖∞ ≤ tol · η (both in unscaled units). When the primal is
 * infeasible the dual iterates diverge along such a ray, so the current iterate is the candidate.
 *
 * Dual infeasible (unbounded): a primal ray d with  Â d ≈ 0,  Q d ≈ 0,  d in the recession cone of
 * the bounds (d_j ≥ 0 where only a lower bound exists, ≤ 0 where only an upper, 0 where both)
 * and cᵀd < 0, accepted when every violation is at most tol · (−cᵀd). Candidates: the primal
 * iterate and the last primal direction.
 */
import { multiplyAx, multiplySymLower } from '../sparse/csc';
import { BOXED, FIXED, FREE, LOWER, UPPER, hasLower, hasUpper, type IpmProblem } from './ipm-problem';
import type { Iterate } from './iterate';

export class InfeasibilityTest {
  private readonly tmpM: Float64Array;
  private readonly tmpN: Float64Array;

  constructor(
    private readonly prob: IpmProblem,
    private readonly kind: Uint8Array,
  ) {
    this.tmpM = new Float64Array(prob.m);
    this.tmpN = new Float64Array(prob.n);
  }

  /** true when (y, z_l, z_u) of the iterate certifies primal infeasibility */
  isPrimalInfeasible(it: Iterate, tol: number): boolean {
    const { n, m, A, lower, upper, colScale, rowScale } = this.prob;
    const { kind } = this;
    const { y, zl, zu } = it;
    const { colPtr: Ap, rowIdx: Ai, values: Ax } = A;
    let eta = 0;
    let res = 0;
    for (let j = 0; j < n + m; j++) {
      let aty: number;
      if (j < n) {
        aty = 0;
        for (let p = Ap[j]; p < Ap[j + 1]; p++) aty += Ax[p] * y[Ai[p]];
      } else aty = -y[j - n];
      const k = kind[j];
      if (k === FIXED) {
        eta -= lower[j] * aty;
        continue;
      }
      if (hasLower(k)) eta += lower[j] * zl[j];
      if (hasUpper(k)) eta -= upper[j] * zu[j];
      const r = -aty - (hasLower(k) ? zl[j] : 0) + (hasUpper(k) ? zu[j] : 0);
      const unscale = j < n ? 1 / colScale[j] : rowScale[j - n];
      res = Math.max(res, Math.abs(r * unscale));
    }
    return eta > 0 && res <= tol * eta;
  }

  /** true when d (a primal vector of length n + m) certifies unboundedness */
  isDualInfeasible(d: Float64Array, tol: number): boolean {
    const { n, m, A, c, colScale, rowScale } = this.prob;
    const { kind, tmpM, tmpN } = this;
    let cd = 0;
    for (let j = 0; j < n; j++) cd += c[j] * d[j];
    if (!(cd < 0)) return false;
    const limit = -tol * cd;
    for (let j = 0; j < n + m; j++) {
      const k = kind[j];
      const unscale = j < n ? colScale[j] : 1 / rowScale[j - n];
      let viol = 0;
      if (k === FIXED || k === BOXED) viol = Math.abs(d[j]);
      else if (k === LOWER) viol = Math.max(-d[j], 0);
      else if (k === UPPER) viol = Math.max(d[j], 0);
      else if (k !== FREE) viol = Math.abs(d[j]);
      if (viol * unscale > limit) return false;
    }
    for (let i = 0; i < m; i++) tmpM[i] = -d[n + i];
    multiplyAx(A, d, tmpM);
    for (let i = 0; i < m; i++) if (Math.abs(tmpM[i] / rowScale[i]) > limit) return false;
    if (this.prob.Q) {
      tmpN.fill(0);
      multiplySymLower(this.prob.Q, d, tmpN);
      for (let j = 0; j < n; j++) if (Math.abs(tmpN[j] / colScale[j]) > limit) return false;
    }
    return true;
  }
}
