import type { EntityManager } from 'typeorm';
import { addDays, type DemandCell, type DemandGrid, type DemandQuery } from '@millrace/contracts';
import { assertWeekStarts, plantWeekStart } from '../master-data/week-alignment';
import { currentWeekStart, weekStarts } from '../master-data/weeks';
import { findFirmOrders, findForecasts, pageGridProducts, weekTotals } from './demand.repository';

/**
 * The demand grid: one page of products × `weeks` weeks from `from` (default: the current plant
 * week), each cell with its firm orders and forecast and their versions, plus week totals over
 * every product matching the filter.
 */
export async function getDemandGrid(db: EntityManager, query: DemandQuery): Promise<DemandGrid> {
  if (query.from) await assertWeekStarts(db, [{ path: 'query.from', date: query.from }]);
  const from = query.from ?? currentWeekStart(await plantWeekStart(db));
  const weeks = weekStarts(from, query.weeks);
  const to = addDays(from, 7 * query.weeks);

  const { products, total } = await pageGridProducts(db, query);
  const ids = products.map((p) => p.id);
  const [firm, forecast, totals] = await Promise.all([findFirmOrders(db, ids, from, to), findForecasts(db, ids, from, to), weekTotals(db, query, from, to)]);

  const cells = new Map<string, DemandCell>();
  const cell = (productId: number, week: string): DemandCell => {
    const key = `${productId}|${week}`;
    let c = cells.get(key);
    if (!c) {
      c = { weekStart: week, firmQty: 0, firmOrders: [], forecastQty: 0, forecastVersion: null };
      cells.set(key, c);
    }
    return c;
  };
  for (const o of firm) {
    const c = cell(o.productId, o.weekStart);
    c.firmOrders.push({ id: o.id, orderRef: o.orderRef, qty: o.qty, mustShip: o.mustShip ?? false, version: o.version });
    c.firmQty += o.qty;
  }
  for (const f of forecast) {
    const c = cell(f.productId, f.weekStart);
    c.forecastQty = f.qty;
    c.forecastVersion = f.version;
  }

  return {
    weeks,
    rows: products.map((p) => ({
      productId: p.id,
      productCode: p.code,
      productName: p.name,
      unit: p.unit,
      kind: p.kind,
      cells: weeks.map((w) => cell(p.id, w)),
    })),
    weekTotals: weeks.map((w) => ({ weekStart: w, firmQty: totals.get(w)?.firmQty ?? 0, forecastQty: totals.get(w)?.forecastQty ?? 0 })),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}
