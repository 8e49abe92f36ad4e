/**
 * The main entry: validate → presolve → scale → interior-point method → unscale → postsolve →
 * certificate on the original problem. Bad input throws a clear error before any iteration;
 * numerical failure ends with status 'numerical_trouble' and the best iterate.
 */
import type { Problem } from './problem/problem';
import type { InfeasibilityRay, SolveResult, SolveStatus } from './solution/result';
import { certify } from './solution/certificate';
import { resolveSettings, type IpmSettings } from './settings';
import { validateProblem } from './validate';
import { presolve, type PresolveOutcome } from './presolve/presolve';
import { identityScaling, ruizEquilibration, scaleMatrix, type Scaling } from './scaling/ruiz-equilibration';
import type { IpmProblem } from './ipm/ipm-problem';
import { interiorPointMethod, type IpmOutcome } from './ipm/interior-point-method';
import { elasticProblem } from './infeasibility/elastic-problem';

export function solve(problem: Problem, partial: Partial<IpmSettings> = {}): SolveResult {
  return runSolve(problem, partial, true);
}

/** allowElastic: whether a stalled solve may be settled by the elastic problem (never nested) */
function runSolve(problem: Problem, partial: Partial<IpmSettings>, allowElastic: boolean): SolveResult {
  const settings = resolveSettings(partial);
  validateProblem(problem);
  const start = performance.now();
  const clock = { start, deadline: start + settings.timeLimitSeconds * 1000 };
  const timings: Record<string, number> = {};
  const stage = <T>(name: string, f: () => T): T => {
    const s = performance.now();
    const r = f();
    timings[name] = (timings[name] ?? 0) + (performance.now() - s) / 1000;
    return r;
  };

  const pre: PresolveOutcome = stage('presolve', () => presolve(problem, settings.presolve));
  if (pre.status !== 'reduced') {
    // presolve proved infeasible/unbounded: solve the original for a certificate ray
    const again = runSolve(problem, { ...partial, presolve: false }, allowElastic);
    return { ...again, message: `${pre.message}; ${again.message ?? ''}`.trim(), seconds: (performance.now() - start) / 1000 };
  }
  const reduced = pre.reduced;
  let xr: Float64Array = new Float64Array(reduced.c.length);
  let yr: Float64Array = new Float64Array(reduced.rowLower.length);
  let outcome: IpmOutcome | null = null;
  let status: SolveStatus = 'optimal';
  let message: string | undefined;
  let ray: InfeasibilityRay | undefined;
  if (reduced.c.length > 0) {
    const scaling = stage('scaling', () =>
      settings.scaling ? ruizEquilibration(reduced.A, settings.scalingPasses) : identityScaling(reduced.A.m, reduced.A.n),
    );
    const ipmProblem = scaledProblem(reduced, scaling);
    try {
      outcome = stage('ipm', () => interiorPointMethod(ipmProblem, settings, clock));
    } catch (err) {
      status = 'numerical_trouble';
      message = `the interior-point method failed: ${(err as Error).message}`;
    }
    if (outcome) {
      status = outcome.status;
      message = outcome.message;
      Object.entries(outcome.timings).forEach(([k, v]) => (timings[`ipm.${k}`] = v));
      ({ x: xr, y: yr } = unscale(outcome, scaling));
      if ((status === 'infeasible' || status === 'unbounded') && settings.presolve) {
        const again = runSolve(problem, { ...partial, presolve: false }, allowElastic);
        return { ...again, seconds: (performance.now() - start) / 1000 };
      }
      if (status === 'infeasible') ray = dualRay(problem, outcome, scaling);
      if (status === 'unbounded') ray = primalRay(problem, outcome, scaling);
    }
  }
  if (allowElastic && outcome !== null && outcome.iterations > 0 && (status === 'numerical_trouble' || status === 'iteration_limit')) {
    // the method stalled: settle feasibility with the elastic problem, which always converges
    const verdict = stage('feasibility', () => elasticVerdict(problem, partial, clock));
    if (verdict) return { ...verdict, seconds: (performance.now() - start) / 1000, timings };
  }
  const { x, y } = stage('postsolve', () => pre.postsolve(xr, yr));
  const point = certify(problem, x, y);
  const sign = problem.maximise ? -1 : 1;
  if (problem.maximise) {
    for (let i = 0; i < y.length; i++) y[i] = -y[i];
    for (let j = 0; j < x.length; j++) point.reducedCosts[j] = -point.reducedCosts[j];
  }
  return {
    status,
    objective: sign * point.primalObjective,
    x,
    rowActivity: point.rowActivity,
    rowDuals: y,
    reducedCosts: point.reducedCosts,
    iterations: outcome?.iterations ?? 0,
    seconds: (performance.now() - start) / 1000,
    certificate: point.certificate,
    ray,
    message: message ?? (outcome ? undefined : 'presolve solved the problem'),
    timings,
  };
}

