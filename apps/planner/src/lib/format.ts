/** Number and date formatting used on every screen (one locale-neutral style for the plant). */
const numberFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 2 });
const wholeFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
const hoursFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1, minimumFractionDigits: 0 });

export const formatNumber = (n: number) => numberFormat.format(n);
export const formatWhole = (n: number) => wholeFormat.format(n);
export const formatHours = (n: number) => `${hoursFormat.format(n)} h`;

/** '2026-12-07' → '7 Dec' (week starts in table headers). */
export function formatWeek(isoDate: string): string {
  const d = new Date(`${isoDate}T00:00:00Z`);
  return d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
}

/** '2026-12-07' → 'week of 7 Dec 2026' (accessible names). */
export function formatWeekLong(isoDate: string): string {
  const d = new Date(`${isoDate}T00:00:00Z`);
  return `week of ${d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' })}`;
}
