/**
 * Phase I (minimise the largest constraint violation; Fiacco & McCormick 1968, from memory): a strictly feasible start for the barrier method, or a
 * proof that none exists.
 *
 * 1. Project a reference point (inside the column bounds where they allow) onto E x = d by least
 *    norm, x = x_ref + Eᵀw with (E Eᵀ) w = d − E x_ref (one refinement pass). If E x = d cannot be
 *    met, the equality rows are inconsistent: infeasible.
 * 2. If G x < h already, done. Otherwise run the barrier method on
 *    minimise s  s.t.  G x − s ≤ h, s ≥ −1, E x = d   from (x, max(Gx − h) + 1),
 *    stopping at the first central point with s < 0 (strictly feasible), or when the lower bound
 *    s − m/t on its optimum is positive (infeasible: no x has G x ≤ h). When its optimum is 0 the
 *    feasible set has no strict interior; the inequalities tight there are reported as implicit
 *    equalities, so that the caller can turn them into equalities and try again.
 */
import type { Problem } from '../problem/problem';
import type { SolveStatus } from '../solution/result';
import { type BarrierForm, phaseOneForm } from './barrier-form';
import type { BarrierSettings } from './barrier-settings';
import { Centering, type NewtonBudget } from './centering';
import { DenseLu } from './dense-lu';

export type PhaseOneOutcome =
  | { kind: 'feasible'; x: Float64Array; centerings: number }
  /** feasible, but these inequalities hold with equality at every feasible point (implicit equalities) */
  | { kind: 'no_interior'; tight: number[]; x: Float64Array }
  | { kind: 'stopped'; status: SolveStatus; message: string; x: Float64Array };

/** An inequality whose slack at the phase I optimum is below this (relative to 1 + |h_k|) is an implicit equality. */
const TIGHT_SLACK = 1e-7;
/** A phase I stalled by rounding at s below this is taken to have optimum 0. */
const NEAR_ZERO_PHASE_ONE = 1e-6;

export function findStrictlyFeasible(problem: Problem, form: BarrierForm, settings: BarrierSettings, budget: NewtonBudget): PhaseOneOutcome {
  const x = referencePoint(problem, form);
  projectOntoEqualities(form, x);
  const residual = Math.max(equalityResidual(form.E, form.d, x), equalityResidual(form.dependentEqualities, form.dependentRhs, x));
  if (residual > settings.tolEquality) {
    return { kind: 'stopped', status: 'infeasible', x, message: `the equality rows and fixed columns are inconsistent (relative residual ${residual.toExponential(2)})` };
  }
  const worst = maxViolation(form, x);
  if (worst < 0) return { kind: 'feasible', x, centerings: 0 };

  const one = phaseOneForm(form);
  const z = new Float64Array(one.n);
  z.set(x);
  z[form.n] = worst + 1;
  const centering = new Centering(one, settings);
  const m = one.G.count;
  let t = settings.barrierT0;
  for (let centerings = 1; ; centerings++) {
    const outcome = centering.run(z, t, budget);
    const s = z[form.n];
    if ((outcome === 'stalled' || outcome === 'singular') && s <= NEAR_ZERO_PHASE_ONE) {
      // Rounding stops phase I at an optimum ≈ 0: no strict interior.
      const x = z.subarray(0, form.n).slice();
      return { kind: 'no_interior', x, tight: tightInequalities(form, x, 10 * Math.max(s, 0)) };
    }
    if (outcome !== 'centred') {
      const status: SolveStatus = outcome === 'time_limit' ? 'time_limit' : outcome === 'step_limit' ? 'iteration_limit' : 'numerical_trouble';
      return { kind: 'stopped', status, x: z.subarray(0, form.n).slice(), message: `phase I ended (${outcome}) at s = ${s.toExponential(3)}` };
    }
    if (s < 0) return { kind: 'feasible', x: z.subarray(0, form.n).slice(), centerings };
    const gap = m / t;
    if (s - gap > 0) {
      return { kind: 'stopped', status: 'infeasible', x: z.subarray(0, form.n).slice(), message: `no point satisfies the inequalities: phase I optimum ≥ ${(s - gap).toExponential(3)} > 0` };
    }
    if (gap <= settings.tolGap) {
      const x = z.subarray(0, form.n).slice();
      return { kind: 'no_interior', x, tight: tightInequalities(form, x) };
    }
    t *= settings.barrierMu;
  }
}

