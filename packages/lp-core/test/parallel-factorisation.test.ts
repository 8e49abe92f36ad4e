/**
 * The two-thread supernodal factorisation (a helper worker thread on shared memory) against the
 * one-thread one, on a 3-D grid Laplacian big enough to be split (its nested-dissection root is a
 * dense 342-column block, wide enough for both threads to share its trailing updates); after it
 * the triangular solves run on both threads too (each half of the tree on its own thread, the top
 * on the caller's).
 * Checks: the residual of the solve (‖M x − b‖ small relative to ‖b‖: a property of any correct
 * factorisation, common practice, no source), agreement with the one-thread factor and solve, and
 * the pivot reports of both threads (zero pivots found in either half are reported, replaced
 * pivots counted).
 */
import { availableParallelism } from 'node:os';
import { describe, expect, it } from 'vitest';
import { SymmetricFactorisation, upperPattern } from '../src/sparse/symmetric-factorisation';
import { splitSubtrees } from '../src/sparse/subtree-split';
import { supernodalSymbolic } from '../src/sparse/supernodal-symbolic';

const strict = { pivotTolerance: 1e-12, dynamicRegularisation: false, bigPivot: 1e128 };
const k = 18;
const n = k * k * k;

/** lower-triangle entries of the 7-point Laplacian on a k³ grid plus shift·I */
function gridEntries(): { rows: Int32Array; cols: Int32Array; vals: Float64Array } {
  const rows: number[] = [];
  const cols: number[] = [];
  const vals: number[] = [];
  const id = (x: number, y: number, z: number) => (z * k + y) * k + x;
  for (let z = 0; z < k; z++)
    for (let y = 0; y < k; y++)
      for (let x = 0; x < k; x++) {
        const v = id(x, y, z);
        rows.push(v);
        cols.push(v);
        vals.push(6.5);
        if (x + 1 < k) (rows.push(id(x + 1, y, z)), cols.push(v), vals.push(-1));
        if (y + 1 < k) (rows.push(id(x, y + 1, z)), cols.push(v), vals.push(-1));
        if (z + 1 < k) (rows.push(id(x, y, z + 1)), cols.push(v), vals.push(-1));
      }
  return { rows: Int32Array.from(rows), cols: Int32Array.from(cols), vals: Float64Array.from(vals) };
}

function factorisation(parallel: boolean, vals: Float64Array) {
  const { rows, cols } = gridEntries();
  const F = new SymmetricFactorisation(n, rows, cols, 'nd', 'supernodal', Infinity, parallel);
  F.Cx.fill(0);
  vals.forEach((v, t) => (F.Cx[F.slot[t]] += v));
  return F;
}

function relativeResidual(F: SymmetricFactorisation, x: Float64Array, b: Float64Array): number {
  const Mx = new Float64Array(x.length);
  F.multiply(x, Mx);
  let r = 0;
  let nb = 0;
  for (let i = 0; i < x.length; i++) {
    r = Math.max(r, Math.abs(Mx[i] - b[i]));
    nb = Math.max(nb, Math.abs(b[i]));
  }
  return r / nb;
}

/**
 * Solves M x = b with the one-thread and the two-thread factorisation: the two-thread solution
 * must satisfy M x = b to 1e-12 and agree with the one-thread one to `agree`.
 */
function expectSameSolution(one: SymmetricFactorisation, two: SymmetricFactorisation, b: Float64Array, agree: number): void {
  const x1 = Float64Array.from(b);
  const x2 = Float64Array.from(b);
  one.solve(x1);
  two.solve(x2);
  expect(relativeResidual(two, x2, b)).toBeLessThan(1e-12);
  let diff = 0;
  for (let i = 0; i < b.length; i++) diff = Math.max(diff, Math.abs(x1[i] - x2[i]) / (1 + Math.abs(x1[i])));
  expect(diff).toBeLessThan(agree);
}

