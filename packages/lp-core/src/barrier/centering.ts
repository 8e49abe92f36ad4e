/**
 * Centering: Newton's method with equality constraints (feasible-start Newton with a KKT solve per step; Nocedal & Wright, Numerical Optimization, from memory) on
 *
 *   φ_t(x) = t f₀(x) − Σ_k log s_k,   s = h − G x > 0,   subject to E x = d.
 *
 * Each step solves the KKT system
 *
 *   [ H/t Eᵀ ] [ Δx ]   [ −∇φ_t/t ]        H = t P + Gᵀ diag(1/s²) G
 *   [ E   0  ] [ w  ] = [ d − E x ]        ∇φ_t = t (P x + q) + Gᵀ (1/s)
 *
 * No regularisation is needed in exact arithmetic: every variable has two bounds (real or the
 * artificial box), so H is positive definite, and dependent equality rows were removed when the
 * form was built; a regularised fallback covers rounding.
 * (The right-hand side d − Ex keeps x on the equality set despite rounding; the first block row is
 * divided by t, so the system stays well scaled as t grows and w is ν directly), stops when the Newton
 * decrement λ² = ΔxᵀHΔx (= −∇φ_tᵀΔx on the equality set) satisfies λ²/2 ≤ tolNewton, and otherwise takes a backtracking step
 * (Alg. 9.2): τ ← βτ until s stays positive and φ_t(x + τΔx) ≤ φ_t(x) + α τ ∇φ_tᵀΔx. The change of
 * φ_t is evaluated as a difference (linear/quadratic terms and Σ log1p), not as φ(new) − φ(old),
 * so the test stays exact when t is large. At the end w is the multiplier ν of E x = d.
 */
import type { BarrierForm } from './barrier-form';
import type { BarrierSettings } from './barrier-settings';
import { DenseLu } from './dense-lu';
import { dot } from '../vectors';

export type CenteringOutcome = 'centred' | 'stopped' | 'stalled' | 'singular' | 'step_limit' | 'time_limit';

/** Newton steps and time shared by all centerings of one solve. */
export interface NewtonBudget {
  stepsUsed: number;
  maxSteps: number;
  deadline: number;
}

/** Passes of iterative refinement after each KKT solve. */
const REFINEMENT_PASSES = 2;
/** Relative regularisation of the fallback KKT solve. */
const FALLBACK_REGULARISATION = 1e-12;
/** A step this small means the line search cannot make progress. */
const MIN_STEP = 1e-14;

export class Centering {
  /** multiplier estimate ν of E x = d from the last Newton system */
  readonly w: Float64Array;
  /** slacks h − G x at the current point */
  readonly slack: Float64Array;
  lastStep = 0;
  private readonly lu: DenseLu;
  private readonly rhs: Float64Array;
  private readonly grad: Float64Array;
  private readonly dx: Float64Array;
  private readonly gdx: Float64Array;
  private readonly px: Float64Array;
  private readonly pdx: Float64Array;
  /** copies of the KKT matrix and right-hand side for iterative refinement */
  private readonly kkt: Float64Array;
  private readonly kktRhs: Float64Array;
  private readonly residual: Float64Array;
  private qdx = 0;
  private xpdx = 0;
  private dxpdx = 0;

  constructor(
    readonly form: BarrierForm,
    private readonly settings: BarrierSettings,
  ) {
    const { n, G, E } = form;
    this.lu = new DenseLu(n + E.count);
    this.rhs = new Float64Array(n + E.count);
    this.kkt = new Float64Array((n + E.count) * (n + E.count));
    this.kktRhs = new Float64Array(n + E.count);
    this.residual = new Float64Array(n + E.count);
    this.w = new Float64Array(E.count);
    this.slack = new Float64Array(G.count);
    this.grad = new Float64Array(n);
    this.dx = new Float64Array(n);
    this.gdx = new Float64Array(G.count);
    this.px = new Float64Array(n);
    this.pdx = new Float64Array(n);
  }

  /** Centres x (in place, strictly feasible on entry) for barrier parameter t. */
  run(x: Float64Array, t: number, budget: NewtonBudget, stopWhen?: (x: Float64Array) => boolean): CenteringOutcome {
    for (let step = 0; step < this.settings.maxNewtonStepsPerCentering; step++) {
      if (budget.stepsUsed >= budget.maxSteps) return 'step_limit';
      if (performance.now() > budget.deadline) return 'time_limit';
      this.computeSlack(x);
      if (!this.newtonDirection(x, t)) return 'singular';
      const decrement = this.prepareLineSearch(x, t);
      if (decrement / 2 <= this.settings.tolNewton) return 'centred';
      const tau = this.lineSearch(t, decrement);
      if (tau < MIN_STEP) {
        // Rounding, not the method, stops progress this close to the centre.
        return decrement / 2 <= Math.sqrt(this.settings.tolNewton) ? 'centred' : 'stalled';
      }
      for (let i = 0; i < x.length; i++) x[i] += tau * this.dx[i];
      this.lastStep = tau;
      budget.stepsUsed++;
      if (stopWhen?.(x)) return 'stopped';
    }
    return 'stalled';
  }

  computeSlack(x: Float64Array): void {
    const { G, h } = this.form;
    for (let k = 0; k < G.count; k++) {
      let gx = 0;
      for (let p = G.ptr[k]; p < G.ptr[k + 1]; p++) gx += G.val[p] * x[G.idx[p]];
      this.slack[k] = h[k] - gx;
    }
  }

