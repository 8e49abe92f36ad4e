import type { EntityManager } from 'typeorm';
import type { PlantSettings, PlantSettingsUpdate } from '@millrace/contracts';
import { PlantSettingsEntity, type PlantSettingsRow } from '../db/entities/plant-settings.entity';
import { updateIfVersion, type VersionedWrite } from '../master-data/versioned-update';

function toPlain(row: PlantSettingsRow): PlantSettings {
  return {
    plantName: row.plantName,
    currency: row.currency,
    weekStart: row.weekStart,
    defaultShiftPattern: {
      shiftsPerDay: row.defaultShiftsPerDay,
      hoursPerShift: row.defaultHoursPerShift,
      daysPerWeek: row.defaultDaysPerWeek,
      shiftStarts: row.defaultShiftStarts,
    },
    maxWeeklyHours: row.maxWeeklyHours,
    minDailyRestHours: row.minDailyRestHours,
    overtimePremium: row.overtimePremium,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** The one settings row (created by the migration). */
export async function readPlantSettings(db: EntityManager): Promise<PlantSettings> {
  return toPlain(await db.getRepository(PlantSettingsEntity).findOneByOrFail({ id: 1 }));
}

export async function writePlantSettings(db: EntityManager, input: PlantSettingsUpdate): Promise<VersionedWrite> {
  return updateIfVersion(db, PlantSettingsEntity, 1, input.version, {
    plantName: input.plantName,
    currency: input.currency,
    weekStart: input.weekStart,
    defaultShiftsPerDay: input.defaultShiftPattern.shiftsPerDay,
    defaultHoursPerShift: input.defaultShiftPattern.hoursPerShift,
    defaultDaysPerWeek: input.defaultShiftPattern.daysPerWeek,
    defaultShiftStarts: input.defaultShiftPattern.shiftStarts,
    maxWeeklyHours: input.maxWeeklyHours,
    minDailyRestHours: input.minDailyRestHours,
    overtimePremium: input.overtimePremium,
  });
}

/** Rows stored against a week start date (they would no longer line up if the week start changed). */
export async function countWeekDatedRows(db: EntityManager): Promise<number> {
  const [row] = (await db.query(`
    SELECT (SELECT COUNT(*) FROM firm_order) + (SELECT COUNT(*) FROM demand_forecast)
         + (SELECT COUNT(*) FROM work_center_week) + (SELECT COUNT(*) FROM scheduled_receipt) AS n`)) as Array<{ n: string | number }>;
  return Number(row.n);
}
