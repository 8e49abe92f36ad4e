import type { DataSource } from 'typeorm';
import type { CalendarReplace, FieldError, WorkCenterDetail } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { changedSinceOpened } from '../master-data/conflict-messages';
import { assertWeekStarts } from '../master-data/week-alignment';
import { getWorkCenterDetail } from './get-work-center.use-case';
import { findWorkCenterById, replaceCalendarWeeks, touchWorkCenterIfVersion } from './work-centers.repository';

/**
 * A planner saves a work center's calendar (holidays, planned downtime, extra shifts per week):
 * the work center must exist and still have the version read; every week must start on the
 * plant's week start day; holidays cannot exceed the pattern's working days. The whole list
 * replaces the old one in one transaction.
 */
export async function replaceCalendar(dataSource: DataSource, id: number, input: CalendarReplace): Promise<WorkCenterDetail> {
  return dataSource.transaction(async (db) => {
    const workCenter = await findWorkCenterById(db, id);
    if (!workCenter) throw AppError.notFound(`There is no work center with id ${id}.`);
    if (workCenter.version !== input.version) throw changedSinceOpened(`work center ${workCenter.code}`);
    await assertWeekStarts(db, input.weeks.map((w, i) => ({ path: `weeks.${i}.weekStart`, date: w.weekStart })));
    const days = workCenter.shiftPattern.daysPerWeek;
    const fields: FieldError[] = input.weeks.flatMap((w, i) =>
      w.holidayDays > days ? [{ path: `weeks.${i}.holidayDays`, message: `${workCenter.code} works ${days} days a week; at most ${days} holidays.` }] : [],
    );
    if (fields.length > 0) throw AppError.validation('Some calendar weeks are not valid.', fields);
    if ((await touchWorkCenterIfVersion(db, id, input.version)) === 'version_mismatch') throw changedSinceOpened(`work center ${workCenter.code}`);
    await replaceCalendarWeeks(db, id, input.weeks);
    return getWorkCenterDetail(db, id);
  });
}
