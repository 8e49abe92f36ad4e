/**
 * The Newton system of every interior-point iteration, behind one small interface so the
 * linear algebra can be swapped:
 *
 *   ⎡ Q + D   −Âᵀ ⎤ ⎡dv⎤   ⎡ r̂ ⎤
 *   ⎣   Â      0  ⎦ ⎣dy⎦ = ⎣ rp ⎦ ,     Â = [A  −I],
 *
 * D the barrier diagonal (plus primal regularisation); D_j = +Infinity marks a fixed variable
 * (dv_j = 0).
 */
export type KktStatus = 'factorised' | 'numerical_trouble' | 'interrupted';

export interface KktSolver {
  /** nonzeros of the factor L */
  readonly nnzL: number;
  /** pivots replaced by dynamic regularisation in the last factorisation */
  readonly replacedPivots: number;
  /** Gondzio correctors worth their cost with this solver (undefined: as many as the settings allow) */
  readonly correctorLimit?: number;
  /**
   * After solve(): per column, e_j = D_j dv_j − (r̂_j + Âᵀ_j dy) where the solver chose dv_j to
   * satisfy Â dv = rp exactly instead of the first block equation (null or absent: none). The
   * caller adds e_j to dz_j, which moves the error into the complementarity equation.
   */
  readonly complementarityShift?: Float64Array | null;
  /**
   * deadline: performance.now() value after which the factorisation gives up ('interrupted');
   * mu: the iterate's complementarity (an iterative solver may stop sooner while it is large)
   */
  factorise(D: Float64Array, deadline?: number, mu?: number): KktStatus;
  solve(rhat: Float64Array, rp: Float64Array, dv: Float64Array, dy: Float64Array): void;
}
