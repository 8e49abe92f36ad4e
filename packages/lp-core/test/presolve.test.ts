/**
 * Presolve reductions and postsolve. Each problem is built so one reduction fires; the solve
 * with presolve must match HiGHS (the `highs` npm package) in objective, and its restored
 * duals must certify optimality on the original problem (dual residual and gap ≤ 1e-7, which
 * by LP duality proves the restored y and z are optimal duals).
 */
import { describe, expect, it } from 'vitest';
import { problemFromDense, solve, type Problem } from '../src/index';
import { presolve } from '../src/presolve/presolve';
import { solveWithHighs } from '../src/adapters/solve-with-highs';

const NO = -Infinity;
const INF = Infinity;

async function expectCertifiedOptimum(p: Problem): Promise<void> {
  const r = solve(p, { presolve: true });
  const ref = await solveWithHighs(p, { method: 'simplex' });
  expect(r.status).toBe('optimal');
  expect(ref.status).toBe('optimal');
  expect(Math.abs(r.objective - ref.objective)).toBeLessThanOrEqual(1e-6 * (1 + Math.abs(ref.objective)));
  expect(r.certificate.primalResidual).toBeLessThan(1e-7);
  expect(r.certificate.dualResidual).toBeLessThan(1e-7);
  expect(r.certificate.relativeGap).toBeLessThan(1e-7);
}

describe('presolve and postsolve (reference: HiGHS; optimality via the certificate)', () => {
  it('singleton rows become bounds; the row dual is restored from the column reduced cost', async () => {
    // max 3x₁ + 2x₂ s.t. x₁ ≤ 4 (singleton row), x₁ + x₂ ≤ 6, 2 ≤ 2x₂ (singleton row)
    const p = problemFromDense({
      sense: 'maximise',
      c: [3, 2],
      A: [[1, 0], [1, 1], [0, 2]],
      rowLower: [NO, NO, 2],
      rowUpper: [4, 6, INF],
    });
    const pre = presolve(p, true);
    expect(pre.reduced.rowLower.length).toBe(1);
    await expectCertifiedOptimum(p);
    const r = solve(p);
    // x = (4, 2): the singleton row x₁ ≤ 4 binds and carries the dual 3 − 2 = 1 (re-solved by hand)
    expect(r.rowDuals[0]).toBeCloseTo(1, 6);
    expect(r.rowDuals[1]).toBeCloseTo(2, 6);
  });

  it('a forcing row fixes its columns; its dual gives the fixed columns the right reduced-cost signs', async () => {
    // x₁ + x₂ + x₃ ≤ 0 with x ≥ 0 forces x₁ = x₂ = x₃ = 0; min −x₁ − 2x₂ + x₃ + x₄ s.t. x₃ + x₄ ≥ 1
    const p = problemFromDense({
      c: [-1, -2, 1, 1],
      A: [[1, 1, 1, 0], [0, 0, 1, 1]],
      rowLower: [NO, 1],
      rowUpper: [0, INF],
    });
    const pre = presolve(p, true);
    expect(pre.reduced.c.length).toBeLessThan(4);
    await expectCertifiedOptimum(p);
    const r = solve(p);
    expect(r.rowDuals[0]).toBeLessThanOrEqual(-2 + 1e-7); // at least the larger gain, 2, per unit of the row
  });

  it('fixed columns, an empty row, an empty column and a redundant row', async () => {
    // x₃ fixed at 2; row 2 empty with bounds around 0; x₄ in no row with cost −1 and upper bound 5;
    // row 3: x₁ + x₂ ≤ 100 can never bind because x₁, x₂ ≤ 10
    const p = problemFromDense({
      c: [1, 1, 3, -1],
      A: [[1, 1, 1, 0], [0, 0, 0, 0], [1, 1, 0, 0]],
      rowLower: [5, -1, NO],
      rowUpper: [INF, 1, 100],
      colLower: [0, 0, 2, 0],
      colUpper: [10, 10, 2, 5],
    });
    const pre = presolve(p, true);
    expect(pre.reduced.rowLower.length).toBe(1);
    expect(pre.reduced.c.length).toBe(2);
    await expectCertifiedOptimum(p);
  });

  it('presolve that proves infeasibility hands over to a full solve for the certificate', () => {
    const p = problemFromDense({ c: [1, 1], A: [[1, 1], [0, 0]], rowLower: [1, 1], rowUpper: [2, 2] });
    expect(presolve(p, true).status).toBe('infeasible');
    const r = solve(p);
    expect(r.status).toBe('infeasible');
    expect(r.ray?.kind).toBe('primal_infeasible');
  });
});

describe('dense columns (Sherman–Morrison–Woodbury path; reference: HiGHS)', () => {
  it('a column present in every row is split off and the optimum is unchanged', async () => {
    const m = 30;
    const n = 20;
    // a transportation-like LP plus one column that appears in every row (invented data; expected value from HiGHS)
    const A = Array.from({ length: m }, (_, i) => Array.from({ length: n + 1 }, (_, j) => (j === n ? 1 : (i + 2 * j) % 7 === 0 ? 1 + ((i * j) % 3) : 0)));
    const p = problemFromDense({
      c: Array.from({ length: n + 1 }, (_, j) => (j === n ? 5 : 1 + (j % 4))),
      A,
      rowLower: Array.from({ length: m }, (_, i) => 1 + (i % 3)),
      rowUpper: Array.from({ length: m }, () => INF),
    });
    const r = solve(p, { denseColumnMin: 10, denseColumnRatio: 0.5, presolve: false });
    const ref = await solveWithHighs(p, { method: 'simplex' });
    expect(r.status).toBe('optimal');
    expect(Math.abs(r.objective - ref.objective)).toBeLessThanOrEqual(1e-6 * (1 + Math.abs(ref.objective)));
    expect(r.certificate.relativeGap).toBeLessThan(1e-7);
  });
});
