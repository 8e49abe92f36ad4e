/**
 * Primal–dual path-following interior-point method with Mehrotra's predictor–corrector
 * (S. Mehrotra, SIAM J. Optim. 2(4), 1992) and Gondzio's multiple centrality correctors
 * (J. Gondzio, Comput. Optim. Appl. 6, 1996), on the bounded form of ipm-problem.ts; see
 * Wright, "Primal–Dual Interior-Point Methods" (SIAM 1997), ch. 10–11.
 *
 * Each iteration: residuals → μ → termination tests → KKT factorisation for
 * D = z_l/x_l + z_u/x_u + ρ → affine (predictor) direction → σ = (μ_aff/μ)³ → combined
 * (corrector) direction → optional centrality correctors → step to 0.9995 of the boundary.
 * With x_l = v − lower, x_u = upper − v the Newton system is
 *   (Q + D) dv − Âᵀdy = r̂ = −rd + r_l/x_l − r_u/x_u,   Â dv = rp,
 *   dz_l = (r_l − z_l dv)/x_l,   dz_u = (r_u + z_u dv)/x_u,
 * where r_l = σμ − x_l z_l (− dx_l^aff dz_l^aff) and r_u likewise.
 */
import type { IpmSettings } from '../settings';
import type { IterationInfo, SolveStatus } from '../solution/result';
import { chooseKktSolver } from './choose-kkt-solver';
import { InfeasibilityTest } from './infeasibility';
import { FIXED, FREE, boundKinds, hasLower, hasUpper, type IpmProblem } from './ipm-problem';
import { allocateIterate, copyIterate, type Iterate } from './iterate';
import type { KktSolver } from './kkt-solver';
import { FactorTooLargeError } from '../sparse/symmetric-factorisation';
import { Residuals, type Measures } from './residuals';
import { startingPoint } from './starting-point';
import { blendedSteps, maxDualStep, maxPrimalStep } from './step-length';

export interface IpmOutcome {
  status: SolveStatus;
  iterations: number;
  /** the returned iterate (the best one seen unless optimal) */
  iterate: Iterate;
  measures: Measures;
  /** for 'infeasible': the dual ray is the iterate's (y, z); for 'unbounded': this primal ray */
  primalRay?: Float64Array;
  message?: string;
  nnzL: number;
  timings: Record<string, number>;
}

export interface Clock {
  start: number;
  deadline: number;
}

/** Iterations of tiny steps after which progress is declared stalled */
const STALL_ITERATIONS = 5;
const TINY_STEP = 1e-8;
/**
 * A Gondzio corrector aims at the point reached with steps min(1, CORRECTOR_REACH·α + 0.1).
 * Measured (iterations, with weighted correctors; 1.5 → 2): the API bench's 200 × 26 model 25 → 24,
 * bench M 17 → 17, L 24 → 23; Netlib afiro 7, brandy 11, e226 15 → 14, finnis 19 → 15.
 */
const CORRECTOR_REACH = 2;

