import { addDays, weekStartOf, type Weekday } from '@millrace/contracts';

/** Today's date in UTC, `YYYY-MM-DD`. */
export function todayIso(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/** The start of the plant week containing today. */
export function currentWeekStart(weekStart: Weekday, now: Date = new Date()): string {
  return weekStartOf(todayIso(now), weekStart);
}

/** `count` consecutive week starts beginning at `from`. */
export function weekStarts(from: string, count: number): string[] {
  return Array.from({ length: count }, (_, i) => addDays(from, 7 * i));
}
