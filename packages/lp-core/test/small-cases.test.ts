/**
 * Small LPs that exercise one feature each. Optimal ones are checked against HiGHS
 * (the `highs` npm package, HiGHS in WebAssembly) for status, objective and x; infeasible and
 * unbounded ones are checked against the definition of a certificate (Farkas' lemma, e.g.
 * Bertsimas & Tsitsiklis, Introduction to Linear Optimization, §4.6).
 */
import { describe, expect, it } from 'vitest';
import { problemFromDense, solve, type Problem, type SolveResult } from '../src/index';
import { solveWithHighs } from '../src/adapters/solve-with-highs';

const NO = -Infinity;
const INF = Infinity;

async function expectAgreesWithHighs(p: Problem, r: SolveResult, checkX = true): Promise<void> {
  const ref = await solveWithHighs(p, { method: 'simplex' });
  expect(r.status).toBe(ref.status);
  expect(Math.abs(r.objective - ref.objective)).toBeLessThanOrEqual(1e-6 * (1 + Math.abs(ref.objective)));
  if (checkX) ref.x.forEach((v, j) => expect(Math.abs(r.x[j] - v)).toBeLessThanOrEqual(1e-6 * (1 + Math.abs(v))));
  expect(r.certificate.primalResidual).toBeLessThan(1e-7);
  expect(r.certificate.dualResidual).toBeLessThan(1e-7);
  expect(r.certificate.relativeGap).toBeLessThan(1e-7);
}

describe.each([true, false])('small LPs (presolve %s)', (presolve) => {
  it('degenerate vertex: three constraints through (1, 1); x is unique, the duals are not', async () => {
    // max x₁ + x₂ s.t. x₁ ≤ 1, x₂ ≤ 1, x₁ + x₂ ≤ 2 (two rows, one column bound), x ≥ 0
    const p = problemFromDense({
      sense: 'maximise',
      c: [1, 1],
      A: [[1, 0], [1, 1]],
      rowLower: [NO, NO],
      rowUpper: [1, 2],
      colUpper: [INF, 1],
    });
    const r = solve(p, { presolve });
    await expectAgreesWithHighs(p, r);
  });

  it('free column: min x₁ + 2x₂ s.t. x₁ − x₂ = −3, x₁ + x₂ ≥ 1, x₁ free, x₂ ≥ 0', async () => {
    const p = problemFromDense({
      c: [1, 2],
      A: [[1, -1], [1, 1]],
      rowLower: [-3, 1],
      rowUpper: [-3, INF],
      colLower: [NO, 0],
    });
    const r = solve(p, { presolve });
    await expectAgreesWithHighs(p, r);
    expect(r.x[0]).toBeLessThan(0); // the free column ends negative
  });

  it('range row: 2 ≤ x₁ + x₂ ≤ 4 with its upper side binding', async () => {
    // max 3x₁ + 2x₂ s.t. 2 ≤ x₁ + x₂ ≤ 4, x₁ − x₂ ≤ 1, x ≥ 0
    const p = problemFromDense({
      sense: 'maximise',
      c: [3, 2],
      A: [[1, 1], [1, -1]],
      rowLower: [2, NO],
      rowUpper: [4, 1],
    });
    const r = solve(p, { presolve });
    await expectAgreesWithHighs(p, r);
    expect(r.rowDuals[0]).toBeGreaterThan(0); // maximising: more room on the binding upper side is worth more
  });

  it('range row with its lower side binding and a fixed column', async () => {
    // min x₁ + x₂ + x₃ s.t. 2 ≤ x₁ + x₂ + x₃ ≤ 4, x₁ + 2x₂ ≥ 1, x₃ fixed at 0.5
    const p = problemFromDense({
      c: [1, 1, 1],
      A: [[1, 1, 1], [1, 2, 0]],
      rowLower: [2, 1],
      rowUpper: [4, INF],
      colLower: [0, 0, 0.5],
      colUpper: [INF, INF, 0.5],
    });
    const r = solve(p, { presolve });
    await expectAgreesWithHighs(p, r, false);
    expect(r.x[2]).toBe(0.5);
    expect(r.rowDuals[0]).toBeGreaterThan(0);
  });

  it('infeasible: x₁ + x₂ ≤ 1 and x₁ + x₂ ≥ 3; the ray is a Farkas certificate', async () => {
    const p = problemFromDense({
      c: [1, 1],
      A: [[1, 1], [1, 1]],
      rowLower: [NO, 3],
      rowUpper: [1, INF],
      rowNames: ['cap', 'need'],
    });
    const r = solve(p, { presolve });
    expect(r.status).toBe('infeasible');
    expect((await solveWithHighs(p, { method: 'simplex' })).status).toBe('infeasible');
    expect(r.ray?.kind).toBe('primal_infeasible');
    const y = new Map(r.ray!.entries.map((e) => [e.name, e.value]));
    const yc = y.get('cap') ?? 0;
    const yn = y.get('need') ?? 0;
    // Farkas: y_cap ≤ 0 on the ≤ row, y_need ≥ 0 on the ≥ row, Aᵀy + z = 0 with z ≥ 0 on x ≥ 0,
    // and 3·y_need + 1·y_cap > 0 (lower·y⁺ − upper·y⁻)
    expect(yc).toBeLessThan(0);
    expect(yn).toBeGreaterThan(0);
    expect(3 * yn + 1 * yc).toBeGreaterThan(0);
    expect(yc + yn).toBeLessThanOrEqual(1e-7);
  });

  it('infeasible by a bound: x₁ ≥ 2 against the row x₁ ≤ 1', () => {
    const p = problemFromDense({ c: [1], A: [[1]], rowLower: [NO], rowUpper: [1], colLower: [2] });
    const r = solve(p, { presolve });
    expect(r.status).toBe('infeasible');
    expect(r.ray?.entries.length).toBeGreaterThan(0);
  });

  it('infeasible with parallel rows (−8x₁ = −40 and −8x₁ ≤ −45): the ray proves it', async () => {
    // x₁ = 5 from the equality, x₁ ≥ 5.625 from the inequality (a case where the interior-point
    // iterates stall; the elastic problem settles it)
    const p = problemFromDense({
      c: [10.5, 0, -1],
      A: [[-8, 0, 0], [0, 0, 2], [0, 0, 0], [-8, 0, 0]],
      rowLower: [-40, 11, -2, NO],
      rowUpper: [-40, 15, 2, -45],
      colLower: [0, 0, 6],
      colUpper: [INF, INF, 6],
      rowNames: ['eq', 'r2', 'r3', 'le'],
    });
    const r = solve(p, { presolve });
    expect(r.status).toBe('infeasible');
    expect((await solveWithHighs(p, { method: 'simplex' })).status).toBe('infeasible');
    const y = new Map(r.ray!.entries.map((e) => [e.name, e.value]));
    const yEq = y.get('eq') ?? 0;
    const yLe = y.get('le') ?? 0;
    // Farkas: −8·y_eq − 8·y_le + z₁ = 0 with z₁ ≥ 0 (x₁ ≥ 0), y_le ≤ 0, and
    // −40·y_eq − (−45)·y_le⁻ ... = −40·y_eq + 45·|y_le| > 0
    expect(yLe).toBeLessThan(0);
    expect(-40 * yEq - 45 * yLe).toBeGreaterThan(0);
    expect(-8 * yEq - 8 * yLe).toBeLessThanOrEqual(1e-7);
  });

  it('unbounded: max x₁ + x₂ s.t. x₁ − x₂ ≤ 1, x ≥ 0; the ray is a feasible direction of increase', async () => {
    const p = problemFromDense({ sense: 'maximise', c: [1, 1], A: [[1, -1]], rowLower: [NO], rowUpper: [1] });
    const r = solve(p, { presolve });
    expect(r.status).toBe('unbounded');
    expect((await solveWithHighs(p, { method: 'simplex' })).status).toBe('unbounded');
    expect(r.ray?.kind).toBe('dual_infeasible');
    const d = new Map(r.ray!.entries.map((e) => [e.name, e.value]));
    const d1 = d.get('x1') ?? 0;
    const d2 = d.get('x2') ?? 0;
    // recession cone: d ≥ 0, d₁ − d₂ ≤ 0; objective grows: d₁ + d₂ > 0
    expect(d1).toBeGreaterThanOrEqual(-1e-7);
    expect(d2).toBeGreaterThanOrEqual(-1e-7);
    expect(d1 - d2).toBeLessThanOrEqual(1e-7);
    expect(d1 + d2).toBeGreaterThan(0);
  });

  it('empty column with zero cost and an empty row are handled', async () => {
    const p = problemFromDense({
      c: [1, 0, -1],
      A: [[1, 0, 1], [0, 0, 0]],
      rowLower: [1, -1],
      rowUpper: [5, 1],
      colUpper: [INF, 3, 2],
    });
    const r = solve(p, { presolve });
    await expectAgreesWithHighs(p, r, false);
  });
});

