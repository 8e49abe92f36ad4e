import type { DataSource } from 'typeorm';
import type { WorkCenter, WorkCenterUpdate } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { changedSinceOpened, codeTaken } from '../master-data/conflict-messages';
import { isDuplicateKey } from '../master-data/duplicate-key';
import { findWorkCenterByCode, findWorkCenterById, updateWorkCenterIfVersion } from './work-centers.repository';

/** A planner edits a work center: it must exist, the version must match, a new code must be free. */
export async function updateWorkCenter(dataSource: DataSource, id: number, input: WorkCenterUpdate): Promise<WorkCenter> {
  try {
    return await dataSource.transaction(async (db) => {
      const workCenter = await findWorkCenterById(db, id);
      if (!workCenter) throw AppError.notFound(`There is no work center with id ${id}.`);
      if (workCenter.version !== input.version) throw changedSinceOpened(`work center ${workCenter.code}`);
      if (input.code !== undefined && input.code !== workCenter.code) {
        const other = await findWorkCenterByCode(db, input.code);
        if (other && other.id !== id) throw codeTaken('work center', input.code);
      }
      if ((await updateWorkCenterIfVersion(db, id, input)) === 'version_mismatch') throw changedSinceOpened(`work center ${workCenter.code}`);
      return (await findWorkCenterById(db, id))!;
    });
  } catch (err) {
    if (isDuplicateKey(err) && input.code !== undefined) throw codeTaken('work center', input.code);
    throw err;
  }
}
