/**
 * Bad input gives a clear error naming what is wrong, before any iteration
 * (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { problemFromDense, solve, type Problem } from '../src/index';

const base = (): Problem =>
  problemFromDense({ c: [1, 2], A: [[1, 1]], rowLower: [1], rowUpper: [Infinity], colNames: ['a', 'b'], rowNames: ['r'] });

describe('bad input', () => {
  it('inconsistent dimensions', () => {
    const p = base();
    p.c = new Float64Array([1, 2, 3]);
    expect(() => solve(p)).toThrow('A has 2 columns but c has 3 entries');
  });
  it('NaN coefficient in A', () => {
    const p = base();
    p.A.values[1] = NaN;
    expect(() => solve(p)).toThrow('entry (0, 1) is NaN');
  });
  it('infinite cost', () => {
    const p = base();
    p.c[0] = Infinity;
    expect(() => solve(p)).toThrow('column a: cost is Infinity');
  });
  it('lower bound above upper bound', () => {
    const p = base();
    p.colLower[1] = 5;
    p.colUpper[1] = 4;
    expect(() => solve(p)).toThrow('column b: lower bound 5 exceeds upper bound 4');
  });
  it('row lower bound of +Infinity', () => {
    const p = base();
    p.rowLower[0] = Infinity;
    expect(() => solve(p)).toThrow('row r: lower bound is +Infinity');
  });
  it('negative diagonal in Q', () => {
    const p = problemFromDense({ c: [1, 2], A: [[1, 1]], rowLower: [1], rowUpper: [1], Q: [[-1, 0], [0, 1]] });
    expect(() => solve(p)).toThrow('Q is not positive semidefinite: diagonal entry of column x1 is -1');
  });
  it('indefinite Q with a positive diagonal (its Cholesky factorisation fails)', () => {
    const p = problemFromDense({ c: [1, 2], A: [[1, 1]], rowLower: [1], rowUpper: [1], Q: [[1, 2], [2, 1]] });
    expect(() => solve(p)).toThrow(/Q is not positive semidefinite: its Cholesky factorisation fails/);
  });
  it('a singular but PSD Q is accepted', () => {
    const p = problemFromDense({ c: [1, 2], A: [[1, 1]], rowLower: [1], rowUpper: [1], Q: [[1, 1], [1, 1]] });
    expect(solve(p).status).toBe('optimal');
  });
  it('empty problem', () => {
    const p = problemFromDense({ c: [], A: [], rowLower: [], rowUpper: [] });
    expect(() => solve(p)).toThrow('the problem is empty: it has no columns');
  });
  it('bad settings are named', () => {
    expect(() => solve(base(), { tolGapRel: 0 })).toThrow('tolGapRel must be a number in (0, 1), got 0');
    expect(() => solve(base(), { maxIterations: 2.5 })).toThrow('maxIterations must be a non-negative integer, got 2.5');
    expect(() => solve(base(), { nonsense: 1 } as never)).toThrow('unknown setting "nonsense"');
    expect(() => solve(base(), { parallelFactorisation: 'yes' } as never)).toThrow('parallelFactorisation must be true, false or "auto", got yes');
  });
});
