/**
 * A basis B of Â = [A I] (m columns: structural columns j < n, and unit columns n + i for the
 * slacks of rows i) chosen by the weights θ of the current interior-point iterate, for
 * preconditioning the normal equations Σ_j θ_j â_j â_jᵀ with P = B Θ_B Bᵀ. After the transform
 * the matrix is I + W Wᵀ with W = Θ_B^{-1/2} B⁻¹ N Θ_N^{1/2}; conjugate gradients converge fast
 * when the entries of W are small. The approach follows L. Schork & J. Gondzio, "Implementation of
 * an interior point method with basis preconditioning", Math. Prog. Comp. 12 (2020):
 *
 *  - build: the columns are offered to a sparse LU heaviest first (slacks included), so B is the
 *    basis of largest weight (the greedy algorithm of a matroid);
 *  - improve ("maximum volume"): while some |W_kj| exceeds `volumeTolerance`, column j replaces
 *    the basic column at k; |det| of the scaled basis grows by that factor each time. Candidates
 *    come from random estimates of the columns' norms (Wᵀr for random signs r, one solve with Bᵀ)
 *    above CANDIDATE_FACTOR times the tolerance, then an exact column (one solve with B) picks the
 *    position;
 *  - exchanges are kept as product-form updates (B_new⁻¹ = E⁻¹B⁻¹, one eta column each) until
 *    `maxUpdates`, or until the updates hold more nonzeros than the factors, then B is factorised
 *    afresh: triangular parts first, the rest in a fill-reducing order (triangular-first-order.ts),
 *    pivots in short rows where threshold pivoting allows.
 */
import type { CscMatrix } from '../problem/problem';
import { columnOrder } from '../sparse/column-ordering';
import { triangularFirstOrder } from '../sparse/triangular-first-order';
import { SparseLu, grow, growF } from '../sparse/sparse-lu';
import { applyUpdates, applyUpdatesTransposed, type UpdateFile } from './product-form';

/**
 * improve() ends a round after this many examined columns in a row without an exchange. Measured
 * on plan-model's 200 × 26 plant: without it 2800–5400 columns were examined an iteration for
 * 24–1276 exchanges; with 50, 230–4600 for 10–1431, CG steps alike. On XL with conjugate
 * residuals (steps, columns examined, improving the basis; seeds 1 and 2 of the bench's model):
 * 50: 6287, 117 k, 9.7 s and 6223, 116 k, 9.6 s; 30: 6472, 95 k, 8.0 s and 6666, 97 k, 7.2 s;
 * 20: 6655, 77 k, 6.8 s and 7899, 76 k, 6.2 s; 10: 10479 steps. At ~2.85 ms a step 30 saves
 * about a second on both; below 20 the basis falls behind.
 */
const MISS_LIMIT = 30;
/**
 * improve() examines a column only if its random estimate exceeds this many times the volume
 * tolerance: the estimate is a column norm, and a column whose norm barely passes rarely holds an
 * entry that does. Measured (columns examined, exchanges, CG steps, iterations): bench L with 1:
 * 24691, 3364, 2580, 27; 1.5: 16796, 3313, 2559, 27; 2: 11824, 3286, 2696, 26 (3.4 s, the fastest);
 * 3: 6974, 3172, 3238, 28. plan-model's 200 × 26 plant: 6.3–6.5 s with 1 or 2.
 */
const CANDIDATE_FACTOR = 2;
/**
 * product-form updates kept before B is factorised afresh (also when they hold more nonzeros than
 * the LU). On XL an iteration made up to 2900 exchanges; with 100 updates that meant a fresh
 * factorisation (AMD on BᵀB, then the LU: ~0.28 s) every 100 of them, 8 s of the iteration.
 */
const MAX_UPDATES = 1000;
/**
 * a refactorisation in the triangular-first order that holds more than this many times the
 * nonzeros of an LU without fill also tries the fill-reducing order over all columns (an AMD order
 * of BᵀB, ~0.1 s on XL). The bench's bases stay below it (measured maxima: M 1.11×, L 1.21×,
 * XL 1.88× in its last iterations; with a limit of 1.5 XL tried the other order 35 times).
 * Meant for bases with a big bump, such as plan-model's generated 1000 × 52 plant's late ones.
 */
