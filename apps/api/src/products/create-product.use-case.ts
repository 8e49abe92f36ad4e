import type { DataSource } from 'typeorm';
import type { Product, ProductCreate } from '@millrace/contracts';
import { codeTaken } from '../master-data/conflict-messages';
import { isDuplicateKey } from '../master-data/duplicate-key';
import { findProductByCode, insertProduct } from './products.repository';

/** A planner adds a product: its code must be free. */
export async function createProduct(dataSource: DataSource, input: ProductCreate): Promise<Product> {
  try {
    return await dataSource.transaction(async (db) => {
      if (await findProductByCode(db, input.code)) throw codeTaken('product', input.code);
      return insertProduct(db, input);
    });
  } catch (err) {
    if (isDuplicateKey(err)) throw codeTaken('product', input.code);
    throw err;
  }
}
