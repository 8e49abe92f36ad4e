import { describe, expect, it } from 'vitest';
import { scenarioOverrideSchema } from '../src/scenarios';

const messagesFor = (value: unknown) => {
  const result = scenarioOverrideSchema.safeParse(value);
  return result.success ? [] : result.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
};

describe('scenario override weeks', () => {
  it('when a week is left empty, then the message asks for the week (not for a date format)', () => {
    expect(messagesFor({ kind: 'extra_shift', workCenter: 'SAW', fromWeek: '', toWeek: '2027-01-04', extraShiftsPerDay: 1 })).toEqual(['fromWeek: Choose a week.']);
  });

  it('when a week is typed in another format, then the message names the ISO format', () => {
    // ISO 8601 calendar date, YYYY-MM-DD (ISO 8601-1:2019, 5.2.2).
    expect(messagesFor({ kind: 'extra_shift', workCenter: 'SAW', fromWeek: '04/01/2027', toWeek: '2027-01-04', extraShiftsPerDay: 1 })).toEqual([
      'fromWeek: Use a date as YYYY-MM-DD.',
    ]);
  });

  it('when both weeks are ISO dates, then the override is accepted', () => {
    expect(messagesFor({ kind: 'extra_shift', workCenter: 'SAW', fromWeek: '2027-01-04', toWeek: '2027-01-11', extraShiftsPerDay: 1 })).toEqual([]);
  });
});
