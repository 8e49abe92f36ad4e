/**
 * The reference-solver adapters on problems with known answers: the Wyndor Glass LP (Hillier &
 * Lieberman, Introduction to Operations Research: optimum 36 at (2, 6), shadow prices 0, 1.5, 1)
 * and trivially infeasible / unbounded LPs.
 */
import { describe, expect, it } from 'vitest';
import { problemFromDense, solveWithHighs, solveWithLpSolver } from '../src/index';
import { randomProblem } from './support/random-problems';

const wyndor = () =>
  problemFromDense({ sense: 'maximise', c: [3, 5], A: [[1, 0], [0, 2], [3, 2]], rowLower: [-Infinity, -Infinity, -Infinity], rowUpper: [4, 12, 18] });
const infeasible = () => problemFromDense({ c: [1, 1], A: [[1, 1], [1, 1]], rowLower: [-Infinity, 2], rowUpper: [1, Infinity] });
const unbounded = () => problemFromDense({ c: [-1, 0], A: [[1, -1]], rowLower: [-Infinity], rowUpper: [1] });

describe('solveWithHighs', () => {
  it.each(['simplex', 'ipm', 'choose'] as const)('Wyndor Glass with method %s: objective, x, duals in lp-core sign convention', async (method) => {
    const r = await solveWithHighs(wyndor(), { method });
    expect(r.status).toBe('optimal');
    expect(r.objective).toBeCloseTo(36, 6);
    expect(r.x[0]).toBeCloseTo(2, 6);
    expect(r.x[1]).toBeCloseTo(6, 6);
    // minimisation form: duals of binding ≤ rows are ≤ 0
    [0, -1.5, -1].forEach((v, i) => expect(r.rowDuals![i]).toBeCloseTo(v, 6));
    expect(r.certificate!.relativeGap).toBeLessThanOrEqual(1e-8);
  });

  it('infeasible and unbounded', async () => {
    expect((await solveWithHighs(infeasible())).status).toBe('infeasible');
    expect((await solveWithHighs(unbounded())).status).toBe('unbounded');
  });
});

describe('solveWithLpSolver (child process)', () => {
  it('Wyndor Glass: objective 36 at (2, 6), with the child\'s peak memory', async () => {
    const r = await solveWithLpSolver(wyndor(), { timeLimitSeconds: 30 });
    expect(r.status).toBe('optimal');
    expect(r.objective).toBeCloseTo(36, 6);
    expect(r.x[0]).toBeCloseTo(2, 6);
    expect(r.x[1]).toBeCloseTo(6, 6);
    expect(r.maxRssKb).toBeGreaterThan(0);
  });

  it('shifted bounds (x ≥ 1, y ≤ −1 and free) are undone in x', async () => {
    // min x − y + z  s.t.  x + y + z = 0.5,  x ≥ 1,  y ≤ −1,  −2 ≤ z ≤ 2 (optimum from HiGHS)
    const p = problemFromDense({ c: [1, -1, 1], A: [[1, 1, 1]], rowLower: [0.5], rowUpper: [0.5], colLower: [1, -Infinity, -2], colUpper: [Infinity, -1, 2] });
    const [ours, reference] = [await solveWithLpSolver(p, { timeLimitSeconds: 30 }), await solveWithHighs(p)];
    expect(ours.status).toBe('optimal');
    expect(ours.objective).toBeCloseTo(reference.objective, 6);
    expect(ours.x[0] + ours.x[1] + ours.x[2]).toBeCloseTo(0.5, 9);
  });

  it('infeasible and unbounded', async () => {
    expect((await solveWithLpSolver(infeasible(), { timeLimitSeconds: 30 })).status).toBe('infeasible');
    expect((await solveWithLpSolver(unbounded(), { timeLimitSeconds: 30 })).status).toBe('unbounded');
  });

  it('stops the child at the hard time limit with status time_limit', async () => {
    // 0.05 s is shorter than starting the child process at all, so the limit always strikes.
    const r = await solveWithLpSolver(randomProblem(81, { rows: 60, cols: 80 }), { timeLimitSeconds: 0.05 });
    expect(r.status).toBe('time_limit');
    expect(r.message).toMatch(/did not finish within 0.05 s/);
  });

  it('refuses a quadratic objective and a non-positive time limit', async () => {
    await expect(solveWithLpSolver(randomProblem(82, { rows: 5, cols: 5, quadratic: true }))).rejects.toThrow(/linear problems only/);
    await expect(solveWithLpSolver(wyndor(), { timeLimitSeconds: 0 })).rejects.toThrow(/timeLimitSeconds must be positive/);
  });
});