function tightInequalities(form: BarrierForm, x: Float64Array, atLeast = 0): number[] {
  const { G, h } = form;
  const tight: number[] = [];
  for (let k = 0; k < G.count; k++) {
    let gx = 0;
    for (let p = G.ptr[k]; p < G.ptr[k + 1]; p++) gx += G.val[p] * x[G.idx[p]];
    if (h[k] - gx <= Math.max(atLeast, TIGHT_SLACK * (1 + Math.abs(h[k])))) tight.push(k);
  }
  return tight;
}

/** A point inside the column bounds: midpoint when both are finite, one unit inside otherwise. */
function referencePoint(problem: Problem, form: BarrierForm): Float64Array {
  return Float64Array.from(form.columnOf, (j) => {
    const l = problem.colLower[j];
    const u = problem.colUpper[j];
    if (l > -Infinity && u < Infinity) return (l + u) / 2;
    if (l > -Infinity) return l + 1;
    if (u < Infinity) return u - 1;
    return 0;
  });
}

function projectOntoEqualities(form: BarrierForm, x: Float64Array): void {
  const { E, d } = form;
  const p = E.count;
  if (p === 0) return;
  const lu = new DenseLu(p);
  // E Eᵀ (+ a tiny multiple of I so that dependent but consistent rows stay solvable)
  let maxDiag = 0;
  for (let a = 0; a < p; a++) {
    for (let b = 0; b < p; b++) lu.a[a * p + b] = sparseRowDot(E, a, b);
    maxDiag = Math.max(maxDiag, lu.a[a * p + a]);
  }
  for (let a = 0; a < p; a++) lu.a[a * p + a] += 1e-14 * (1 + maxDiag);
  if (!lu.factorise()) return;
  const r = new Float64Array(p);
  for (let pass = 0; pass < 2; pass++) {
    for (let e = 0; e < p; e++) {
      let ex = 0;
      for (let k = E.ptr[e]; k < E.ptr[e + 1]; k++) ex += E.val[k] * x[E.idx[k]];
      r[e] = d[e] - ex;
    }
    lu.solve(r);
    for (let e = 0; e < p; e++) for (let k = E.ptr[e]; k < E.ptr[e + 1]; k++) x[E.idx[k]] += E.val[k] * r[e];
  }
}

function sparseRowDot(E: BarrierForm['E'], a: number, b: number): number {
  let s = 0;
  for (let p = E.ptr[a]; p < E.ptr[a + 1]; p++) {
    for (let q = E.ptr[b]; q < E.ptr[b + 1]; q++) if (E.idx[p] === E.idx[q]) s += E.val[p] * E.val[q];
  }
  return s;
}

/** ‖E x − d‖∞ / (1 + ‖d‖∞) */
export function equalityResidual(E: BarrierForm['E'], d: Float64Array, x: Float64Array): number {
  let worst = 0;
  let scale = 0;
  for (let e = 0; e < E.count; e++) {
    let ex = 0;
    for (let k = E.ptr[e]; k < E.ptr[e + 1]; k++) ex += E.val[k] * x[E.idx[k]];
    worst = Math.max(worst, Math.abs(ex - d[e]));
    scale = Math.max(scale, Math.abs(d[e]));
  }
  return worst / (1 + scale);
}

/** max_k (G x − h)_k, −∞ when there are no inequalities */
function maxViolation(form: BarrierForm, x: Float64Array): number {
  const { G, h } = form;
  let worst = -Infinity;
  for (let k = 0; k < G.count; k++) {
    let gx = 0;
    for (let p = G.ptr[k]; p < G.ptr[k + 1]; p++) gx += G.val[p] * x[G.idx[p]];
    worst = Math.max(worst, gx - h[k]);
  }
  return worst;
}
