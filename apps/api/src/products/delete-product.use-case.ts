import type { DataSource } from 'typeorm';
import { AppError } from '../http/app-error';
import { changedSinceOpened, listSome, stillReferenced } from '../master-data/conflict-messages';
import { deleteEmptyDemand, deleteProductRow, findProductById, productReferrers } from './products.repository';

/**
 * A planner deletes a product: it must exist (and still have the version read, when sent), and
 * nothing may still use it: no other product's BOM and no demand (demand is never dropped
 * silently). Its own BOM lines and routing steps go with it.
 */
export async function deleteProduct(dataSource: DataSource, id: number, version?: number): Promise<void> {
  await dataSource.transaction(async (db) => {
    const product = await findProductById(db, id);
    if (!product) throw AppError.notFound(`There is no product with id ${id}.`);
    if (version !== undefined && product.version !== version) throw changedSinceOpened(`product ${product.code}`);
    const refs = await productReferrers(db, id);
    const referrers: string[] = [];
    if (refs.parents.length > 0) referrers.push(`the bill of materials of ${listSome(refs.parents)}`);
    if (refs.firmOrders > 0) referrers.push(`${refs.firmOrders} firm order${refs.firmOrders === 1 ? '' : 's'}`);
    if (refs.forecasts > 0) referrers.push(`${refs.forecasts} forecast week${refs.forecasts === 1 ? '' : 's'}`);
    if (referrers.length > 0) throw stillReferenced(`Product ${product.code}`, referrers);
    await deleteEmptyDemand(db, id);
    await deleteProductRow(db, id);
  });
}
