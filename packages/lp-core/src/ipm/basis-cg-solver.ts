/**
 * The normal equations of normal-equations.ts, (A Θ_x Aᵀ + Θ_w + δI) dy = rhs, solved by
 * preconditioned conjugate gradients instead of a Cholesky factor: for models whose factor is
 * dense (multi-period planning models couple every capacity and material row of a period, and
 * the periods to each other) the factor costs far more than a few hundred products with A.
 *
 * Preconditioners, in turn:
 *  - optionally a Cholesky factorisation for the first `directIterations` iterations (the
 *    solver is then a NormalEquations); and, with `fallBack`, for the rest of the solve once CG
 *    turns out to cost more per iteration than a factorisation (SPARSE_OPERATION_COST);
 *  - else the diagonal of the matrix, until a solve needs more than DIAGONAL_STEPS steps (at the
 *    starting point, where all weights are alike, a solve that needs more keeps its inexact
 *    direction instead: no basis would stand out yet);
 *  - then P = B Θ_B Bᵀ for a basis B of [A I] picked and improved by the weights
 *    (basis-preconditioner.ts); CG then runs on the split system I + W Wᵀ, W = Θ_B^{-1/2} B⁻¹ N Θ_N^{1/2}
 *    (the same iterates as with P⁻¹r = B⁻ᵀ Θ_B⁻¹ B⁻¹ r on the normal equations), solved by
 *    conjugate residuals, whose residual never grows (krylov.ts: fewer steps to the stopping rule).
 * A step costs one product with A and one with Aᵀ and the diagonal, or, with the basis, one with N
 * and one with Nᵀ and a solve with B and with Bᵀ (split-system.ts; measured on L: 0.39–0.46 ms
 * against 0.77–0.97 ms for the normal equations and P⁻¹). CG keeps the iterate with the smallest residual r and stops
 *  - with the diagonal preconditioner when ‖r‖∞ ≤ max(CG_TOLERANCE · (1 + ‖rhs‖∞), INEXACT · ‖rp‖∞,
 *    min(√μ, MU_TOLERANCE · μ/√μ₀)): the residual left is the direction's error in Â dv = rp, which
 *    need only be small against rp and μ while the iterate is far from feasible and optimal (an
 *    inexact Newton step);
 *  - with the basis when ‖Θ_B^{-1/2} B⁻¹ r‖∞ ≤ KKT_TOLERANCE · √μ: the basic part of dv is then set
 *    so that Â dv = rp holds exactly (exactPrimal) and the error moves into the complementarity
 *    equations of the basic columns, where it is measured by that scaled norm against √(x z) (the
 *    recovery of Schork & Gondzio's implementation). Measured on the bench's L model against the
 *    first rule throughout: 3976 → 2651 CG steps, 26 → 27 iterations, 5.6 → 4.3 s; M 1816 → 1373
 *    steps; the primal residual falls to 1e-16 once a full step is taken.
 */
import type { IpmSettings } from '../settings';
import { BasisPreconditioner } from './basis-preconditioner';
import type { KktSolver, KktStatus } from './kkt-solver';
import type { IpmProblem } from './ipm-problem';
import type { NormalEquations } from './normal-equations';
import { FactorTooLargeError } from '../sparse/symmetric-factorisation';
import { maxAbs, normalRightHandSide, recoverDirection } from './normal-matrix';
import { SplitSystem } from './split-system';
import { groupColumns, type ColumnGroups } from './column-groups';
import { addColumnProducts } from './split-product-kernel';
import { dot } from '../vectors';
import { conjugateGradients, conjugateResiduals, KrylovWork } from './krylov';

/**
 * CG's relative residual target (both preconditioners), and the fraction of the primal residual
 * the diagonally preconditioned CG may stop at. Measured on the bench's L model (Cholesky for six iterations, then CG): 1e-9 and 0.1 took
 * 22 iterations and 8096 CG steps, 1e-8 22 and 7522, INEXACT 0.01 24 and 8954; objectives within
 * 1e-9 of HiGHS. The stricter target is kept: it costs 7 % more steps.
 */
