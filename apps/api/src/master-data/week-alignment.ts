import type { EntityManager } from 'typeorm';
import { weekdayOf, type FieldError, type Weekday } from '@millrace/contracts';
import { PlantSettingsEntity } from '../db/entities/plant-settings.entity';
import { AppError } from '../http/app-error';

/** The plant's week start day (plant settings, one row). */
export async function plantWeekStart(db: EntityManager): Promise<Weekday> {
  const settings = await db.getRepository(PlantSettingsEntity).findOneByOrFail({ id: 1 });
  return settings.weekStart;
}

/**
 * Weeks are identified by their first day: every date sent as a week must fall on the plant's
 * week start day. Answers 400 naming each misaligned field.
 */
export async function assertWeekStarts(db: EntityManager, dates: Array<{ path: string; date: string }>): Promise<void> {
  if (dates.length === 0) return;
  const fields = weekStartErrors(await plantWeekStart(db), dates);
  if (fields.length > 0) {
    throw AppError.validation(fields.length === 1 ? 'One week does not start on the plant week start.' : `${fields.length} weeks do not start on the plant week start.`, fields);
  }
}

/** The dates that do not fall on the plant's week start day, each with the message to show. */
export function weekStartErrors(weekStart: Weekday, dates: Array<{ path: string; date: string }>): FieldError[] {
  return dates
    .filter((d) => weekdayOf(d.date) !== weekStart)
    .map((d) => ({ path: d.path, message: `${d.date} is a ${dayName(weekdayOf(d.date))}; weeks start on ${dayName(weekStart)}.` }));
}

/** A weekday as written in a sentence ("monday" → "Monday"). */
function dayName(day: Weekday): string {
  return day.charAt(0).toUpperCase() + day.slice(1);
}
