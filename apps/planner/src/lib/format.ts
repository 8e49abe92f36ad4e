/**
 * Number and date formatting used on every screen (one style for the plant). The Intl formatters
 * are built once: building one per call is slow enough to stall a grid of hundreds of cells.
 */
const numberFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 2 });
const wholeFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
const hoursFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1, minimumFractionDigits: 0 });
const weekShortFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
const weekLongFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

export const formatNumber = (n: number) => numberFormat.format(n);
export const formatWhole = (n: number) => wholeFormat.format(n);
export const formatHours = (n: number) => `${hoursFormat.format(n)} h`;

const utcDate = (isoDate: string) => new Date(`${isoDate}T00:00:00Z`);

/** '2026-12-07' → '7 Dec' (week starts in table headers). */
export const formatWeek = (isoDate: string): string => weekShortFormat.format(utcDate(isoDate));

/** '2026-12-07' → 'week of 7 Dec 2026' (accessible names). */
export const formatWeekLong = (isoDate: string): string => `week of ${weekLongFormat.format(utcDate(isoDate))}`;

const dateTimeFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** '2026-12-07T14:30:00.000Z' → '7 Dec 2026, 15:30' in the browser's time zone (mail dates, link expiry). */
export const formatDateTime = (iso: string): string => {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateTimeFormat.format(date);
};
