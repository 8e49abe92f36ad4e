import type { EntityManager } from 'typeorm';
import type { Page, Product, ProductCreate, ProductListQuery, ProductUpdate } from '@millrace/contracts';
import { ProductEntity, type ProductRow } from '../db/entities/product.entity';
import { codedTable } from '../master-data/coded-table';
import { pageFrom } from '../master-data/list-query';
import type { VersionedWrite } from '../master-data/versioned-update';

export function toProduct(row: ProductRow): Product {
  return {
    id: row.id,
    code: row.code,
    name: row.name,
    unit: row.unit,
    kind: row.kind,
    price: row.price,
    holdingCostRatePct: row.holdingCostRatePct,
    safetyStock: row.safetyStock,
    batchMultiple: row.batchMultiple,
    openingStock: row.openingStock,
    latePenalty: row.latePenalty,
    family: row.family,
    active: Boolean(row.active),
    version: row.version,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const sortColumns = {
  code: 't.code',
  name: 't.name',
  kind: 't.kind',
  family: 't.family',
  price: 't.price',
  updatedAt: 't.updatedAt',
} as const;

export async function listProducts(db: EntityManager, query: ProductListQuery): Promise<Page<Product>> {
  const qb = db.getRepository(ProductEntity).createQueryBuilder('t');
  if (query.kind) qb.andWhere('t.kind = :kind', { kind: query.kind });
  if (query.family) qb.andWhere('t.family = :family', { family: query.family });
  if (query.active !== undefined) qb.andWhere('t.active = :active', { active: query.active });
  return pageFrom(qb, query, sortColumns, toProduct);
}

/**
 * Every product by code, in plain SQL (planning data reads all of them at once; entity hydration
 * costs more than the query at 2,000 rows).
 */
export async function listAllProducts(db: EntityManager): Promise<Product[]> {
  const rows = (await db.query(
    `SELECT id, code, name, unit, kind, price, holding_cost_rate_pct, safety_stock, batch_multiple, opening_stock, late_penalty,
            family, active, version, created_at, updated_at FROM product ORDER BY code`,
  )) as Array<Record<string, string | number | Date | null>>;
  return rows.map((r) => ({
    id: Number(r.id),
    code: String(r.code),
    name: String(r.name),
    unit: String(r.unit),
    kind: r.kind as Product['kind'],
    price: Number(r.price),
    holdingCostRatePct: Number(r.holding_cost_rate_pct),
    safetyStock: Number(r.safety_stock),
    batchMultiple: Number(r.batch_multiple),
    openingStock: Number(r.opening_stock),
    latePenalty: Number(r.late_penalty),
    family: r.family === null ? null : String(r.family),
    active: Boolean(Number(r.active)),
    version: Number(r.version),
    createdAt: (r.created_at as Date).toISOString(),
    updatedAt: (r.updated_at as Date).toISOString(),
  }));
}

const products = codedTable(ProductEntity, toProduct);

export const findProductById = products.findById;
export const findProductByCode = products.findByCode;
/** Products by id (for reference checks); missing ids are simply absent from the map. */
export const findProductsByIds = products.findByIds;
export const insertProduct = (db: EntityManager, input: ProductCreate): Promise<Product> => products.insert(db, input);

export const updateProductIfVersion = (db: EntityManager, id: number, input: ProductUpdate): Promise<VersionedWrite> => products.patchIfVersion(db, id, input);

/** Bumps the version (a BOM or routing save counts as a change of the product). */
export const touchProductIfVersion = products.touchIfVersion;
export const deleteProductRow = products.deleteRow;

/** What still points at a product from elsewhere: parents whose BOM uses it, and its demand. */
export async function productReferrers(db: EntityManager, id: number): Promise<{ parents: string[]; firmOrders: number; forecasts: number }> {
  const parents = (await db.query(
    `SELECT DISTINCT p.code FROM bom_line b JOIN product p ON p.id = b.parent_product_id
      WHERE b.component_product_id = ? ORDER BY p.code`,
    [id],
  )) as Array<{ code: string }>;
  const [counts] = (await db.query(
    `SELECT (SELECT COUNT(*) FROM firm_order WHERE product_id = ? AND qty > 0) AS firm,
            (SELECT COUNT(*) FROM demand_forecast WHERE product_id = ? AND qty > 0) AS forecast`,
    [id, id],
  )) as Array<{ firm: string | number; forecast: string | number }>;
  return { parents: parents.map((p) => p.code), firmOrders: Number(counts.firm), forecasts: Number(counts.forecast) };
}

/** Removes the zero-quantity demand rows of a product (they hold nothing worth keeping). */
export async function deleteEmptyDemand(db: EntityManager, id: number): Promise<void> {
  await db.query('DELETE FROM firm_order WHERE product_id = ? AND qty = 0', [id]);
  await db.query('DELETE FROM demand_forecast WHERE product_id = ? AND qty = 0', [id]);
}
