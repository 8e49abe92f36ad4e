/**
 * Conjugate gradients with a basis preconditioner (ipm/basis-cg-solver.ts, ipm/basis-preconditioner.ts),
 * alone ('basis-cg') and after six Cholesky iterations ('cholesky-then-basis-cg'):
 *  - the Netlib problems reach the optima published for the collection (glpk-doc's table, as in
 *    netlib.test.ts; e226 with its objective constant against HiGHS);
 *  - seeded random LPs (feasible, degenerate, infeasible, unbounded) and a planning LP of the
 *    benchmark's shape agree with HiGHS (npm `highs`) in status and objective;
 *  - the basis after the maximum-volume exchanges has no scaled entry |W_kj| above the tolerance,
 *    and its solves agree with ml-matrix's dense LU solve (a reference library), and so does the
 *    split system's product I + W Wᵀ (ipm/split-system.ts).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { Matrix, solve as denseSolve } from 'ml-matrix';
import { solve, solveWithHighs } from '../src/index';
import { BasisPreconditioner } from '../src/ipm/basis-preconditioner';
import { BasisCgSolver, type CholeskyOption } from '../src/ipm/basis-cg-solver';
import { SplitSystem } from '../src/ipm/split-system';
import { cscFromTriplets } from '../src/sparse/csc';
import { chooseKktSolver } from '../src/ipm/choose-kkt-solver';
import type { IpmProblem } from '../src/ipm/ipm-problem';
import { NormalEquations } from '../src/ipm/normal-equations';
import { resolveSettings } from '../src/settings';
import type { Problem } from '../src/problem/problem';
import { PLANNING_SIZES, planningProblem } from '../bench/planning-lp';
import { type NetlibTableEntry, loadNetlib } from './support/netlib';
import { type RandomKind, randomProblem } from './support/random-problems';
import { SeededRandom } from './support/seeded-random';

const TOLERANCE = 1e-6;
const relativeError = (a: number, b: number) => Math.abs(a - b) / Math.max(1, Math.abs(b));
const SOLVERS = ['basis-cg', 'cholesky-then-basis-cg'] as const;

describe('Netlib problems with conjugate gradients', () => {
  let table: Map<string, NetlibTableEntry>;
  let problems: Map<string, Problem>;
  beforeAll(() => {
    ({ table, problems } = loadNetlib());
  }, 120_000);

  const cases = SOLVERS.flatMap((s) => ['afiro', 'brandy', 'finnis'].map((name) => [s, name] as const));
  it.each(cases)('%s: %s reaches the published optimum', (linearSolver, name) => {
    const r = solve(problems.get(name)!, { linearSolver });
    expect(r.status).toBe('optimal');
    expect(relativeError(r.objective, table.get(name)!.optimum)).toBeLessThanOrEqual(TOLERANCE);
    expect(r.certificate.primalResidual).toBeLessThanOrEqual(1e-6);
    expect(r.certificate.relativeGap).toBeLessThanOrEqual(1e-6);
  });

  it.each(SOLVERS)('%s: e226 (objective constant 7.113) agrees with HiGHS and with −11.638929066', async (linearSolver) => {
    const p = problems.get('e226')!;
    const r = solve(p, { linearSolver });
    const reference = await solveWithHighs(p);
    expect(r.status).toBe('optimal');
    expect(relativeError(r.objective, reference.objective)).toBeLessThanOrEqual(TOLERANCE);
    expect(relativeError(r.objective, -11.638929066)).toBeLessThanOrEqual(TOLERANCE);
  });
});

describe('random LPs with conjugate gradients against HiGHS', () => {
  const KINDS: RandomKind[] = ['feasible', 'degenerate', 'infeasible', 'unbounded'];
  const expected = (kind: RandomKind) => (kind === 'infeasible' || kind === 'unbounded' ? kind : 'optimal');
  const cases = SOLVERS.flatMap((s) => KINDS.flatMap((kind) => [31, 32].map((seed) => [s, kind, seed] as const)));
  it.each(cases)('%s: %s seed %i', async (linearSolver, kind, seed) => {
    const problem = randomProblem(seed, { rows: 120, cols: 180, perColumn: 4, kind });
    const ours = solve(problem, { linearSolver });
    const reference = await solveWithHighs(problem);
    expect(reference.status).toBe(expected(kind));
    expect(ours.status).toBe(reference.status);
    if (ours.status === 'optimal') expect(relativeError(ours.objective, reference.objective)).toBeLessThanOrEqual(TOLERANCE);
  });
});

describe('a planning LP of the benchmark shape (M size, 2340 rows)', () => {
  it.each([...SOLVERS, 'auto'] as const)('%s agrees with HiGHS', async (linearSolver) => {
    const p = planningProblem(PLANNING_SIZES.M, 5, 'planning-M');
    const ours = solve(p, { linearSolver });
    const reference = await solveWithHighs(p, { method: 'ipm', crossover: false });
    expect(ours.status).toBe('optimal');
    expect(relativeError(ours.objective, reference.objective)).toBeLessThanOrEqual(TOLERANCE);
    expect(ours.certificate.primalResidual).toBeLessThanOrEqual(1e-6);
  }, 60_000);
});

/** the IPM form of a random LP, unscaled: v = (x, w), w = A x with the row bounds */
function ipmForm(p: Problem): IpmProblem {
  const { m, n } = p.A;
  return {
    n,
    m,
    A: p.A,
    c: p.c,
    c0: p.c0,
    lower: Float64Array.from([...p.colLower, ...p.rowLower]),
    upper: Float64Array.from([...p.colUpper, ...p.rowUpper]),
    colScale: new Float64Array(n).fill(1),
    rowScale: new Float64Array(m).fill(1),
  };
}

