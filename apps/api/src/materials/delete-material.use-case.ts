import type { DataSource } from 'typeorm';
import { AppError } from '../http/app-error';
import { changedSinceOpened, listSome, stillReferenced } from '../master-data/conflict-messages';
import { deleteMaterialRow, findMaterialById, materialReferrers } from './materials.repository';

/** A planner deletes a material no bill of materials uses any more; its scheduled receipts go with it. */
export async function deleteMaterial(dataSource: DataSource, id: number, version?: number): Promise<void> {
  await dataSource.transaction(async (db) => {
    const material = await findMaterialById(db, id);
    if (!material) throw AppError.notFound(`There is no material with id ${id}.`);
    if (version !== undefined && material.version !== version) throw changedSinceOpened(`material ${material.code}`);
    const products = await materialReferrers(db, id);
    if (products.length > 0) throw stillReferenced(`Material ${material.code}`, [`the bill of materials of ${listSome(products)}`]);
    await deleteMaterialRow(db, id);
  });
}
