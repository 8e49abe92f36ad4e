/**
 * Which solver takes the Newton systems of an interior-point solve (settings.linearSolver):
 *
 *  - 'cholesky': the normal equations by sparse Cholesky (normal-equations.ts), or the augmented
 *    system when Q has off-diagonal entries (augmented-system.ts);
 *  - 'basis-cg': conjugate gradients, diagonal then basis preconditioner, no factorisation at all
 *    (basis-cg-solver.ts; LPs only);
 *  - 'cholesky-then-basis-cg': Cholesky for the first CHOLESKY_ITERATIONS iterations, then
 *    conjugate gradients with the basis preconditioner (LPs only);
 *  - 'auto' (the default): 'cholesky', unless one factorisation takes at least HYBRID_MIN_FLOPS
 *    multiply–adds ('cholesky-then-basis-cg', going back to Cholesky for good if an iteration of
 *    CG costs more than a factorisation) or the factor would not fit in maxFactorMegabytes
 *    ('basis-cg').
 *
 * Measured on the bench's L planning model (12740 rows, one factorisation 7.3e9 multiply–adds,
 * 1.0–1.7 s on two threads): Cholesky throughout 23 iterations in 38–40 s; Cholesky for 4, 6, 8
 * iterations then CG: 21.6, 18.2, 24.6 s (same machine spell, objectives within 1e-9 of HiGHS).
 * Counted: Cholesky for 3, 4, 5, 6, 8 iterations then 28, 25, 26, 27, 26 iterations in all with
 * 5737, 3677, 3366, 5152, 4556 CG steps; yet timed in the benchmark, interleaved, 4 took 20.8 and
 * 18.0 s, 6 took 17.4 and 16.4 s (the early CG iterations after 4 make many more exchanges on a
 * fuller basis), so 6 it is;
 * CG from the start stalled its first iteration for 70 s (no basis stands out while all θ are
 * alike, and the diagonal preconditioner needs thousands of steps there). On plan-model's
 * generated 200 × 26 plant (6e9 multiply–adds) CG needs hundreds of exchanges an iteration and
 * cost more than Cholesky (28–37 s against 26 s); there 'auto' goes back to Cholesky after the
 * first CG iteration.
 */
import type { IpmSettings } from '../settings';
import { FactorTooLargeError } from '../sparse/symmetric-factorisation';
import { AugmentedSystem } from './augmented-system';
import { BasisCgSolver } from './basis-cg-solver';
import { hasOffDiagonalQ, type IpmProblem } from './ipm-problem';
import type { KktSolver } from './kkt-solver';
import { NormalEquations } from './normal-equations';

export const CHOLESKY_ITERATIONS = 6;
/** 'auto' keeps Cholesky throughout below this many multiply–adds per factorisation */
export const HYBRID_MIN_FLOPS = 2e9;

export function chooseKktSolver(prob: IpmProblem, settings: IpmSettings): KktSolver {
  if (hasOffDiagonalQ(prob.Q)) return new AugmentedSystem(prob, settings);
  const lp = !prob.Q;
  const choice = lp ? settings.linearSolver : 'cholesky';
  if (choice === 'basis-cg') return new BasisCgSolver(prob, settings);
  let direct: NormalEquations;
  try {
    direct = new NormalEquations(prob, settings);
  } catch (err) {
    if (err instanceof FactorTooLargeError && choice === 'auto') return new BasisCgSolver(prob, settings);
    throw err;
  }
  if (choice === 'cholesky-then-basis-cg') return new BasisCgSolver(prob, settings, direct, CHOLESKY_ITERATIONS);
  if (choice === 'auto' && direct.flops >= HYBRID_MIN_FLOPS) return new BasisCgSolver(prob, settings, direct, CHOLESKY_ITERATIONS, true);
  return direct;
}
