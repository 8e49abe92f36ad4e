import type { EntityManager } from 'typeorm';
import type { DemandQuery, ProductKind } from '@millrace/contracts';
import { DemandForecastEntity } from '../db/entities/demand-forecast.entity';
import { FirmOrderEntity } from '../db/entities/firm-order.entity';
import { likeContains } from '../master-data/list-query';
import { toIsoDate } from '../master-data/iso-date';

export interface StoredFirmOrder {
  id: number;
  productId: number;
  weekStart: string;
  orderRef: string;
  qty: number;
  version: number;
}
export interface StoredForecast {
  id: number;
  productId: number;
  weekStart: string;
  qty: number;
  version: number;
}
export interface GridProduct {
  id: number;
  code: string;
  name: string;
  unit: string;
  kind: ProductKind;
}

function productFilter(query: Pick<DemandQuery, 'q' | 'kind' | 'family'>): { sql: string; params: unknown[] } {
  const clauses: string[] = [];
  const params: unknown[] = [];
  if (query.q) {
    clauses.push('(p.code LIKE ? OR p.name LIKE ?)');
    params.push(likeContains(query.q), likeContains(query.q));
  }
  if (query.kind) {
    clauses.push('p.kind = ?');
    params.push(query.kind);
  }
  if (query.family) {
    clauses.push('p.family = ?');
    params.push(query.family);
  }
  return { sql: clauses.length ? `WHERE ${clauses.join(' AND ')}` : '', params };
}

/** One page of products for the demand grid (by code), and how many match the filter. */
export async function pageGridProducts(db: EntityManager, query: DemandQuery): Promise<{ products: GridProduct[]; total: number }> {
  const filter = productFilter(query);
  const [count] = (await db.query(`SELECT COUNT(*) AS n FROM product p ${filter.sql}`, filter.params)) as Array<{ n: string | number }>;
  const products = (await db.query(
    `SELECT p.id, p.code, p.name, p.unit, p.kind FROM product p ${filter.sql} ORDER BY p.code, p.id LIMIT ? OFFSET ?`,
    [...filter.params, query.pageSize, (query.page - 1) * query.pageSize],
  )) as GridProduct[];
  return { products, total: Number(count.n) };
}

/** Firm and forecast totals per week over every product matching the filter, weeks in [from, to). */
export async function weekTotals(
  db: EntityManager,
  query: DemandQuery,
  from: string,
  to: string,
): Promise<Map<string, { firmQty: number; forecastQty: number }>> {
  const filter = productFilter(query);
  const where = filter.sql ? `${filter.sql} AND` : 'WHERE';
  const firm = (await db.query(
    `SELECT d.week_start AS week, SUM(d.qty) AS qty FROM firm_order d JOIN product p ON p.id = d.product_id
      ${where} d.week_start >= ? AND d.week_start < ? GROUP BY d.week_start`,
    [...filter.params, from, to],
  )) as Array<{ week: Date; qty: string }>;
  const forecast = (await db.query(
    `SELECT d.week_start AS week, SUM(d.qty) AS qty FROM demand_forecast d JOIN product p ON p.id = d.product_id
      ${where} d.week_start >= ? AND d.week_start < ? GROUP BY d.week_start`,
    [...filter.params, from, to],
  )) as Array<{ week: Date; qty: string }>;
  const totals = new Map<string, { firmQty: number; forecastQty: number }>();
  const at = (week: Date) => {
    const key = toIsoDate(week);
    const t = totals.get(key) ?? { firmQty: 0, forecastQty: 0 };
    totals.set(key, t);
    return t;
  };
  for (const r of firm) at(r.week).firmQty += Number(r.qty);
  for (const r of forecast) at(r.week).forecastQty += Number(r.qty);
  return totals;
}

/**
 * Firm orders of the given products in weeks [from, to). With `forUpdate`, the rows (and the
 * index gaps around them) stay locked until the transaction ends.
 */
