import type { DataSource } from 'typeorm';
import type { Product, ProductCreate } from '@millrace/contracts';
import { codeTaken } from '../master-data/conflict-messages';
import { findProductByCode, insertProduct } from './products.repository';

/** A planner adds a product: its code must be free. */
export async function createProduct(dataSource: DataSource, input: ProductCreate): Promise<Product> {
  return dataSource.transaction(async (db) => {
    if (await findProductByCode(db, input.code)) throw codeTaken('product', input.code);
    return insertProduct(db, input);
  });
}
