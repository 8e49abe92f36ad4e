/**
 * Normal equations for an LP or a QP with diagonal Q. Eliminating dv from the Newton system
 * (kkt-solver.ts) with Θ = (Q + D)⁻¹ leaves
 *
 *   (Â Θ Âᵀ + δI) dy = rp − Â Θ r̂,      Â Θ Âᵀ = A Θ_x Aᵀ + Θ_w,
 *   dv = Θ (r̂ + Âᵀ dy).
 *
 * A Θ_x Aᵀ is summed column by column (Σ_j θ_j a_j a_jᵀ) straight into the permuted factor
 * pattern through precomputed slots; dense columns are split off (dense-column-update.ts).
 * Each solve is polished by iterative refinement against the unfactorised operator.
 */
import type { IpmSettings } from '../settings';
import { SymmetricFactorisation, estimateFactorFlops } from '../sparse/symmetric-factorisation';
import { DenseColumnUpdate } from './dense-column-update';
import type { KktSolver, KktStatus } from './kkt-solver';
import { qDiagonal, type IpmProblem } from './ipm-problem';
import { maxAbs, multiplyNormal, normalRightHandSide, recoverDirection } from './normal-matrix';

/**
 * refinement stops once the residual is this small relative to the right-hand side. Measured on
 * the API bench's 200 × 26 model: 1e-12 took 226 factor solves for 135 Newton solves (28
 * iterations), 1e-10 takes 139 for the same 28 iterations and objective to 5e-11 (time in Newton
 * solves 1.15–1.25 s → 0.64–0.69 s); the Netlib optima keep their accuracy.
 */
const REFINE_TOLERANCE = 1e-10;

export class NormalEquations implements KktSolver {
  private readonly F: SymmetricFactorisation;
  private readonly dense: DenseColumnUpdate | null;
  private readonly isDense: Uint8Array;
  private readonly qdiag: Float64Array;
  private readonly thetaX: Float64Array;
  private readonly thetaW: Float64Array;
  private readonly rhs: Float64Array;
  private readonly resid: Float64Array;
  private readonly corr: Float64Array;
  private readonly best: Float64Array;
  private readonly delta: number;
  replacedPivots = 0;

  constructor(
    private readonly prob: IpmProblem,
    private readonly settings: IpmSettings,
    /** what estimateFlops already computed: the AMD order, and the pattern unless dropped */
    analysis: { order: Int32Array | null; pattern?: NormalPattern } | null = null,
  ) {
    const { n, m, A } = prob;
    const { rows, cols, denseCols } = analysis?.pattern ?? normalPattern(prob, settings);
    const amdOrder = analysis?.order ?? null;
    this.isDense = new Uint8Array(n);
    for (const j of denseCols) this.isDense[j] = 1;
    this.F = new SymmetricFactorisation(m, rows, cols, settings.ordering, 'supernodal', (settings.maxFactorMegabytes * 2 ** 20) / 8, settings.parallelFactorisation, amdOrder);
    this.dense = denseCols.length > 0 ? new DenseColumnUpdate(m, A, Int32Array.from(denseCols)) : null;
    this.qdiag = qDiagonal(n, prob.Q);
    this.thetaX = new Float64Array(n);
    this.thetaW = new Float64Array(m);
    this.rhs = new Float64Array(m);
    this.resid = new Float64Array(m);
    this.corr = new Float64Array(m);
    this.best = new Float64Array(m);
    this.delta = settings.regDual;
  }

  /**
   * Multiply–adds of one factorisation, estimated in the approximate-minimum-degree order without
   * building the factorisation (see estimateFactorFlops, also for flopLimit), and that order and
   * the pattern for the constructor.
   */
  static estimateFlops(
    prob: IpmProblem,
    settings: IpmSettings,
    flopLimit = Infinity,
  ): { flops: number; atLeast: boolean; order: Int32Array | null; pattern: NormalPattern } {
    const pattern = normalPattern(prob, settings);
    return { ...estimateFactorFlops(prob.m, pattern.rows, pattern.cols, flopLimit), pattern };
  }

  get nnzL(): number {
    return this.F.nnzL;
  }

  /** multiply–adds of one factorisation */
  get flops(): number {
    return this.F.flops;
  }

