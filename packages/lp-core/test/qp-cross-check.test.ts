/**
 * QPs: the interior-point solver (solve) and the independent log-barrier method (solveBarrier) agree
 * to 1e-6, with HiGHS (npm `highs`) as a third, outside opinion; and both reach the closed-form
 * projection onto the probability simplex (Held, Wolfe & Crowder 1974; Duchi et al. 2008).
 */
import { describe, expect, it } from 'vitest';
import { problemFromDense, solve, solveBarrier, solveWithHighs } from '../src/index';
import { randomProblem } from './support/random-problems';

const relativeError = (a: number, b: number) => Math.abs(a - b) / Math.max(1, Math.abs(b));

describe('interior point and log barrier agree on QPs', () => {
  it.each([71, 72, 73, 74, 75, 76])('random QP seed %i', async (seed) => {
    const problem = randomProblem(seed, { rows: 30, cols: 40, quadratic: true, kind: seed % 2 ? 'feasible' : 'degenerate', freeShare: 0.15 });
    const ipm = solve(problem);
    const barrier = solveBarrier(problem);
    const reference = await solveWithHighs(problem);
    expect(ipm.status).toBe('optimal');
    expect(barrier.status).toBe('optimal');
    expect(relativeError(ipm.objective, barrier.objective)).toBeLessThanOrEqual(1e-6);
    expect(relativeError(ipm.objective, reference.objective)).toBeLessThanOrEqual(1e-6);
  });

  it('both reach the closed-form projection onto the simplex of p = (0.9, −0.2, 0.4, 0.1)', () => {
    // sorted p: 0.9, 0.4, 0.1, −0.2; θ = (0.9 + 0.4 − 1)/2 = 0.15 (0.1 − 0.15 < 0 stops the support),
    // x = max(p − θ, 0) = (0.75, 0, 0.25, 0), objective ½‖x − p‖² = ½(0.0225 + 0.04 + 0.0225 + 0.01) = 0.0475
    const p = [0.9, -0.2, 0.4, 0.1];
    const problem = problemFromDense({
      c: p.map((v) => -v),
      c0: 0.5 * p.reduce((s, v) => s + v * v, 0),
      Q: p.map((_, i) => p.map((__, j) => (i === j ? 1 : 0))),
      A: [[1, 1, 1, 1]],
      rowLower: [1],
      rowUpper: [1],
    });
    for (const result of [solve(problem), solveBarrier(problem)]) {
      expect(result.status).toBe('optimal');
      expect(result.objective).toBeCloseTo(0.0475, 7);
      [0.75, 0, 0.25, 0].forEach((v, j) => expect(result.x[j]).toBeCloseTo(v, 6));
    }
  });
});
