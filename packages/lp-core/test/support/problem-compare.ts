/** Exact comparison of two Problems (same names, order, bounds, objective, matrices, integer columns). */
import { expect } from 'vitest';
import type { CscMatrix, Problem } from '../../src/problem/problem';

export function dense(M: CscMatrix, symmetricLower = false): number[][] {
  const out = Array.from({ length: M.m }, () => new Array<number>(M.n).fill(0));
  for (let j = 0; j < M.n; j++) {
    for (let p = M.colPtr[j]; p < M.colPtr[j + 1]; p++) {
      out[M.rowIdx[p]][j] += M.values[p];
      if (symmetricLower && M.rowIdx[p] !== j) out[j][M.rowIdx[p]] += M.values[p];
    }
  }
  return out;
}

export function expectSameProblem(actual: Problem, expected: Problem): void {
  expect(actual.colNames).toEqual(expected.colNames);
  expect(actual.rowNames).toEqual(expected.rowNames);
  expect(Boolean(actual.maximise)).toBe(Boolean(expected.maximise));
  expect([...actual.c]).toEqual([...expected.c]);
  expect(actual.c0).toBe(expected.c0);
  expect([...actual.rowLower]).toEqual([...expected.rowLower]);
  expect([...actual.rowUpper]).toEqual([...expected.rowUpper]);
  expect([...actual.colLower]).toEqual([...expected.colLower]);
  expect([...actual.colUpper]).toEqual([...expected.colUpper]);
  expect(dense(actual.A)).toEqual(dense(expected.A));
  const emptyQ = (p: Problem) => !p.Q || p.Q.colPtr[p.Q.n] === 0;
  expect(emptyQ(actual)).toBe(emptyQ(expected));
  if (!emptyQ(expected)) expect(dense(actual.Q!, true)).toEqual(dense(expected.Q!, true));
  expect(actual.integerCols ?? []).toEqual(expected.integerCols ?? []);
}
