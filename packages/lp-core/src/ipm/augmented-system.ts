/**
 * Augmented (quasidefinite) system for a QP whose Q has off-diagonal entries. Eliminating
 * only the row slacks w (dw = Θ_w (r̂_w − dy)) leaves
 *
 *   ⎡ −(Q + D_x)     Aᵀ      ⎤ ⎡dx⎤   ⎡      −r̂_x        ⎤
 *   ⎣     A       Θ_w + δI   ⎦ ⎣dy⎦ = ⎣ rp + Θ_w r̂_w     ⎦
 *
 * which is quasidefinite (negative definite block, positive definite block), so LDLᵀ exists
 * for any symmetric ordering (Vanderbei 1995) with pivot signs known in advance.
 */
import type { IpmSettings } from '../settings';
import { SymmetricFactorisation } from '../sparse/symmetric-factorisation';
import type { KktSolver, KktStatus } from './kkt-solver';
import type { IpmProblem } from './ipm-problem';

/** stands in for an infinite barrier term of a fixed variable */
const FIXED_DIAGONAL = 1e20;

export class AugmentedSystem implements KktSolver {
  private readonly F: SymmetricFactorisation;
  private readonly sign: Int8Array;
  private readonly thetaW: Float64Array;
  private readonly rhs: Float64Array;
  private readonly sol: Float64Array;
  private readonly resid: Float64Array;
  private readonly corr: Float64Array;
  replacedPivots = 0;

  constructor(
    private readonly prob: IpmProblem,
    private readonly settings: IpmSettings,
  ) {
    const { n, m, A } = prob;
    const Q = prob.Q!;
    const rows: number[] = [];
    const cols: number[] = [];
    for (let j = 0; j < n; j++) {
      rows.push(j);
      cols.push(j);
      for (let p = Q.colPtr[j]; p < Q.colPtr[j + 1]; p++) {
        if (Q.rowIdx[p] === j) continue;
        rows.push(Q.rowIdx[p]);
        cols.push(j);
      }
      for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) {
        rows.push(n + A.rowIdx[p]);
        cols.push(j);
      }
    }
    for (let i = 0; i < m; i++) {
      rows.push(n + i);
      cols.push(n + i);
    }
    this.F = new SymmetricFactorisation(n + m, Int32Array.from(rows), Int32Array.from(cols), settings.ordering, 'supernodal', (settings.maxFactorMegabytes * 2 ** 20) / 8, settings.parallelFactorisation);
    this.sign = new Int8Array(n + m);
    for (let k = 0; k < n + m; k++) this.sign[k] = this.F.perm[k] < n ? -1 : 1;
    this.thetaW = new Float64Array(m);
    this.rhs = new Float64Array(n + m);
    this.sol = new Float64Array(n + m);
    this.resid = new Float64Array(n + m);
    this.corr = new Float64Array(n + m);
  }

  get nnzL(): number {
    return this.F.nnzL;
  }

  factorise(D: Float64Array, deadline = Infinity): KktStatus {
    const { n, m, A } = this.prob;
    const Q = this.prob.Q!;
    const { Cx, slot } = this.F;
    Cx.fill(0);
    let t = 0;
    for (let j = 0; j < n; j++) {
      let d = D[j] === Infinity ? FIXED_DIAGONAL : D[j];
      for (let p = Q.colPtr[j]; p < Q.colPtr[j + 1]; p++) if (Q.rowIdx[p] === j) d += Q.values[p];
      Cx[slot[t++]] -= d;
      for (let p = Q.colPtr[j]; p < Q.colPtr[j + 1]; p++) {
        if (Q.rowIdx[p] !== j) Cx[slot[t++]] -= Q.values[p];
      }
      for (let p = A.colPtr[j]; p < A.colPtr[j + 1]; p++) Cx[slot[t++]] += A.values[p];
    }
    for (let i = 0; i < m; i++) {
      this.thetaW[i] = D[n + i] === Infinity ? 0 : 1 / D[n + i];
      Cx[slot[t++]] += this.thetaW[i] + this.settings.regDual;
    }
    const report = this.F.factorise({
      pivotTolerance: this.settings.pivotTolerance,
      dynamicRegularisation: true,
      bigPivot: 1e128,
      deadline,
      sign: this.sign,
    });
    this.replacedPivots = report.replacedPivots;
    if (report.status === 'interrupted') return 'interrupted';
    return report.status === 'factorised' ? 'factorised' : 'numerical_trouble';
  }

  solve(rhat: Float64Array, rp: Float64Array, dv: Float64Array, dy: Float64Array): void {
    const { n, m } = this.prob;
    const { rhs, sol, resid, corr, thetaW } = this;
    for (let j = 0; j < n; j++) rhs[j] = -rhat[j];
    for (let i = 0; i < m; i++) rhs[n + i] = rp[i] + thetaW[i] * rhat[n + i];
    sol.set(rhs);
    this.F.solve(sol);
    for (let k = 0; k < this.settings.refinementSteps; k++) {
      resid.fill(0);
      this.F.multiply(sol, resid);
      let r = 0;
      for (let i = 0; i < n + m; i++) {
        corr[i] = rhs[i] - resid[i];
        r = Math.max(r, Math.abs(corr[i]));
      }
      if (!(r > 1e-14)) break;
      this.F.solve(corr);
      for (let i = 0; i < n + m; i++) sol[i] += corr[i];
    }
    for (let j = 0; j < n; j++) dv[j] = sol[j];
    for (let i = 0; i < m; i++) {
      dy[i] = sol[n + i];
      dv[n + i] = thetaW[i] * (rhat[n + i] - dy[i]);
    }
  }
}