describe('two-thread supernodal factorisation (3-D grid Laplacian, 18³ unknowns)', () => {
  const { vals } = gridEntries();
  const b = Float64Array.from({ length: n }, (_, i) => Math.sin(i) + 0.5);

  it('splits the elimination tree into two halves of nearly equal work and a top', () => {
    const F = factorisation(true, vals);
    expect(F.flops).toBeGreaterThan(2e7);
    // the split is computed on the same supernodal structure the factorisation uses
    const upper = upperPattern(n, F.Cp, F.Ci);
    const split = splitSubtrees(supernodalSymbolic(n, upper.Cp, upper.Ci));
    expect(split).not.toBeNull();
    const { first, second, top } = split!.shares;
    expect(first + second + top).toBeCloseTo(1, 12);
    expect(Math.abs(first - second)).toBeLessThanOrEqual(0.1 * (first + second) + 1e-12);
    expect(top).toBeLessThanOrEqual(0.6);
  });

  it('solves with a small residual and agrees with the one-thread factorisation', () => {
    const one = factorisation(false, vals);
    const two = factorisation(true, vals);
    expect(one.threads).toBe(1);
    expect(two.threads).toBe(availableParallelism() >= 2 ? 2 : 1);
    for (let round = 0; round < 3; round++) {
      // a new diagonal each round, as in successive interior-point iterations
      const shifted = vals.map((v, t) => (t % 4 === 0 ? v + round : v));
      for (const F of [one, two]) {
        F.Cx.fill(0);
        shifted.forEach((v, t) => (F.Cx[F.slot[t]] += v));
        expect(F.factorise(strict).status).toBe('factorised');
      }
      expectSameSolution(one, two, b, 1e-12);
    }
    // the helper answered every factorisation and solve (a failing helper is given up: one thread)
    expect(two.threads).toBe(availableParallelism() >= 2 ? 2 : 1);
  });

  it('reports a zero pivot from either thread, and counts replaced pivots with dynamic regularisation', () => {
    // zero rows and columns spread over the grid: their pivots are zero whichever thread meets them
    const singular = new Set([0, Math.floor(n / 3), Math.floor((2 * n) / 3), n - 1]);
    const { rows, cols } = gridEntries();
    const cut = vals.map((v, t) => (singular.has(rows[t]) || singular.has(cols[t]) ? 0 : v));
    const F = factorisation(true, cut);
    const strictReport = F.factorise(strict);
    expect(strictReport.status).toBe('zero_pivot');
    expect(strictReport.column).toBeGreaterThanOrEqual(0);
    F.Cx.fill(0);
    cut.forEach((v, t) => (F.Cx[F.slot[t]] += v));
    const regularised = F.factorise({ ...strict, dynamicRegularisation: true });
    expect(regularised.status).toBe('factorised');
    expect(regularised.replacedPivots).toBe(singular.size);
  });
});

/**
 * A tree that cannot be split: a dense 560-column block (its root, nearly all the work) with 300
 * sparse unknowns hanging off it, as in planning models whose shared materials and subassemblies
 * couple every week. Only the root is shared between the threads: the updates into it from the
 * sparse part (split by the root's columns) and its dense factorisation.
 */
describe('two-thread factorisation of a wide dense root alone', () => {
  const dense = 560;
  const leaves = 300;
  const size = dense + leaves;
  function entries(zeroRoot: number[] = []): { rows: Int32Array; cols: Int32Array; vals: Float64Array } {
    const rows: number[] = [];
    const cols: number[] = [];
    const vals: number[] = [];
    const cut = new Set(zeroRoot);
    // leaves first, in cliques of four (supernodes four columns wide); each couples to three
    // unknowns of the dense block
    for (let l = 0; l < leaves; l++) {
      const v = dense + l;
      rows.push(v), cols.push(v), vals.push(4);
      for (let o = l + 1; o < leaves && Math.floor(o / 4) === Math.floor(l / 4); o++) rows.push(dense + o), cols.push(v), vals.push(-0.1);
      for (const k of [l % dense, (7 * l + 3) % dense, (13 * l + 5) % dense]) {
        if (cut.has(k)) continue;
        rows.push(Math.max(v, k)), cols.push(Math.min(v, k)), vals.push(-0.5);
      }
    }
    // the dense block: diagonally dominant, entries from a fixed pattern (no randomness)
    for (let j = 0; j < dense; j++) {
      for (let i = j; i < dense; i++) {
        if (cut.has(i) || cut.has(j)) continue;
        rows.push(i), cols.push(j), vals.push(i === j ? dense + 5 : Math.sin(i * 31 + j * 17));
      }
    }
    return { rows: Int32Array.from(rows), cols: Int32Array.from(cols), vals: Float64Array.from(vals) };
  }
  function factor(parallel: boolean, e = entries()) {
    const F = new SymmetricFactorisation(size, e.rows, e.cols, 'amd', 'supernodal', Infinity, parallel);
    F.Cx.fill(0);
    e.vals.forEach((v, t) => (F.Cx[F.slot[t]] += v));
    return F;
  }

  it('cannot be split, and shares the root: same factor and solve as one thread', () => {
    const two = factor(true);
    const upper = upperPattern(size, two.Cp, two.Ci);
    expect(splitSubtrees(supernodalSymbolic(size, upper.Cp, upper.Ci))).toBeNull();
    expect(two.threads).toBe(availableParallelism() >= 2 ? 2 : 1);
    const one = factor(false);
    expect(one.factorise(strict).status).toBe('factorised');
    for (let round = 0; round < 2; round++) {
      expect(two.factorise(strict).status).toBe('factorised');
      const b = Float64Array.from({ length: size }, (_, i) => Math.cos(i) + 0.25);
      expectSameSolution(one, two, b, 1e-13);
    }
    expect(two.threads).toBe(availableParallelism() >= 2 ? 2 : 1);
  });

  it('reports a zero pivot inside the shared root, and counts replaced ones', () => {
    const zero = [17, 300, 555];
    const F = factor(true, entries(zero));
    const report = F.factorise(strict);
    expect(report.status).toBe('zero_pivot');
    const G = factor(true, entries(zero));
    const regularised = G.factorise({ ...strict, dynamicRegularisation: true });
    expect(regularised.status).toBe('factorised');
    expect(regularised.replacedPivots).toBe(zero.length);
    // the helper is still answering afterwards
    expect(G.threads).toBe(availableParallelism() >= 2 ? 2 : 1);
  });
});
