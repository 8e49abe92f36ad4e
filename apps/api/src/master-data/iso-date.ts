/**
 * A DATE column value as `YYYY-MM-DD`. Entities map DATE columns to strings; raw query
 * results come back as Date objects at UTC midnight (the pool runs with timezone 'Z').
 */
export function toIsoDate(value: Date | string): string {
  if (typeof value === 'string') return value.slice(0, 10);
  return value.toISOString().slice(0, 10);
}
