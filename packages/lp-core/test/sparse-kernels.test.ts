/**
 * Sparse kernels, one test per matrix pathology after the QDLDL test suite (identity, 1×1,
 * 2×2, rank deficient, zero on the diagonal, a real matrix), with solutions checked against
 * ml-matrix's dense LU solve (a reference library) and AMD fill checked against the natural order.
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { Matrix, solve as denseSolve } from 'ml-matrix';
import { SymmetricFactorisation, estimateFactorFlops, type Kernel, type Ordering } from '../src/sparse/symmetric-factorisation';
import { cscFromTriplets, transpose, multiplyAx, multiplyATy } from '../src/sparse/csc';
import { approximateMinimumDegree } from '../src/sparse/amd';
import { nestedDissection } from '../src/sparse/nested-dissection';
import { symbolicFactor } from '../src/sparse/symbolic';

const strict = { pivotTolerance: 1e-12, dynamicRegularisation: false, bigPivot: 1e128 };

/** factorises a dense symmetric matrix given as rows, using its lower triangle as entries */
let kernel: Kernel = 'supernodal';
function factorDense(M: number[][], ordering: Ordering = 'amd') {
  const rows: number[] = [];
  const cols: number[] = [];
  const vals: number[] = [];
  for (let i = 0; i < M.length; i++)
    for (let j = 0; j <= i; j++)
      if (M[i][j] !== 0 || i === j) {
        rows.push(i);
        cols.push(j);
        vals.push(M[i][j]);
      }
  const F = new SymmetricFactorisation(M.length, Int32Array.from(rows), Int32Array.from(cols), ordering, kernel);
  F.Cx.fill(0);
  vals.forEach((v, t) => (F.Cx[F.slot[t]] += v));
  return { F, report: F.factorise(strict) };
}

function expectSolves(M: number[][], b: number[], F: SymmetricFactorisation) {
  const x = Float64Array.from(b);
  F.solve(x);
  // reference: ml-matrix dense solve
  const ref = denseSolve(new Matrix(M), Matrix.columnVector(b)).to1DArray();
  ref.forEach((v, i) => expect(Math.abs(x[i] - v)).toBeLessThan(1e-9 * (1 + Math.abs(v))));
}

