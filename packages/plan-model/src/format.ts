/** Number and week-range wording used in plan explanations. */

/** 2 decimals, thousands not grouped: 38.1 → "38.10" */
export const money = (v: number): string => v.toFixed(2);

/** quantity with at most 2 decimals, trailing zeros dropped: 40 → "40", 2.5 → "2.5" */
export const qty = (v: number): string => String(Math.round(v * 100) / 100);

/** [4, 5, 7] → "weeks 4–5, 7"; [3] → "week 3" */
export function weekRanges(weeks: number[]): string {
  const sorted = [...new Set(weeks)].sort((a, b) => a - b);
  if (sorted.length === 0) return 'no week';
  const parts: string[] = [];
  let start = sorted[0];
  let prev = sorted[0];
  for (const w of sorted.slice(1).concat([NaN])) {
    if (w === prev + 1) {
      prev = w;
      continue;
    }
    parts.push(start === prev ? `${start}` : `${start}–${prev}`);
    start = w;
    prev = w;
  }
  return `${sorted.length === 1 ? 'week' : 'weeks'} ${parts.join(', ')}`;
}
