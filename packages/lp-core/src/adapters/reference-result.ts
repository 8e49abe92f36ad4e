import type { Certificate, SolveStatus } from '../solution/result';

/** What a reference solver (HiGHS, javascript-lp-solver) reports, in lp-core's terms. */
export interface ReferenceResult {
  solver: ReferenceSolverName;
  status: SolveStatus;
  /** cᵀx + ½xᵀQx + c₀ in the problem's own sense (negated back when it maximises); NaN when not optimal */
  objective: number;
  x: Float64Array;
  rowActivity?: Float64Array;
  /** y in lp-core's sign convention (c + Qx − Aᵀy − z = 0 for the minimisation form) */
  rowDuals?: Float64Array;
  reducedCosts?: Float64Array;
  /** measured on the original problem when x (and duals) are available */
  certificate?: Certificate;
  iterations: number;
  seconds: number;
  message?: string;
}

export type ReferenceSolverName = 'highs-simplex' | 'highs-ipm' | 'highs-choose' | 'javascript-lp-solver';
