/**
 * MPS reader. Reference: HiGHS (npm package `highs`) reading the same text with its own MPS parser;
 * where a rule is checked by hand, the MPS conventions are named beside the check.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { MpsParseError, readMps } from '../src/index';
import { dense } from './support/problem-compare';
import { highs } from './support/highs-runtime';

const fixture = (name: string) => readFileSync(join(__dirname, 'fixtures', name), 'utf8');

describe('readMps against HiGHS reading the same file', () => {
  it('reads every section and bound type of all-sections.mps as HiGHS does', async () => {
    const text = fixture('all-sections.mps');
    const ours = readMps(text);
    const h = await highs();
    const model = h.createModel({ format: 'mps', data: text });
    const lp = model.getModel('csc');
    try {
      // HiGHS keeps the file's sense; lp-core stores the minimisation form (c, c₀, Q negated when maximising).
      expect(lp.sense).toBe(-1);
      expect(ours.maximise).toBe(true);
      const sign = -1;
      expect(ours.colNames).toEqual(Array.from({ length: lp.numCols }, (_, j) => model.getColName(j)));
      expect(ours.rowNames).toEqual(Array.from({ length: lp.numRows }, (_, i) => model.getRowName(i)));
      expect([...ours.c]).toEqual([...lp.colCost].map((v) => sign * v + 0));
      expect(ours.c0).toBe(sign * lp.offset);
      expect([...ours.rowLower]).toEqual([...lp.rowLower]);
      expect([...ours.rowUpper]).toEqual([...lp.rowUpper]);
      // One deliberate difference: x6 has UP −3 on a zero lower bound. We read lower = −∞ (CPLEX's and
      // CoinUtils' rule, from memory); HiGHS 1.15 keeps lower = 0 (an empty range).
      const x6 = ours.colNames.indexOf('x6');
      expect([ours.colLower[x6], lp.colLower[x6]]).toEqual([-Infinity, 0]);
      expect([...ours.colLower].filter((_, j) => j !== x6)).toEqual([...lp.colLower].filter((_, j) => j !== x6));
      expect([...ours.colUpper]).toEqual([...lp.colUpper]);
      const theirs = { m: lp.numRows, n: lp.numCols, colPtr: lp.matrix.starts, rowIdx: lp.matrix.indices, values: lp.matrix.values };
      expect(dense(ours.A)).toEqual(dense(theirs));
      const hess = lp.hessian!;
      const theirQ = dense({ m: lp.numCols, n: lp.numCols, colPtr: hess.starts, rowIdx: hess.indices, values: hess.values }, true);
      expect(dense(ours.Q!, true)).toEqual(theirQ.map((row) => row.map((v) => sign * v + 0)));
      expect(ours.integerCols).toEqual([...lp.integrality].flatMap((t, j) => (t === 1 ? [j] : [])));
    } finally {
      model.dispose();
    }
  });
});

describe('readMps conventions', () => {
  const problem = readMps(fixture('all-sections.mps'));
  const col = (name: string) => problem.colNames.indexOf(name);
  const row = (name: string) => problem.rowNames.indexOf(name);

  it('takes the first N row as objective and drops later N rows with their entries', () => {
    expect(problem.rowNames).not.toContain('spare');
    expect(problem.rowNames).not.toContain('profit');
    expect(problem.A.m).toBe(5);
  });

  it('turns the objective-row RHS into c₀ = −rhs (common practice, no source), negated for MAX', () => {
    // file: RHS profit −10 → constant +10 of the maximisation → c₀ = −10 of the minimisation form
    expect(problem.c0).toBe(-10);
  });

  it('applies the RANGES sign rules (MPS format, as tabulated in CPLEX and lp_solve file-format references, from memory)', () => {
    expect([problem.rowLower[row('cap')], problem.rowUpper[row('cap')]]).toEqual([25, 40]); // L: [b − |R|, b]
    expect([problem.rowLower[row('demand')], problem.rowUpper[row('demand')]]).toEqual([5, 9]); // G: [b, b + |R|]
    expect([problem.rowLower[row('blend')], problem.rowUpper[row('blend')]]).toEqual([8, 10.5]); // E, R > 0: [b, b + R]
    expect([problem.rowLower[row('mix')], problem.rowUpper[row('mix')]]).toEqual([1.5, 3]); // E, R < 0: [b + R, b]
  });

  it('reads UP with a negative value on a zero lower bound as lower = −∞ (CPLEX and CoinUtils rule, from memory)', () => {
    expect([problem.colLower[col('x6')], problem.colUpper[col('x6')]]).toEqual([-Infinity, -3]);
  });

  it('reports integer columns from markers and from BV/LI/UI bounds', () => {
    expect(problem.integerCols).toEqual([col('y1'), col('b1')]);
    expect([problem.colLower[col('b1')], problem.colUpper[col('b1')]]).toEqual([0, 1]);
  });

  it('accepts the same-line OBJSENSE form', () => {
    const text = fixture('all-sections.mps').replace('OBJSENSE\n    MAX', 'OBJSENSE MAXIMIZE');
    expect(readMps(text)).toEqual(problem);
  });
});

describe('fixed format', () => {
  // Columns 2–3, 5–12, 15–22, 25–36, 40–47, 50–61 (the original MPS layout); names contain blanks.
  const text = [
    'NAME          FIXED',
    'ROWS',
    ' N  COST',
    ' L  LIM 1',
    ' G  LIM 2',
    'COLUMNS',
    '    X ONE     COST                1.   LIM 1               1.',
    '    X ONE     LIM 2               1.',
    '    X TWO     COST                2.   LIM 1               1.',
    'RHS',
    '    RHS       LIM 1               4.   LIM 2               1.',
    'BOUNDS',
    ' UP BND       X TWO               3.',
    'ENDATA',
  ].join('\n');

  it('reads names with blanks by column position', () => {
    const p = readMps(text, { format: 'fixed' });
    expect(p.colNames).toEqual(['X ONE', 'X TWO']);
    expect(p.rowNames).toEqual(['LIM 1', 'LIM 2']);
    expect([...p.rowUpper]).toEqual([4, Infinity]);
    expect([...p.rowLower]).toEqual([-Infinity, 1]);
    expect([...p.colUpper]).toEqual([Infinity, 3]);
  });

  it('falls back to fixed format automatically when free format cannot read the file', () => {
    expect(readMps(text)).toEqual(readMps(text, { format: 'fixed' }));
  });
});

describe('malformed files name the line and what was expected', () => {
  const base = ['NAME T', 'ROWS', ' N obj', ' L c1', 'COLUMNS', '    x obj 1 c1 2', 'RHS', '    rhs c1 4', 'ENDATA'];
  const withLine = (index: number, line: string) => base.map((l, i) => (i === index ? line : l)).join('\n');
  const cases: [string, string, number, RegExp][] = [
    ['an unknown row type', withLine(3, ' X c1'), 4, /row type N, E, L or G, found 'X'/],
    ['an unknown row in COLUMNS', withLine(5, '    x obj 1 c9 2'), 6, /row named in ROWS, found 'c9'/],
    ['a coefficient that is not a number', withLine(5, '    x obj 1 c1 two'), 6, /as a number, found 'two'/],
    ['an unknown section', withLine(6, 'RHSIDE'), 7, /section name .* found 'RHSIDE'/],
    ['an unknown bound type', [...base.slice(0, 8), 'BOUNDS', ' XX bnd x 3', 'ENDATA'].join('\n'), 10, /bound type .* found 'XX'/],
    ['a missing ENDATA', base.slice(0, 8).join('\n'), 8, /ENDATA/],
    ['a second RHS vector', withLine(7, '    rhs c1 4\n    other c1 5'), 9, /second one 'other'/],
  ];
  it.each(cases)('%s', (_what, text, line, message) => {
    let error: unknown;
    try {
      readMps(text);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(MpsParseError);
    expect((error as MpsParseError).line).toBe(line);
    expect((error as Error).message).toMatch(message);
  });
});
