import { EntitySchema } from 'typeorm';
import type { Weekday } from '@millrace/contracts';
import { clockTimeList, decimalAsNumber } from './column-types';

/** The plant's settings: exactly one row (id 1). Table `plant_settings`. */
export interface PlantSettingsRow {
  id: number;
  plantName: string;
  currency: string;
  weekStart: Weekday;
  defaultShiftsPerDay: number;
  defaultHoursPerShift: number;
  defaultDaysPerWeek: number;
  defaultShiftStarts: string[];
  maxWeeklyHours: number;
  minDailyRestHours: number;
  overtimePremium: number;
  version: number;
  createdAt: Date;
  updatedAt: Date;
}

export const PlantSettingsEntity = new EntitySchema<PlantSettingsRow>({
  name: 'PlantSettings',
  tableName: 'plant_settings',
  columns: {
    id: { type: 'tinyint', primary: true },
    plantName: { name: 'plant_name', type: 'varchar', length: 120 },
    currency: { type: 'char', length: 3 },
    weekStart: { name: 'week_start', type: 'varchar', length: 9 },
    defaultShiftsPerDay: { name: 'default_shifts_per_day', type: 'tinyint' },
    defaultHoursPerShift: { name: 'default_hours_per_shift', type: 'decimal', precision: 5, scale: 2, transformer: decimalAsNumber },
    defaultDaysPerWeek: { name: 'default_days_per_week', type: 'tinyint' },
    defaultShiftStarts: { name: 'default_shift_starts', type: 'varchar', length: 40, transformer: clockTimeList },
    maxWeeklyHours: { name: 'max_weekly_hours', type: 'decimal', precision: 6, scale: 2, transformer: decimalAsNumber },
    minDailyRestHours: { name: 'min_daily_rest_hours', type: 'decimal', precision: 5, scale: 2, transformer: decimalAsNumber },
    overtimePremium: { name: 'overtime_premium', type: 'decimal', precision: 5, scale: 3, transformer: decimalAsNumber },
    version: { type: 'int', default: 1 },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
    updatedAt: { name: 'updated_at', type: 'datetime', precision: 3 },
  },
});