/** a Cholesky solver of prob's normal equations, for the CG solver's first iterations and fall-back */
function choleskyOf(prob: IpmProblem): CholeskyOption {
  const direct = new NormalEquations(prob, resolveSettings());
  return { flops: direct.flops, create: () => direct };
}

describe('one Newton system solved both ways', () => {
  it('CG with the basis preconditioner gives the Cholesky solver\'s direction; with fall-back set it goes back to Cholesky once CG costs more', () => {
    const p = randomProblem(43, { rows: 50, cols: 80, perColumn: 4, kind: 'feasible' });
    const prob = ipmForm(p);
    const { m, n } = p.A;
    const settings = resolveSettings();
    const rng = new SeededRandom(9);
    // barrier diagonals spread over twelve orders of magnitude, as late in a solve
    const D = Float64Array.from({ length: n + m }, () => 10 ** rng.uniform(-6, 6));
    const rhat = Float64Array.from({ length: n + m }, () => rng.uniform(-1, 1));
    // rp = 0: a feasible iterate, where CG must solve to its tight target (1e-9 of the right-hand side)
    const rp = new Float64Array(m);
    const direct = new NormalEquations(prob, settings);
    expect(direct.factorise(D)).toBe('factorised');
    const dvRef = new Float64Array(n + m);
    const dyRef = new Float64Array(m);
    direct.solve(rhat, rp, dvRef, dyRef);

    // Cholesky for one iteration, then CG; a tiny model's factorisation is cheap, so CG costs more
    const cg = new BasisCgSolver(prob, settings, choleskyOf(prob), 1, true);
    expect(cg.factorise(D)).toBe('factorised');
    expect(cg.preconditioner).toBe('direct');
    expect(cg.factorise(D)).toBe('factorised');
    expect(cg.preconditioner).toBe('basis');
    const dv = new Float64Array(n + m);
    const dy = new Float64Array(m);
    cg.solve(rhat, rp, dv, dy);
    const scale = Math.max(...dyRef.map(Math.abs));
    dyRef.forEach((v, i) => expect(Math.abs(dy[i] - v)).toBeLessThanOrEqual(1e-6 * scale));
    expect(cg.stats.steps.at(-1)).toBeGreaterThan(0);
    expect(cg.factorise(D)).toBe('factorised');
    expect(cg.preconditioner).toBe('direct');
    // without fall-back it stays on CG
    const stay = new BasisCgSolver(prob, settings, choleskyOf(prob), 1, false);
    stay.factorise(D);
    stay.factorise(D);
    stay.solve(rhat, rp, dv, dy);
    stay.factorise(D);
    expect(stay.preconditioner).toBe('basis');
    // a lower bound on the factorisation's cost is counted further before the solve goes back
    for (const exact of [choleskyOf(prob).flops, 1e15]) {
      const limits: number[] = [];
      const countFlops = (limit: number) => (limits.push(limit), exact >= limit ? { flops: limit, atLeast: true } : { flops: exact, atLeast: false });
      const bound = { ...choleskyOf(prob), flops: 1, atLeast: true, countFlops };
      const weighed = new BasisCgSolver(prob, settings, bound, 1, true);
      weighed.factorise(D);
      weighed.factorise(D);
      weighed.solve(rhat, rp, dv, dy);
      weighed.factorise(D);
      weighed.solve(rhat, rp, dv, dy);
      weighed.factorise(D);
      // counted once, far enough ahead that the next iteration did not count again
      expect(limits).toHaveLength(1);
      expect(limits[0]).toBeGreaterThan(1);
      expect(weighed.preconditioner).toBe(exact === 1e15 ? 'basis' : 'direct');
    }
  });

  it('a second solve in the same iteration starts from the first one\'s dy: the same system again takes no step', () => {
    const p = randomProblem(44, { rows: 50, cols: 80, perColumn: 4, kind: 'feasible' });
    const prob = ipmForm(p);
    const { m, n } = p.A;
    const rng = new SeededRandom(10);
    const D = Float64Array.from({ length: n + m }, () => 10 ** rng.uniform(-4, 4));
    const rhat = Float64Array.from({ length: n + m }, () => rng.uniform(-1, 1));
    const rp = new Float64Array(m);
    const cg = new BasisCgSolver(prob, resolveSettings(), choleskyOf(prob), 1);
    cg.factorise(D);
    cg.factorise(D);
    const dv = new Float64Array(n + m);
    const dy = new Float64Array(m);
    cg.solve(rhat, rp, dv, dy);
    expect(cg.stats.steps.at(-1)).toBeGreaterThan(0);
    const dy2 = new Float64Array(m);
    cg.solve(rhat, rp, dv, dy2);
    expect(cg.stats.steps.at(-1)).toBe(0);
    expect([...dy2]).toEqual([...dy]);
    // a new iteration does not reuse it
    cg.factorise(D);
    cg.solve(rhat, rp, dv, dy2);
    expect(cg.stats.steps.at(-1)).toBeGreaterThan(0);
  });
});

