import type { EntityManager } from 'typeorm';
import { addDays, quantitySchema, type Product } from '@millrace/contracts';
import {
  deleteFirmOrders,
  deleteForecasts,
  findFirmOrders,
  findForecasts,
  insertFirmOrders,
  insertForecasts,
  updateFirmOrderQty,
  updateForecastQty,
  type StoredFirmOrder,
  type StoredForecast,
} from '../../demand/demand.repository';
import { plantWeekStart, weekStartErrors } from '../../master-data/week-alignment';
import { listAllProducts } from '../../products/products.repository';
import { addError, hasErrors } from '../import-row';
import { CodeIndex, FirstRows, sameQty, unitMismatch } from './code-index';
import { ImportConflict, type ImportKindHandler } from './import-kind';

/** Longest customer order reference (the firm_order column). */
const maxOrderRef = 60;

type DemandType = 'firm' | 'forecast';
interface Cell {
  type: DemandType;
  productId: number;
  weekStart: string;
  orderRef: string;
}
type Entry = (Cell & { op: 'created'; qtyAfter: number }) | (Cell & { op: 'updated'; qtyBefore: number; qtyAfter: number }) | (Cell & { op: 'deleted'; qtyBefore: number });

const cellKey = (c: Cell) => `${c.type}|${c.productId}|${c.weekStart}|${c.orderRef.toLowerCase()}`;

async function storedCells(db: EntityManager, productIds: number[], weeks: string[]): Promise<Map<string, (StoredFirmOrder | StoredForecast) & { type: DemandType }>> {
  const map = new Map<string, (StoredFirmOrder | StoredForecast) & { type: DemandType }>();
  if (productIds.length === 0 || weeks.length === 0) return map;
  const from = weeks.reduce((a, b) => (a < b ? a : b));
  const to = addDays(weeks.reduce((a, b) => (a > b ? a : b)), 1);
  for (const f of await findFirmOrders(db, productIds, from, to, true)) map.set(cellKey({ type: 'firm', ...f }), { ...f, type: 'firm' });
  for (const f of await findForecasts(db, productIds, from, to, true)) map.set(cellKey({ type: 'forecast', orderRef: '', ...f }), { ...f, type: 'forecast' });
  return map;
}

/**
 * Demand: firm customer orders (product, week, order reference) and forecasts (product, week)
 * are set to the file's quantities; demand the file does not name stays. A quantity of 0
 * removes a firm order or forecast, as in the demand grid.
 */