describe.each(['supernodal', 'simplicial'] as const)('LDLᵀ factorisation, %s kernel (QDLDL-style pathologies; reference: ml-matrix dense solve)', (k) => {
  beforeEach(() => {
    kernel = k;
  });
  it('identity', () => {
    const M = [[1, 0, 0], [0, 1, 0], [0, 0, 1]];
    const { F, report } = factorDense(M);
    expect(report.status).toBe('factorised');
    expectSolves(M, [1, 2, 3], F);
  });
  it('1 × 1', () => {
    const { F, report } = factorDense([[4]]);
    expect(report.status).toBe('factorised');
    expectSolves([[4]], [2], F);
  });
  it('2 × 2 (indefinite: D = (1, −3))', () => {
    const M = [[1, 2], [2, 1]];
    const { F, report } = factorDense(M, 'natural');
    expect(report.status).toBe('factorised');
    expect(Array.from(F.D)).toEqual([1, -3]);
    expectSolves(M, [1, -1], F);
  });
  it('rank deficient: fails cleanly with zero_pivot and no NaN', () => {
    // third row = first + second
    const M = [[2, 1, 3], [1, 2, 3], [3, 3, 6]];
    const { F, report } = factorDense(M, 'natural');
    expect(report.status).toBe('zero_pivot');
    expect(report.column).toBe(2);
    expect(Array.from(F.D.subarray(0, 2)).every(Number.isFinite)).toBe(true);
  });
  it('rank deficient with dynamic regularisation: the pivot is replaced and counted', () => {
    const M = [[2, 1, 3], [1, 2, 3], [3, 3, 6]];
    const { F } = factorDense(M, 'natural');
    const r = F.factorise({ ...strict, dynamicRegularisation: true });
    expect(r.status).toBe('factorised');
    expect(r.replacedPivots).toBe(1);
  });
  it('zero on the diagonal (filled by elimination)', () => {
    const M = [[2, 1, 0], [1, 0, 1], [0, 1, 3]];
    const { F, report } = factorDense(M, 'natural');
    expect(report.status).toBe('factorised');
    expectSolves(M, [1, 2, 3], F);
  });
  it('a real normal-equations matrix A Θ Aᵀ (Winston furniture rows, Θ from an interior point)', () => {
    // A: lumber, finishing, carpentry rows of Winston's furniture example
    const A = [[8, 6, 1], [4, 2, 1.5], [2, 1.5, 0.5]];
    const theta = [0.7, 1e-3, 5.2];
    const M = A.map((ri) => A.map((rk) => ri.reduce((s, a, j) => s + a * theta[j] * rk[j], 0)));
    const { F, report } = factorDense(M);
    expect(report.status).toBe('factorised');
    expectSolves(M, [48, 20, 8], F);
  });

  it('a sparse SPD matrix of order 60 (grid Laplacian + I): both kernels agree with the dense solve', () => {
    const k = 6;
    const n = k * 10;
    const M = Array.from({ length: n }, () => new Array(n).fill(0));
    for (let r = 0; r < 10; r++)
      for (let c = 0; c < k; c++) {
        const v = r * k + c;
        M[v][v] = 5;
        if (c + 1 < k) M[v][v + 1] = M[v + 1][v] = -1;
        if (r + 1 < 10) M[v][v + k] = M[v + k][v] = -1;
      }
    const { F, report } = factorDense(M);
    expect(report.status).toBe('factorised');
    expectSolves(M, Array.from({ length: n }, (_, i) => Math.sin(i)), F);
  });
});

describe('CSC helpers (checked by hand on a 2 × 3 matrix)', () => {
  it('sums duplicates, transposes and multiplies', () => {
    // A = [[1, 0, 2], [0, 3, 4]] with the (0,2) entry given as 1 + 1
    const A = cscFromTriplets(2, 3, [0, 1, 0, 1, 0], [0, 1, 2, 2, 2], [1, 3, 1, 4, 1]);
    expect(Array.from(A.colPtr)).toEqual([0, 1, 2, 4]);
    expect(Array.from(A.values)).toEqual([1, 3, 2, 4]);
    const y = new Float64Array(2);
    multiplyAx(A, [1, 1, 1], y);
    expect(Array.from(y)).toEqual([3, 7]);
    const x = new Float64Array(3);
    multiplyATy(A, [1, 1], x);
    expect(Array.from(x)).toEqual([1, 3, 6]);
    const T = transpose(A);
    expect(T.m).toBe(3);
    expect(Array.from(T.rowIdx)).toEqual([0, 2, 1, 2]);
  });
  it('rejects an index outside the matrix with a clear message', () => {
    expect(() => cscFromTriplets(2, 2, [2], [0], [1])).toThrow('row index 2 outside 0..1');
  });
});

/** nnz(L) of the upper-triangle pattern of P M Pᵀ */
function fillOf(n: number, edges: [number, number][], perm: Int32Array): number {
  const pinv = new Int32Array(n);
  perm.forEach((g, k) => (pinv[g] = k));
  const cols: number[][] = Array.from({ length: n }, (_, k) => [k]);
  for (const [i, j] of edges) {
    const a = pinv[i];
    const b = pinv[j];
    cols[Math.max(a, b)].push(Math.min(a, b));
  }
  const Cp = new Int32Array(n + 1);
  cols.forEach((c, k) => (Cp[k + 1] = Cp[k] + c.length));
  const Ci = Int32Array.from(cols.flatMap((c) => c.sort((x, y) => x - y)));
  return symbolicFactor(n, Cp, Ci).nnzL;
}

