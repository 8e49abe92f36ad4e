import { z } from 'zod';

/** A calendar date `YYYY-MM-DD`. Weeks are identified by the date of their first day (plant week start). */
export const isoDateSchema = z.iso.date({ message: 'Use a date written YYYY-MM-DD.' });
export type IsoDate = z.infer<typeof isoDateSchema>;

/** Days a plant week may start on. */
export const weekdaySchema = z.enum(['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday']);
export type Weekday = z.infer<typeof weekdaySchema>;

/** Clock time `HH:MM` (24 h). */
export const clockTimeSchema = z
  .string()
  .regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Use a time written HH:MM (24-hour clock).');

/** The weekday of a `YYYY-MM-DD` date (calendar arithmetic in UTC, no time zone involved). */
export function weekdayOf(date: string): Weekday {
  const day = new Date(`${date}T00:00:00Z`).getUTCDay();
  return (['sunday', 'monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday'] as const)[day];
}

/** `date` plus `days` days, as `YYYY-MM-DD`. */
export function addDays(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

/** The start of the week (beginning on `weekStart`) that contains `date`. */
export function weekStartOf(date: string, weekStart: Weekday): string {
  const order = weekdaySchema.options;
  const offset = (order.indexOf(weekdayOf(date)) - order.indexOf(weekStart) + 7) % 7;
  return addDays(date, -offset);
}
