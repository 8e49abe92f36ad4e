/**
 * The solver the plan-model tests run the planning model through: lp-core's own `solve` (the
 * production interior-point solver) when the package exports it. Until it lands, the tests that
 * need a solution use HiGHS through test/support/highs-solve.ts, and the cross-check of lp-core
 * against HiGHS is skipped with that reason printed.
 */
import * as lpCore from '@millrace/lp-core';
import type { Problem, SolveResult } from '@millrace/lp-core';
import { solveWithHighsRef } from './highs-solve';

type Solve = (problem: Problem) => SolveResult | Promise<SolveResult>;
export const lpCoreSolve: Solve | undefined = (lpCore as unknown as { solve?: Solve }).solve;
export const solverName = lpCoreSolve ? 'lp-core' : 'HiGHS (lp-core solve not exported yet)';

export async function solveUnderTest(problem: Problem): Promise<SolveResult> {
  return lpCoreSolve ? await lpCoreSolve(problem) : solveWithHighsRef(problem);
}
