import type { PlanState } from '@millrace/contracts';

/** "2027-01-04T07:30" → "07:30" */
export const clockOf = (wallClock: string): string => wallClock.slice(11, 16);

/** Minutes → "7 h 30 min" / "45 min" / "8 h". */
export function formatMinutes(minutes: number): string {
  const m = Math.round(minutes);
  const h = Math.floor(m / 60);
  const rest = m - h * 60;
  if (h === 0) return `${rest} min`;
  return rest === 0 ? `${h} h` : `${h} h ${rest} min`;
}

const quantityFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 2 });
export const formatQuantity = (q: number): string => quantityFormat.format(q);

/** units spelt as words change with the number; symbols and abbreviations (pcs, kg, m) do not */
const unitWords: Record<string, string> = { unit: 'units', units: 'units', piece: 'pieces', pieces: 'pieces', set: 'sets', sets: 'sets', box: 'boxes', boxes: 'boxes', pair: 'pairs', pairs: 'pairs' };
/** Quantity and unit as read aloud: "1 unit", "2 units", "1.5 units", "1 pcs" (pcs unchanged). */
export function formatQuantityUnit(q: number, unit: string): string {
  const number = formatQuantity(q);
  const plural = unitWords[unit.toLowerCase()];
  if (plural === undefined) return unit === '' ? number : `${number} ${unit}`;
  const singular = Object.keys(unitWords).find((w) => unitWords[w] === plural && w !== plural)!;
  return `${number} ${number === '1' ? singular : plural}`;
}

const weekOfFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
/** A week by its first day, short enough for one line of a printed column: "2026-11-30" → "wk of 30 Nov". */
export const formatWeekOf = (isoDate: string): string => `wk of ${weekOfFormat.format(new Date(`${isoDate}T00:00:00Z`))}`;

const weekOfLongFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
/** A job carried over from an earlier plan week, in plain words: "2026-03-02" → "carried over from week of 2 Mar". */
export const carriedFromWords = (isoDate: string): string => `carried over from week of ${weekOfLongFormat.format(new Date(`${isoDate}T00:00:00Z`))}`;

/** "carried over …" → "Carried over …" */
export const upperFirst = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1);

const dayFormat = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
const shortDayFormat = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });
/** "2027-01-04" → "Monday 4 January 2027" */
export const formatDay = (isoDate: string): string => dayFormat.format(new Date(`${isoDate}T00:00:00Z`));
/** "2027-01-04" → "Mon 4 Jan" */
export const formatShortDay = (isoDate: string): string => shortDayFormat.format(new Date(`${isoDate}T00:00:00Z`));

const stampFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
/** An ISO instant in the reader's local time: "4 Jan 2027, 09:12". */
export const formatStamp = (iso: string | Date): string => stampFormat.format(typeof iso === 'string' ? new Date(iso) : iso);

export const sheetPlanStateWords: Partial<Record<PlanState, string>> = { approved: 'Approved, not yet released', released: 'Released to the floor' };

/** "Shift 1" with its clock times. */
export const shiftLabel = (shift: number, start: string, end: string): string => `Shift ${shift}, ${clockOf(start)}–${clockOf(end)}`;

/**
 * Overtime the plan counts on that no sheet holds, in plain words: "The plan counts on 3 h 30 min
 * of overtime at CNC this week that does not fit after the last shift; the supervisor decides
 * where it goes."
 */
export const overtimeNotPlacedWords = (hours: number, workCenter: string): string =>
  `The plan counts on ${formatMinutes(hours * 60)} of overtime at ${workCenter} this week that does not fit after the last shift; the supervisor decides where it goes.`;

/** Whether unplaced overtime is worth a line: at least half a minute (it is shown to the minute). */
export const showsOvertimeNotPlaced = (hours: number): boolean => hours * 60 >= 0.5;
