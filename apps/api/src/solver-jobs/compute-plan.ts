import type { CheckViolation, CrossCheckSolver, Rounding, SolveStatus } from '@millrace/contracts';
import { solve, writeMps, type SolveResult } from '@millrace/lp-core';
import { buildModel, checkPlan, mapSolution, materialCalls, roundPlan, type Plan, type PlanningData, type RoundingReport } from '@millrace/plan-model';
import { hashOf } from '../plans/canonical-hash';
import type { SolveOutcomeRecord } from '../plans/plans.repository';
import { chooseCrossCheckSolver } from './cross-check-plan';
import { planResultsFromPlan } from './plan-results-from-plan';

/** What the worker is asked to solve. */
export interface ComputeRequest {
  planId: number;
  data: PlanningData;
  horizonWeeks: number;
  smoothing: { enabled: boolean; weight: number };
  wholeUnits: boolean;
}

export interface ComputeProgress {
  iteration: number;
  relativeGap: number;
  primalObjective: number;
  elapsedSeconds: number;
}

export interface ComputeHooks {
  onProgress(progress: ComputeProgress): void;
  shouldStop(): boolean;
}

/** Seconds spent per named stage of the computation (build, mps, solve, map, round, check, results). */
export type StageTimings = Record<string, number>;

export type ComputeOutcome =
  | { kind: 'cancelled'; seconds: number }
  | {
      kind: 'finished';
      record: Omit<SolveOutcomeRecord, 'crossCheck'>;
      timings: StageTimings;
      /** the solver that will cross-check the model (chosen here, from the problem its MPS was written from) */
      crossCheckSolver: CrossCheckSolver;
    };

/**
 * The whole solve of one plan version, as a story: build the LP from the snapshot, keep its exact
 * MPS, solve it with lp-core's interior-point method, map the solution back to a plan, round to
 * whole units when asked, re-verify it with plan-model's independent checker, and shape the
 * results. Pure computation (no database): it runs inside a worker thread.
 */
export function computePlan(request: ComputeRequest, hooks: ComputeHooks): ComputeOutcome {
  const timings: StageTimings = {};
  const stage = <T>(name: string, f: () => T): T => {
    const start = performance.now();
    const value = f();
    timings[name] = (performance.now() - start) / 1000;
    return value;
  };
  const built = stage('build', () =>
    buildModel(request.data, { horizonWeeks: request.horizonWeeks, smoothing: request.smoothing, wholeUnits: request.wholeUnits }),
  );
  const { problem } = built;
  const mps = stage('mps', () => writeMps(problem));
  const crossCheckSolver = chooseCrossCheckSolver(problem);
  const modelSize = { rows: problem.A.m, columns: problem.A.n, nonzeros: problem.A.colPtr[problem.A.n] };

  // The solver thread lives as long as the API, so the factorisation's helper thread pays its
  // start-up once. Measured on 200 × 26, POST solve → final state (plan-solve-e2e.ts, 4 runs
  // each, interleaved): 6.4–7.5 s on one thread, 5.7–6.3 s with the helper.
  // Small models (the demo plant included) stay on one thread (lp-core's size threshold).
  const result = stage('solve', () => solve(problem, {
    parallelFactorisation: true,
    onIteration: (info) =>
      hooks.onProgress({ iteration: info.iteration, relativeGap: info.relativeGap, primalObjective: -info.primalObjective, elapsedSeconds: info.seconds }),
    shouldStop: hooks.shouldStop,
  }));
  if (result.status === 'cancelled') return { kind: 'cancelled', seconds: result.seconds };

  // A run that stopped early may have no finite residuals: it then has no certificate to show.
  const c = result.certificate;
  const certificate = [c.primalResidual, c.dualResidual, c.relativeGap].every(Number.isFinite)
    ? { primalResidual: c.primalResidual, dualResidual: c.dualResidual, relativeGap: c.relativeGap, iterations: result.iterations, seconds: result.seconds }
    : null;
  const base = { certificate, modelSize, mps, checkViolations: [] as CheckViolation[], rounding: null, results: null, resultsHash: null, plan: null };
  const lpPlan = stage('map', () => mapSolution(request.data, built, result));

  if (result.status !== 'optimal') {
    const status = statusOf(result);
    const sentences = lpPlan.infeasibility;
    return {
      kind: 'finished',
      timings,
      crossCheckSolver,
      record: {
        ...base,
        solveStatus: status,
        objective: null,
        infeasibility: status === 'infeasible' ? { summary: sentences[0] ?? 'No plan meets every must-ship order.', conflicts: sentences.slice(1) } : null,
        message: status === 'infeasible' ? (sentences[0] ?? null) : (result.message ?? `The solver stopped early (${result.status}); no plan.`),
      },
    };
  }

  const objective = -result.objective;
  const rounded = request.wholeUnits ? stage('round', () => roundPlan(request.data, lpPlan)) : null;
  const shown: Plan = rounded ? rounded.plan : lpPlan;
  const rounding = rounded ? roundingOf(rounded.report) : null;
  // the rounding pass already ran the independent checker on the plan it returns
  const violations = (rounded ? rounded.report.violations : stage('check', () => checkPlan(request.data, shown))).map((v) => ({ kind: v.kind, item: v.item, week: v.week, message: v.message }));
  const results = stage('results', () =>
    planResultsFromPlan(request.planId, request.data, shown, materialCalls(request.data, request.horizonWeeks, shown.products)),
  );
  results.objective = objective;
  const resultsHash = stage('hash', () => hashOf(results));
  return {
    kind: 'finished',
    timings,
    crossCheckSolver,
    record: {
      ...base,
      solveStatus: violations.length > 0 ? 'check_failed' : 'solved',
      objective,
      checkViolations: violations,
      rounding,
      infeasibility: null,
      results,
      resultsHash,
      plan: shown,
      message:
        violations.length > 0
          ? `The independent check found ${violations.length} violation(s) against the planning data; the plan is not valid.`
          : null,
    },
  };
}

function statusOf(result: SolveResult): SolveStatus {
  switch (result.status) {
    case 'infeasible':
      return 'infeasible';
    case 'unbounded':
      return 'unbounded';
    case 'cancelled':
      return 'cancelled';
    default:
      return 'stopped_early';
  }
}

/** The rounded plan's margin against the LP plan's margin (the bound whole units cannot beat without smoothing). */
function roundingOf(report: RoundingReport): Rounding {
  return {
    outcome: report.outcome,
    margin: report.roundedMargin,
    lpBound: report.lpMargin,
    gap: report.gap,
    relativeGap: report.gap / Math.max(1, Math.abs(report.lpMargin)),
  };
}
