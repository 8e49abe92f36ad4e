/**
 * Every tolerance and limit of the interior-point solver, with its default. Settings are
 * validated once (validateSettings) before any work; a bad value is a clear error.
 */
import type { IterationInfo } from './solution/result';

export interface IpmSettings {
  /** optimal when |primal − dual objective| / (1 + |primal objective|) ≤ this */
  tolGapRel: number;
  /** optimal when ‖row and bound violation‖∞ / (1 + ‖bounds‖∞) ≤ this */
  tolPrimalRel: number;
  /** optimal when ‖c + Qx − Aᵀy − z‖∞ / (1 + ‖c‖∞) ≤ this */
  tolDualRel: number;
  /** a ray whose residual is at most this times its objective proves infeasibility/unboundedness */
  tolInfeasibility: number;
  /** iteration limit (status 'iteration_limit') */
  maxIterations: number;
  /** wall-clock limit in seconds (status 'time_limit'); Infinity for none */
  timeLimitSeconds: number;
  /** run the presolve reductions (and postsolve) */
  presolve: boolean;
  /** equilibrate A by Ruiz scaling before solving */
  scaling: boolean;
  /** Ruiz passes */
  scalingPasses: number;
  /** primal (proximal) regularisation ρ added to the barrier diagonal of bounded variables */
  regPrimal: number;
  /** the barrier diagonal of a free variable (it has no barrier term): Θ = 1 / regFree */
  regFree: number;
  /** dual regularisation δ added to the normal-equations diagonal */
  regDual: number;
  /** relative size under which a Cholesky pivot counts as zero (then replaced, see ldl.ts) */
  pivotTolerance: number;
  /** largest fraction of the step to the boundary that is taken */
  stepToBoundary: number;
  /** at most this many Gondzio centrality correctors per iteration (0 = Mehrotra only) */
  maxCorrectors: number;
  /** a column with more than max(denseColumnMin, denseColumnRatio · m) nonzeros is treated as dense */
  denseColumnRatio: number;
  denseColumnMin: number;
  /** at most this many dense columns are split off (Sherman–Morrison–Woodbury) */
  maxDenseColumns: number;
  /** iterative refinement steps on each normal-equations solve */
  refinementSteps: number;
  /** largest Cholesky factor allowed, in megabytes of values; a bigger one ends the solve before it starts */
  maxFactorMegabytes: number;
  /** fill-reducing ordering: 'auto' tries AMD and nested dissection and keeps the cheaper factorisation */
  ordering: 'auto' | 'amd' | 'nd' | 'natural';
  /**
   * how the Newton systems of an LP are solved (ipm/choose-kkt-solver.ts): 'cholesky' (sparse
   * Cholesky of the normal equations), 'basis-cg' (conjugate gradients with a diagonal, then a
   * basis preconditioner; no factorisation), 'cholesky-then-basis-cg' (Cholesky for the first six
   * iterations, then basis-preconditioned CG), or 'auto': Cholesky unless one factorisation,
   * estimated in AMD order, takes at least 1e8 multiply–adds and 2000 per nonzero of [A I] (then
   * 'basis-cg', back to Cholesky if CG costs more per iteration) or the factor does not fit in
   * maxFactorMegabytes (then 'basis-cg'). QPs always use a factorisation.
   */
  linearSolver: 'auto' | 'cholesky' | 'basis-cg' | 'cholesky-then-basis-cg';
  /**
   * factorise (and solve with) big normal-equations matrices on two threads, a helper worker
   * thread sharing the work, when the machine has two cores: true, false, or 'auto' (the
   * default: only when one factorisation takes at least 1e9 multiply–adds, so the helper's
   * one-off start-up of about 1 s is repaid within a few iterations; smaller models stay on one
   * thread). A long-lived process (the API's solver thread) passes true: it pays the start-up once.
   * Unless false, conjugate gradients also share each product of a big split system (100000
   * entries of N or more) with the helper.
   */
  parallelFactorisation: boolean | 'auto';
  /** called after every iteration (progress bars) */
  onIteration?: (info: IterationInfo) => void;
  /** polled once per iteration; returning true ends the solve with status 'cancelled' */
  shouldStop?: () => boolean;
}