  /**
   * Assembles and solves the KKT system at x; fills grad, dx and w. Should rounding make the matrix
   * singular (curvature of a far artificial bound lost next to large entries), the solve is repeated
   * once with a small quasi-definite regularisation (+δ on H, −δ on the equality block).
   */
  private newtonDirection(x: Float64Array, t: number): boolean {
    if (this.factoriseKkt(x, t, 0)) return this.solveKkt();
    return this.factoriseKkt(x, t, FALLBACK_REGULARISATION) && this.solveKkt();
  }

  private factoriseKkt(x: Float64Array, t: number, regularisation: number): boolean {
    const { n, P, q, G, E, d } = this.form;
    const size = n + E.count;
    const a = this.lu.a;
    a.fill(0);
    if (P) symmetricTimes(P, n, x, this.px);
    for (let i = 0; i < n; i++) this.grad[i] = t * ((P ? this.px[i] : 0) + q[i]);
    if (P) for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) a[i * size + j] = P[i * n + j];
    for (let k = 0; k < G.count; k++) {
      const inv = 1 / this.slack[k];
      const inv2 = (inv * inv) / t;
      for (let p = G.ptr[k]; p < G.ptr[k + 1]; p++) {
        const i = G.idx[p];
        this.grad[i] += G.val[p] * inv;
        const gi = G.val[p] * inv2;
        for (let r = G.ptr[k]; r < G.ptr[k + 1]; r++) a[i * size + G.idx[r]] += gi * G.val[r];
      }
    }
    if (regularisation > 0) {
      let maxDiag = 0;
      for (let i = 0; i < n; i++) maxDiag = Math.max(maxDiag, Math.abs(a[i * size + i]));
      const delta = regularisation * (1 + maxDiag);
      for (let i = 0; i < n; i++) a[i * size + i] += delta;
      for (let e = 0; e < E.count; e++) a[(n + e) * size + n + e] = -delta;
    }
    for (let e = 0; e < E.count; e++) {
      let ex = 0;
      for (let p = E.ptr[e]; p < E.ptr[e + 1]; p++) {
        const j = E.idx[p];
        a[(n + e) * size + j] = E.val[p];
        a[j * size + n + e] = E.val[p];
        ex += E.val[p] * x[j];
      }
      this.rhs[n + e] = d[e] - ex;
    }
    for (let i = 0; i < n; i++) this.rhs[i] = -this.grad[i] / t;
    this.kkt.set(a);
    this.kktRhs.set(this.rhs);
    return this.lu.factorise();
  }

  /** Solves with the factors, then refines: sol += K⁻¹(b − K sol) (Golub & Van Loan §3.5.3). */
  private solveKkt(): boolean {
    const { n, E } = this.form;
    const size = n + E.count;
    const { kkt, kktRhs, residual } = this;
    this.lu.solve(this.rhs);
    for (let pass = 0; pass < REFINEMENT_PASSES; pass++) {
      for (let i = 0; i < size; i++) {
        let r = kktRhs[i];
        for (let j = 0; j < size; j++) r -= kkt[i * size + j] * this.rhs[j];
        residual[i] = r;
      }
      this.lu.solve(residual);
      for (let i = 0; i < size; i++) this.rhs[i] += residual[i];
    }
    for (let i = 0; i < n; i++) this.dx[i] = this.rhs[i];
    for (let e = 0; e < E.count; e++) this.w[e] = this.rhs[n + e];
    return this.dx.every(Number.isFinite);
  }

  /**
   * Directional quantities for the line search along dx, and the Newton decrement
   * λ² = Δxᵀ H Δx = t ΔxᵀPΔx + Σ_k ((GΔx)_k / s_k)², summed from non-negative terms (no cancellation).
   */
  private prepareLineSearch(x: Float64Array, t: number): number {
    const { n, P, q, G } = this.form;
    let decrement = 0;
    for (let k = 0; k < G.count; k++) {
      let g = 0;
      for (let p = G.ptr[k]; p < G.ptr[k + 1]; p++) g += G.val[p] * this.dx[G.idx[p]];
      this.gdx[k] = g / this.slack[k]; // relative slack decrease per unit step
      decrement += this.gdx[k] * this.gdx[k];
    }
    this.qdx = dot(q, this.dx);
    this.xpdx = 0;
    this.dxpdx = 0;
    if (P) {
      symmetricTimes(P, n, this.dx, this.pdx);
      this.xpdx = dot(x, this.pdx);
      this.dxpdx = dot(this.dx, this.pdx);
      decrement += t * this.dxpdx;
    }
    return decrement;
  }

  /** Backtracking line search on φ_t along dx with slope −λ²; returns the step τ (0 when none is acceptable). */
  private lineSearch(t: number, decrement: number): number {
    const { G } = this.form;
    const { lineSearchAlpha: alpha, lineSearchBeta: beta } = this.settings;
    let tau = 1;
    let maxRatio = 0;
    for (let k = 0; k < G.count; k++) maxRatio = Math.max(maxRatio, this.gdx[k]);
    while (tau * maxRatio >= 1) tau *= beta;
    while (tau >= MIN_STEP) {
      let change = t * (tau * (this.qdx + this.xpdx) + 0.5 * tau * tau * this.dxpdx);
      for (let k = 0; k < G.count; k++) change -= Math.log1p(-tau * this.gdx[k]);
      if (change <= -alpha * tau * decrement) return tau;
      tau *= beta;
    }
    return 0;
  }
}

function symmetricTimes(P: Float64Array, n: number, v: Float64Array, out: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += P[i * n + j] * v[j];
    out[i] = s;
  }
}
