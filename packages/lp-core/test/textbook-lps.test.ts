/**
 * Textbook LPs with unique optima (check values from /work/shared/DOMAIN.md §2, rows 1–3):
 * status first, then x, objective and duals to 1e-6. Duals follow lp-core's convention:
 * y = ∂objective/∂(row bound) in the problem's own sense.
 */
import { describe, expect, it } from 'vitest';
import { problemFromDense, solve } from '../src/index';

const close = (actual: ArrayLike<number>, expected: number[], tol = 1e-6): void => {
  expect(actual.length).toBe(expected.length);
  expected.forEach((v, i) => expect(Math.abs(actual[i] - v)).toBeLessThanOrEqual(tol * (1 + Math.abs(v))));
};
const NO = -Infinity;

describe.each([true, false])('textbook LPs (presolve %s)', (presolve) => {
  it('Hillier & Lieberman, glass plant: x = (2, 6), z = 36; duals (0, 1.5, 1)', () => {
    // max 3x₁ + 5x₂; x₁ ≤ 4; 2x₂ ≤ 12; 3x₁ + 2x₂ ≤ 18 (Hillier & Lieberman, Introduction to OR, ch. 3)
    const p = problemFromDense({
      sense: 'maximise',
      c: [3, 5],
      A: [[1, 0], [0, 2], [3, 2]],
      rowLower: [NO, NO, NO],
      rowUpper: [4, 12, 18],
    });
    const r = solve(p, { presolve });
    expect(r.status).toBe('optimal');
    close(r.x, [2, 6]); // [S]
    expect(r.objective).toBeCloseTo(36, 6); // [S]
    close(r.rowDuals, [0, 1.5, 1]); // [M+R] from memory, re-solved
    expect(r.certificate.relativeGap).toBeLessThan(1e-7);
  });

  it('Winston, furniture example: x = (2, 0, 8), z = 280; duals (0, 10, 10, 0); reduced cost of x₂ = −5', () => {
    // max 60x₁ + 30x₂ + 20x₃; lumber 8, 6, 1 ≤ 48; finishing 4, 2, 1.5 ≤ 20; carpentry 2, 1.5, 0.5 ≤ 8; x₂ ≤ 5
    // (Winston, Operations Research, sensitivity-analysis chapter) — x₂ ≤ 5 kept as a row as in the book
    const p = problemFromDense({
      sense: 'maximise',
      c: [60, 30, 20],
      A: [[8, 6, 1], [4, 2, 1.5], [2, 1.5, 0.5], [0, 1, 0]],
      rowLower: [NO, NO, NO, NO],
      rowUpper: [48, 20, 8, 5],
    });
    const r = solve(p, { presolve });
    expect(r.status).toBe('optimal');
    close(r.x, [2, 0, 8]); // [S]
    expect(r.objective).toBeCloseTo(280, 6); // [S]
    close(r.rowDuals, [0, 10, 10, 0]); // [M+R] from memory, re-solved
    expect(r.reducedCosts[1]).toBeCloseTo(-5, 6); // [M+R] from memory, re-solved
  });

  it('Winston §3.10, sailboats: cost 78,450; regular (40, 40, 40, 25); overtime (0, 10, 35, 0); duals (430, 450, 450, 400)', () => {
    // columns: regular x₁..x₄ (0 ≤ x ≤ 40, 400 each), overtime o₁..o₄ (450), stock i₁..i₄ (20 at quarter end)
    // rows: i_{t−1} + x_t + o_t − i_t = d_t with d = (40, 60, 75, 25) and opening stock i₀ = 10 moved to the right side
    const A: number[][] = [];
    for (let t = 0; t < 4; t++) {
      const row = new Array(12).fill(0);
      row[t] = 1;
      row[4 + t] = 1;
      row[8 + t] = -1;
      if (t > 0) row[8 + t - 1] = 1;
      A.push(row);
    }
    const demand = [40 - 10, 60, 75, 25];
    const p = problemFromDense({
      c: [400, 400, 400, 400, 450, 450, 450, 450, 20, 20, 20, 20],
      A,
      rowLower: demand,
      rowUpper: demand,
      colUpper: [40, 40, 40, 40, Infinity, Infinity, Infinity, Infinity, Infinity, Infinity, Infinity, Infinity],
      rowNames: ['q1', 'q2', 'q3', 'q4'],
    });
    const r = solve(p, { presolve });
    expect(r.status).toBe('optimal');
    expect(r.objective).toBeCloseTo(78450, 4); // [S]
    close(r.x.subarray(0, 4), [40, 40, 40, 25]); // [S]
    close(r.x.subarray(4, 8), [0, 10, 35, 0]); // [S]
    close(r.x.subarray(8, 12), [10, 0, 0, 0]); // [S]
    close(r.rowDuals, [430, 450, 450, 400]); // [M+R] from memory, re-solved
  });
});
