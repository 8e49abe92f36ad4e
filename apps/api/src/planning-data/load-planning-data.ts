import type { EntityManager } from 'typeorm';
import { addDays } from '@millrace/contracts';
import type { PlanningData } from '@millrace/plan-model';
import { assertWeekStarts, plantWeekStart } from '../master-data/week-alignment';
import { currentWeekStart, weekStarts } from '../master-data/weeks';
import { readMasterDataRows } from './planning-data.repository';
import { toPlanningData } from './to-planning-data';

/** Longest horizon the planning data is read for. */
export const maxHorizonWeeks = 104;

export interface PlanningDataOptions {
  /** first week (a plant week start); default: the current plant week */
  from?: string;
  /** the clock (tests) */
  now?: Date;
}

/**
 * The current master data and demand as the plain PlanningData of the planning model, for
 * `horizonWeeks` weeks from the current plant week (or `from`). Call it inside a transaction so
 * every table is read from one snapshot; the caller keeps the result with its plan version.
 */
export async function loadPlanningData(db: EntityManager, horizonWeeks: number, options: PlanningDataOptions = {}): Promise<PlanningData> {
  if (!Number.isInteger(horizonWeeks) || horizonWeeks < 1 || horizonWeeks > maxHorizonWeeks) {
    throw new RangeError(`horizonWeeks must be a whole number from 1 to ${maxHorizonWeeks}, got ${horizonWeeks}`);
  }
  if (options.from) await assertWeekStarts(db, [{ path: 'from', date: options.from }]);
  const from = options.from ?? currentWeekStart(await plantWeekStart(db), options.now);
  const rows = await readMasterDataRows(db, from, addDays(from, 7 * horizonWeeks));
  return toPlanningData(rows, weekStarts(from, horizonWeeks));
}
