import type { DataSource } from 'typeorm';
import type { Material, MaterialCreate } from '@millrace/contracts';
import { codeTaken } from '../master-data/conflict-messages';
import { isDuplicateKey } from '../master-data/duplicate-key';
import { findMaterialByCode, insertMaterial } from './materials.repository';

/** A planner adds a material: its code must be free. */
export async function createMaterial(dataSource: DataSource, input: MaterialCreate): Promise<Material> {
  try {
    return await dataSource.transaction(async (db) => {
      if (await findMaterialByCode(db, input.code)) throw codeTaken('material', input.code);
      return insertMaterial(db, input);
    });
  } catch (err) {
    if (isDuplicateKey(err)) throw codeTaken('material', input.code);
    throw err;
  }
}