function amdOf(n: number, edges: [number, number][], order = approximateMinimumDegree): Int32Array {
  const rows = Int32Array.from(edges.map((e) => e[0]));
  const cols = Int32Array.from(edges.map((e) => e[1]));
  const Ap = new Int32Array(n + 1);
  edges.forEach(([, j]) => Ap[j + 1]++);
  for (let j = 0; j < n; j++) Ap[j + 1] += Ap[j];
  const fill = Ap.slice(0, n);
  const Ai = new Int32Array(edges.length);
  edges.forEach(([i, j]) => (Ai[fill[j]++] = i));
  void rows;
  void cols;
  return order(n, Ap, Ai);
}

describe('approximate minimum degree (fill against the natural order; common practice, no source)', () => {
  const natural = (n: number) => Int32Array.from({ length: n }, (_, i) => i);
  it('arrowhead with the dense node first: natural order fills completely, AMD gives no fill', () => {
    const n = 40;
    const edges: [number, number][] = [];
    for (let i = 1; i < n; i++) edges.push([i, 0]);
    const perm = amdOf(n, edges);
    expect(new Set(perm).size).toBe(n);
    expect(fillOf(n, edges, natural(n))).toBe((n * (n - 1)) / 2);
    expect(fillOf(n, edges, perm)).toBe(n - 1);
  });
  it('banded (bandwidth 3): AMD never increases fill', () => {
    const n = 200;
    const edges: [number, number][] = [];
    for (let i = 0; i < n; i++) for (let d = 1; d <= 3 && i + d < n; d++) edges.push([i + d, i]);
    const perm = amdOf(n, edges);
    expect(new Set(perm).size).toBe(n);
    expect(fillOf(n, edges, perm)).toBeLessThanOrEqual(fillOf(n, edges, natural(n)));
  });
  it('2-D grid 30 × 30: AMD reduces fill well below the banded natural order', () => {
    const k = 30;
    const n = k * k;
    const edges: [number, number][] = [];
    for (let r = 0; r < k; r++)
      for (let c = 0; c < k; c++) {
        if (c + 1 < k) edges.push([r * k + c + 1, r * k + c]);
        if (r + 1 < k) edges.push([(r + 1) * k + c, r * k + c]);
      }
    const perm = amdOf(n, edges);
    expect(new Set(perm).size).toBe(n);
    const amd = fillOf(n, edges, perm);
    const nat = fillOf(n, edges, natural(n));
    expect(amd).toBeLessThan(0.7 * nat);
  });
});