/** IPM form of the (reduced) problem with A_s = R A C and bounds of v = (x, w) */
function scaledProblem(p: Problem, s: Scaling): IpmProblem {
  const n = p.c.length;
  const m = p.rowLower.length;
  const { colScale: C, rowScale: R } = s;
  const lower = new Float64Array(n + m);
  const upper = new Float64Array(n + m);
  const c = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    c[j] = p.c[j] * C[j];
    lower[j] = p.colLower[j] / C[j];
    upper[j] = p.colUpper[j] / C[j];
  }
  for (let i = 0; i < m; i++) {
    lower[n + i] = p.rowLower[i] * R[i];
    upper[n + i] = p.rowUpper[i] * R[i];
  }
  const Q = p.Q ? scaleMatrix(p.Q, C, C) : undefined;
  return { n, m, A: scaleMatrix(p.A, R, C), c, c0: p.c0, Q, lower, upper, colScale: C, rowScale: R };
}

function unscale(o: IpmOutcome, s: Scaling): { x: Float64Array; y: Float64Array } {
  const n = s.colScale.length;
  const m = s.rowScale.length;
  const x = new Float64Array(n);
  const y = new Float64Array(m);
  for (let j = 0; j < n; j++) x[j] = o.iterate.v[j] * s.colScale[j];
  for (let i = 0; i < m; i++) y[i] = o.iterate.y[i] * s.rowScale[i];
  return { x, y };
}

/** Farkas ray of an infeasible problem: row multipliers y and column-bound multipliers z_l − z_u */
function dualRay(p: Problem, o: IpmOutcome, s: Scaling): InfeasibilityRay {
  const n = s.colScale.length;
  const m = s.rowScale.length;
  const values: { name: string; value: number }[] = [];
  for (let i = 0; i < m; i++) values.push({ name: p.rowNames[i], value: o.iterate.y[i] * s.rowScale[i] });
  for (let j = 0; j < n; j++) values.push({ name: p.colNames[j], value: (o.iterate.zl[j] - o.iterate.zu[j]) / s.colScale[j] });
  return { kind: 'primal_infeasible', entries: normalised(values) };
}

/** a feasible direction of unbounded decrease, by column */
function primalRay(p: Problem, o: IpmOutcome, s: Scaling): InfeasibilityRay {
  const d = o.primalRay!;
  const values = p.colNames.map((name, j) => ({ name, value: d[j] * s.colScale[j] }));
  return { kind: 'dual_infeasible', entries: normalised(values) };
}

/** scales to a largest magnitude of 1 and drops entries below 1e-9 of it */
function normalised(values: { name: string; value: number }[]): { name: string; value: number }[] {
  const big = values.reduce((a, e) => Math.max(a, Math.abs(e.value)), 0);
  if (!(big > 0) || !Number.isFinite(big)) return [];
  return values.filter((e) => Math.abs(e.value) > 1e-9 * big).map((e) => ({ name: e.name, value: e.value / big }));
}

/**
 * Solves the elastic problem (infeasibility/elastic-problem.ts). A positive least violation
 * proves infeasibility: the result then carries its duals as the Farkas ray. Returns null when
 * the problem is feasible or the elastic solve did not finish.
 */
function elasticVerdict(p: Problem, partial: Partial<IpmSettings>, clock: { start: number; deadline: number }): SolveResult | null {
  const remaining = (clock.deadline - performance.now()) / 1000;
  if (!(remaining > 0)) return null;
  const e = runSolve(elasticProblem(p), {
    ...partial,
    onIteration: undefined,
    timeLimitSeconds: Math.min(remaining, partial.timeLimitSeconds ?? Infinity),
    maxIterations: Math.max(partial.maxIterations ?? 100, 100),
  }, false);
  if (e.status !== 'optimal') return null;
  let bNorm = 0;
  for (const a of [p.rowLower, p.rowUpper, p.colLower, p.colUpper]) for (const v of a) if (Number.isFinite(v)) bNorm = Math.max(bNorm, Math.abs(v));
  if (!(e.objective > 1e-6 * (1 + bNorm))) return null;
  const n = p.c.length;
  const m = p.rowLower.length;
  const entries: { name: string; value: number }[] = [];
  for (let i = 0; i < m; i++) entries.push({ name: p.rowNames[i], value: e.rowDuals[i] });
  for (let j = 0; j < n; j++) entries.push({ name: p.colNames[j], value: e.reducedCosts[j] });
  const point = certify(p, e.x.subarray(0, n), e.rowDuals);
  return {
    status: 'infeasible',
    objective: point.primalObjective * (p.maximise ? -1 : 1),
    x: Float64Array.from(e.x.subarray(0, n)),
    rowActivity: point.rowActivity,
    rowDuals: e.rowDuals,
    reducedCosts: point.reducedCosts,
    iterations: e.iterations,
    seconds: e.seconds,
    certificate: point.certificate,
    ray: { kind: 'primal_infeasible', entries: normalised(entries) },
    message: `no point satisfies the constraints: the least total row violation is ${e.objective.toPrecision(6)} (elastic problem)`,
  };
}