const FILL_LIMIT = 2.5;
/** a column whose new pivot is below this fraction of its largest entry is taken as dependent */
const DEPENDENCE_TOLERANCE = 1e-7;

export interface MaxVolumeReport {
  /** exchanges made */
  exchanges: number;
  /** columns whose exact scaled column was computed */
  examined: number;
}

export class BasisPreconditioner {
  readonly m: number;
  readonly n: number;
  /** column of Â at each basis position */
  readonly basic: Int32Array;
  /** position of each column of Â in the basis, −1 when nonbasic */
  readonly position: Int32Array;
  private lu: SparseLu;
  private readonly work: Float64Array;
  /** B⁻¹â_j of the column examined (zero between uses) and its nonzero positions */
  private readonly colWork: Float64Array;
  private readonly colPattern: Int32Array;
  // product-form updates
  private etaCount = 0;
  private readonly etaPos: Int32Array;
  private readonly etaPivot: Float64Array;
  private readonly etaPtr: Int32Array;
  private etaIdx: Int32Array;
  private etaVal: Float64Array;
  /** xorshift state for the random signs (fixed seed: runs repeat exactly) */
  private seed = 0x2545f491;
  // improve()'s work arrays: B⁻ᵀ(r/√θ_B), the estimates by column, 1/√θ by basis position
  private readonly u: Float64Array;
  private readonly est: Float64Array;
  private readonly inv: Float64Array;
  /** ftranColumn's marks of the positions in its pattern */
  private readonly seen: Int32Array;
  private seenStamp = 0;
  /** nonzeros of each row of A: the LU pivots in short rows where it can (less fill) */
  private readonly rowCount: Int32Array;

  constructor(
    private readonly A: CscMatrix,
    readonly maxUpdates = MAX_UPDATES,
    private readonly fillLimit = FILL_LIMIT,
  ) {
    this.m = A.m;
    this.n = A.n;
    this.basic = new Int32Array(this.m);
    this.position = new Int32Array(this.n + this.m).fill(-1);
    this.lu = new SparseLu(this.m);
    this.work = new Float64Array(this.m);
    this.colWork = new Float64Array(this.m);
    this.colPattern = new Int32Array(this.m);
    this.u = new Float64Array(this.m);
    this.est = new Float64Array(this.n + this.m);
    this.inv = new Float64Array(this.m);
    this.rowCount = new Int32Array(this.m);
    this.seen = new Int32Array(this.m);
    for (let p = 0; p < A.colPtr[this.n]; p++) this.rowCount[A.rowIdx[p]]++;
    this.etaPos = new Int32Array(maxUpdates);
    this.etaPivot = new Float64Array(maxUpdates);
    this.etaPtr = new Int32Array(maxUpdates + 1);
    this.etaIdx = new Int32Array(16 * this.m);
    this.etaVal = new Float64Array(16 * this.m);
  }

  /** nonzeros of the LU factors and of the updates */
  get nonzeros(): number {
    return this.lu.nonzeros + this.etaPtr[this.etaCount];
  }

  /** Picks the basis of largest weight: columns offered heaviest first. */
  build(weight: Float64Array): void {
    const N = this.n + this.m;
    const order = new Int32Array(N);
    for (let j = 0; j < N; j++) order[j] = j;
    order.sort((a, b) => weight[b] - weight[a]);
    const lu = new SparseLu(this.m, 4 * this.m, this.rowCount);
    this.position.fill(-1);
    for (let q = 0; q < N && lu.rank < this.m; q++) this.offer(lu, order[q]);
    this.install(lu);
  }

