/** How a solve ended. */
export type SolveStatus =
  | 'optimal'
  | 'infeasible'
  | 'unbounded'
  | 'iteration_limit'
  | 'time_limit'
  | 'numerical_trouble'
  | 'cancelled';

/** Residuals and gap measured on the original (unscaled, un-presolved) problem. */
export interface Certificate {
  /** ‖ violation of row and column bounds ‖∞ relative to 1 + ‖b‖∞ */
  primalResidual: number;
  /** ‖ c + Qx − Aᵀy − z ‖∞ relative to 1 + ‖c‖∞ */
  dualResidual: number;
  /** |primal − dual objective| / (1 + |primal objective|) */
  relativeGap: number;
}

/** A ray proving infeasibility (dual ray on rows/bounds) or unboundedness (primal ray on columns). */
export interface InfeasibilityRay {
  kind: 'primal_infeasible' | 'dual_infeasible';
  /** non-zero entries only, by row or column name */
  entries: { name: string; value: number }[];
}

/** One line of progress, passed to onIteration after each iteration. */
export interface IterationInfo {
  iteration: number;
  primalObjective: number;
  dualObjective: number;
  primalResidual: number;
  dualResidual: number;
  relativeGap: number;
  mu: number;
  stepPrimal: number;
  stepDual: number;
  seconds: number;
}

export interface SolveResult {
  status: SolveStatus;
  /** cᵀx + ½xᵀQx + c₀ in the problem's own sense (negated back when the source maximised) */
  objective: number;
  x: Float64Array;
  /** A x */
  rowActivity: Float64Array;
  /** y: ∂objective/∂(row bound) — for a binding ≤ row of a minimisation y ≤ 0 */
  rowDuals: Float64Array;
  /** z = c + Qx − Aᵀy */
  reducedCosts: Float64Array;
  iterations: number;
  seconds: number;
  certificate: Certificate;
  ray?: InfeasibilityRay;
  /** human-readable detail for non-optimal endings */
  message?: string;
  /** seconds spent per named stage (presolve, scaling, factorise, solve, postsolve, …) */
  timings?: Record<string, number>;
}
