import type { DataSource } from 'typeorm';
import type { FieldError, ProductDetail, RoutingReplace } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { changedSinceOpened } from '../master-data/conflict-messages';
import { findWorkCentersByIds } from '../work-centers/work-centers.repository';
import { getProductDetail } from './get-product.use-case';
import { findProductById, touchProductIfVersion } from './products.repository';
import { replaceRoutingSteps } from './routing.repository';

/**
 * A planner saves a product's whole routing: the product must exist and still have the version
 * read; every step's work center must exist. The old steps are replaced in one transaction and
 * the product's version moves on.
 */
export async function replaceRouting(dataSource: DataSource, productId: number, input: RoutingReplace): Promise<ProductDetail> {
  return dataSource.transaction(async (db) => {
    const product = await findProductById(db, productId);
    if (!product) throw AppError.notFound(`There is no product with id ${productId}.`);
    if (product.version !== input.version) throw changedSinceOpened(`product ${product.code}`);

    const workCenters = await findWorkCentersByIds(db, input.steps.map((s) => s.workCenterId));
    const fields: FieldError[] = input.steps.flatMap((s, i) =>
      workCenters.has(s.workCenterId) ? [] : [{ path: `steps.${i}.workCenterId`, message: `There is no work center with id ${s.workCenterId}.` }],
    );
    if (fields.length > 0) throw AppError.validation('Some routing steps are not valid.', fields);

    if ((await touchProductIfVersion(db, productId, input.version)) === 'version_mismatch') throw changedSinceOpened(`product ${product.code}`);
    await replaceRoutingSteps(db, productId, input.steps);
    return getProductDetail(db, productId);
  });
}