  /**
   * Factorises the current basis afresh, its columns in the order of triangularFirstOrder (the
   * triangular parts first, the bump in a fill-reducing order): positions are assigned anew. When
   * that LU holds more than `fillLimit` (FILL_LIMIT) times the nonzeros of a fill-free one (a big bump, whose L
   * also fills the columns offered after it), the fill-reducing order over all columns is tried
   * too and the sparser LU kept.
   */
  refactor(): void {
    const cols = Array.from(this.basic);
    const { colPtr, rowIdx } = this.A;
    const start = new Int32Array(cols.length + 1);
    cols.forEach((j, k) => (start[k + 1] = start[k] + (j < this.n ? colPtr[j + 1] - colPtr[j] : 1)));
    const rows = new Int32Array(start[cols.length]);
    cols.forEach((j, k) => {
      if (j < this.n) rows.set(rowIdx.subarray(colPtr[j], colPtr[j + 1]), start[k]);
      else rows[start[k]] = j - this.n;
    });
    const { order } = triangularFirstOrder(this.m, cols.length, start, rows);
    let lu = this.factorIn(Array.from(order, (k) => cols[k]));
    // B's entries and L's unit diagonal: what an LU without fill holds
    if (lu.nonzeros > this.fillLimit * (start[cols.length] + this.m)) {
      const basic = Int32Array.from(this.basic);
      const other = this.factorIn(this.fillReducingOrder(cols));
      if (other.nonzeros < lu.nonzeros) lu = other;
      else {
        this.basic.set(basic);
        this.position.fill(-1);
        basic.forEach((j, k) => (this.position[j] = k));
      }
    }
    this.install(lu);
  }

  /**
   * an LU of the basis with its columns in the given order, positions assigned as they are taken;
   * a column that meets a single free row and only rows whose L columns are empty below the
   * diagonal is taken without a search (SparseLu.offerSingleton; on XL 0.55 µs a column through
   * offer(): such columns are most of a planning basis in triangular-first order)
   */
  private factorIn(cols: number[]): SparseLu {
    const lu = new SparseLu(this.m, Math.max(4 * this.m, this.lu.nonzeros), this.rowCount);
    this.position.fill(-1);
    for (const j of cols) if (this.offerSingleton(lu, j) === 'not-singleton') this.offer(lu, j);
    // columns refused as dependent (rounding after many exchanges) give way to slacks
    for (let i = 0; i < this.m && lu.rank < this.m; i++) if (lu.pinv[i] < 0) this.offer(lu, this.n + i);
    return lu;
  }

  /** columns of Â in the order of columnOrder (slacks first: they cause no fill) */
  private fillReducingOrder(cols: number[]): number[] {
    const slacks = cols.filter((j) => j >= this.n);
    const structural = cols.filter((j) => j < this.n);
    const { colPtr, rowIdx } = this.A;
    const start = new Int32Array(structural.length + 1);
    structural.forEach((j, k) => (start[k + 1] = start[k] + colPtr[j + 1] - colPtr[j]));
    const rows = new Int32Array(start[structural.length]);
    structural.forEach((j, k) => rows.set(rowIdx.subarray(colPtr[j], colPtr[j + 1]), start[k]));
    const order = columnOrder(this.m, structural.length, start, rows);
    return [...slacks, ...Array.from(order, (k) => structural[k])];
  }

  /**
   * Factorises afresh when the updates hold more than `share` of the factors' nonzeros: before a
   * round of CG, where every step applies them twice.
   */
  compact(share: number): void {
    if (this.etaCount > 0 && this.etaPtr[this.etaCount] > share * this.lu.nonzeros) this.refactor();
  }

  /** x ← B⁻¹x (x by row in, by basis position out) */
  ftran(x: Float64Array): void {
    this.lu.solve(x, this.work);
    applyUpdates(this.updateFile, x);
  }

  /** the LU factors of the basis as last factorised (the updates since are applied apart) */
  get factors(): SparseLu {
    return this.lu;
  }

  /** product-form updates since the last factorisation */
  get updateCount(): number {
    return this.etaCount;
  }

