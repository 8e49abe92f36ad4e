import type { DataSource } from 'typeorm';
import type { WorkCenter, WorkCenterCreate } from '@millrace/contracts';
import { codeTaken } from '../master-data/conflict-messages';
import { isDuplicateKey } from '../master-data/duplicate-key';
import { findWorkCenterByCode, insertWorkCenter } from './work-centers.repository';

/** A planner adds a work center: its code must be free. */
export async function createWorkCenter(dataSource: DataSource, input: WorkCenterCreate): Promise<WorkCenter> {
  try {
    return await dataSource.transaction(async (db) => {
      if (await findWorkCenterByCode(db, input.code)) throw codeTaken('work center', input.code);
      return insertWorkCenter(db, input);
    });
  } catch (err) {
    if (isDuplicateKey(err)) throw codeTaken('work center', input.code);
    throw err;
  }
}
