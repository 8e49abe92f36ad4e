/**
 * The log-barrier method for LPs and convex QPs (sequential unconstrained minimisation, Fiacco & McCormick 1968, from memory),
 * an independent second solver used to cross-check the interior-point solver:
 *
 *   phase I → strictly feasible x
 *   repeat: centre x for t (Newton with equality constraints) → stop when m/t ≤ ε → t ← μ t
 *
 * with ε = tolGap · max(1, |f₀(x)|). Columns without finite bounds are boxed at ±R (boxRadius); an
 * optimum on that box means the problem is unbounded. Multipliers come from the barrier: λ_k = 1/(t s_k) for each
 * inequality and ν = w from the Newton KKT system for each equality; mapped to lp-core's convention
 * c + Qx − Aᵀy − z = 0 they give y_i = λ_lower − λ_upper − ν_i per row and z_j likewise per column.
 * Dense linear algebra: meant for problems up to a few thousand columns.
 */
import type { Problem } from '../problem/problem';
import { certify } from '../solution/certificate';
import { validateProblem } from '../validate';
import type { SolveResult, SolveStatus } from '../solution/result';
import { type BarrierForm, barrierForm, expandToColumns } from './barrier-form';
import { type BarrierSettings, resolveBarrierSettings } from './barrier-settings';
import { Centering, type CenteringOutcome, type NewtonBudget } from './centering';
import { dot } from '../vectors';
import { findStrictlyFeasible } from './phase-one';

export function solveBarrier(problem: Problem, overrides: Partial<BarrierSettings> = {}): SolveResult {
  const settings = resolveBarrierSettings(overrides);
  validateProblem(problem);
  const start = performance.now();
  const budget: NewtonBudget = { stepsUsed: 0, maxSteps: settings.maxNewtonSteps, deadline: start + settings.timeLimitSeconds * 1000 };
  // Phase I; inequalities that hold with equality at every feasible point become equalities.
  let working = problem;
  let implicitEqualities = 0;
  let form = barrierForm(working, settings.boxRadius);
  let phaseOne = findStrictlyFeasible(working, form, settings, budget);
  for (let round = 0; phaseOne.kind === 'no_interior' && round < MAX_IMPLICIT_EQUALITY_ROUNDS; round++) {
    working = withImplicitEqualities(working, form, phaseOne.tight);
    implicitEqualities += phaseOne.tight.length;
    form = barrierForm(working, settings.boxRadius);
    phaseOne = findStrictlyFeasible(working, form, settings, budget);
  }
  const phaseOneSeconds = (performance.now() - start) / 1000;
  if (phaseOne.kind === 'no_interior') {
    return result(problem, expandToColumns(form, phaseOne.x), null, 'numerical_trouble', budget, start, 'the feasible set has no strict interior even after fixing implicit equalities', { phaseOne: phaseOneSeconds });
  }
  if (phaseOne.kind === 'stopped') {
    return result(problem, expandToColumns(form, phaseOne.x), null, phaseOne.status, budget, start, phaseOne.message, { phaseOne: phaseOneSeconds });
  }

  const x = phaseOne.x;
  const centering = new Centering(form, settings);
  const m = form.G.count;
  let t = settings.barrierT0;
  for (let outer = 1; ; outer++) {
    const outcome = centering.run(x, t, budget);
    const lastGap = outer > 1 ? (m * settings.barrierMu) / t : Infinity; // m/t of the last completed centre
    if ((outcome === 'stalled' || outcome === 'singular') && lastGap <= settings.tolGapReduced * Math.max(1, Math.abs(objectiveOf(form, x)))) {
      return result(problem, x, { centering, t }, 'optimal', budget, start, `rounding stopped centering at t = ${t.toExponential(2)}; optimal within the gap bound m/t = ${lastGap.toExponential(2)} of the last centre`, {
        phaseOne: phaseOneSeconds,
        phaseTwo: (performance.now() - start) / 1000 - phaseOneSeconds,
      });
    }
    if (outcome !== 'centred') {
      return result(problem, x, { centering, t }, statusOf(outcome), budget, start, `centering ended (${outcome}) at t = ${t.toExponential(2)}`, {
        phaseOne: phaseOneSeconds,
      });
    }
    const objective = objectiveOf(form, x);
    report(settings, problem, form, x, centering, t, outer, objective, start);
    if (m / t <= settings.tolGap * Math.max(1, Math.abs(objective))) {
      const onBox = pressedAgainstBox(problem, form, centering, x, t);
      if (onBox >= 0) {
        return result(problem, x, { centering, t }, 'unbounded', budget, start, `column '${problem.colNames[onBox]}' is held by the artificial bound ±${form.boxRadius.toExponential(1)}: the objective is unbounded below (or the optimum lies beyond boxRadius)`, { phaseOne: phaseOneSeconds });
      }
      const note = implicitEqualities > 0 ? `${implicitEqualities} inequalities hold with equality at every feasible point and were solved as equalities; their duals may carry the wrong sign (see the dual residual)` : undefined;
      return result(problem, x, { centering, t }, 'optimal', budget, start, note, {
        phaseOne: phaseOneSeconds,
        phaseTwo: (performance.now() - start) / 1000 - phaseOneSeconds,
      });
    }
    t *= settings.barrierMu;
  }
}

/** Rounds of "turn tight inequalities into equalities, redo phase I". */
const MAX_IMPLICIT_EQUALITY_ROUNDS = 5;
/** An artificial box bound whose multiplier exceeds this (relative to 1 + ‖c‖∞) carries the objective: unbounded. */
const BOX_MULTIPLIER_TOLERANCE = 1e-6;