  /** the updates as stored, by position */
  get updateFile(): UpdateFile {
    return { count: this.etaCount, pos: this.etaPos, pivot: this.etaPivot, ptr: this.etaPtr, idx: this.etaIdx, val: this.etaVal };
  }

  /**
   * x ← B⁻¹â_j, sparse: x (by position) must be zero on entry; its nonzero positions are left in
   * pattern[0..count), count returned. Costs what the nonzeros cost, not a sweep over all rows.
   */
  ftranColumn(j: number, x: Float64Array, pattern: Int32Array): number {
    let count: number;
    if (j >= this.n) {
      UNIT_ROW[0] = j - this.n;
      count = this.lu.solveSparse(UNIT_ROW, UNIT_VALUE, 0, 1, x, pattern);
    } else {
      const { colPtr, rowIdx, values } = this.A;
      count = this.lu.solveSparse(rowIdx, values, colPtr[j], colPtr[j + 1], x, pattern);
    }
    if (this.etaCount === 0) return count;
    const { etaPos, etaPivot, etaPtr, etaIdx, etaVal, seen } = this;
    const stamp = ++this.seenStamp;
    for (let q = 0; q < count; q++) seen[pattern[q]] = stamp;
    for (let e = 0; e < this.etaCount; e++) {
      const k = etaPos[e];
      const xk = x[k] / etaPivot[e];
      x[k] = xk;
      if (xk === 0) continue;
      for (let p = etaPtr[e]; p < etaPtr[e + 1]; p++) {
        const i = etaIdx[p];
        x[i] -= etaVal[p] * xk;
        if (seen[i] !== stamp) {
          seen[i] = stamp;
          pattern[count++] = i;
        }
      }
    }
    return count;
  }

  /** x ← B⁻ᵀx (x by basis position in, by row out) */
  btran(x: Float64Array): void {
    applyUpdatesTransposed(this.updateFile, x);
    this.lu.solveTransposed(x, this.work);
  }

  /**
   * Exchanges columns while a scaled entry |W_kj| = |(B⁻¹â_j)_k| √(θ_j / θ_basic(k)) exceeds
   * `volumeTolerance`, at most `maxExchanges` times.
   */
  improve(weight: Float64Array, volumeTolerance: number, maxExchanges: number, rounds = 2): MaxVolumeReport {
    const { m, n, A, basic, position } = this;
    const { colPtr: Ap, rowIdx: Ai, values: Ax } = A;
    const N = n + m;
    const { u, est, inv } = this;
    for (let k = 0; k < m; k++) inv[k] = 1 / Math.sqrt(weight[basic[k]]);
    const col = this.colWork;
    const colPattern = this.colPattern;
    let exchanges = 0;
    let examined = 0;
    for (let round = 0; round < rounds && exchanges < maxExchanges; round++) {
      // est_j = |Σ_k r_k W_kj| for random signs r: u = B⁻ᵀ (r / √θ_B), est_j = √θ_j |â_jᵀu|
      for (let k = 0; k < m; k++) u[k] = this.sign() * inv[k];
      this.btran(u);
      const candidates: number[] = [];
      for (let j = 0; j < N; j++) {
        if (position[j] >= 0) continue;
        let s: number;
        if (j < n) {
          s = 0;
          for (let p = Ap[j]; p < Ap[j + 1]; p++) s += Ax[p] * u[Ai[p]];
        } else s = u[j - n];
        est[j] = Math.abs(s) * Math.sqrt(weight[j]);
        if (est[j] > CANDIDATE_FACTOR * volumeTolerance) candidates.push(j);
      }
      if (candidates.length === 0) break;
      candidates.sort((a, b) => est[b] - est[a]);
      // the estimates are column norms, not largest entries: most of the promising columns come
      // first, so a long run of columns without an entry above the tolerance ends the round
      let misses = 0;
      for (const j of candidates) {
        if (exchanges >= maxExchanges || misses >= MISS_LIMIT) break;
        if (position[j] >= 0) continue;
        const count = this.ftranColumn(j, col, colPattern);
        examined++;
        const sj = Math.sqrt(weight[j]);
        let best = -1;
        let bestValue = volumeTolerance;
        for (let q = 0; q < count; q++) {
          const k = colPattern[q];
          const scaled = Math.abs(col[k]) * sj * inv[k];
          if (scaled > bestValue) {
            bestValue = scaled;
            best = k;
          }
        }
        if (best >= 0) this.exchange(best, j, col, colPattern, count);
        for (let q = 0; q < count; q++) col[colPattern[q]] = 0;
        if (best < 0) {
          misses++;
          continue;
        }
        misses = 0;
        exchanges++;
        // a refactorisation renumbers the positions
        if (this.etaCount === 0) for (let k = 0; k < m; k++) inv[k] = 1 / Math.sqrt(weight[basic[k]]);
        else inv[best] = 1 / sj;
      }
    }
    return { exchanges, examined };
  }