const CG_TOLERANCE = 1e-9;
const INEXACT = 0.1;
/**
 * Diagonally preconditioned CG may also stop at min(√μ, MU_TOLERANCE·μ/√μ₀) (μ₀ the first
 * iterate's; measured when this rule served the basis as well): while the iterate is
 * far from optimal the direction need not be exact (its error is left in the primal residual,
 * which the termination test checks on the original problem); the allowance shrinks with μ, so the
 * primal residual keeps pace with the gap. Measured from the start with 'basis-cg' (CG steps,
 * iterations): L without it 7486 in 26; with √μ alone 4891 in 27, but on XL the primal residual
 * then lagged (gap 1e-8, residual 1e-7) and the solve ran on to μ = 1e-11, where the last
 * iteration cost 29 s of exchanges (170 s in all); with 10·μ/√μ₀ alone L 4139 in 29 and XL 10928
 * in 37 (158 s), but small random LPs ran into the iteration limit (the allowance is 10·√μ₀ at the
 * start); with the minimum of both L 5441 in 27. Objectives within 1e-8 of each other.
 */
const MU_TOLERANCE = 10;
/**
 * With the basis preconditioner CG stops at ‖Θ_B^{-1/2} B⁻¹ r‖∞ ≤ KKT_TOLERANCE·√μ: the default of
 * Schork & Gondzio's implementation (IPX's kkt_tol, 0.3; read in HiGHS's ipx_internal.h).
 */
const KKT_TOLERANCE = 0.3;
/**
 * a diagonally preconditioned solve that needs more steps than this switches to the basis.
 * Measured with CG from the start, 300 → 150: L 5441 → 3976 CG steps (time alike, more
 * exchanges); M 3734 → 1816 steps (a second solve 0.75 → 0.58 s); XL 135 → 110 s; plan-model's
 * 200 × 26 plant 18.4 → 19.2 s. With the split system and its stopping rule, 150 → 100: L 2678 →
 * 2371 steps (3.9–4.1 → 3.4–3.8 s, interleaved), 60: 2596 steps and 4519 exchanges; M 1436 → 1230;
 * XL 9270 → 9260 (73 s both); plan-model's 200 × 26 plant 6.3–6.9 s either way.
 */
const DIAGONAL_STEPS = 100;
/**
 * exchanges per iteration: at least MAX_EXCHANGES and EXCHANGE_SHARE of the rows; the scaled entry
 * size they push under (2, as Schork & Gondzio). Measured on plan-model's generated 200 × 26 plant
 * (17281 rows): at most 400 exchanges a solve, the basis fell behind the moving weights and CG took
 * 1000–3800 steps a solve in the last iterations (98 s); with up to 3000, 40–170 steps (30 s).
 */
const MAX_EXCHANGES = 400;
const EXCHANGE_SHARE = 0.2;
/**
 * ... and, above MAX_EXCHANGES, at most this many per CG step of the previous iteration: an
 * exchange costs a sparse solve with B and a share of the next fresh LU, on XL several times a CG
 * step. Measured (whole solve): XL with up to a fifth of the rows 184 s (improving the basis 59 s,
 * up to 2900 exchanges an iteration), with up to 1519 129 s (25 s), with 4 per step 135 s;
 * plan-model's 200 × 26 plant with up to 400 27.6 s, 864 18.3 s, 3456 (a fifth) 16.4 s, 4 per
 * step 18.4 s; L and M never reach the limits. Since exchanges got cheaper (a sparse solve
 * 61 → 22–26 µs, refactorisations triangular first) and with conjugate residuals, on XL (steps,
 * columns examined, exchanges; one thread, runs back to back): 4 per step 8222, 74 k, 28.5 k in
 * 46.2 s; 8 6537, 106 k, 28.7 k in 40.9 s; 16 6287, 117 k, 28.7 k in 40.9 s (the same as with no
 * limit but the fifth of the rows): as many exchanges in all, made earlier, for a quarter fewer
 * steps.
 */