describe('a step with the basis preconditioner is primal-feasible however early CG stops', () => {
  it('Â dv = rp to rounding, and the complementarity shift is D dv − (r̂ + Âᵀdy) on the basic columns only', () => {
    const p = randomProblem(45, { rows: 60, cols: 90, perColumn: 4, kind: 'feasible' });
    const prob = ipmForm(p);
    const { m, n, colPtr, rowIdx, values } = p.A;
    const rng = new SeededRandom(11);
    const D = Float64Array.from({ length: n + m }, () => 10 ** rng.uniform(-4, 4));
    const rhat = Float64Array.from({ length: n + m }, () => rng.uniform(-1, 1));
    const rp = Float64Array.from({ length: m }, () => rng.uniform(-1, 1));
    const cg = new BasisCgSolver(prob, resolveSettings(), choleskyOf(prob), 1);
    cg.factorise(D);
    // a large μ: CG may stop at 0.3·√μ on the scaled residual, far from the exact solution
    cg.factorise(D, Infinity, 100);
    expect(cg.preconditioner).toBe('basis');
    const dv = new Float64Array(n + m);
    const dy = new Float64Array(m);
    cg.solve(rhat, rp, dv, dy);
    const shift = cg.complementarityShift!;
    expect(shift).not.toBeNull();
    // Â = [A −I]: the primal residual of the step
    const primal = (v: Float64Array) => {
      const r = Float64Array.from(rp, (b, i) => b + v[n + i]);
      for (let j = 0; j < n; j++) for (let q = colPtr[j]; q < colPtr[j + 1]; q++) r[rowIdx[q]] -= values[q] * v[j];
      return Math.max(...r.map(Math.abs));
    };
    expect(primal(dv)).toBeLessThanOrEqual(1e-10);
    // the first block equation's error e_j = D_j dv_j − (r̂_j + Âᵀ_j dy), column by column
    const firstBlock = Float64Array.from({ length: n + m }, (_, j) => {
      if (j >= n) return D[j] * dv[j] - (rhat[j] - dy[j - n]);
      let s = rhat[j];
      for (let q = colPtr[j]; q < colPtr[j + 1]; q++) s += values[q] * dy[rowIdx[q]];
      return D[j] * dv[j] - s;
    });
    let basic = 0;
    for (let j = 0; j < n + m; j++) {
      expect(Math.abs(shift[j] - firstBlock[j])).toBeLessThanOrEqual(1e-8 * (1 + Math.abs(firstBlock[j])));
      if (shift[j] !== 0) basic++;
    }
    expect(basic).toBeGreaterThan(0);
    expect(basic).toBeLessThanOrEqual(m);
    // the test means something only if CG did stop early: dv from dy alone misses rp
    const fromDy = Float64Array.from({ length: n + m }, (_, j) => (firstBlock[j] === 0 ? dv[j] : dv[j] - firstBlock[j] / D[j]));
    expect(primal(fromDy)).toBeGreaterThan(1e-6);
    // a Cholesky solve leaves no shift
    const direct = new BasisCgSolver(prob, resolveSettings(), choleskyOf(prob), 5);
    direct.factorise(D);
    direct.solve(rhat, rp, dv, dy);
    expect(direct.complementarityShift).toBeNull();
  });
});

