/**
 * writeMps → readMps gives back the same problem. The Netlib files (Debian coinor-libcoinutils-dev)
 * are the outside data here; HiGHS (npm `highs`) reading our written text is the outside reader.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readMps, solveWithHighs, writeMps } from '../src/index';
import type { Problem } from '../src/problem/problem';
import { highs } from './support/highs-runtime';
import { NETLIB_PROBLEMS, netlibMps } from './support/netlib';
import { expectSameProblem } from './support/problem-compare';
import { randomProblem } from './support/random-problems';

describe('writeMps output reads back into the same problem', () => {
  it.each(NETLIB_PROBLEMS)('Netlib %s', (name) => {
    const problem = readMps(netlibMps(name));
    expectSameProblem(readMps(writeMps(problem)), problem);
  });

  it('all-sections.mps (maximise, ranges, every bound type, integer markers, QUADOBJ)', () => {
    const problem = readMps(readFileSync(join(__dirname, 'fixtures', 'all-sections.mps'), 'utf8'));
    const text = writeMps(problem);
    expect(text).toMatch(/^OBJSENSE$/m);
    expect(text).toMatch(/^QUADOBJ$/m);
    expectSameProblem(readMps(text), problem);
  });

  it.each([1, 2, 3, 4])('random QP %i with free columns, free rows and ranges', (seed) => {
    const problem = randomProblem(seed, { rows: 12, cols: 15, quadratic: true, freeShare: 0.2, rangeShare: 0.3 });
    problem.c0 = 1.25;
    problem.integerCols = [0, 1, 7];
    expectSameProblem(readMps(writeMps(problem)), problem);
  });

  it('keeps bounds whose difference is not exact in floating point (0.1 ≤ row ≤ 0.3)', () => {
    const problem = tinyProblem();
    problem.rowLower[0] = 0.1;
    problem.rowUpper[0] = 0.3;
    expectSameProblem(readMps(writeMps(problem)), problem);
  });

  it('keeps a column with 0 lower bound and a negative upper bound (UP then LO)', () => {
    const problem = tinyProblem();
    problem.colUpper[1] = -2;
    expectSameProblem(readMps(writeMps(problem)), problem);
  });

  it('writes free format for long names and fixed format for names with blanks', () => {
    const long = tinyProblem();
    long.colNames = ['a_column_name_longer_than_eight', 'y'];
    const longText = writeMps(long);
    expectSameProblem(readMps(longText, { format: 'free' }), long);

    const blanks = tinyProblem();
    blanks.rowNames = ['CAP 1'];
    blanks.colNames = ['X 1', 'X 2'];
    expectSameProblem(readMps(writeMps(blanks), { format: 'fixed' }), blanks);
  });

  it('refuses duplicate names, which MPS cannot express', () => {
    const problem = tinyProblem();
    problem.colNames = ['x', 'x'];
    expect(() => writeMps(problem)).toThrow(/column name 'x' is used twice/);
  });
});

describe('HiGHS reads our MPS output', () => {
  it.each([5, 6])('random QP %i: same optimum from our arrays and from HiGHS parsing our file', async (seed) => {
    const problem = randomProblem(seed, { rows: 10, cols: 12, quadratic: true });
    problem.c0 = -3.5;
    const direct = await solveWithHighs(problem);
    const h = await highs();
    const model = h.createModel({ format: 'mps', data: writeMps(problem) });
    try {
      model.options.set({ output_flag: false });
      const run = model.run();
      expect(run.modelStatus).toBe(7); // HiGHS "Optimal"
      expect(direct.status).toBe('optimal');
      expect(model.getObjectiveValue()).toBeCloseTo(direct.objective, 6);
    } finally {
      model.dispose();
    }
  });
});

/** min x + 2y  s.t.  1 ≤ x + y ≤ 4,  0 ≤ x ≤ 3,  y free */
function tinyProblem(): Problem {
  return {
    name: 'TINY',
    colNames: ['x', 'y'],
    rowNames: ['r'],
    c: Float64Array.from([1, 2]),
    c0: 0,
    A: { m: 1, n: 2, colPtr: Int32Array.from([0, 1, 2]), rowIdx: Int32Array.from([0, 0]), values: Float64Array.from([1, 1]) },
    rowLower: Float64Array.from([1]),
    rowUpper: Float64Array.from([4]),
    colLower: Float64Array.from([0, -Infinity]),
    colUpper: Float64Array.from([3, Infinity]),
  };
}
