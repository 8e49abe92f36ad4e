import type { DataSource } from 'typeorm';
import { AppError } from '../http/app-error';
import { changedSinceOpened, listSome, stillReferenced } from '../master-data/conflict-messages';
import { deleteWorkCenterRow, findWorkCenterById, workCenterReferrers } from './work-centers.repository';

/** A planner deletes a work center no routing uses any more; its calendar goes with it. */
export async function deleteWorkCenter(dataSource: DataSource, id: number, version?: number): Promise<void> {
  await dataSource.transaction(async (db) => {
    const workCenter = await findWorkCenterById(db, id);
    if (!workCenter) throw AppError.notFound(`There is no work center with id ${id}.`);
    if (version !== undefined && workCenter.version !== version) throw changedSinceOpened(`work center ${workCenter.code}`);
    const products = await workCenterReferrers(db, id);
    if (products.length > 0) throw stillReferenced(`Work center ${workCenter.code}`, [`the routing of ${listSome(products)}`]);
    await deleteWorkCenterRow(db, id);
  });
}
