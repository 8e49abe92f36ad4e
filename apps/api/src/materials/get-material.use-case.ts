import type { EntityManager } from 'typeorm';
import type { MaterialDetail } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { findMaterialById, listReceipts } from './materials.repository';

/** A material with its scheduled receipts, or 404. */
export async function getMaterialDetail(db: EntityManager, id: number): Promise<MaterialDetail> {
  const material = await findMaterialById(db, id);
  if (!material) throw AppError.notFound(`There is no material with id ${id}.`);
  return { ...material, receipts: await listReceipts(db, id) };
}
