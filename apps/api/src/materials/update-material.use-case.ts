import type { DataSource } from 'typeorm';
import type { Material, MaterialUpdate } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { changedSinceOpened, codeTaken } from '../master-data/conflict-messages';
import { isDuplicateKey } from '../master-data/duplicate-key';
import { findMaterialByCode, findMaterialById, updateMaterialIfVersion } from './materials.repository';

/**
 * A planner edits a material: it must exist, the version must match, a new code must be free,
 * and the lot rule and lot size must fit together once merged with the stored values.
 */
export async function updateMaterial(dataSource: DataSource, id: number, input: MaterialUpdate): Promise<Material> {
  try {
    return await dataSource.transaction(async (db) => {
      const material = await findMaterialById(db, id);
      if (!material) throw AppError.notFound(`There is no material with id ${id}.`);
      if (material.version !== input.version) throw changedSinceOpened(`material ${material.code}`);
      if (input.code !== undefined && input.code !== material.code) {
        const other = await findMaterialByCode(db, input.code);
        if (other && other.id !== id) throw codeTaken('material', input.code);
      }
      const lotRule = input.lotRule ?? material.lotRule;
      const lotSize = input.lotSize !== undefined ? input.lotSize : material.lotSize;
      if (lotRule === 'lot_for_lot' && lotSize !== null) {
        throw AppError.validation('Lot-for-lot has no lot size.', [{ path: 'lotSize', message: 'Lot-for-lot has no lot size; send lotSize: null.' }]);
      }
      if (lotRule !== 'lot_for_lot' && (lotSize === null || lotSize <= 0)) {
        throw AppError.validation('This lot rule needs a lot size.', [{ path: 'lotSize', message: 'This lot rule needs a lot size above 0.' }]);
      }
      if ((await updateMaterialIfVersion(db, id, input)) === 'version_mismatch') throw changedSinceOpened(`material ${material.code}`);
      return (await findMaterialById(db, id))!;
    });
  } catch (err) {
    if (isDuplicateKey(err) && input.code !== undefined) throw codeTaken('material', input.code);
    throw err;
  }
}
