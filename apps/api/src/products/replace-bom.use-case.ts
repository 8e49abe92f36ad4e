import type { DataSource } from 'typeorm';
import type { BomReplace, FieldError, ProductDetail } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { changedSinceOpened } from '../master-data/conflict-messages';
import { findMaterialsByIds } from '../materials/materials.repository';
import { findBomCycle } from './bom-cycle';
import { listProductEdges, lockBomStructure, replaceBomLines } from './bom.repository';
import { getProductDetail } from './get-product.use-case';
import { findProductById, findProductsByIds, touchProductIfVersion } from './products.repository';

/**
 * A planner saves a product's whole bill of materials: the product must exist and still have
 * the version read; every component must exist, differ from the parent and appear once; the new
 * structure must not close a cycle anywhere in the database (422 naming the path). The old lines
 * are replaced in one transaction and the product's version moves on.
 */
export async function replaceBom(dataSource: DataSource, productId: number, input: BomReplace): Promise<ProductDetail> {
  return dataSource.transaction(async (db) => {
    const product = await findProductById(db, productId);
    if (!product) throw AppError.notFound(`There is no product with id ${productId}.`);
    if (product.version !== input.version) throw changedSinceOpened(`product ${product.code}`);

    const productIds = input.lines.flatMap((l) => (l.componentProductId === null ? [] : [l.componentProductId]));
    const materialIds = input.lines.flatMap((l) => (l.materialId === null ? [] : [l.materialId]));
    const [components, materials] = await Promise.all([findProductsByIds(db, productIds), findMaterialsByIds(db, materialIds)]);

    const fields: FieldError[] = [];
    const seen = new Set<string>();
    input.lines.forEach((line, i) => {
      if (line.componentProductId !== null) {
        const path = `lines.${i}.componentProductId`;
        if (line.componentProductId === productId) fields.push({ path, message: `${product.code} cannot be a component of itself.` });
        else if (!components.has(line.componentProductId)) fields.push({ path, message: `There is no product with id ${line.componentProductId}.` });
        const key = `p${line.componentProductId}`;
        if (seen.has(key)) fields.push({ path, message: 'This component is already on another line; combine the quantities.' });
        seen.add(key);
      } else if (line.materialId !== null) {
        const path = `lines.${i}.materialId`;
        if (!materials.has(line.materialId)) fields.push({ path, message: `There is no material with id ${line.materialId}.` });
        const key = `m${line.materialId}`;
        if (seen.has(key)) fields.push({ path, message: 'This material is already on another line; combine the quantities.' });
        seen.add(key);
      }
    });
    if (fields.length > 0) throw AppError.validation('Some lines of the bill of materials are not valid.', fields);

    await lockBomStructure(db);
    const childCodes = productIds.map((id) => components.get(id)!.code);
    const cycle = findBomCycle(await listProductEdges(db), product.code, childCodes);
    if (cycle) {
      const path = cycle.join(' → ');
      throw AppError.unprocessable(`This bill of materials would make ${product.code} contain itself: ${path}.`, [
        { item: product.code, message: `Cycle in the bill of materials: ${path}.` },
      ]);
    }

    if ((await touchProductIfVersion(db, productId, input.version)) === 'version_mismatch') throw changedSinceOpened(`product ${product.code}`);
    await replaceBomLines(db, productId, input.lines);
    return getProductDetail(db, productId);
  });
}