describe("'auto' picks the linear solver by what a factorisation costs", () => {
  // thresholds: CG_MIN_FLOPS and CG_FLOPS_PER_NONZERO in choose-kkt-solver.ts
  it('planning LP of the benchmark\'s S size (about 4e5 multiply–adds a factorisation): Cholesky', () => {
    const kkt = chooseKktSolver(ipmForm(planningProblem(PLANNING_SIZES.S, 1, 'S')), resolveSettings());
    expect(kkt).toBeInstanceOf(NormalEquations);
  });

  it('M size (about 3.6e8 multiply–adds, 22000 per nonzero of [A I]): conjugate gradients, falling back on the factorisation', () => {
    const kkt = chooseKktSolver(ipmForm(planningProblem(PLANNING_SIZES.M, 1, 'M')), resolveSettings());
    expect(kkt).toBeInstanceOf(BasisCgSolver);
    expect((kkt as BasisCgSolver).preconditioner).toBe('diagonal');
  });

  it("'cholesky' keeps the factorisation for M", () => {
    const kkt = chooseKktSolver(ipmForm(planningProblem(PLANNING_SIZES.M, 1, 'M')), resolveSettings({ linearSolver: 'cholesky' }));
    expect(kkt).toBeInstanceOf(NormalEquations);
  });
});

