import type { EntityManager } from 'typeorm';
import type { ProductDetail } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { listBomLines } from './bom.repository';
import { findProductById } from './products.repository';
import { listRoutingSteps } from './routing.repository';

/** A product with its bill of materials and routing, or 404. */
export async function getProductDetail(db: EntityManager, id: number): Promise<ProductDetail> {
  const product = await findProductById(db, id);
  if (!product) throw AppError.notFound(`There is no product with id ${id}.`);
  const [bom, routing] = await Promise.all([listBomLines(db, id), listRoutingSteps(db, id)]);
  return { ...product, bom, routing };
}