const EXCHANGES_PER_STEP = 16;
const VOLUME_TOLERANCE = 2;
/** after the exchanges, B is factorised afresh if its updates hold more than this share of the LU's nonzeros */
const UPDATE_SHARE = 0.1;
/**
 * Gondzio correctors per iteration while CG solves: each costs a whole CG solve (with a Cholesky
 * factor, two triangular solves). Measured on L (six Cholesky iterations first): 4 correctors
 * 22 iterations and 8096 CG steps, 2: 25 and 6412, 1: 27 and 5452, 0: 37 and 5271. With the
 * split system and its stopping rule, from the start (CG steps, iterations, seconds): L 1: 2678,
 * 27, 4.0–4.1 s; 0: 2407, 33, 4.0–4.4 s; XL 1: 9270, 40; 0: 9137, 49 (time alike); M alike;
 * plan-model's 200 × 26 plant 1: 28 iterations, 6.1–6.8 s; 0: 34, 6.3–6.4 s. Kept at 1.
 */
export const CG_CORRECTORS = 1;

/**
 * With `fallBack` (as 'auto' sets it), CG gives way to Cholesky for the rest of the solve once the
 * CG work per iteration so far, in sparse operations weighted by SPARSE_OPERATION_COST, exceeds
 * one factorisation's multiply–adds. Averaged over the iterations, not per iteration: the
 * iteration that builds the basis costs several (on the bench's M model, where CG takes 0.40 s
 * and Cholesky 0.55 s, that one iteration alone would send the solve back to Cholesky).
 * The weight is measured: the supernodal kernels run ~6.6e9 multiply–adds a second on two
 * threads (bench L), CG's scattered products and solves ~3.4e8 operations a second (one thread).
 * Counting operations keeps the choice independent of how busy the machine is (a run repeats
 * exactly).
 */
const SPARSE_OPERATION_COST = 20;
/**
 * a lower bound on a factorisation's cost that no longer settles the fall-back is counted up to
 * this many times CG's cost per iteration (on XL, counting in full took 2.9 s; CG's cost per
 * iteration grows a few times over a solve)
 */
const COUNT_AHEAD = 8;

/** a Cholesky solver of the same normal equations, built only if it is used */
export interface CholeskyOption {
  /** multiply–adds of one factorisation (exact or estimated), or a lower bound when atLeast */
  flops: number;
  atLeast?: boolean;
  /** counts the multiply–adds again up to a higher limit (given with atLeast) */
  countFlops?: (limit: number) => { flops: number; atLeast: boolean };
  create: () => NormalEquations;
}

export interface CgStatistics {
  /** CG steps of every solve */
  steps: number[];
  /** basis exchanges of every iteration with the basis preconditioner */
  exchanges: number[];
}

export class BasisCgSolver implements KktSolver {
  readonly stats: CgStatistics = { steps: [], exchanges: [] };
  private readonly basis: BasisPreconditioner;
  /** the weights of the columns of [A I]: θ_x, then the slacks' θ_w + δ */
  private readonly weight: Float64Array;
  /** views into weight: θ_x, and θ_w + δ (the diagonal added to A Θ_x Aᵀ) */
  private readonly thetaX: Float64Array;
  private readonly slackWeight: Float64Array;
  private readonly thetaW: Float64Array;
  private readonly diagonal: Float64Array;
  private readonly rhs: Float64Array;
  /** the Krylov methods' work vectors */
  private readonly krylov: KrylovWork;
  /** by row, then by position: the normal equations' right-hand side and B⁻¹ of it, or rp − Â dv and B⁻¹ of it (exactPrimal) */
  private readonly rowWork: Float64Array;
  /** see complementarityShift */
  private readonly shift: Float64Array;
  private shifted = false;
  // the split system's matrix, CG's iterate u on it and its right-hand side (by row: split-system.ts)
  private readonly split: SplitSystem;
  private readonly u: Float64Array;
  private readonly splitRhs: Float64Array;
  private readonly warmU: Float64Array;
  private readonly maxSteps: number;
  private readonly maxExchanges: number;
  /** CG steps of the previous iteration's solves, and of this one's so far */
  private lastIterationSteps = 0;
  private iterationSteps = 0;
  private mode: 'direct' | 'diagonal' | 'basis';
  private iterations = 0;
  /** dy of the last solve, valid (warm) until the next factorise */
  private readonly warmDy: Float64Array;
  private warm = false;
  /** the mode of the solve that left warmDy (diagonal) or warmU (basis) */
  private warmMode: 'direct' | 'diagonal' | 'basis' = 'diagonal';
  private deadline = Infinity;
  /** μ of this iteration and of the first */
  private mu = 0;
  private mu0 = 0;
  /** sparse operations of CG so far */
  private work = 0;
  private direct: NormalEquations | null = null;
  /** a factorisation's multiply–adds as the Cholesky option gives them, and whether a lower bound */
  private choleskyFlops: number;
  private choleskyAtLeast: boolean;
  /** A Θ_x^{1/2} by column length and the rest of the matrix's diagonal, while the diagonal preconditioner serves (groupNormal) */
  private groupedNormal: { columns: ColumnGroups; diagonal: Float64Array } | null = null;
  /** true once CG has given way to Cholesky for good */
  private backToCholesky = false;