export async function findFirmOrders(db: EntityManager, productIds: number[], from: string, to: string, forUpdate = false): Promise<StoredFirmOrder[]> {
  if (productIds.length === 0) return [];
  const qb = db
    .getRepository(FirmOrderEntity)
    .createQueryBuilder('d')
    .where('d.productId IN (:...productIds) AND d.weekStart >= :from AND d.weekStart < :to', { productIds, from, to })
    .orderBy('d.weekStart')
    .addOrderBy('d.orderRef');
  if (forUpdate) qb.setLock('pessimistic_write');
  return (await qb.getMany()).map((r) => ({ id: r.id, productId: r.productId, weekStart: r.weekStart, orderRef: r.orderRef, qty: r.qty, version: r.version }));
}

export async function findForecasts(db: EntityManager, productIds: number[], from: string, to: string, forUpdate = false): Promise<StoredForecast[]> {
  if (productIds.length === 0) return [];
  const qb = db
    .getRepository(DemandForecastEntity)
    .createQueryBuilder('d')
    .where('d.productId IN (:...productIds) AND d.weekStart >= :from AND d.weekStart < :to', { productIds, from, to });
  if (forUpdate) qb.setLock('pessimistic_write');
  return (await qb.getMany()).map((r) => ({ id: r.id, productId: r.productId, weekStart: r.weekStart, qty: r.qty, version: r.version }));
}

export async function insertFirmOrders(db: EntityManager, rows: Array<Omit<StoredFirmOrder, 'id' | 'version'>>): Promise<void> {
  if (rows.length === 0) return;
  const now = new Date();
  await db.getRepository(FirmOrderEntity).insert(rows.map((r) => ({ ...r, version: 1, createdAt: now, updatedAt: now })));
}

export async function insertForecasts(db: EntityManager, rows: Array<Omit<StoredForecast, 'id' | 'version'>>): Promise<void> {
  if (rows.length === 0) return;
  const now = new Date();
  await db.getRepository(DemandForecastEntity).insert(rows.map((r) => ({ ...r, version: 1, createdAt: now, updatedAt: now })));
}

export async function updateFirmOrderQty(db: EntityManager, id: number, qty: number): Promise<void> {
  await db.getRepository(FirmOrderEntity).update({ id }, { qty, version: () => 'version + 1', updatedAt: new Date() });
}

export async function updateForecastQty(db: EntityManager, id: number, qty: number): Promise<void> {
  await db.getRepository(DemandForecastEntity).update({ id }, { qty, version: () => 'version + 1', updatedAt: new Date() });
}

export async function deleteFirmOrders(db: EntityManager, ids: number[]): Promise<void> {
  if (ids.length > 0) await db.getRepository(FirmOrderEntity).delete(ids);
}

export async function deleteForecasts(db: EntityManager, ids: number[]): Promise<void> {
  if (ids.length > 0) await db.getRepository(DemandForecastEntity).delete(ids);
}

/** Every firm order and forecast in weeks [from, to) (planning data, home page). */
export async function listDemandBetween(db: EntityManager, from: string, to: string): Promise<{ firm: StoredFirmOrder[]; forecast: StoredForecast[] }> {
  const firm = await db
    .getRepository(FirmOrderEntity)
    .createQueryBuilder('d')
    .where('d.weekStart >= :from AND d.weekStart < :to', { from, to })
    .orderBy('d.weekStart')
    .addOrderBy('d.orderRef')
    .getMany();
  const forecast = await db
    .getRepository(DemandForecastEntity)
    .createQueryBuilder('d')
    .where('d.weekStart >= :from AND d.weekStart < :to', { from, to })
    .orderBy('d.weekStart')
    .getMany();
  return {
    firm: firm.map((r) => ({ id: r.id, productId: r.productId, weekStart: r.weekStart, orderRef: r.orderRef, qty: r.qty, version: r.version })),
    forecast: forecast.map((r) => ({ id: r.id, productId: r.productId, weekStart: r.weekStart, qty: r.qty, version: r.version })),
  };
}
