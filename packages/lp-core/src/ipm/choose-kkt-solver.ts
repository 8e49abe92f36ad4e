/**
 * Which solver takes the Newton systems of an interior-point solve (settings.linearSolver):
 *
 *  - 'cholesky': the normal equations by sparse Cholesky (normal-equations.ts), or the augmented
 *    system when Q has off-diagonal entries (augmented-system.ts);
 *  - 'basis-cg': conjugate gradients, diagonal then basis preconditioner, no factorisation at all
 *    (basis-cg-solver.ts; LPs only);
 *  - 'cholesky-then-basis-cg': Cholesky for the first CHOLESKY_ITERATIONS iterations, then
 *    conjugate gradients with the basis preconditioner (LPs only);
 *  - 'auto' (the default): 'cholesky', unless one factorisation takes at least CG_MIN_FLOPS
 *    multiply–adds and CG_FLOPS_PER_NONZERO per nonzero of [A I]: then 'basis-cg', going back to
 *    Cholesky for good if an iteration of CG costs more than a factorisation; and 'basis-cg' when
 *    the factor would not fit in maxFactorMegabytes. The cost is estimated in the approximate
 *    minimum degree order from the elimination tree alone (NormalEquations.estimateFlops), so
 *    choosing CG builds no factorisation: on L the full symbolic analysis took 0.4–0.7 s. The
 *    ordering stops counting at FIRST_COUNT times the threshold (XL: 2.9 → 1.1–1.5 s), and counts
 *    on later only if the fall-back needs more.
 *
 * Measured on the bench's planning models (lp-core's bench, one machine, interleaved runs):
 *  - S (328 rows, estimated 4.3e5 multiply–adds, 210 per nonzero): Cholesky 0.035–0.046 s, CG 0.086 s;
 *  - M (2340 rows, estimated 3.6e8, 22000 per nonzero; 1.4e8 in the order the factorisation
 *    picks): Cholesky 0.55–0.75 s, CG 0.40–0.46 s (0.35–0.69 s with the split system);
 *  - L (12729 rows, 7.3e9 in the factorisation's order): Cholesky throughout 38–40 s; six
 *    Cholesky iterations then CG 13.8 s; CG from the start 4.8–5.3 s (26 iterations, 3976 steps),
 *    with primal-exact steps and the split system 3.3–4.1 s (27 iterations, 2371 steps);
 *  - XL (75920 rows): the first factorisation did not end within 300 s; CG from the start 110 s,
 *    then 73 s, with the split system laid out by row, the triangular-first basis LU and the
 *    helper thread 40–45 s (57–60 s on a slower morning; with grouped products then 44–52 s);
 *  - plan-model's generated 200 × 26 plant (6e9): Cholesky 26 s, CG from the start 6.1–6.9 s
 *    (16–19 s measured earlier by a script that did not hand μ on, so CG ran to its tight target);
 *  - the demo plant's 12-week plan (1142 rows, estimated 1.2e7, about 2000 per nonzero):
 *    Cholesky 0.14–0.15 s, CG 0.18–0.21 s (steady state), hence CG_MIN_FLOPS 1e8, not 1e7 (with
 *    1e7 the solve started on CG and fell back to Cholesky halfway).
 * CG from the start used to stall (70 s for L's first iteration): the diagonal preconditioner
 * gave up at the starting point, where all weights are alike, and the basis then picked filled its
 * LU with millions of nonzeros. Now the first iteration keeps its inexact directions, the
 * diagonal preconditioner carries the next few (8 on L), and the basis is factorised with its
 * triangular parts first (40–54 thousand nonzeros on L, about those of B itself).
 */
import type { IpmSettings } from '../settings';
import { FactorTooLargeError } from '../sparse/symmetric-factorisation';
import { AugmentedSystem } from './augmented-system';
import { BasisCgSolver, type CholeskyOption } from './basis-cg-solver';
import { hasOffDiagonalQ, type IpmProblem } from './ipm-problem';
import type { KktSolver } from './kkt-solver';
import { NormalEquations } from './normal-equations';

export const CHOLESKY_ITERATIONS = 6;
/**
 * 'auto' takes CG when a factorisation costs at least CG_MIN_FLOPS multiply–adds and at least
 * CG_FLOPS_PER_NONZERO per nonzero of [A I] (what one CG step costs, roughly).
 */
export const CG_MIN_FLOPS = 1e8;
export const CG_FLOPS_PER_NONZERO = 2000;

/**
 * the first count of a factorisation's cost goes on to this many times the threshold, past the
 * point that decides for CG, so that the fall-back (which counts on to 8 times CG's cost per
 * iteration, basis-cg-solver.ts) seldom has to count again: CG's cost per iteration measured 1, 3.8
 * and 6 times the threshold on the bench's M, L and XL models. On XL the count to the threshold
 * took 0.8–1.1 s, the fall-back's second count (to 5.7e10) 1.1–1.5 s more, one count to 48 times
 * the threshold (5.7e10) 1.1–1.5 s; on M and L the count runs to the end either way.
 */
const FIRST_COUNT = 48;

/** the multiply–adds of a factorisation from which on CG is preferred */
function cgThreshold(prob: IpmProblem): number {
  return Math.max(CG_MIN_FLOPS, CG_FLOPS_PER_NONZERO * (prob.A.colPtr[prob.n] + prob.m));
}

export function chooseKktSolver(prob: IpmProblem, settings: IpmSettings): KktSolver {
  if (hasOffDiagonalQ(prob.Q)) return new AugmentedSystem(prob, settings);
  const lp = !prob.Q;
  const choice = lp ? settings.linearSolver : 'cholesky';
  if (choice === 'basis-cg') return new BasisCgSolver(prob, settings);
  // counted up to FIRST_COUNT times the threshold: past that the count is only needed if CG turns out costly
  const estimate = choice === 'auto' ? NormalEquations.estimateFlops(prob, settings, FIRST_COUNT * cgThreshold(prob)) : null;
  if (estimate && estimate.flops >= cgThreshold(prob)) {
    // the fall-back keeps the order (if the count got that far) only: the pattern is cheap to build again, and rarely needed
    const order = estimate.order;
    const cholesky: CholeskyOption = {
      flops: estimate.flops,
      atLeast: estimate.atLeast,
      countFlops: (limit) => NormalEquations.estimateFlops(prob, settings, limit),
      create: () => new NormalEquations(prob, settings, { order }),
    };
    return new BasisCgSolver(prob, settings, cholesky, 0, true);
  }
  let direct: NormalEquations;
  try {
    direct = new NormalEquations(prob, settings, estimate);
  } catch (err) {
    if (err instanceof FactorTooLargeError && choice === 'auto') return new BasisCgSolver(prob, settings);
    throw err;
  }
  if (choice === 'cholesky-then-basis-cg') return new BasisCgSolver(prob, settings, { flops: direct.flops, create: () => direct }, CHOLESKY_ITERATIONS);
  return direct;
}