describe('nested dissection (fill against the natural order; common practice, no source)', () => {
  /** a 60 × 60 grid: banded natural order fills ~n^1.5, dissection ~n log n */
  const k = 60;
  const n = k * k;
  const edges: [number, number][] = [];
  for (let r = 0; r < k; r++)
    for (let c = 0; c < k; c++) {
      if (c + 1 < k) edges.push([r * k + c + 1, r * k + c]);
      if (r + 1 < k) edges.push([(r + 1) * k + c, r * k + c]);
    }
  it('is a permutation and needs less fill than the natural order on a grid', () => {
    const perm = amdOf(n, edges, nestedDissection);
    expect(new Set(perm).size).toBe(n);
    const natural = Int32Array.from({ length: n }, (_, i) => i);
    expect(fillOf(n, edges, perm)).toBeLessThan(0.8 * fillOf(n, edges, natural));
  });
  it('a grid Laplacian factorised in nested-dissection order solves like the dense LU (wide supernodes)', () => {
    const g = 24;
    const N = g * g;
    const M = Array.from({ length: N }, () => new Array(N).fill(0));
    const rows: number[] = [];
    const cols: number[] = [];
    for (let v = 0; v < N; v++) {
      M[v][v] = 4.5;
      rows.push(v);
      cols.push(v);
      const r = Math.floor(v / g);
      const c = v % g;
      if (c + 1 < g) {
        M[v][v + 1] = M[v + 1][v] = -1;
        rows.push(v + 1);
        cols.push(v);
      }
      if (r + 1 < g) {
        M[v][v + g] = M[v + g][v] = -1;
        rows.push(v + g);
        cols.push(v);
      }
    }
    const F = new SymmetricFactorisation(N, Int32Array.from(rows), Int32Array.from(cols), 'nd');
    rows.forEach((i, t) => (F.Cx[F.slot[t]] += M[i][cols[t]]));
    expect(F.factorise(strict).status).toBe('factorised');
    expectSolves(M, Array.from({ length: N }, (_, i) => Math.cos(i)), F);
  });
  it("'auto' keeps the cheaper of AMD and nested dissection", () => {
    const rows = Int32Array.from(edges.map((e) => e[0]).concat(Array.from({ length: n }, (_, i) => i)));
    const cols = Int32Array.from(edges.map((e) => e[1]).concat(Array.from({ length: n }, (_, i) => i)));
    const auto = new SymmetricFactorisation(n, rows, cols, 'auto');
    const amd = new SymmetricFactorisation(n, rows, cols, 'amd');
    const nd = new SymmetricFactorisation(n, rows, cols, 'nd');
    expect(auto.flops).toBe(Math.min(amd.flops, nd.flops));
  });
  it('the flops estimate in AMD order needs no factorisation, and its order, handed on, gives the factorisation AMD itself gives', () => {
    const rows = Int32Array.from(edges.map((e) => e[0]).concat(Array.from({ length: n }, (_, i) => i)));
    const cols = Int32Array.from(edges.map((e) => e[1]).concat(Array.from({ length: n }, (_, i) => i)));
    const estimate = estimateFactorFlops(n, rows, cols);
    expect(estimate.atLeast).toBe(false);
    expect([...estimate.order!].sort((a, b) => a - b)).toEqual([...Array(n).keys()]);
    const amd = new SymmetricFactorisation(n, rows, cols, 'amd');
    const reused = new SymmetricFactorisation(n, rows, cols, 'amd', 'supernodal', Infinity, false, estimate.order);
    expect([...reused.perm]).toEqual([...amd.perm]);
    expect(reused.flops).toBe(amd.flops);
    // column counts squared with the diagonal: no more than the supernodal count, which may add explicit zeros
    expect(estimate.flops).toBeGreaterThan(0);
    expect(estimate.flops).toBeLessThanOrEqual(amd.flops);
  });
  it('counted up to a limit, the estimate stops once the ordering reaches it, a lower bound then; otherwise it is the whole count', () => {
    // the grid, and the grid with a row set aside as dense (899 entries > 10·√n), which the
    // ordering's own count leaves out and the tree's count takes in
    const denseRow = Array.from({ length: 899 }, (_, t): [number, number] => [4 * (t + 1) + 1, 0]);
    for (const pattern of [edges, edges.concat(denseRow)]) {
      const rows = Int32Array.from(pattern.map((e) => e[0]).concat(Array.from({ length: n }, (_, i) => i)));
      const cols = Int32Array.from(pattern.map((e) => e[1]).concat(Array.from({ length: n }, (_, i) => i)));
      const whole = estimateFactorFlops(n, rows, cols);
      const stops: boolean[] = [];
      for (const share of [1e-6, 0.01, 0.1, 0.5, 0.9, 0.999, 1, 1.001, 2]) {
        const limit = Math.round(share * whole.flops);
        const part = estimateFactorFlops(n, rows, cols, limit);
        stops.push(part.atLeast);
        if (part.atLeast) {
          expect(part.flops).toBe(limit);
          expect(part.order).toBeNull();
        } else {
          expect(part.flops).toBe(whole.flops);
          expect([...part.order!]).toEqual([...whole.order!]);
        }
      }
      // below the whole count it stops, above it does not; the dense row's part may be missed
      expect(stops.slice(0, 5)).toEqual([true, true, true, true, true]);
      expect(stops.slice(7)).toEqual([false, false]);
    }
  });
});