describe('limits and hooks', () => {
  const p = problemFromDense({
    sense: 'maximise',
    c: [60, 30, 20],
    A: [[8, 6, 1], [4, 2, 1.5], [2, 1.5, 0.5]],
    rowLower: [NO, NO, NO],
    rowUpper: [48, 20, 8],
  });
  it('iteration limit returns the best iterate with status iteration_limit', () => {
    const r = solve(p, { maxIterations: 2, presolve: false });
    expect(r.status).toBe('iteration_limit');
    expect(r.iterations).toBe(2);
    expect(Array.from(r.x).every(Number.isFinite)).toBe(true);
  });
  it('with Cholesky asked for, a factor above maxFactorMegabytes ends at once with numerical_trouble and says why', () => {
    const r = solve(p, { presolve: false, maxFactorMegabytes: 1e-6, linearSolver: 'cholesky' });
    expect(r.status).toBe('numerical_trouble');
    expect(r.iterations).toBe(0);
    expect(r.message).toMatch(/the Cholesky factor would hold \d+ entries .* \(maxFactorMegabytes = 0.000001\)/);
  });
  it("by default ('auto') a factor above maxFactorMegabytes gives way to conjugate gradients; HiGHS agrees", async () => {
    const r = solve(p, { presolve: false, maxFactorMegabytes: 1e-6 });
    await expectAgreesWithHighs(p, r);
  });
  it('a time limit is honoured', () => {
    const r = solve(p, { presolve: false, timeLimitSeconds: 1e-9 });
    expect(r.status).toBe('time_limit');
  });
  it('shouldStop ends with status cancelled; onIteration sees every iteration', () => {
    const seen: number[] = [];
    const r = solve(p, { presolve: false, onIteration: (i) => seen.push(i.iteration), shouldStop: () => seen.length >= 3 });
    expect(r.status).toBe('cancelled');
    expect(seen).toEqual([0, 1, 2]);
  });
});