export function interiorPointMethod(prob: IpmProblem, settings: IpmSettings, clock: Clock): IpmOutcome {
  const t0 = performance.now();
  const timings: Record<string, number> = { kktSetup: 0, factorise: 0, solve: 0, other: 0 };
  const { n, m, lower, upper } = prob;
  const N = n + m;
  const kind = boundKinds(lower, upper);
  let kkt: KktSolver;
  try {
    kkt = chooseKktSolver(prob, settings);
  } catch (err) {
    if (!(err instanceof FactorTooLargeError)) throw err;
    const it0 = allocateIterate(N, m);
    return {
      status: 'numerical_trouble',
      iterations: 0,
      iterate: it0,
      measures: new Residuals(prob, kind).compute(it0),
      message: `${err.message} (maxFactorMegabytes = ${settings.maxFactorMegabytes})`,
      nnzL: err.entries,
      timings,
    };
  }
  timings.kktSetup = (performance.now() - t0) / 1000;

  const it = allocateIterate(N, m);
  const best = allocateIterate(N, m);
  const aff = allocateIterate(N, m);
  const dir = allocateIterate(N, m);
  // weighted correctors: the full correction first, then blends (the last weight is α_p·α_d)
  const weights = Float64Array.from([1, 0.75, 0.5, 0]);
  const blendP = new Float64Array(weights.length);
  const blendD = new Float64Array(weights.length);
  const rhat = new Float64Array(N);
  const rp = new Float64Array(m);
  const D = new Float64Array(N);
  const rl = new Float64Array(N);
  const ru = new Float64Array(N);
  const res = new Residuals(prob, kind);
  const infeas = new InfeasibilityTest(prob, kind);
  const isQP = prob.Q !== undefined;

  const timed = <T>(stage: string, f: () => T): T => {
    const s = performance.now();
    const r = f();
    timings[stage] += (performance.now() - s) / 1000;
    return r;
  };
  const finish = (status: SolveStatus, iterations: number, measures: Measures, extra: Partial<IpmOutcome> = {}): IpmOutcome => ({
    status,
    iterations,
    iterate: it,
    measures,
    nnzL: kkt.nnzL,
    timings,
    ...extra,
  });

  const start = timed('factorise', () => startingPoint(prob, kind, kkt, it, dir, rhat, rp, clock.deadline));
  if (start === 'interrupted') {
    return finish('time_limit', 0, res.compute(it), { message: `time limit of ${settings.timeLimitSeconds} s reached in the first factorisation` });
  }
  if (start !== 'factorised') {
    return finish('numerical_trouble', 0, res.compute(it), { message: 'the starting-point system could not be factorised' });
  }

  let bestScore = Infinity;
  let bestMeasures: Measures = res.compute(it);
  let bestIteration = 0;
  let stall = 0;
  let alphaP = 0;
  let alphaD = 0;
  const muFloor = 0;

  const restoreBest = (status: SolveStatus, iteration: number, message: string): IpmOutcome => {
    copyIterate(best, it);
    return finish(status, iteration, bestMeasures, { message: `${message} (best iterate: iteration ${bestIteration})` });
  };

  for (let iter = 0; ; iter++) {
    // residuals and μ
    const meas = res.compute(it);
    const { rd } = res;
    rp.set(res.rp);
    const mu = meas.mu;
    const elapsed = (performance.now() - clock.start) / 1000;
    if (settings.onIteration) {
      const info: IterationInfo = {
        iteration: iter,
        primalObjective: meas.primalObjective,
        dualObjective: meas.dualObjective,
        primalResidual: meas.primalResidual,
        dualResidual: meas.dualResidual,
        relativeGap: meas.relativeGap,
        mu,
        stepPrimal: alphaP,
        stepDual: alphaD,
        seconds: elapsed,
      };
      settings.onIteration(info);
    }
    const score = Math.max(meas.primalResidual / settings.tolPrimalRel, meas.dualResidual / settings.tolDualRel, meas.relativeGap / settings.tolGapRel);
    if (!(score >= bestScore) && Number.isFinite(score)) {
      bestScore = score;
      bestMeasures = meas;
      bestIteration = iter;
      copyIterate(it, best);
    }

    // termination
    if (
      meas.primalResidual <= settings.tolPrimalRel &&
      meas.dualResidual <= settings.tolDualRel &&
      meas.relativeGap <= settings.tolGapRel
    ) {
      return finish('optimal', iter, meas);
    }
    if (!Number.isFinite(score)) return restoreBest('numerical_trouble', iter, 'the iterate is no longer finite');
    if (meas.primalResidual > settings.tolPrimalRel && infeas.isPrimalInfeasible(it, settings.tolInfeasibility)) {
      return finish('infeasible', iter, meas, { message: 'the dual iterates diverge along a Farkas ray: no point satisfies the constraints' });
    }
    if (meas.dualResidual > settings.tolDualRel || meas.relativeGap > settings.tolGapRel) {
      if (infeas.isDualInfeasible(it.v, settings.tolInfeasibility)) {
        return finish('unbounded', iter, meas, { primalRay: Float64Array.from(it.v), message: 'the objective decreases without bound along a feasible ray' });
      }
      if (iter > 0 && infeas.isDualInfeasible(dir.v, settings.tolInfeasibility)) {
        return finish('unbounded', iter, meas, { primalRay: Float64Array.from(dir.v), message: 'the objective decreases without bound along a feasible ray' });
      }
    }
    if (settings.shouldStop?.()) return restoreBest('cancelled', iter, 'stopped by the caller');
    if (iter >= settings.maxIterations) return restoreBest('iteration_limit', iter, `no convergence within ${settings.maxIterations} iterations`);
    if (performance.now() > clock.deadline) return restoreBest('time_limit', iter, `time limit of ${settings.timeLimitSeconds} s reached`);
    if (stall >= STALL_ITERATIONS) return restoreBest('numerical_trouble', iter, 'steps stayed below 1e-8 for 5 iterations');

    // barrier diagonal
    for (let j = 0; j < N; j++) {
      const k = kind[j];
      if (k === FIXED) {
        D[j] = Infinity;
        continue;
      }
      let d = k === FREE ? settings.regFree : settings.regPrimal;
      if (hasLower(k)) d += it.zl[j] / (it.v[j] - lower[j]);
      if (hasUpper(k)) d += it.zu[j] / (upper[j] - it.v[j]);
      D[j] = d;
    }
    const fs = timed('factorise', () => kkt.factorise(D, clock.deadline, mu));
    if (fs === 'interrupted') return restoreBest('time_limit', iter, `time limit of ${settings.timeLimitSeconds} s reached during a factorisation`);
    if (fs !== 'factorised') return restoreBest('numerical_trouble', iter, 'the Newton system could not be factorised');

    // predictor: r_l = −x_l z_l, r_u = −x_u z_u
    for (let j = 0; j < N; j++) {
      const k = kind[j];
      rl[j] = hasLower(k) ? -(it.v[j] - lower[j]) * it.zl[j] : 0;
      ru[j] = hasUpper(k) ? -(upper[j] - it.v[j]) * it.zu[j] : 0;
    }
    timed('solve', () => computeDirection(aff));
    let aP = maxPrimalStep(prob, kind, it, aff);
    let aD = maxDualStep(kind, it, aff);
    if (isQP) aP = aD = Math.min(aP, aD);
    const muAff = complementarityAfter(aff, aP, aD);
    const sigma = mu > 0 ? Math.min(1, Math.pow(muAff / mu, 3)) : 0;

    // corrector: r_l = σμ − x_l z_l − dx_l dz_l,  r_u = σμ − x_u z_u − dx_u dz_u (dx_u = −dv)
    const target = Math.max(sigma * mu, muFloor);
    for (let j = 0; j < N; j++) {
      const k = kind[j];
      rl[j] = hasLower(k) ? target - (it.v[j] - lower[j]) * it.zl[j] - aff.v[j] * aff.zl[j] : 0;
      ru[j] = hasUpper(k) ? target - (upper[j] - it.v[j]) * it.zu[j] + aff.v[j] * aff.zu[j] : 0;
    }
    timed('solve', () => computeDirection(dir));
    aP = maxPrimalStep(prob, kind, it, dir);
    aD = maxDualStep(kind, it, dir);
    if (isQP) aP = aD = Math.min(aP, aD);

    // Gondzio centrality correctors: push outlying products x z toward [β_min, β_max]·σμ
    const correctors = Math.min(settings.maxCorrectors, kkt.correctorLimit ?? Infinity);
    for (let k = 0; k < correctors; k++) {
      const enlarged = Math.min(1, CORRECTOR_REACH * Math.min(aP, aD) + 0.1);
      const tP = isQP ? enlarged : Math.min(1, CORRECTOR_REACH * aP + 0.1);
      const tD = isQP ? enlarged : Math.min(1, CORRECTOR_REACH * aD + 0.1);
      if (!gondzioRhs(target, tP, tD)) break;
      timed('solve', () => computeDirection(aff));
      // the corrected direction, or a blend dir + ω (corrected − dir) if that steps further
      // (weighted correctors: Colombo & Gondzio, Comput. Optim. Appl. 41, 2008)
      weights[3] = Math.max(0.1, aP * aD);
      blendedSteps(prob, kind, it, dir, aff, weights, blendP, blendD);
      let cP = -1;
      let cD = -1;
      let weight = 1;
      for (let q = 0; q < weights.length; q++) {
        let p = blendP[q];
        let d = blendD[q];
        if (isQP) p = d = Math.min(p, d);
        if (p + d > cP + cD) {
          cP = p;
          cD = d;
          weight = weights[q];
        }
      }
      if (cP + cD < 1.01 * (aP + aD)) break;
      if (weight === 1) copyIterate(aff, dir);
      else blend(dir, aff, weight, dir);
      aP = cP;
      aD = cD;
    }

    const tau = settings.stepToBoundary;
    alphaP = Math.min(1, tau * aP);
    alphaD = Math.min(1, tau * aD);
    if (isQP) alphaP = alphaD = Math.min(alphaP, alphaD);
    stall = Math.max(alphaP, alphaD) < TINY_STEP ? stall + 1 : 0;
    for (let j = 0; j < N; j++) {
      if (kind[j] === FIXED) continue;
      it.v[j] += alphaP * dir.v[j];
      it.zl[j] += alphaD * dir.zl[j];
      it.zu[j] += alphaD * dir.zu[j];
    }
    for (let i = 0; i < m; i++) it.y[i] += alphaD * dir.y[i];
    keepInterior();
    void rd;
  }

  /** out ← a + w (b − a); out may be a */
  function blend(a: Iterate, b: Iterate, w: number, out: Iterate): void {
    for (let j = 0; j < N; j++) {
      out.v[j] = a.v[j] + w * (b.v[j] - a.v[j]);
      out.zl[j] = a.zl[j] + w * (b.zl[j] - a.zl[j]);
      out.zu[j] = a.zu[j] + w * (b.zu[j] - a.zu[j]);
    }
    for (let i = 0; i < m; i++) out.y[i] = a.y[i] + w * (b.y[i] - a.y[i]);
  }

  /** r̂ = −rd + r_l/x_l − r_u/x_u, solve, then recover dz_l, dz_u into d */
  function computeDirection(d: Iterate): void {
    const { rd } = res;
    for (let j = 0; j < N; j++) {
      const k = kind[j];
      if (k === FIXED) {
        rhat[j] = 0;
        continue;
      }
      let r = -rd[j];
      if (hasLower(k)) r += rl[j] / (it.v[j] - lower[j]);
      if (hasUpper(k)) r -= ru[j] / (upper[j] - it.v[j]);
      rhat[j] = r;
    }
    kkt.solve(rhat, rp, d.v, d.y);
    for (let j = 0; j < N; j++) {
      const k = kind[j];
      if (k === FIXED) {
        d.v[j] = 0;
        d.zl[j] = 0;
        d.zu[j] = 0;
        continue;
      }
      d.zl[j] = hasLower(k) ? (rl[j] - it.zl[j] * d.v[j]) / (it.v[j] - lower[j]) : 0;
      d.zu[j] = hasUpper(k) ? (ru[j] + it.zu[j] * d.v[j]) / (upper[j] - it.v[j]) : 0;
    }
    const shift = kkt.complementarityShift;
    if (shift) {
      // the dual equation dz_l − dz_u = … holds again; the error goes to the bound whose
      // complementarity product matters more (the nearer one)
      for (let j = 0; j < N; j++) {
        const e = shift[j];
        const k = kind[j];
        if (e === 0 || k === FIXED) continue;
        if (hasLower(k) && (!hasUpper(k) || it.zl[j] * (upper[j] - it.v[j]) >= it.zu[j] * (it.v[j] - lower[j]))) d.zl[j] += e;
        else if (hasUpper(k)) d.zu[j] -= e;
      }
    }
  }

  /** average complementarity after steps aP, aD along d */
  function complementarityAfter(d: Iterate, aP: number, aD: number): number {
    let s = 0;
    for (let j = 0; j < N; j++) {
      const k = kind[j];
      if (hasLower(k)) s += (it.v[j] - lower[j] + aP * d.v[j]) * (it.zl[j] + aD * d.zl[j]);
      if (hasUpper(k)) s += (upper[j] - it.v[j] - aP * d.v[j]) * (it.zu[j] + aD * d.zu[j]);
    }
    return res.boundCount > 0 ? s / res.boundCount : 0;
  }

  /**
   * Gondzio's corrector right-hand side: at the trial point reached with steps tP, tD along
   * dir, products outside [0.1, 10]·target are pulled back to the interval. Adds the correction
   * to the current r_l, r_u. Returns false when no product needs correcting.
   */
  function gondzioRhs(target: number, tP: number, tD: number): boolean {
    const lo = 0.1 * target;
    const hi = 10 * target;
    let any = false;
    for (let j = 0; j < N; j++) {
      const k = kind[j];
      if (hasLower(k)) {
        const p = (it.v[j] - lower[j] + tP * dir.v[j]) * (it.zl[j] + tD * dir.zl[j]);
        let t = 0;
        if (p < lo) t = lo - p;
        else if (p > hi) t = Math.max(hi - p, -hi);
        if (t !== 0) any = true;
        rl[j] = dirRl(j) + t;
      }
      if (hasUpper(k)) {
        const p = (upper[j] - it.v[j] - tP * dir.v[j]) * (it.zu[j] + tD * dir.zu[j]);
        let t = 0;
        if (p < lo) t = lo - p;
        else if (p > hi) t = Math.max(hi - p, -hi);
        if (t !== 0) any = true;
        ru[j] = dirRu(j) + t;
      }
    }
    return any;
  }

  /** the complementarity right-hand side that produced dir, recovered from dir itself */
  function dirRl(j: number): number {
    return (it.v[j] - lower[j]) * dir.zl[j] + it.zl[j] * dir.v[j];
  }
  function dirRu(j: number): number {
    return (upper[j] - it.v[j]) * dir.zu[j] - it.zu[j] * dir.v[j];
  }

  /** guards against round-off pushing a slack or a dual to zero */
  function keepInterior(): void {
    for (let j = 0; j < N; j++) {
      const k = kind[j];
      if (hasLower(k)) {
        if (it.v[j] - lower[j] <= 0) it.v[j] = lower[j] + 1e-14 * (1 + Math.abs(lower[j]));
        if (it.zl[j] <= 0) it.zl[j] = 1e-14;
      }
      if (hasUpper(k)) {
        if (upper[j] - it.v[j] <= 0) it.v[j] = upper[j] - 1e-14 * (1 + Math.abs(upper[j]));
        if (it.zu[j] <= 0) it.zu[j] = 1e-14;
      }
    }
  }
}