export const defaultIpmSettings: Readonly<IpmSettings> = Object.freeze({
  tolGapRel: 1e-8,
  tolPrimalRel: 1e-8,
  tolDualRel: 1e-8,
  tolInfeasibility: 1e-8,
  maxIterations: 100,
  timeLimitSeconds: Infinity,
  presolve: true,
  scaling: true,
  scalingPasses: 10,
  regPrimal: 1e-12,
  regFree: 1e-8,
  regDual: 1e-10,
  pivotTolerance: 1e-12,
  stepToBoundary: 0.9995,
  maxCorrectors: 4,
  denseColumnRatio: 0.3,
  denseColumnMin: 100,
  maxDenseColumns: 40,
  refinementSteps: 3,
  maxFactorMegabytes: 1536,
  ordering: 'auto',
  linearSolver: 'auto',
  parallelFactorisation: 'auto',
});

/** Merges with the defaults and checks every field; throws one Error listing what is wrong. */
export function resolveSettings(partial: Partial<IpmSettings> = {}): IpmSettings {
  const s: IpmSettings = { ...defaultIpmSettings, ...partial };
  const problems: string[] = [];
  const known = new Set(Object.keys(defaultIpmSettings).concat(['onIteration', 'shouldStop']));
  for (const key of Object.keys(partial)) if (!known.has(key)) problems.push(`unknown setting "${key}"`);
  const inOpen01 = (k: keyof IpmSettings): void => {
    const v = s[k];
    if (typeof v !== 'number' || !(v > 0 && v < 1)) problems.push(`${k} must be a number in (0, 1), got ${String(v)}`);
  };
  const nonNegativeInt = (k: keyof IpmSettings): void => {
    const v = s[k];
    if (typeof v !== 'number' || !Number.isInteger(v) || v < 0) problems.push(`${k} must be a non-negative integer, got ${String(v)}`);
  };
  const nonNegative = (k: keyof IpmSettings): void => {
    const v = s[k];
    if (typeof v !== 'number' || Number.isNaN(v) || v < 0) problems.push(`${k} must be a number ≥ 0, got ${String(v)}`);
  };
  (['tolGapRel', 'tolPrimalRel', 'tolDualRel', 'tolInfeasibility', 'stepToBoundary', 'denseColumnRatio'] as const).forEach(inOpen01);
  (['maxIterations', 'scalingPasses', 'maxCorrectors', 'denseColumnMin', 'maxDenseColumns', 'refinementSteps'] as const).forEach(nonNegativeInt);
  (['regPrimal', 'regFree', 'regDual', 'pivotTolerance'] as const).forEach(nonNegative);
  if (typeof s.maxFactorMegabytes !== 'number' || !(s.maxFactorMegabytes > 0)) {
    problems.push(`maxFactorMegabytes must be a positive number, got ${String(s.maxFactorMegabytes)}`);
  }
  if (typeof s.timeLimitSeconds !== 'number' || !(s.timeLimitSeconds > 0)) {
    problems.push(`timeLimitSeconds must be a positive number or Infinity, got ${String(s.timeLimitSeconds)}`);
  }
  if (s.parallelFactorisation !== 'auto' && typeof s.parallelFactorisation !== 'boolean') {
    problems.push(`parallelFactorisation must be true, false or "auto", got ${String(s.parallelFactorisation)}`);
  }
  for (const k of ['presolve', 'scaling'] as const) {
    if (typeof s[k] !== 'boolean') problems.push(`${k} must be true or false, got ${String(s[k])}`);
  }
  if (!['auto', 'cholesky', 'basis-cg', 'cholesky-then-basis-cg'].includes(s.linearSolver)) {
    problems.push(`linearSolver must be "auto", "cholesky", "basis-cg" or "cholesky-then-basis-cg", got ${String(s.linearSolver)}`);
  }
  if (!['auto', 'amd', 'nd', 'natural'].includes(s.ordering)) problems.push(`ordering must be "auto", "amd", "nd" or "natural", got ${String(s.ordering)}`);
  for (const k of ['onIteration', 'shouldStop'] as const) {
    if (s[k] !== undefined && typeof s[k] !== 'function') problems.push(`${k} must be a function`);
  }
  if (problems.length > 0) throw new Error(`Invalid solver settings: ${problems.join('; ')}`);
  return s;
}
