import type { DataSource } from 'typeorm';
import type { MaterialDetail, ReceiptsReplace } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { changedSinceOpened } from '../master-data/conflict-messages';
import { assertWeekStarts } from '../master-data/week-alignment';
import { getMaterialDetail } from './get-material.use-case';
import { findMaterialById, replaceReceipts, touchMaterialIfVersion } from './materials.repository';

/**
 * A planner saves a material's scheduled receipts (purchases already on order): the material must
 * exist and still have the version read; each receipt's week must start on the plant's week start
 * day. The whole list replaces the old one in one transaction.
 */
export async function replaceMaterialReceipts(dataSource: DataSource, id: number, input: ReceiptsReplace): Promise<MaterialDetail> {
  return dataSource.transaction(async (db) => {
    const material = await findMaterialById(db, id);
    if (!material) throw AppError.notFound(`There is no material with id ${id}.`);
    if (material.version !== input.version) throw changedSinceOpened(`material ${material.code}`);
    await assertWeekStarts(db, input.receipts.map((r, i) => ({ path: `receipts.${i}.weekStart`, date: r.weekStart })));
    if ((await touchMaterialIfVersion(db, id, input.version)) === 'version_mismatch') throw changedSinceOpened(`material ${material.code}`);
    await replaceReceipts(db, id, input.receipts);
    return getMaterialDetail(db, id);
  });
}