  constructor(
    private readonly prob: IpmProblem,
    private readonly settings: IpmSettings,
    /** the Cholesky solver for the first `directIterations` iterations and the fall-back, or null */
    private readonly cholesky: CholeskyOption | null = null,
    private readonly directIterations = 0,
    /** go back to Cholesky when CG costs more than a factorisation (see SPARSE_OPERATION_COST) */
    private fallBack = false,
  ) {
    const { n, m } = prob;
    this.basis = new BasisPreconditioner(prob.A);
    this.weight = new Float64Array(n + m);
    this.thetaX = this.weight.subarray(0, n);
    this.slackWeight = this.weight.subarray(n);
    this.thetaW = new Float64Array(m);
    this.diagonal = new Float64Array(m);
    this.rhs = new Float64Array(m);
    this.krylov = new KrylovWork(m);
    this.rowWork = new Float64Array(m);
    this.shift = new Float64Array(n + m);
    this.u = new Float64Array(m);
    this.warmU = new Float64Array(m);
    this.split = new SplitSystem(m, settings.parallelFactorisation);
    this.splitRhs = new Float64Array(m);
    this.warmDy = new Float64Array(m);
    this.maxSteps = Math.max(500, Math.min(5000, m));
    this.maxExchanges = Math.max(MAX_EXCHANGES, Math.ceil(m * EXCHANGE_SHARE));
    this.mode = cholesky && directIterations > 0 ? 'direct' : 'diagonal';
    this.choleskyFlops = cholesky?.flops ?? 0;
    this.choleskyAtLeast = cholesky?.atLeast === true && cholesky.countFlops !== undefined;
  }

  get nnzL(): number {
    return this.mode === 'direct' ? this.directSolver().nnzL : this.basis.nonzeros;
  }

  get replacedPivots(): number {
    return this.mode === 'direct' ? this.directSolver().replacedPivots : 0;
  }

  /** correctors worth their cost: as many as asked while the Cholesky factor solves */
  get correctorLimit(): number {
    return this.mode === 'direct' ? Infinity : CG_CORRECTORS;
  }

  /**
   * After a solve with the basis preconditioner: e_j = D_j dv_j − (r̂_j + Âᵀ_j dy) for the basic
   * columns, whose dv was set so that Â dv = rp holds exactly (exactPrimal); zero elsewhere. The
   * interior-point method adds it to dz_j, so the first block equation holds and CG's error sits
   * in the complementarity equations of the basic columns. Null after any other solve.
   */
  get complementarityShift(): Float64Array | null {
    return this.shifted ? this.shift : null;
  }

  /** the preconditioner in use: 'direct' (Cholesky), 'diagonal' or 'basis' */
  get preconditioner(): 'direct' | 'diagonal' | 'basis' {
    return this.mode;
  }

