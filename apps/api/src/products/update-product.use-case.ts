import type { DataSource } from 'typeorm';
import type { Product, ProductUpdate } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { changedSinceOpened, codeTaken } from '../master-data/conflict-messages';
import { isDuplicateKey } from '../master-data/duplicate-key';
import { findProductByCode, findProductById, updateProductIfVersion } from './products.repository';

/** A planner edits a product: it must exist, the version must match, a new code must be free. */
export async function updateProduct(dataSource: DataSource, id: number, input: ProductUpdate): Promise<Product> {
  try {
    return await dataSource.transaction(async (db) => {
      const product = await findProductById(db, id);
      if (!product) throw AppError.notFound(`There is no product with id ${id}.`);
      if (product.version !== input.version) throw changedSinceOpened(`product ${product.code}`);
      if (input.code !== undefined && input.code !== product.code) {
        const other = await findProductByCode(db, input.code);
        if (other && other.id !== id) throw codeTaken('product', input.code);
      }
      if ((await updateProductIfVersion(db, id, input)) === 'version_mismatch') throw changedSinceOpened(`product ${product.code}`);
      return (await findProductById(db, id))!;
    });
  } catch (err) {
    if (isDuplicateKey(err) && input.code !== undefined) throw codeTaken('product', input.code);
    throw err;
  }
}
