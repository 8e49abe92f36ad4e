import type { CrossCheck, CrossCheckSolver } from '@millrace/contracts';
import { readMps, solveBarrier, solveWithHighs, solveWithLpSolver, type Problem } from '@millrace/lp-core';

/** Objectives agreeing to this relative difference verify a plan (issue 4: 1e-6). */
export const crossCheckTolerance = 1e-6;
/** javascript-lp-solver is used only up to this many columns and rows (it stalled on a 928-column plan LP in 120 s). */
export const lpSolverMaxSize = 400;

export interface CrossCheckSettings {
  /** wall-clock limit for javascript-lp-solver, seconds */
  lpSolverTimeLimitSeconds: number;
  /** wall-clock limit for HiGHS and the barrier method, seconds */
  largeTimeLimitSeconds: number;
}

export const defaultCrossCheckSettings: CrossCheckSettings = { lpSolverTimeLimitSeconds: 30, largeTimeLimitSeconds: 120 };

export interface CrossCheckRequest {
  /** the exact MPS of the solved LP */
  mps: string;
  /** the plan's objective (margin, i.e. minus the MPS optimum) */
  planObjective: number;
}

/**
 * Which independent solver checks a problem: the barrier method for a QP, else by size. Only
 * nonzero quadratic terms count (the MPS file holds no others), so the problem as built and as
 * read back from its MPS get the same answer.
 */
export function chooseCrossCheckSolver(problem: Problem): CrossCheckSolver {
  const Q = problem.Q;
  if (Q && Q.values.subarray(0, Q.colPtr[Q.n]).some((v) => v !== 0)) return 'barrier';
  return problem.A.n <= lpSolverMaxSize && problem.A.m <= lpSolverMaxSize ? 'javascript-lp-solver' : 'highs';
}

/**
 * Re-solves the exported MPS with an independent solver and compares objectives. A check that
 * did not finish is "not_finished", never "verified"; a disagreement beyond 1e-6 relative is
 * "unverified" with both numbers.
 */
export async function crossCheckPlan(request: CrossCheckRequest, settings: CrossCheckSettings = defaultCrossCheckSettings): Promise<CrossCheck> {
  const problem = readMps(request.mps);
  const solver = chooseCrossCheckSolver(problem);
  const started = performance.now();
  const reference = await runReference(solver, problem, settings);
  const seconds = (performance.now() - started) / 1000;
  const planObjective = request.planObjective;
  const label = crossCheckSolverLabel(solver);
  if (reference.status !== 'optimal') {
    const stopped = reference.status === 'time_limit' || reference.status === 'iteration_limit' || reference.status === 'cancelled';
    return {
      solver,
      status: stopped ? 'not_finished' : 'unverified',
      objective: null,
      planObjective,
      relativeDifference: null,
      seconds,
      message: stopped
        ? `${label} did not finish within its limit (${seconds.toFixed(1)} s); the plan is not verified.`
        : `${label} ended with status ${reference.status}${reference.message ? ` (${reference.message})` : ''} while our solver found an optimum of ${cents(planObjective)}; the plan is not verified.`,
    };
  }
  const objective = -reference.objective;
  const relativeDifference = Math.abs(objective - planObjective) / Math.max(1, Math.abs(objective), Math.abs(planObjective));
  const agrees = relativeDifference <= crossCheckTolerance;
  return {
    solver,
    status: agrees ? 'verified' : 'unverified',
    objective,
    planObjective,
    relativeDifference,
    seconds,
    message: agrees
      ? `${label} found the same optimum (${cents(objective)}) in ${seconds.toFixed(2)} s.`
      : `${label} found ${cents(objective)} but the plan says ${cents(planObjective)} (relative difference ${relativeDifference.toExponential(2)}, above ${crossCheckTolerance}).`,
  };
}

/** A margin in a message: to the cent, like every money figure the planner reads. */
const cents = (value: number) => value.toFixed(2);

interface ReferenceOutcome {
  status: string;
  objective: number;
  message?: string;
}

async function runReference(solver: CrossCheckSolver, problem: Problem, settings: CrossCheckSettings): Promise<ReferenceOutcome> {
  switch (solver) {
    case 'javascript-lp-solver':
      return solveWithLpSolver(problem, { timeLimitSeconds: settings.lpSolverTimeLimitSeconds });
    case 'highs':
      return solveWithHighs(problem, { timeLimitSeconds: settings.largeTimeLimitSeconds });
    case 'barrier':
      return solveBarrier(problem, { timeLimitSeconds: settings.largeTimeLimitSeconds });
  }
}

/** The checking solver in words. */
export function crossCheckSolverLabel(solver: CrossCheckSolver): string {
  return { 'javascript-lp-solver': 'The simplex library javascript-lp-solver', highs: 'HiGHS', barrier: 'The log-barrier method' }[solver];
}
