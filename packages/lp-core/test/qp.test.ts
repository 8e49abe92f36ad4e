/**
 * Quadratic programs with solutions in closed form.
 */
import { describe, expect, it } from 'vitest';
import { problemFromDense, solve } from '../src/index';

/** Euclidean projection onto the probability simplex by sorting (Held, Wolfe & Crowder 1974; Duchi et al., ICML 2008) */
function projectOntoSimplex(a: number[]): number[] {
  const u = [...a].sort((p, q) => q - p);
  let sum = 0;
  let theta = 0;
  u.forEach((v, j) => {
    sum += v;
    const t = (sum - 1) / (j + 1);
    if (v - t > 0) theta = t;
  });
  return a.map((v) => Math.max(v - theta, 0));
}

describe('QP: projection onto the simplex, min ½‖x − a‖² s.t. Σx = 1, x ≥ 0', () => {
  const a = [0.8, 0.5, -0.3, 0.1, 0.45, -1.2];
  const expected = projectOntoSimplex(a);
  const theta = a[0] - expected[0];
  it.each([true, false])('matches the sort-and-threshold projection (presolve %s)', (presolve) => {
    // ½‖x − a‖² = ½xᵀIx − aᵀx + ½‖a‖²
    const n = a.length;
    const p = problemFromDense({
      c: a.map((v) => -v),
      c0: 0.5 * a.reduce((s, v) => s + v * v, 0),
      A: [new Array(n).fill(1)],
      rowLower: [1],
      rowUpper: [1],
      Q: a.map((_, i) => a.map((__, j) => (i === j ? 1 : 0))),
    });
    const r = solve(p, { presolve });
    expect(r.status).toBe('optimal');
    expected.forEach((v, j) => expect(r.x[j]).toBeCloseTo(v, 6));
    const dist = 0.5 * a.reduce((s, v, j) => s + (expected[j] - v) ** 2, 0);
    expect(r.objective).toBeCloseTo(dist, 7);
    // the row multiplier is −θ (the KKT conditions of the projection)
    expect(r.rowDuals[0]).toBeCloseTo(-theta, 6);
  });
});

describe('QP with an off-diagonal Q (augmented system): Lagrange conditions solved by hand', () => {
  it('min ½xᵀ[[2,1],[1,2]]x − x₁ − 4x₂ s.t. x₁ + x₂ = 2, x free: x = (−0.5, 2.5), y = 0.5, objective −4.25', () => {
    // Qx + c = y·1: 2x₁ + x₂ − 1 = y, x₁ + 2x₂ − 4 = y ⇒ x₁ = x₂ − 3; with x₁ + x₂ = 2: x = (−0.5, 2.5), y = 0.5
    const p = problemFromDense({
      c: [-1, -4],
      A: [[1, 1]],
      rowLower: [2],
      rowUpper: [2],
      colLower: [-Infinity, -Infinity],
      Q: [[2, 1], [1, 2]],
    });
    const r = solve(p);
    expect(r.status).toBe('optimal');
    expect(r.x[0]).toBeCloseTo(-0.5, 6);
    expect(r.x[1]).toBeCloseTo(2.5, 6);
    expect(r.rowDuals[0]).toBeCloseTo(0.5, 6);
    expect(r.objective).toBeCloseTo(-4.25, 6);
  });
  it('same Q, c = (2, −4), x ≥ 0 and x₁ + x₂ ≥ 3: the bound on x₁ binds, x = (0, 3), y = 2, z₁ = 3', () => {
    // with x₁ = 0: min x₂² − 4x₂ over x₂ ≥ 3 ⇒ x₂ = 3, y = 2·3 − 4 = 2; z₁ = (2·0 + 1·3) + 2 − y = 3 > 0
    const p = problemFromDense({
      c: [2, -4],
      A: [[1, 1]],
      rowLower: [3],
      rowUpper: [Infinity],
      Q: [[2, 1], [1, 2]],
    });
    const r = solve(p);
    expect(r.status).toBe('optimal');
    expect(r.x[0]).toBeCloseTo(0, 6);
    expect(r.x[1]).toBeCloseTo(3, 6);
    expect(r.rowDuals[0]).toBeCloseTo(2, 6);
    expect(r.reducedCosts[0]).toBeCloseTo(3, 6);
    expect(r.objective).toBeCloseTo(-3, 6);
  });
});