  factorise(D: Float64Array, deadline = Infinity, mu = 0): KktStatus {
    this.iterations++;
    this.mu = mu;
    if (this.mu0 === 0) this.mu0 = mu;
    this.lastIterationSteps = this.iterationSteps;
    this.iterationSteps = 0;
    this.deadline = deadline;
    const cgIterations = this.iterations - 1 - this.directIterations;
    if (this.fallBack && this.mode === 'basis' && this.choleskyIsCheaper(cgIterations)) this.fallBackToCholesky();
    this.warm = false;
    if (this.mode === 'direct') {
      if (this.iterations <= this.directIterations || this.backToCholesky) return this.directSolver().factorise(D, deadline);
      this.mode = 'diagonal';
    }
    const { n, m } = this.prob;
    const { thetaX, thetaW, weight } = this;
    const delta = this.settings.regDual;
    for (let j = 0; j < n; j++) thetaX[j] = D[j] === Infinity ? 0 : 1 / D[j];
    for (let i = 0; i < m; i++) thetaW[i] = D[n + i] === Infinity ? 0 : 1 / D[n + i];
    for (let i = 0; i < m; i++) weight[n + i] = thetaW[i] + delta;
    for (let j = 0; j < n + m; j++) if (!(weight[j] < Infinity)) return 'numerical_trouble';
    if (this.mode === 'basis') this.improveBasis();
    else if (this.directIterations > 0) this.switchToBasis();
    else {
      this.setDiagonal();
      this.groupNormal();
    }
    return 'factorised';
  }

  solve(rhat: Float64Array, rp: Float64Array, dv: Float64Array, dy: Float64Array): void {
    this.shifted = false;
    if (this.mode === 'direct') {
      this.directSolver().solve(rhat, rp, dv, dy);
      return;
    }
    const { n, m, A } = this.prob;
    const { thetaX, thetaW, rhs } = this;
    normalRightHandSide(A, thetaX, thetaW, rhat, rp, rhs);
    let steps: number;
    if (this.mode === 'diagonal') {
      const muAllowance = this.mu0 > 0 ? Math.min(Math.sqrt(this.mu), (MU_TOLERANCE * this.mu) / Math.sqrt(this.mu0)) : 0;
      const target = Math.max(CG_TOLERANCE * (1 + maxAbs(rhs)), INEXACT * maxAbs(rp), muAllowance);
      steps = this.conjugateGradients(dy, target, DIAGONAL_STEPS);
      // at the starting point all weights are alike and no basis stands out: keep the inexact
      // direction (its error stays in the primal residual) and switch only later
      if (steps < 0 && this.iterations === 1) steps = -steps;
      else if (steps < 0) {
        this.switchToBasis();
        steps = DIAGONAL_STEPS + Math.abs(this.solveSplitSystem(dy, this.maxSteps));
      }
    } else steps = Math.abs(this.solveSplitSystem(dy, this.maxSteps));
    this.stats.steps.push(steps);
    this.iterationSteps += steps;
    // per step: products with A and Aᵀ (with the basis: N and Nᵀ and solves with B), vector operations
    this.work += steps * (this.mode === 'basis' ? this.split.nonzeros : 2 * A.colPtr[n] + 6 * m);
    recoverDirection(A, thetaX, thetaW, rhat, dy, dv);
    if (this.mode === 'basis') this.exactPrimal(rp, dv);
    this.warmDy.set(dy);
    this.warm = true;
    this.warmMode = this.mode;
  }

  /**
   * Makes the step primal-feasible: dv_B += B⁻¹(rp − Â dv), so Â dv = rp up to rounding whatever
   * CG's residual, and records the change as complementarityShift. (B is a basis of [A I]; the
   * slack columns of Â = [A −I] carry the other sign.)
   */
  private exactPrimal(rp: Float64Array, dv: Float64Array): void {
    const { n, m, A } = this.prob;
    const { colPtr: Ap, rowIdx: Ai, values: Ax } = A;
    const { rowWork: gap, shift, thetaX, thetaW } = this;
    for (let i = 0; i < m; i++) gap[i] = rp[i] + dv[n + i];
    for (let j = 0; j < n; j++) {
      const v = dv[j];
      if (v === 0) continue;
      for (let p = Ap[j]; p < Ap[j + 1]; p++) gap[Ai[p]] -= Ax[p] * v;
    }
    this.basis.ftran(gap);
    shift.fill(0);
    const { basic } = this.basis;
    for (let k = 0; k < m; k++) {
      const j = basic[k];
      const change = gap[k];
      if (j < n) {
        if (thetaX[j] === 0) continue;
        dv[j] += change;
        shift[j] = change / thetaX[j];
      } else {
        if (thetaW[j - n] === 0) continue;
        dv[j] -= change;
        shift[j] = -change / thetaW[j - n];
      }
    }
    this.shifted = true;
  }