describe('the basis preconditioner', () => {
  /** dense B (columns of [A I] at the basis positions) */
  function denseBasis(p: Problem, basic: Int32Array): Matrix {
    const { m, n, colPtr, rowIdx, values } = p.A;
    const B = Matrix.zeros(m, m);
    basic.forEach((j, k) => {
      if (j >= n) B.set(j - n, k, 1);
      else for (let q = colPtr[j]; q < colPtr[j + 1]; q++) B.set(rowIdx[q], k, values[q]);
    });
    return B;
  }

  /** column j of Â = [A I], dense */
  function denseColumn(p: Problem, j: number): Matrix {
    const { m, n, colPtr, rowIdx, values } = p.A;
    const a = Matrix.zeros(m, 1);
    if (j >= n) a.set(j - n, 0, 1);
    else for (let q = colPtr[j]; q < colPtr[j + 1]; q++) a.set(rowIdx[q], 0, values[q]);
    return a;
  }

  /** a random LP's basis built greedily from weights spread over twelve orders of magnitude */
  function weightedBasis(problemSeed: number, weightSeed: number) {
    const p = randomProblem(problemSeed, { rows: 60, cols: 90, perColumn: 4, kind: 'feasible' });
    const { m, n } = p.A;
    const rng = new SeededRandom(weightSeed);
    const weight = Float64Array.from({ length: n + m }, () => 10 ** rng.uniform(-6, 6));
    const basis = new BasisPreconditioner(p.A, 20);
    basis.build(weight);
    return { p, m, n, rng, weight, basis };
  }

  /** B⁻¹b through the LU and its updates equals ml-matrix's dense solve, for a random b */
  function expectFtranLikeDense(basis: BasisPreconditioner, B: Matrix, rng: SeededRandom): void {
    const b = Array.from({ length: B.rows }, () => rng.uniform(-1, 1));
    const x = Float64Array.from(b);
    basis.ftran(x);
    denseSolve(B, Matrix.columnVector(b)).to1DArray().forEach((v, i) => expect(x[i]).toBeCloseTo(v, 8));
  }

  it('after the exchanges no scaled entry of B⁻¹N exceeds the tolerance, and B x = b, Bᵀ y = c match the dense solve', () => {
    const { p, m, n, rng, weight, basis } = weightedBasis(41, 5);
    const report = basis.improve(weight, 2, 10_000, 50);
    expect(report.exchanges).toBeGreaterThan(0); // the greedy basis was not already the answer
    const B = denseBasis(p, basis.basic);
    // every nonbasic column: |(B⁻¹ â_j)_k| √(θ_j / θ_basic(k)) ≤ 2 (+ rounding)
    let worst = 0;
    for (let j = 0; j < n + m; j++) {
      if (basis.position[j] >= 0) continue;
      const a = denseColumn(p, j);
      const w = denseSolve(B, a).to1DArray();
      w.forEach((v, k) => (worst = Math.max(worst, (Math.abs(v) * Math.sqrt(weight[j])) / Math.sqrt(weight[basis.basic[k]]))));
    }
    expect(worst).toBeLessThanOrEqual(2 + 1e-9);
    // solves through the product-form updates
    expectFtranLikeDense(basis, B, rng);
    const b = Array.from({ length: m }, () => rng.uniform(-1, 1));
    const y = Float64Array.from(b);
    basis.btran(y);
    const refY = denseSolve(B.transpose(), Matrix.columnVector(b)).to1DArray();
    refY.forEach((v, i) => expect(y[i]).toBeCloseTo(v, 8));
    // the sparse solve with a column of Â (through L, U and the updates) gives the dense answer,
    // and its pattern holds every nonzero
    let checked = 0;
    for (let j = 0; j < n + m; j++) {
      if (basis.position[j] >= 0) continue;
      const a = denseColumn(p, j);
      const ref = denseSolve(B, a).to1DArray();
      const w = new Float64Array(m);
      const pattern = new Int32Array(m);
      const count = basis.ftranColumn(j, w, pattern);
      const inPattern = new Set(pattern.subarray(0, count));
      ref.forEach((v, k) => {
        expect(w[k]).toBeCloseTo(v, 8);
        if (Math.abs(v) > 1e-12) expect(inPattern.has(k)).toBe(true);
      });
      checked++;
    }
    expect(checked).toBe(n);
  });

  it('a fresh factorisation after a few exchanges drops the updates and still solves like the dense LU', () => {
    const { p, rng, weight, basis } = weightedBasis(46, 6);
    const report = basis.improve(weight, 2, 3, 1);
    expect(report.exchanges).toBeGreaterThan(0);
    expect(basis.updateCount).toBeGreaterThan(0);
    basis.refactor();
    expect(basis.updateCount).toBe(0);
    expectFtranLikeDense(basis, denseBasis(p, basis.basic), rng);
  });

  it('a refactorisation that fills past the limit also tries the fill-reducing order and keeps the sparser LU; either way it solves like the dense LU', () => {
    const { p, rng, weight } = weightedBasis(48, 8);
    const sizes: number[] = [];
    for (const fillLimit of [Infinity, 0]) {
      // Infinity: the triangular-first order alone; 0: both orders, the sparser kept
      const basis = new BasisPreconditioner(p.A, 20, fillLimit);
      basis.build(weight);
      basis.refactor();
      sizes.push(basis.nonzeros);
      expectFtranLikeDense(basis, denseBasis(p, basis.basic), rng);
      basis.basic.forEach((j, k) => expect(basis.position[j]).toBe(k));
    }
    expect(sizes[1]).toBeLessThanOrEqual(sizes[0]);
  });

  it("the split system's product is x + W Wᵀx, W = Θ_B^{-1/2} B⁻¹ N Θ_N^{1/2} formed densely, with updates pending and after a fresh factorisation, alone and with the helper thread, whole and taken apart", () => {
    // A random LP's matrix with eight single-entry columns appended (they go on the split
    // system's diagonal) and a few columns of weight 0 (left out of N)
    const base = randomProblem(47, { rows: 40, cols: 60, perColumn: 4, kind: 'feasible' }).A;
    const rng = new SeededRandom(7);
    const rows: number[] = [];
    const cols: number[] = [];
    const vals: number[] = [];
    for (let j = 0; j < base.n; j++)
      for (let q = base.colPtr[j]; q < base.colPtr[j + 1]; q++) {
        rows.push(base.rowIdx[q]);
        cols.push(j);
        vals.push(base.values[q]);
      }
    for (let k = 0; k < 8; k++) {
      rows.push(rng.integer(0, base.m - 1));
      cols.push(base.n + k);
      vals.push(rng.uniform(0.5, 3));
    }
    const A = cscFromTriplets(base.m, base.n + 8, rows, cols, vals);
    const { m, n } = A;
    const weight = Float64Array.from({ length: n + m }, () => 10 ** rng.uniform(-4, 4));
    for (const j of [3, 17, 61]) weight[j] = 0;
    const basis = new BasisPreconditioner(A, 20);
    basis.build(weight);
    basis.refactor();
    const p = { A } as Problem;
    const expectLikeDense = () => {
      const B = denseBasis(p, basis.basic);
      const nonbasic = Array.from({ length: n + m }, (_, j) => j).filter((j) => basis.position[j] < 0);
      const N = new Matrix(m, nonbasic.length);
      nonbasic.forEach((j, c) => denseColumn(p, j).to1DArray().forEach((v, i) => N.set(i, c, v * Math.sqrt(weight[j]))));
      const W = denseSolve(B, N);
      basis.basic.forEach((j, k) => {
        for (let c = 0; c < nonbasic.length; c++) W.set(k, c, W.get(k, c) / Math.sqrt(weight[j]));
      });
      const x = Float64Array.from({ length: m }, () => rng.uniform(-1, 1));
      const X = Matrix.columnVector(Array.from(x));
      const ref = W.mmul(W.transpose().mmul(X)).add(X).to1DArray();
      // on this thread, and with the helper thread taking part of N's product (any size will do)
      for (const parallel of [false, true]) {
        const split = new SplitSystem(m, parallel, 0);
        split.prepare(basis, A, weight);
        // the split system numbers position k by the row pivoted there
        const row = basis.factors.pivotRow;
        const xByRow = new Float64Array(m);
        x.forEach((v, k) => (xByRow[row[k]] = v));
        const out = new Float64Array(m);
        split.begin();
        const xOut = split.apply(xByRow, out);
        split.end();
        ref.forEach((v, k) => expect(out[row[k]]).toBeCloseTo(v, 7));
        expect(xOut).toBeCloseTo(ref.reduce((s, v, k) => s + v * x[k], 0), 6);
        // taken apart (krylov.ts folds the ends into its passes): x + s ∘ R(s ∘ x), and xᵀ(I + W Wᵀ)x − xᵀx
        const scale = split.fusedScale;
        expect(scale === null).toBe(basis.updateCount > 0);
        if (scale) {
          xByRow.forEach((v, i) => (split.input[i] = scale[i] * v));
          const raw = new Float64Array(m);
          split.begin();
          const quadratic = split.applyToInput(raw);
          split.end();
          ref.forEach((v, k) => expect(xByRow[row[k]] + scale[row[k]] * raw[row[k]]).toBeCloseTo(v, 7));
          expect(quadratic).toBeCloseTo(xOut - x.reduce((s, v) => s + v * v, 0), 6);
        }
      }
    };
    const report = basis.improve(weight, 1.5, 10, 1);
    expect(report.exchanges).toBeGreaterThan(0);
    expect(basis.updateCount).toBeGreaterThan(0); // the product-form updates are in the product
    expectLikeDense();
    basis.refactor();
    expect(basis.updateCount).toBe(0);
    expectLikeDense();
  });

  it('the greedy build takes the heaviest independent columns: with slacks heaviest, B is the identity', () => {
    const p = randomProblem(42, { rows: 20, cols: 30, perColumn: 3, kind: 'feasible' });
    const { m, n } = p.A;
    const weight = new Float64Array(n + m);
    for (let j = 0; j < n; j++) weight[j] = 1;
    for (let i = 0; i < m; i++) weight[n + i] = 100;
    const basis = new BasisPreconditioner(p.A);
    basis.build(weight);
    expect([...basis.basic].sort((a, b) => a - b)).toEqual(Array.from({ length: m }, (_, i) => n + i));
  });
});
