import type { DataSource } from 'typeorm';
import type { WorkCenter, WorkCenterCreate } from '@millrace/contracts';
import { codeTaken } from '../master-data/conflict-messages';
import { findWorkCenterByCode, insertWorkCenter } from './work-centers.repository';

/** A planner adds a work center: its code must be free. */
export async function createWorkCenter(dataSource: DataSource, input: WorkCenterCreate): Promise<WorkCenter> {
  return dataSource.transaction(async (db) => {
    if (await findWorkCenterByCode(db, input.code)) throw codeTaken('work center', input.code);
    return insertWorkCenter(db, input);
  });
}
