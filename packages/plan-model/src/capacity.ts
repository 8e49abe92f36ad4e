import type { PlanningData, WorkCenter, CalendarException } from './planning-data';

/**
 * Weekly capacity of a work center from its shift calendar (rough-cut capacity; DOMAIN.md §1):
 *
 *   available[w,t] = shifts × hours per shift × (days − holidays) × efficiency − downtime   (≥ 0)
 *
 * in standard hours. Overtime is in clock hours, capped per week; one clock hour of overtime
 * yields `efficiency` standard hours. A closed week has neither regular time nor overtime.
 */

function exceptionsOf(wc: WorkCenter, week: number): CalendarException[] {
  return wc.exceptions.filter((e) => e.week === week);
}

export function isClosed(wc: WorkCenter, week: number): boolean {
  return exceptionsOf(wc, week).some((e) => e.closed === true);
}

/** shifts per day in the given week, extra shifts included */
export function shiftsPerDay(wc: WorkCenter, week: number): number {
  const s = wc.shiftPattern;
  if (!s) return 0;
  return s.shiftsPerDay + exceptionsOf(wc, week).reduce((a, e) => a + (e.extraShiftsPerDay ?? 0), 0);
}

/** working days in the given week after holidays */
export function workingDays(wc: WorkCenter, week: number): number {
  const s = wc.shiftPattern;
  if (!s) return 0;
  return Math.max(0, s.daysPerWeek - exceptionsOf(wc, week).reduce((a, e) => a + (e.holidayDays ?? 0), 0));
}

export function downtimeHours(wc: WorkCenter, week: number): number {
  return exceptionsOf(wc, week).reduce((a, e) => a + (e.downtimeHours ?? 0), 0);
}

/** standard hours of regular time available in the week */
export function availableHours(wc: WorkCenter, week: number): number {
  const s = wc.shiftPattern;
  if (!s || isClosed(wc, week)) return 0;
  const gross = shiftsPerDay(wc, week) * s.hoursPerShift * workingDays(wc, week) * wc.efficiency;
  return Math.max(0, gross - downtimeHours(wc, week));
}

/** overtime clock hours allowed in the week (Infinity = no cap) */
export function overtimeCapHours(wc: WorkCenter, week: number): number {
  if (!wc.shiftPattern || isClosed(wc, week)) return 0;
  return wc.overtimeCapHoursPerWeek === null ? Infinity : wc.overtimeCapHoursPerWeek;
}

export function workCenterByCode(data: PlanningData): Map<string, WorkCenter> {
  return new Map(data.workCenters.map((w) => [w.code, w]));
}
