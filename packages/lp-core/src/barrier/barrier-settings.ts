/**
 * Settings of the log-barrier method (Fiacco & McCormick, Nonlinear
 * Programming: Sequential Unconstrained Minimization Techniques, 1968, for the barrier method; Nocedal &
 * Wright, Numerical Optimization, 2nd ed., 2006, for backtracking line search and Newton's method — from memory), with defaults in the
 * ranges that book recommends. Validated once, before any iteration.
 */
import type { IterationInfo } from '../solution/result';

export interface BarrierSettings {
  /** backtracking: accept τ when φ(x + τΔx) ≤ φ(x) + α τ ∇φᵀΔx; α ∈ (0, ½), default 0.01 */
  lineSearchAlpha: number;
  /** backtracking: shrink τ ← β τ; β ∈ (0, 1), default 0.5 */
  lineSearchBeta: number;
  /** barrier parameter growth t ← μ t; μ > 1, default 10 */
  barrierMu: number;
  /** initial barrier parameter t⁽⁰⁾ > 0, default 1 */
  barrierT0: number;
  /** stop when m/t ≤ tolGap · max(1, |f₀(x)|) (m = number of inequalities); default 1e-8 */
  tolGap: number;
  /**
   * when rounding stops a centering before m/t reaches tolGap, the solve still counts as optimal if
   * the last completed centre had m/t ≤ tolGapReduced · max(1, |f₀(x)|) (f₀(x) − p* ≤ m/t); default 1e-6
   */
  tolGapReduced: number;
  /** centering stops when λ²/2 ≤ tolNewton (λ = Newton decrement); default 1e-10 */
  tolNewton: number;
  /** relative equality residual ‖Ex − d‖∞ / (1 + ‖d‖∞) above which the equality rows are inconsistent; default 1e-8 */
  tolEquality: number;
  /** Newton steps per centering, default 500 */
  maxNewtonStepsPerCentering: number;
  /** Newton steps in total (phase I and II), default 5000 */
  maxNewtonSteps: number;
  /**
   * Columns without a finite lower (upper) bound get an artificial one at ∓R, R = boxRadius ·
   * max(1, largest finite bound); this keeps every centering problem bounded (the barrier method's
   * convergence assumes bounded sublevel sets). An artificial bound that carries a significant multiplier at the end means unbounded. Default 1e3.
   */
  boxRadius: number;
  /** wall-clock limit in seconds, default Infinity */
  timeLimitSeconds: number;
  /** called after each outer (centering) iteration */
  onIteration?: (info: IterationInfo) => void;
}

export const DEFAULT_BARRIER_SETTINGS: Readonly<BarrierSettings> = {
  lineSearchAlpha: 0.01,
  lineSearchBeta: 0.5,
  barrierMu: 10,
  barrierT0: 1,
  tolGap: 1e-8,
  tolGapReduced: 1e-6,
  tolNewton: 1e-10,
  tolEquality: 1e-8,
  maxNewtonStepsPerCentering: 500,
  maxNewtonSteps: 5000,
  boxRadius: 1e3,
  timeLimitSeconds: Infinity,
};

export function resolveBarrierSettings(overrides: Partial<BarrierSettings> = {}): BarrierSettings {
  const s: BarrierSettings = { ...DEFAULT_BARRIER_SETTINGS, ...overrides };
  const check = (ok: boolean, what: string) => {
    if (!ok) throw new Error(`barrier settings: ${what}`);
  };
  check(s.lineSearchAlpha > 0 && s.lineSearchAlpha < 0.5, `lineSearchAlpha must lie in (0, 0.5), got ${s.lineSearchAlpha}`);
  check(s.lineSearchBeta > 0 && s.lineSearchBeta < 1, `lineSearchBeta must lie in (0, 1), got ${s.lineSearchBeta}`);
  check(s.barrierMu > 1, `barrierMu must exceed 1, got ${s.barrierMu}`);
  check(s.barrierT0 > 0 && Number.isFinite(s.barrierT0), `barrierT0 must be positive and finite, got ${s.barrierT0}`);
  check(s.tolGap > 0, `tolGap must be positive, got ${s.tolGap}`);
  check(s.tolGapReduced >= s.tolGap, `tolGapReduced must be at least tolGap, got ${s.tolGapReduced}`);
  check(s.tolNewton > 0, `tolNewton must be positive, got ${s.tolNewton}`);
  check(s.tolEquality > 0, `tolEquality must be positive, got ${s.tolEquality}`);
  check(Number.isInteger(s.maxNewtonStepsPerCentering) && s.maxNewtonStepsPerCentering > 0, 'maxNewtonStepsPerCentering must be a positive integer');
  check(Number.isInteger(s.maxNewtonSteps) && s.maxNewtonSteps > 0, 'maxNewtonSteps must be a positive integer');
  check(s.boxRadius > 0 && Number.isFinite(s.boxRadius), `boxRadius must be positive and finite, got ${s.boxRadius}`);
  check(s.timeLimitSeconds > 0, `timeLimitSeconds must be positive, got ${s.timeLimitSeconds}`);
  return s;
}
