import { describe, expect, it } from 'vitest';
import { carriedFromWords, formatQuantityUnit, formatWeekOf, overtimeNotPlacedWords, showsOvertimeNotPlaced } from './sheet-words';

describe('sheet words', () => {
  // English number agreement: a unit spelt as a word is singular for exactly one and plural
  // otherwise (decimals included); abbreviations and symbols never take a plural (common practice, no source)
  it('says "1 unit" and "2 units", "1.5 units", "0 units"; leaves "pcs", "kg" and "m2" as they are', () => {
    expect(formatQuantityUnit(1, 'units')).toBe('1 unit');
    expect(formatQuantityUnit(1, 'unit')).toBe('1 unit');
    expect(formatQuantityUnit(2, 'unit')).toBe('2 units');
    expect(formatQuantityUnit(1.5, 'units')).toBe('1.5 units');
    expect(formatQuantityUnit(0, 'units')).toBe('0 units');
    expect(formatQuantityUnit(1, 'sets')).toBe('1 set');
    expect(formatQuantityUnit(1, 'boxes')).toBe('1 box');
    expect(formatQuantityUnit(1, 'pcs')).toBe('1 pcs');
    expect(formatQuantityUnit(3, 'pcs')).toBe('3 pcs');
    expect(formatQuantityUnit(1, 'kg')).toBe('1 kg');
    expect(formatQuantityUnit(12.25, 'm2')).toBe('12.25 m2');
    expect(formatQuantityUnit(4, '')).toBe('4');
  });
  it('names a week by its first day in a few characters: 2026-11-30 is "wk of 30 Nov" (calendar fact)', () => {
    expect(formatWeekOf('2026-11-30')).toBe('wk of 30 Nov');
    expect(formatWeekOf('2027-01-04')).toBe('wk of 4 Jan');
  });
  it('names the plan week a carried-over job belongs to by its first day: 2026-03-02 is "week of 2 Mar" (calendar fact)', () => {
    expect(carriedFromWords('2026-03-02')).toBe('carried over from week of 2 Mar');
    expect(carriedFromWords('2026-12-28')).toBe('carried over from week of 28 Dec');
  });
  it('says overtime that found no room in hours and minutes: 3.5 h is "3 h 30 min", 0.25 h is "15 min" (arithmetic, worked by hand); nothing under half a minute', () => {
    expect(overtimeNotPlacedWords(3.5, 'CNC')).toBe('The plan counts on 3 h 30 min of overtime at CNC this week that does not fit after the last shift; the supervisor decides where it goes.');
    expect(overtimeNotPlacedWords(0.25, 'W1')).toContain(' 15 min of overtime at W1 ');
    expect(showsOvertimeNotPlaced(0)).toBe(false);
    expect(showsOvertimeNotPlaced(0.005)).toBe(false);
    expect(showsOvertimeNotPlaced(1 / 60)).toBe(true);
  });
});