  factorise(D: Float64Array, deadline = Infinity): KktStatus {
    const { n, m, A } = this.prob;
    const { colPtr: Ap, values: Ax } = A;
    const { thetaX, thetaW, qdiag, isDense } = this;
    for (let j = 0; j < n; j++) thetaX[j] = D[j] === Infinity ? 0 : 1 / (qdiag[j] + D[j]);
    for (let i = 0; i < m; i++) thetaW[i] = D[n + i] === Infinity ? 0 : 1 / D[n + i];
    const Cx = this.F.Cx;
    const slot = this.F.slot;
    Cx.fill(0);
    let t = 0;
    for (let j = 0; j < n; j++) {
      if (isDense[j]) continue;
      const th = thetaX[j];
      const p1 = Ap[j + 1];
      for (let p = Ap[j]; p < p1; p++) {
        const ap = th * Ax[p];
        for (let q = p; q < p1; q++) Cx[slot[t++]] += ap * Ax[q];
      }
    }
    for (let i = 0; i < m; i++) Cx[slot[t++]] += thetaW[i] + this.delta;
    const report = this.F.factorise({
      pivotTolerance: this.settings.pivotTolerance,
      dynamicRegularisation: true,
      bigPivot: 1e128,
      deadline,
    });
    this.replacedPivots = report.replacedPivots;
    if (report.status === 'interrupted') return 'interrupted';
    if (report.status !== 'factorised') return 'numerical_trouble';
    if (this.dense && !this.dense.update(thetaX, (x) => this.F.solve(x))) return 'numerical_trouble';
    return 'factorised';
  }

  /** out ← (A Θ_x Aᵀ + Θ_w) x, dense columns included and without the regularisation δ, so refinement removes its error */
  private multiply(x: Float64Array, out: Float64Array): void {
    multiplyNormal(this.prob.A, this.thetaX, this.thetaW, x, out);
  }

  private applyInverse(x: Float64Array): void {
    this.F.solve(x);
    if (this.dense) this.dense.correct(x);
  }

  solve(rhat: Float64Array, rp: Float64Array, dv: Float64Array, dy: Float64Array): void {
    const { m, A } = this.prob;
    const { thetaX, thetaW, rhs, resid, corr, best } = this;
    normalRightHandSide(A, thetaX, thetaW, rhat, rp, rhs);
    dy.set(rhs);
    this.applyInverse(dy);
    // iterative refinement: keep the iterate with the smallest residual
    let bestNorm = Infinity;
    const rhsNorm = maxAbs(rhs);
    for (let k = 0; k <= this.settings.refinementSteps; k++) {
      this.multiply(dy, resid);
      for (let i = 0; i < m; i++) resid[i] = rhs[i] - resid[i];
      const r = maxAbs(resid);
      if (!(r < bestNorm)) break;
      bestNorm = r;
      best.set(dy);
      if (r <= REFINE_TOLERANCE * (1 + rhsNorm) || k === this.settings.refinementSteps) break;
      corr.set(resid);
      this.applyInverse(corr);
      for (let i = 0; i < m; i++) dy[i] += corr[i];
    }
    dy.set(best);
    recoverDirection(A, thetaX, thetaW, rhat, dy, dv);
  }
}

/**
 * The pattern of A Aᵀ + I as a list of entries (lower triangle, with the diagonal), without the
 * dense columns, which are split off (at most settings.maxDenseColumns, longest first).
 */
export interface NormalPattern {
  rows: Int32Array;
  cols: Int32Array;
  denseCols: number[];
}

function normalPattern(prob: IpmProblem, settings: IpmSettings): NormalPattern {
  const { n, m, A } = prob;
  const { colPtr: Ap, rowIdx: Ai } = A;
  const limit = Math.max(settings.denseColumnMin, settings.denseColumnRatio * m);
  const denseCols: number[] = [];
  for (let j = 0; j < n; j++) if (Ap[j + 1] - Ap[j] > limit) denseCols.push(j);
  denseCols.sort((a, b) => Ap[b + 1] - Ap[b] - (Ap[a + 1] - Ap[a]));
  denseCols.length = Math.min(denseCols.length, settings.maxDenseColumns);
  const isDense = new Uint8Array(n);
  for (const j of denseCols) isDense[j] = 1;
  let T = m;
  for (let j = 0; j < n; j++) {
    if (isDense[j]) continue;
    const c = Ap[j + 1] - Ap[j];
    T += (c * (c + 1)) / 2;
  }
  const rows = new Int32Array(T);
  const cols = new Int32Array(T);
  let t = 0;
  for (let j = 0; j < n; j++) {
    if (isDense[j]) continue;
    for (let p = Ap[j]; p < Ap[j + 1]; p++) {
      for (let q = p; q < Ap[j + 1]; q++) {
        rows[t] = Ai[q];
        cols[t] = Ai[p];
        t++;
      }
    }
  }
  for (let i = 0; i < m; i++) {
    rows[t] = i;
    cols[t] = i;
    t++;
  }
  return { rows, cols, denseCols };
}
