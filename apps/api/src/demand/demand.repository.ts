import type { EntityManager } from 'typeorm';
import type { DemandQuery, ProductKind } from '@millrace/contracts';
import { DemandForecastEntity } from '../db/entities/demand-forecast.entity';
import { FirmOrderEntity } from '../db/entities/firm-order.entity';
import { likeContains } from '../master-data/list-query';

export interface StoredFirmOrder {
  id: number;
  productId: number;
  weekStart: string;
  orderRef: string;
  qty: number;
  /** must ship complete by its week (a hard requirement for the plan); absent on insert means no */
  mustShip?: boolean;
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
  // Without a product filter the sums need no join (they run on the week index alone).
  const sumPerWeek = (table: string) =>
    filter.sql
      ? db.query(
          `SELECT DATE_FORMAT(d.week_start, '%Y-%m-%d') AS week, SUM(d.qty) AS qty FROM ${table} d JOIN product p ON p.id = d.product_id
            ${filter.sql} AND d.week_start >= ? AND d.week_start < ? GROUP BY d.week_start`,
          [...filter.params, from, to],
        )
      : db.query(`SELECT DATE_FORMAT(week_start, '%Y-%m-%d') AS week, SUM(qty) AS qty FROM ${table} WHERE week_start >= ? AND week_start < ? GROUP BY week_start`, [from, to]);
  const firm = (await sumPerWeek('firm_order')) as Array<{ week: string; qty: string }>;
  const forecast = (await sumPerWeek('demand_forecast')) as Array<{ week: string; qty: string }>;
  const totals = new Map<string, { firmQty: number; forecastQty: number }>();
  const at = (key: string) => {
    const t = totals.get(key) ?? { firmQty: 0, forecastQty: 0 };
    totals.set(key, t);
    return t;
  };
  for (const r of firm) at(r.week).firmQty += Number(r.qty);
  for (const r of forecast) at(r.week).forecastQty += Number(r.qty);
  return totals;
}

const firmColumns = "id, product_id AS productId, DATE_FORMAT(week_start, '%Y-%m-%d') AS weekStart, order_ref AS orderRef, qty, must_ship AS mustShip, version";
const forecastColumns = "id, product_id AS productId, DATE_FORMAT(week_start, '%Y-%m-%d') AS weekStart, qty, version";

type RawFirm = Omit<StoredFirmOrder, 'qty' | 'mustShip'> & { qty: string; mustShip: number | string };
type RawForecast = Omit<StoredForecast, 'qty'> & { qty: string };
const plainFirm = (r: RawFirm): StoredFirmOrder => ({ id: r.id, productId: r.productId, weekStart: r.weekStart, orderRef: r.orderRef, qty: Number(r.qty), mustShip: Number(r.mustShip) === 1, version: r.version });
const plainForecast = (r: RawForecast): StoredForecast => ({ id: r.id, productId: r.productId, weekStart: r.weekStart, qty: Number(r.qty), version: r.version });

/**
 * Firm orders of the given products in weeks [from, to). With `forUpdate`, the rows (and the
 * index gaps around them) stay locked until the transaction ends. Plain SQL: these reads run
 * over tens of thousands of rows for the grid and the planning data.
 */
export async function findFirmOrders(db: EntityManager, productIds: number[], from: string, to: string, forUpdate = false): Promise<StoredFirmOrder[]> {
  if (productIds.length === 0) return [];
  const rows = (await db.query(
    `SELECT ${firmColumns} FROM firm_order WHERE product_id IN (?) AND week_start >= ? AND week_start < ?
      ORDER BY week_start, order_ref${forUpdate ? ' FOR UPDATE' : ''}`,
    [productIds, from, to],
  )) as RawFirm[];
  return rows.map(plainFirm);
}

export async function findForecasts(db: EntityManager, productIds: number[], from: string, to: string, forUpdate = false): Promise<StoredForecast[]> {
  if (productIds.length === 0) return [];
  const rows = (await db.query(
    `SELECT ${forecastColumns} FROM demand_forecast WHERE product_id IN (?) AND week_start >= ? AND week_start < ?${forUpdate ? ' FOR UPDATE' : ''}`,
    [productIds, from, to],
  )) as RawForecast[];
  return rows.map(plainForecast);
}

export async function insertFirmOrders(db: EntityManager, rows: Array<Omit<StoredFirmOrder, 'id' | 'version'>>): Promise<void> {
  if (rows.length === 0) return;
  const now = new Date();
  await db.getRepository(FirmOrderEntity).insert(rows.map((r) => ({ ...r, mustShip: r.mustShip ?? false, version: 1, createdAt: now, updatedAt: now })));
}

export async function insertForecasts(db: EntityManager, rows: Array<Omit<StoredForecast, 'id' | 'version'>>): Promise<void> {
  if (rows.length === 0) return;
  const now = new Date();
  await db.getRepository(DemandForecastEntity).insert(rows.map((r) => ({ ...r, version: 1, createdAt: now, updatedAt: now })));
}

export async function updateFirmOrderQty(db: EntityManager, id: number, qty: number): Promise<void> {
  await db.getRepository(FirmOrderEntity).update({ id }, { qty, version: () => 'version + 1', updatedAt: new Date() });
}

/** Quantity and must-ship mark of one firm order (the mark only when given). */
export async function updateFirmOrder(db: EntityManager, id: number, change: { qty: number; mustShip?: boolean }): Promise<void> {
  const mark = change.mustShip === undefined ? {} : { mustShip: change.mustShip };
  await db.getRepository(FirmOrderEntity).update({ id }, { qty: change.qty, ...mark, version: () => 'version + 1', updatedAt: new Date() });
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
  const firm = (await db.query(`SELECT ${firmColumns} FROM firm_order WHERE week_start >= ? AND week_start < ? ORDER BY week_start, order_ref, id`, [from, to])) as RawFirm[];
  const forecast = (await db.query(`SELECT ${forecastColumns} FROM demand_forecast WHERE week_start >= ? AND week_start < ? ORDER BY week_start, product_id`, [from, to])) as RawForecast[];
  return { firm: firm.map(plainFirm), forecast: forecast.map(plainForecast) };
}
