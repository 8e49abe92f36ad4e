import type { EntityManager } from 'typeorm';
import type { WorkCenterDetail } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { findWorkCenterById, listCalendarWeeks } from './work-centers.repository';

/** A work center with its calendar weeks, or 404. */
export async function getWorkCenterDetail(db: EntityManager, id: number): Promise<WorkCenterDetail> {
  const workCenter = await findWorkCenterById(db, id);
  if (!workCenter) throw AppError.notFound(`There is no work center with id ${id}.`);
  return { ...workCenter, calendar: await listCalendarWeeks(db, id) };
}