/**
 * The column whose artificial bound has a significant multiplier 1/(t s), −1 when none. (A column
 * that merely drifts far out along an unbounded optimal face has a large slack and a tiny multiplier.)
 */
function pressedAgainstBox(problem: Problem, form: BarrierForm, centering: Centering, x: Float64Array, t: number): number {
  centering.computeSlack(x);
  let cNorm = 0;
  for (const v of problem.c) cNorm = Math.max(cNorm, Math.abs(v));
  const threshold = BOX_MULTIPLIER_TOLERANCE * (1 + cNorm);
  for (let k = 0; k < form.G.count; k++) {
    const origin = form.inequalityOrigin[k];
    if (origin.artificial && 1 / (t * centering.slack[k]) > threshold) return origin.index;
  }
  return -1;
}

/** A copy of the problem in which the given inequalities of its barrier form are equalities. */
function withImplicitEqualities(problem: Problem, form: BarrierForm, tight: number[]): Problem {
  const copy: Problem = {
    ...problem,
    rowLower: problem.rowLower.slice(),
    rowUpper: problem.rowUpper.slice(),
    colLower: problem.colLower.slice(),
    colUpper: problem.colUpper.slice(),
  };
  for (const k of tight) {
    const { kind, index, side, artificial } = form.inequalityOrigin[k];
    if (artificial) continue;
    const [lower, upper] = kind === 'row' ? [copy.rowLower, copy.rowUpper] : [copy.colLower, copy.colUpper];
    if (side === 'lower') upper[index] = lower[index];
    else lower[index] = upper[index];
  }
  return copy;
}

function statusOf(outcome: CenteringOutcome): SolveStatus {
  switch (outcome) {
    case 'step_limit':
      return 'iteration_limit';
    case 'time_limit':
      return 'time_limit';
    default:
      return 'numerical_trouble';
  }
}

/** f₀(x) = ½ xᵀPx + qᵀx + constant */
function objectiveOf(form: BarrierForm, x: Float64Array): number {
  let value = dot(form.q, x) + form.constant;
  const { P, n } = form;
  if (P) {
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = 0; j < n; j++) s += P[i * n + j] * x[j];
      value += 0.5 * x[i] * s;
    }
  }
  return value;
}

/**
 * Row duals y and reduced costs z from the barrier multipliers at the current centre; a fixed
 * column's z is c + Qx − Aᵀy (its bound is an equality substituted out of the form), except that a
 * column fixed by a singleton equality row passes its reduced cost to that row's dual.
 */
function multipliers(problem: Problem, form: BarrierForm, x: Float64Array, centering: Centering, t: number) {
  centering.computeSlack(x);
  const y = new Float64Array(problem.A.m);
  const z = new Float64Array(problem.A.n);
  form.inequalityOrigin.forEach((origin, k) => {
    const lambda = 1 / (t * centering.slack[k]);
    const target = origin.kind === 'row' ? y : z;
    target[origin.index] += origin.side === 'lower' ? lambda : -lambda;
  });
  form.equalityOrigin.forEach((origin, e) => {
    const target = origin.kind === 'row' ? y : z;
    target[origin.index] -= centering.w[e];
  });
  const columns = expandToColumns(form, x);
  // A row that fixed its only column carries that column's whole reduced cost (undo in reverse order).
  for (let k = form.singletonFixings.length - 1; k >= 0; k--) {
    const { row, col } = form.singletonFixings[k];
    const reduced = certify(problem, columns, y).reducedCosts[col];
    for (let p = problem.A.colPtr[col]; p < problem.A.colPtr[col + 1]; p++) {
      if (problem.A.rowIdx[p] === row) y[row] += reduced / problem.A.values[p];
    }
  }
  const computed = certify(problem, columns, y).reducedCosts;
  for (let j = 0; j < problem.A.n; j++) if (form.variableOf[j] < 0) z[j] = computed[j];
  return { y, z };
}

function report(
  settings: BarrierSettings, problem: Problem, form: BarrierForm, x: Float64Array, centering: Centering,
  t: number, outer: number, objective: number, start: number,
): void {
  if (!settings.onIteration) return;
  const { y } = multipliers(problem, form, x, centering, t);
  const measured = certify(problem, expandToColumns(form, x), y);
  settings.onIteration({
    iteration: outer,
    primalObjective: objective,
    dualObjective: objective - form.G.count / t,
    primalResidual: measured.certificate.primalResidual,
    dualResidual: measured.certificate.dualResidual,
    relativeGap: measured.certificate.relativeGap,
    mu: 1 / t,
    stepPrimal: centering.lastStep,
    stepDual: centering.lastStep,
    seconds: (performance.now() - start) / 1000,
  });
}

function result(
  problem: Problem, x: Float64Array, centre: { centering: Centering; t: number } | null, status: SolveStatus,
  budget: NewtonBudget, start: number, message: string | undefined, timings: Record<string, number>,
): SolveResult {
  const form = centre ? centre.centering.form : null;
  const { y, z } = centre && form ? multipliers(problem, form, x, centre.centering, centre.t) : { y: new Float64Array(problem.A.m), z: null };
  const columns = form ? expandToColumns(form, x) : x;
  const measured = certify(problem, columns, y);
  const sense = problem.maximise ? -1 : 1;
  return {
    status,
    objective: sense * measured.primalObjective,
    x: columns,
    rowActivity: measured.rowActivity,
    rowDuals: y,
    reducedCosts: z ?? measured.reducedCosts,
    iterations: budget.stepsUsed,
    seconds: (performance.now() - start) / 1000,
    certificate: measured.certificate,
    ...(message ? { message } : {}),
    timings,
  };
}
