import { EntitySchema } from 'typeorm';
import { clockTimeList, decimalAsNumber } from './column-types';

/** A work center with its regular shift pattern. Table `work_center`. */
export interface WorkCenterRow {
  id: number;
  code: string;
  name: string;
  efficiency: number;
  overtimeCapHoursPerWeek: number | null;
  overtimeCostPerHour: number;
  shiftsPerDay: number;
  hoursPerShift: number;
  daysPerWeek: number;
  shiftStarts: string[];
  version: number;
  createdAt: Date;
  updatedAt: Date;
}

export const WorkCenterEntity = new EntitySchema<WorkCenterRow>({
  name: 'WorkCenter',
  tableName: 'work_center',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    code: { type: 'varchar', length: 40 },
    name: { type: 'varchar', length: 120 },
    efficiency: { type: 'decimal', precision: 5, scale: 3, transformer: decimalAsNumber },
    overtimeCapHoursPerWeek: { name: 'overtime_cap_hours', type: 'decimal', precision: 12, scale: 4, nullable: true, transformer: decimalAsNumber },
    overtimeCostPerHour: { name: 'overtime_cost_per_hour', type: 'decimal', precision: 14, scale: 4, transformer: decimalAsNumber },
    shiftsPerDay: { name: 'shifts_per_day', type: 'tinyint' },
    hoursPerShift: { name: 'hours_per_shift', type: 'decimal', precision: 5, scale: 2, transformer: decimalAsNumber },
    daysPerWeek: { name: 'days_per_week', type: 'tinyint' },
    shiftStarts: { name: 'shift_starts', type: 'varchar', length: 40, transformer: clockTimeList },
    version: { type: 'int', default: 1 },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
    updatedAt: { name: 'updated_at', type: 'datetime', precision: 3 },
  },
  indices: [
    { name: 'uq_work_center_code', columns: ['code'], unique: true },
    { name: 'ix_work_center_name', columns: ['name'] },
  ],
});