  /** the Cholesky solver, built when first needed */
  private directSolver(): NormalEquations {
    return (this.direct ??= this.cholesky!.create());
  }

  /**
   * CG's work per iteration so far weighs more than a factorisation (see SPARSE_OPERATION_COST).
   * A lower bound on the factorisation's cost is counted further when it no longer settles the
   * question, up to COUNT_AHEAD times what CG costs now, so that it is seldom counted again.
   */
  private choleskyIsCheaper(cgIterations: number): boolean {
    const { cholesky } = this;
    if (!cholesky) return false;
    const cgCost = () => (SPARSE_OPERATION_COST * this.work) / Math.max(cgIterations, 1);
    if (cgCost() <= this.choleskyFlops) return false;
    if (this.choleskyAtLeast) {
      const count = cholesky.countFlops!(COUNT_AHEAD * cgCost());
      this.choleskyFlops = count.flops;
      this.choleskyAtLeast = count.atLeast;
    }
    return cgCost() > this.choleskyFlops;
  }

  /** Cholesky for the rest of the solve, unless its factor turns out not to fit after all */
  private fallBackToCholesky(): void {
    try {
      this.directSolver();
    } catch (err) {
      if (!(err instanceof FactorTooLargeError)) throw err;
      this.fallBack = false;
      return;
    }
    this.mode = 'direct';
    this.backToCholesky = true;
  }

  /** the diagonal of A Θ_x Aᵀ + Θ_w + δI */
  private setDiagonal(): void {
    const { n, A } = this.prob;
    const { colPtr: Ap, rowIdx: Ai, values: Ax } = A;
    const d = this.diagonal;
    d.set(this.slackWeight);
    for (let j = 0; j < n; j++) for (let p = Ap[j]; p < Ap[j + 1]; p++) d[Ai[p]] += this.thetaX[j] * Ax[p] * Ax[p];
  }

  private switchToBasis(): void {
    this.mode = 'basis';
    this.groupedNormal = null;
    this.basis.build(this.weight);
    this.basis.refactor();
    this.improveBasis();
  }

  private improveBasis(): void {
    const { m, n } = this.prob;
    // exchanges are bought to save CG steps: at most EXCHANGES_PER_STEP per step of the last iteration
    const limit = Math.min(this.maxExchanges, Math.max(MAX_EXCHANGES, EXCHANGES_PER_STEP * this.lastIterationSteps));
    const report = this.basis.improve(this.weight, VOLUME_TOLERANCE, limit);
    this.basis.compact(UPDATE_SHARE);
    this.split.prepare(this.basis, this.prob.A, this.weight);
    this.stats.exchanges.push(report.exchanges);
    // two estimate rounds over all columns, one solve and one scan per examined column
    this.work += 2 * (this.prob.A.colPtr[n] + n + m) + report.examined * (this.basis.nonzeros + m);
  }

  /** out ← (A Θ_x Aᵀ + Θ_w + δI) x; returns xᵀ out */
  private readonly applyNormal = (x: Float64Array, out: Float64Array): number => {
    // laid out by factorise() whenever the diagonal preconditioner serves, the only mode that multiplies so
    const { columns: c, diagonal: d } = this.groupedNormal!;
    for (let i = 0; i < out.length; i++) out[i] = d[i] * x[i];
    addColumnProducts(c.ptr, c.idx, c.val, c.groups, x, out, 0, c.columns);
    return dot(x, out);
  };

