import { describe, expect, it } from 'vitest';
import { importFields } from '@millrace/contracts';
import { parseDate, parseDecimal, readCell, serialToIso } from '../../src/imports/cell-values';
import { closestCode, editDistance } from '../../src/imports/edit-distance';
import { columnTitles, suggestMapping } from '../../src/imports/header-mapping';

describe('reading cells', () => {
  it('when numbers are written with decimal commas, points or thousands groups, then each reads as the number meant', () => {
    // Common practice, no source: continental Europe writes 1.234,5; the English-speaking world 1,234.5.
    expect(parseDecimal('1,5')).toBe(1.5);
    expect(parseDecimal('1.5')).toBe(1.5);
    expect(parseDecimal('1.234,5')).toBe(1234.5);
    expect(parseDecimal('1,234.5')).toBe(1234.5);
    expect(parseDecimal('1 234,5')).toBe(1234.5);
    expect(parseDecimal("1'234.5")).toBe(1234.5);
    expect(parseDecimal('1.234.567')).toBe(1234567);
    expect(parseDecimal('-2')).toBe(-2);
    expect(parseDecimal('abc')).toBeNull();
    expect(parseDecimal('12kg')).toBeNull();
  });

  it('when dates come as text in the usual forms, then they read as the same ISO date; ambiguous ones are refused', () => {
    expect(parseDate('2026-03-02')).toEqual({ date: '2026-03-02' });
    expect(parseDate('02.03.2026')).toEqual({ date: '2026-03-02' });
    expect(parseDate('2026/03/02')).toEqual({ date: '2026-03-02' });
    expect(parseDate('23/03/2026')).toEqual({ date: '2026-03-23' });
    expect(parseDate('03/23/2026')).toEqual({ date: '2026-03-23' });
    expect(parseDate('03/02/2026')).toEqual({ message: '03/02/2026 can be read day-first or month-first; write it as YYYY-MM-DD.' });
    expect(parseDate('2026-02-30')).toEqual({ message: '2026-02-30 is not a real date.' });
  });

  it('when a date is a spreadsheet serial number, then it counts days from 1899-12-30', () => {
    // ECMA-376 Part 1 §18.17.4.1 (1900 date system; serial 1 = 1900-01-01 with the 1900-02-29 quirk,
    // so for dates after February 1900 day 0 is 1899-12-30); 45292 = 2024-01-01 is checked against
    // LibreOffice's own conversion in the XLSX tests.
    expect(serialToIso(45292)).toBe('2024-01-01');
    expect(parseDate(46083)).toEqual({ date: '2026-03-02' });
  });

  it('when a cell does not fit its field, then the message names the value', () => {
    const qty = importFields.bom.find((f) => f.key === 'qtyPer')!;
    const kind = importFields.products.find((f) => f.key === 'kind')!;
    const seq = importFields.routings.find((f) => f.key === 'sequence')!;
    expect(readCell(qty, 'four')).toEqual({ outcome: 'invalid', message: 'four is not a number.' });
    expect(readCell(seq, '1,5')).toEqual({ outcome: 'invalid', message: '1,5 is not a whole number.' });
    expect(readCell(kind, 'Finished good')).toEqual({ outcome: 'value', value: 'finished' });
    expect(readCell(kind, 'raw')).toEqual({ outcome: 'invalid', message: 'raw is not one of finished, subassembly.' });
    expect(readCell(qty, { error: '#DIV/0!' })).toEqual({ outcome: 'invalid', message: 'The spreadsheet shows #DIV/0! here instead of a value.' });
    expect(readCell(qty, '  ')).toEqual({ outcome: 'empty' });
  });
});

describe('did you mean', () => {
  it('when distances are computed, then they match the textbook examples', () => {
    // Levenshtein distance examples (from memory, the usual textbook pair): kitten → sitting = 3; flaw → lawn = 2.
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('flaw', 'lawn')).toBe(2);
    expect(editDistance('', 'abc')).toBe(3);
    expect(editDistance('OAK', 'oak')).toBe(0);
  });

  it('when a code is one typo away from a known code, then that code is suggested; far codes suggest nothing', () => {
    expect(closestCode('OAK-BORD', ['OAK-BOARD', 'PINE-BOARD', 'SCREW'])).toBe('OAK-BOARD');
    expect(closestCode('TABEL-1', ['TABLE-1', 'CHAIR-1'])).toBe('TABLE-1');
    expect(closestCode('XYZ-99', ['TABLE-1', 'CHAIR-1'])).toBeNull();
  });
});

describe('headers', () => {
  it('when titles are other usual names, then the suggested mapping finds our fields', () => {
    const mapping = suggestMapping(['Parent item', 'Part number', 'Qty per unit', 'UoM', 'Scrap %'], importFields.bom);
    expect(mapping).toEqual({ parent: 'Parent item', component: 'Part number', qtyPer: 'Qty per unit', unit: 'UoM', scrapPct: 'Scrap %' });
  });

  it('when a title is merged over two columns or repeated, then the later columns get numbered titles', () => {
    expect(columnTitles(['parent', 'quantity', null, 'quantity', null], new Set([2]))).toEqual(['parent', 'quantity', 'quantity (2)', 'quantity (3)', 'column E']);
  });
});
