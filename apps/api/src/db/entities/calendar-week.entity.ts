import { EntitySchema } from 'typeorm';
import { decimalAsNumber } from './column-types';

/** One exceptional week in a work center's calendar. Table `work_center_week`. */
export interface CalendarWeekRow {
  id: number;
  workCenterId: number;
  /** YYYY-MM-DD, a plant week start */
  weekStart: string;
  holidayDays: number;
  downtimeHours: number;
  extraShifts: number;
  note: string | null;
  workCenter?: unknown;
}

export const CalendarWeekEntity = new EntitySchema<CalendarWeekRow>({
  name: 'CalendarWeek',
  tableName: 'work_center_week',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    workCenterId: { name: 'work_center_id', type: 'int' },
    weekStart: { name: 'week_start', type: 'date' },
    holidayDays: { name: 'holiday_days', type: 'tinyint', default: 0 },
    downtimeHours: { name: 'downtime_hours', type: 'decimal', precision: 12, scale: 4, default: 0, transformer: decimalAsNumber },
    extraShifts: { name: 'extra_shifts', type: 'tinyint', default: 0 },
    note: { type: 'varchar', length: 200, nullable: true },
  },
  relations: {
    workCenter: {
      type: 'many-to-one',
      target: 'WorkCenter',
      joinColumn: { name: 'work_center_id', foreignKeyConstraintName: 'fk_work_center_week_wc' },
      onDelete: 'CASCADE',
      onUpdate: 'RESTRICT',
    },
  },
  indices: [{ name: 'uq_work_center_week', columns: ['workCenterId', 'weekStart'], unique: true }],
});
