/**
 * Ratio tests of the interior-point method (the longest step that keeps slacks and duals
 * positive). The one-pass step lengths along blends of two directions (weighted correctors) must
 * equal the ratio tests of each blend formed explicitly — an internal consistency check of the
 * fused kernel; the ratio test itself is the textbook one (e.g. Nocedal & Wright, Numerical
 * Optimization, 2nd ed., §14.2, the step length in Mehrotra's algorithm).
 */
import { describe, expect, it } from 'vitest';
import { BOXED, FIXED, FREE, LOWER, UPPER, type IpmProblem } from '../src/ipm/ipm-problem';
import { allocateIterate, type Iterate } from '../src/ipm/iterate';
import { blendedSteps, maxDualStep, maxPrimalStep } from '../src/ipm/step-length';
import { SeededRandom } from './support/seeded-random';

function randomCase(seed: number, N: number) {
  const rng = new SeededRandom(seed);
  const kinds = [FREE, LOWER, UPPER, BOXED, FIXED];
  const kind = new Uint8Array(N);
  const lower = new Float64Array(N);
  const upper = new Float64Array(N);
  const it = allocateIterate(N, 0);
  const a = allocateIterate(N, 0);
  const b = allocateIterate(N, 0);
  for (let j = 0; j < N; j++) {
    const k = kinds[Math.floor(rng.next() * kinds.length)];
    kind[j] = k;
    lower[j] = k === LOWER || k === BOXED || k === FIXED ? -5 + 10 * rng.next() : -Infinity;
    upper[j] = k === UPPER || k === BOXED ? (Number.isFinite(lower[j]) ? lower[j] : 0) + 0.5 + 10 * rng.next() : k === FIXED ? lower[j] : Infinity;
    // an interior point: strictly inside the box, positive duals
    const lo = Number.isFinite(lower[j]) ? lower[j] : upper[j] - 20;
    const hi = Number.isFinite(upper[j]) ? upper[j] : lo + 20;
    it.v[j] = k === FIXED ? lower[j] : lo + (hi - lo) * (0.05 + 0.9 * rng.next());
    it.zl[j] = 0.01 + rng.next();
    it.zu[j] = 0.01 + rng.next();
    for (const d of [a, b]) {
      d.v[j] = k === FIXED ? 0 : 40 * (rng.next() - 0.5);
      d.zl[j] = 4 * (rng.next() - 0.5);
      d.zu[j] = 4 * (rng.next() - 0.5);
    }
  }
  const prob = { n: N, m: 0, lower, upper } as unknown as IpmProblem;
  return { prob, kind, it, a, b };
}

function formed(a: Iterate, b: Iterate, w: number, N: number): Iterate {
  const d = allocateIterate(N, 0);
  for (let j = 0; j < N; j++) {
    d.v[j] = a.v[j] + w * (b.v[j] - a.v[j]);
    d.zl[j] = a.zl[j] + w * (b.zl[j] - a.zl[j]);
    d.zu[j] = a.zu[j] + w * (b.zu[j] - a.zu[j]);
  }
  return d;
}

describe('step lengths along blends of two directions', () => {
  it.each([1, 2, 3, 4, 5])('equal the ratio tests of each blend formed explicitly (seed %i)', (seed) => {
    const N = 400;
    const { prob, kind, it: point, a, b } = randomCase(seed, N);
    const weights = Float64Array.from([1, 0.75, 0.5, 0.12]);
    const primal = new Float64Array(4);
    const dual = new Float64Array(4);
    blendedSteps(prob, kind, point, a, b, weights, primal, dual);
    weights.forEach((w, q) => {
      const d = formed(a, b, w, N);
      expect(primal[q]).toBeCloseTo(maxPrimalStep(prob, kind, point, d), 12);
      expect(dual[q]).toBeCloseTo(maxDualStep(kind, point, d), 12);
      // a real limit was hit: the steps are below 1 on these long random directions
      expect(primal[q]).toBeLessThan(1);
      expect(dual[q]).toBeLessThan(1);
    });
  });

  it('keeps the full step when no blend heads for a bound', () => {
    const N = 3;
    const { prob, kind, it: point, a, b } = randomCase(11, N);
    for (const d of [a, b]) {
      d.v.fill(0);
      d.zl.fill(1);
      d.zu.fill(1);
    }
    const primal = new Float64Array(4);
    const dual = new Float64Array(4);
    blendedSteps(prob, kind, point, a, b, Float64Array.from([1, 0.75, 0.5, 0.25]), primal, dual);
    expect([...primal, ...dual]).toEqual(new Array(8).fill(1));
  });

  it('refuses a weight list of another length, by name', () => {
    const { prob, kind, it: point, a, b } = randomCase(12, 2);
    expect(() => blendedSteps(prob, kind, point, a, b, Float64Array.from([1, 0.5]), new Float64Array(2), new Float64Array(2))).toThrow(/4 weights, got 2/);
  });
});
