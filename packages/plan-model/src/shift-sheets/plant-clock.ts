/** Plant wall-clock arithmetic: minutes from the start of a plan week ↔ "YYYY-MM-DDTHH:MM". */

const WEEKDAYS = ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'] as const;

/** "HH:MM" → minutes after midnight */
export function clockMinutes(hhmm: string): number {
  const [h, m] = hhmm.split(':').map(Number);
  return h * 60 + m;
}

/** ISO date + whole days (calendar arithmetic in UTC, so no daylight-saving shifts) */
export function addDays(isoDate: string, days: number): string {
  const d = new Date(`${isoDate}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

/** minutes from the week's first day 00:00 → "YYYY-MM-DDTHH:MM" (rounded to the minute) */
export function wallClock(weekStartDate: string, minute: number): string {
  const m = Math.round(minute);
  const day = Math.floor(m / 1440);
  const inDay = m - day * 1440;
  const hh = String(Math.floor(inDay / 60)).padStart(2, '0');
  const mm = String(inDay % 60).padStart(2, '0');
  return `${addDays(weekStartDate, day)}T${hh}:${mm}`;
}

/** weekday name of a day of the plan week, given the plant's first weekday */
export function weekdayOf(weekStart: (typeof WEEKDAYS)[number], dayIndex: number): string {
  return WEEKDAYS[(WEEKDAYS.indexOf(weekStart) + dayIndex) % 7];
}