  /**
   * A Θ_x^{1/2} grouped by column length for applyNormal (measured on XL's diagonal phase: the
   * products with A one column at a time took 1.7 s of a 54 s solve), and the diagonal of the
   * single-entry columns and Θ_w + δI
   */
  private groupNormal(): void {
    const { n, m, A } = this.prob;
    const { colPtr: Ap, rowIdx: Ai, values: Ax } = A;
    const { thetaX } = this;
    const diagonal = this.groupedNormal?.diagonal ?? new Float64Array(m);
    diagonal.set(this.slackWeight);
    for (let j = 0; j < n; j++) if (Ap[j + 1] - Ap[j] === 1) diagonal[Ai[Ap[j]]] += thetaX[j] * Ax[Ap[j]] * Ax[Ap[j]];
    this.groupedNormal = { columns: groupColumns(A, (j) => Math.sqrt(thetaX[j])), diagonal };
  }

  /** z ← P⁻¹ r, P the diagonal of the matrix */
  private precondition(r: Float64Array, z: Float64Array): void {
    for (let i = 0; i < z.length; i++) z[i] = r[i] / this.diagonal[i];
  }

  private readonly applyDiagonal = (r: Float64Array, z: Float64Array): void => this.precondition(r, z);
  private readonly applySplitSystem = (x: Float64Array, out: Float64Array): number => this.split.apply(x, out);

  /**
   * Diagonally preconditioned CG on (A Θ_x Aᵀ + Θ_w + δI) dy = rhs, started from P⁻¹ rhs or from
   * the previous solve's dy of the same iteration. Returns the steps taken, negated when `limit`
   * steps (or the deadline) came first.
   */
  private conjugateGradients(dy: Float64Array, target: number, limit: number): number {
    this.precondition(this.rhs, dy);
    const warm = this.warm && this.warmMode === 'diagonal' ? this.warmDy : null;
    return conjugateGradients(dy, this.rhs, this.applyNormal, this.applyDiagonal, warm, { target, limit, deadline: this.deadline }, this.krylov);
  }

  /**
   * The basis phase's solve: conjugate residuals (krylov.ts) on the split system
   * (I + W Wᵀ) u = Θ_B^{-1/2} B⁻¹ rhs, W = Θ_B^{-1/2} B⁻¹ N Θ_N^{1/2}, u = Θ_B^{1/2} Bᵀ dy. CG there
   * would take the same iterates as CG on the normal equations preconditioned by B Θ_B Bᵀ,
   * but a step multiplies by N and Nᵀ only (the basic columns' share of A is left out: a third of
   * L's nonzeros), and the residual is the scaled one the stopping rule measures. Starts from
   * u = Θ_B^{-1/2} B⁻¹ rhs (exact when N carries no weight) or from the previous solve's u of this
   * iteration; stops at max(KKT_TOLERANCE·√μ, CG_TOLERANCE·(1 + ‖Θ_B^{-1/2} B⁻¹ rhs‖∞)).
   * dy ← B⁻ᵀ Θ_B^{-1/2} u. u and the split right-hand side are numbered as split-system.ts numbers
   * them (by the row pivoted at each position). Returns the steps taken, negated when `limit`
   * steps (or the deadline) came first.
   */
  private solveSplitSystem(dy: Float64Array, limit: number): number {
    const { u, splitRhs } = this;
    const byPosition = this.rowWork;
    byPosition.set(this.rhs);
    this.basis.ftran(byPosition);
    this.split.toSplit(byPosition, splitRhs);
    const target = Math.max(KKT_TOLERANCE * Math.sqrt(this.mu), CG_TOLERANCE * (1 + maxAbs(splitRhs)));
    u.set(splitRhs);
    const warm = this.warm && this.warmMode === 'basis' ? this.warmU : null;
    let steps: number;
    this.split.begin();
    try {
      steps = conjugateResiduals(u, splitRhs, this.applySplitSystem, warm, { target, limit, deadline: this.deadline }, this.krylov, this.split);
    } finally {
      this.split.end();
    }
    this.warmU.set(u);
    this.split.fromSplit(u, dy);
    this.basis.btran(dy);
    return steps;
  }
}