export const demandImport: ImportKindHandler = {
  kind: 'demand',
  async check(db, rows) {
    const products = new CodeIndex('product', await listAllProducts(db));
    const weekStart = await plantWeekStart(db);
    const firstRows = new FirstRows();
    const cells: Array<{ row: (typeof rows)[number]; cell: Cell; qty: number }> = [];

    for (const row of rows) {
      const code = row.data.product as string | undefined;
      const product: Product | undefined = code === undefined ? undefined : products.get(code);
      if (code !== undefined && !product) addError(row, 'product', products.unknown(code));
      const date = row.data.weekStart as string | undefined;
      if (date !== undefined) for (const e of weekStartErrors(weekStart, [{ path: 'weekStart', date }])) addError(row, 'weekStart', e.message);
      const orderRef = typeof row.data.orderRef === 'string' ? row.data.orderRef.trim() : '';
      // No type given: an order reference makes it a firm order, none a forecast.
      const type: DemandType | undefined = !('type' in row.values) || row.values.type === null ? (orderRef ? 'firm' : 'forecast') : (row.data.type as DemandType | undefined);
      if (type === 'firm' && orderRef === '') addError(row, 'orderRef', 'A firm order needs its customer order reference.');
      if (type === 'forecast' && orderRef !== '') addError(row, 'orderRef', 'A forecast has no order reference; leave it empty or make the row firm.');
      if (orderRef.length > maxOrderRef) addError(row, 'orderRef', `Use at most ${maxOrderRef} characters.`);
      if (row.data.qty !== undefined) {
        const qty = quantitySchema.safeParse(row.data.qty);
        if (!qty.success) addError(row, 'qty', qty.error.issues[0].message);
      }
      if (product && typeof row.data.unit === 'string') {
        const mismatch = unitMismatch(row.data.unit, product.code, product.unit);
        if (mismatch) addError(row, 'unit', mismatch);
      }
      if (!product || !type || date === undefined || hasErrors(row)) continue;
      const cell: Cell = { type, productId: product.id, weekStart: date, orderRef };
      const first = firstRows.seen(cellKey(cell), row.rowNumber);
      if (first !== null) {
        addError(row, type === 'firm' ? 'orderRef' : 'weekStart', `The same ${type === 'firm' ? 'firm order' : 'forecast'} of ${product.code} for the week of ${date} is already on row ${first}.`);
        continue;
      }
      cells.push({ row, cell, qty: row.data.qty as number });
    }

    const stored = await storedCells(db, [...new Set(cells.map((c) => c.cell.productId))], [...new Set(cells.map((c) => c.cell.weekStart))]);
    const plan: Array<{ cell: Cell; qty: number; old: ((StoredFirmOrder | StoredForecast) & { type: DemandType }) | undefined }> = [];
    for (const { row, cell, qty } of cells) {
      const old = stored.get(cellKey(cell));
      if (!old) row.outcome = qty === 0 ? 'unchanged' : 'create';
      else row.outcome = sameQty(old.qty, qty) ? 'unchanged' : 'update';
      if (row.outcome !== 'unchanged') plan.push({ cell, qty, old });
    }

    return {
      removed: 0,
      async write(wdb: EntityManager) {
        const entries: Entry[] = [];
        const newFirm: Array<Omit<StoredFirmOrder, 'id' | 'version'>> = [];
        const newForecast: Array<Omit<StoredForecast, 'id' | 'version'>> = [];
        const gone: { firm: number[]; forecast: number[] } = { firm: [], forecast: [] };
        for (const { cell, qty, old } of plan) {
          if (!old) {
            if (cell.type === 'firm') newFirm.push({ productId: cell.productId, weekStart: cell.weekStart, orderRef: cell.orderRef, qty });
            else newForecast.push({ productId: cell.productId, weekStart: cell.weekStart, qty });
            entries.push({ ...cell, op: 'created', qtyAfter: qty });
          } else if (qty === 0) {
            gone[cell.type].push(old.id);
            entries.push({ ...cell, op: 'deleted', qtyBefore: old.qty });
          } else {
            if (cell.type === 'firm') await updateFirmOrderQty(wdb, old.id, qty);
            else await updateForecastQty(wdb, old.id, qty);
            entries.push({ ...cell, op: 'updated', qtyBefore: old.qty, qtyAfter: qty });
          }
        }
        await insertFirmOrders(wdb, newFirm);
        await insertForecasts(wdb, newForecast);
        await deleteFirmOrders(wdb, gone.firm);
        await deleteForecasts(wdb, gone.forecast);
        return { kind: 'demand', entries };
      },
    };
  },
  async undo(db, raw) {
    const entries = raw as Entry[];
    const stored = await storedCells(db, [...new Set(entries.map((e) => e.productId))], [...new Set(entries.map((e) => e.weekStart))]);
    const conflict = (e: Cell) => new ImportConflict(`The ${e.type === 'firm' ? `firm order ${e.orderRef}` : 'forecast'} for the week of ${e.weekStart} was changed after the import; undo would lose that change.`);
    const restore: { firm: Array<Omit<StoredFirmOrder, 'id' | 'version'>>; forecast: Array<Omit<StoredForecast, 'id' | 'version'>> } = { firm: [], forecast: [] };
    const gone: { firm: number[]; forecast: number[] } = { firm: [], forecast: [] };
    for (const e of entries) {
      const now = stored.get(cellKey(e));
      // Undo goes by values, not versions, so a chain of undos stays possible.
      if (e.op === 'created') {
        if (!now || !sameQty(now.qty, e.qtyAfter)) throw conflict(e);
        gone[e.type].push(now.id);
      } else if (e.op === 'updated') {
        if (!now || !sameQty(now.qty, e.qtyAfter)) throw conflict(e);
        if (e.type === 'firm') await updateFirmOrderQty(db, now.id, e.qtyBefore);
        else await updateForecastQty(db, now.id, e.qtyBefore);
      } else {
        if (now) throw conflict(e);
        if (e.type === 'firm') restore.firm.push({ productId: e.productId, weekStart: e.weekStart, orderRef: e.orderRef, qty: e.qtyBefore });
        else restore.forecast.push({ productId: e.productId, weekStart: e.weekStart, qty: e.qtyBefore });
      }
    }
    await deleteFirmOrders(db, gone.firm);
    await deleteForecasts(db, gone.forecast);
    await insertFirmOrders(db, restore.firm);
    await insertForecasts(db, restore.forecast);
  },
};
