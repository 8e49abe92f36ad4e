import type { EntityManager } from 'typeorm';
import type { CalendarWeek, CalendarWeekInput, Page, WorkCenter, WorkCenterCreate, WorkCenterListQuery, WorkCenterUpdate } from '@millrace/contracts';
import { CalendarWeekEntity } from '../db/entities/calendar-week.entity';
import { WorkCenterEntity, type WorkCenterRow } from '../db/entities/work-center.entity';
import { codedTable } from '../master-data/coded-table';
import { pageFrom } from '../master-data/list-query';
import { definedOnly, updateIfVersion, type VersionedWrite } from '../master-data/versioned-update';

export function toWorkCenter(row: WorkCenterRow): WorkCenter {
  return {
    id: row.id,
    code: row.code,
    name: row.name,
    efficiency: row.efficiency,
    overtimeCapHoursPerWeek: row.overtimeCapHoursPerWeek,
    overtimeCostPerHour: row.overtimeCostPerHour,
    shiftPattern: {
      shiftsPerDay: row.shiftsPerDay,
      hoursPerShift: row.hoursPerShift,
      daysPerWeek: row.daysPerWeek,
      shiftStarts: row.shiftStarts,
    },
    version: row.version,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const sortColumns = { code: 't.code', name: 't.name', efficiency: 't.efficiency', updatedAt: 't.updatedAt' } as const;

export async function listWorkCenters(db: EntityManager, query: WorkCenterListQuery): Promise<Page<WorkCenter>> {
  return pageFrom(db.getRepository(WorkCenterEntity).createQueryBuilder('t'), query, sortColumns, toWorkCenter);
}

/** Every work center, by code (planning data and the home page). */
export async function listAllWorkCenters(db: EntityManager): Promise<WorkCenter[]> {
  return (await db.getRepository(WorkCenterEntity).find({ order: { code: 'ASC' } })).map(toWorkCenter);
}

const workCenters = codedTable(WorkCenterEntity, toWorkCenter);

export const findWorkCenterById = workCenters.findById;
export const findWorkCenterByCode = workCenters.findByCode;
export const findWorkCentersByIds = workCenters.findByIds;

function patternColumns(p: WorkCenterCreate['shiftPattern']) {
  return { shiftsPerDay: p.shiftsPerDay, hoursPerShift: p.hoursPerShift, daysPerWeek: p.daysPerWeek, shiftStarts: p.shiftStarts };
}

export async function insertWorkCenter(db: EntityManager, input: WorkCenterCreate): Promise<WorkCenter> {
  const { shiftPattern, ...rest } = input;
  return workCenters.insert(db, { ...rest, ...patternColumns(shiftPattern) });
}

export async function updateWorkCenterIfVersion(db: EntityManager, id: number, input: WorkCenterUpdate): Promise<VersionedWrite> {
  const { version, shiftPattern, ...rest } = input;
  const pattern = shiftPattern ? patternColumns(shiftPattern) : {};
  return updateIfVersion(db, WorkCenterEntity, id, version, { ...definedOnly(rest), ...pattern });
}

export const touchWorkCenterIfVersion = workCenters.touchIfVersion;
export const deleteWorkCenterRow = workCenters.deleteRow;

/** Codes of the products whose routing uses the work center. */
export async function workCenterReferrers(db: EntityManager, id: number): Promise<string[]> {
  const rows = (await db.query(
    `SELECT DISTINCT p.code FROM routing_step r JOIN product p ON p.id = r.product_id WHERE r.work_center_id = ? ORDER BY p.code`,
    [id],
  )) as Array<{ code: string }>;
  return rows.map((r) => r.code);
}

function toCalendarWeek(r: { weekStart: string; holidayDays: number; downtimeHours: number; extraShifts: number; note: string | null }): CalendarWeek {
  return { weekStart: r.weekStart, holidayDays: r.holidayDays, downtimeHours: r.downtimeHours, extraShifts: r.extraShifts, note: r.note };
}

const calendarColumns =
  "work_center_id AS workCenterId, DATE_FORMAT(week_start, '%Y-%m-%d') AS weekStart, holiday_days AS holidayDays, downtime_hours AS downtimeHours, extra_shifts AS extraShifts, note";
type RawCalendarWeek = { workCenterId: number; weekStart: string; holidayDays: number; downtimeHours: string; extraShifts: number; note: string | null };

export async function listCalendarWeeks(db: EntityManager, workCenterId: number): Promise<CalendarWeek[]> {
  const rows = (await db.query(`SELECT ${calendarColumns} FROM work_center_week WHERE work_center_id = ? ORDER BY week_start`, [workCenterId])) as RawCalendarWeek[];
  return rows.map((r) => toCalendarWeek({ ...r, downtimeHours: Number(r.downtimeHours) }));
}

/** Calendar weeks of every work center in [from, to) (planning data, home page). */
export async function listCalendarWeeksBetween(db: EntityManager, from: string, to: string): Promise<Array<CalendarWeek & { workCenterId: number }>> {
  const rows = (await db.query(`SELECT ${calendarColumns} FROM work_center_week WHERE week_start >= ? AND week_start < ? ORDER BY work_center_id, week_start`, [from, to])) as RawCalendarWeek[];
  return rows.map((r) => ({ ...toCalendarWeek({ ...r, downtimeHours: Number(r.downtimeHours) }), workCenterId: r.workCenterId }));
}

export async function replaceCalendarWeeks(db: EntityManager, workCenterId: number, weeks: CalendarWeekInput[]): Promise<void> {
  const repo = db.getRepository(CalendarWeekEntity);
  await repo.delete({ workCenterId });
  if (weeks.length === 0) return;
  await repo.insert(weeks.map((w) => ({ workCenterId, ...w })));
}