  private sign(): number {
    let x = this.seed;
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    this.seed = x;
    return x & 1 ? 1 : -1;
  }

  /** column j enters at position k; w = B⁻¹â_j (by position), nonzero at pattern[0..count) */
  private exchange(k: number, j: number, w: Float64Array, pattern: Int32Array, count: number): void {
    // refactorise once the updates cost more to apply than the factors themselves
    if (this.etaCount === this.maxUpdates || this.etaPtr[this.etaCount] > Math.max(this.lu.nonzeros, this.m)) {
      this.position[this.basic[k]] = -1;
      this.basic[k] = j;
      this.position[j] = k;
      this.refactor();
      return;
    }
    const e = this.etaCount;
    let nz = this.etaPtr[e];
    const need = nz + count;
    if (need > this.etaIdx.length) {
      const cap = Math.max(need, 2 * this.etaIdx.length);
      this.etaIdx = grow(this.etaIdx, cap);
      this.etaVal = growF(this.etaVal, cap);
    }
    for (let q = 0; q < count; q++) {
      const i = pattern[q];
      if (i === k || w[i] === 0) continue;
      this.etaIdx[nz] = i;
      this.etaVal[nz++] = w[i];
    }
    this.etaPos[e] = k;
    this.etaPivot[e] = w[k];
    this.etaPtr[e + 1] = nz;
    this.etaCount = e + 1;
    this.position[this.basic[k]] = -1;
    this.basic[k] = j;
    this.position[j] = k;
  }

  /** offers column j by SparseLu.offerSingleton, which tells whether it could take it that way */
  private offerSingleton(lu: SparseLu, j: number): 'accepted' | 'refused' | 'not-singleton' {
    const k = lu.rank;
    const { colPtr, rowIdx, values } = this.A;
    if (j >= this.n) UNIT_ROW[0] = j - this.n;
    const taken = j >= this.n ? lu.offerSingleton(UNIT_ROW, UNIT_VALUE, 0, 1, DEPENDENCE_TOLERANCE) : lu.offerSingleton(rowIdx, values, colPtr[j], colPtr[j + 1], DEPENDENCE_TOLERANCE);
    if (taken === 'accepted') {
      this.basic[k] = j;
      this.position[j] = k;
    }
    return taken;
  }

  private offer(lu: SparseLu, j: number): void {
    const k = lu.rank;
    let ok: boolean;
    if (j >= this.n) {
      UNIT_ROW[0] = j - this.n;
      ok = lu.offer(UNIT_ROW, UNIT_VALUE, 0, 1, DEPENDENCE_TOLERANCE);
    } else {
      const { colPtr, rowIdx, values } = this.A;
      ok = lu.offer(rowIdx, values, colPtr[j], colPtr[j + 1], DEPENDENCE_TOLERANCE);
    }
    if (ok) {
      this.basic[k] = j;
      this.position[j] = k;
    }
  }

  private install(lu: SparseLu): void {
    this.lu = lu;
    this.etaCount = 0;
  }
}

const UNIT_ROW = new Int32Array(1);
const UNIT_VALUE = Float64Array.of(1);
