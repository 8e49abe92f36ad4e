import type { DataSource } from 'typeorm';
import { addDays, type DemandBatch, type DemandBatchResult, type DemandChange, type FieldError } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { changedSinceOpened } from '../master-data/conflict-messages';
import { isDuplicateKey } from '../master-data/duplicate-key';
import { assertWeekStarts } from '../master-data/week-alignment';
import { findProductsByIds } from '../products/products.repository';
import {
  deleteFirmOrders,
  deleteForecasts,
  findFirmOrders,
  findForecasts,
  insertFirmOrders,
  insertForecasts,
  updateFirmOrder,
  updateForecastQty,
  type StoredFirmOrder,
  type StoredForecast,
} from './demand.repository';

/** What one change does once checked against the stored row. */
type Action =
  | { kind: 'insert' }
  | { kind: 'update'; id: number }
  | { kind: 'delete'; id: number }
  | { kind: 'unchanged' };

/**
 * A planner saves a batch of demand cell changes in one request: every product must exist, every
 * week must start on the plant week start, and every cell must still hold what the planner read
 * (its version, or nothing when they saw an empty cell). Any bad or conflicting cell rejects the
 * whole batch (400 / 409 naming the cells); otherwise all changes are written in one transaction.
 * A quantity of 0 removes the firm order or forecast.
 */
export async function applyDemandChanges(dataSource: DataSource, batch: DemandBatch): Promise<DemandBatchResult> {
  try {
    return await writeBatch(dataSource, batch);
  } catch (err) {
    // Two saves of the same cells at the same moment: the unique key or InnoDB's deadlock check
    // stops one of them; nothing of that batch was written.
    if (isDuplicateKey(err) || isDeadlock(err)) throw changedSinceOpened('the demand you are saving');
    throw err;
  }
}

function isDeadlock(err: unknown): boolean {
  const e = err as { code?: string; driverError?: { code?: string } } | null;
  return e?.code === 'ER_LOCK_DEADLOCK' || e?.driverError?.code === 'ER_LOCK_DEADLOCK';
}

async function writeBatch(dataSource: DataSource, batch: DemandBatch): Promise<DemandBatchResult> {
  return dataSource.transaction(async (db) => {
    const changes = batch.changes;
    const productIds = [...new Set(changes.map((c) => c.productId))];
    const products = await findProductsByIds(db, productIds);
    const missing: FieldError[] = changes.flatMap((c, i) =>
      products.has(c.productId) ? [] : [{ path: `changes.${i}.productId`, message: `There is no product with id ${c.productId}.` }],
    );
    if (missing.length > 0) throw AppError.validation('Some changes name products that do not exist.', missing);
    await assertWeekStarts(db, changes.map((c, i) => ({ path: `changes.${i}.weekStart`, date: c.weekStart })));

    const weeks = changes.map((c) => c.weekStart).sort();
    const from = weeks[0];
    const to = addDays(weeks[weeks.length - 1], 1);
    const [firm, forecast] = await Promise.all([findFirmOrders(db, productIds, from, to, true), findForecasts(db, productIds, from, to, true)]);
    const firmByKey = new Map(firm.map((o) => [firmKey(o.productId, o.weekStart, o.orderRef), o]));
    const forecastByKey = new Map(forecast.map((f) => [`${f.productId}|${f.weekStart}`, f]));

    const conflicts: FieldError[] = [];
    const actions: Action[] = changes.map((c, i) => {
      const stored = c.kind === 'firm' ? firmByKey.get(firmKey(c.productId, c.weekStart, c.orderRef)) : forecastByKey.get(`${c.productId}|${c.weekStart}`);
      const what = describeCell(c, products.get(c.productId)!.code);
      if ((stored?.version ?? null) !== c.version) {
        conflicts.push({ path: `changes.${i}`, message: `Someone else changed ${what} since you opened it.` });
        return { kind: 'unchanged' };
      }
      return decide(c, stored);
    });
    if (conflicts.length > 0) {
      const first = conflicts[0].message.replace(/^Someone else changed (.*) since you opened it\.$/, '$1');
      const more = conflicts.length > 1 ? ` and ${conflicts.length - 1} more cell${conflicts.length === 2 ? '' : 's'}` : '';
      const error = changedSinceOpened(`${first}${more}`);
      throw new AppError(409, 'conflict', error.message, { fields: conflicts });
    }

    const result: DemandBatchResult = { created: 0, updated: 0, deleted: 0, unchanged: 0 };
    const newFirm: Array<Omit<StoredFirmOrder, 'id' | 'version'>> = [];
    const newForecast: Array<Omit<StoredForecast, 'id' | 'version'>> = [];
    const goneFirm: number[] = [];
    const goneForecast: number[] = [];
    for (const [i, action] of actions.entries()) {
      const c = changes[i];
      if (action.kind === 'unchanged') result.unchanged += 1;
      else if (action.kind === 'insert') {
        result.created += 1;
        if (c.kind === 'firm') newFirm.push({ productId: c.productId, weekStart: c.weekStart, orderRef: c.orderRef, qty: c.qty, mustShip: c.mustShip ?? false });
        else newForecast.push({ productId: c.productId, weekStart: c.weekStart, qty: c.qty });
      } else if (action.kind === 'delete') {
        result.deleted += 1;
        (c.kind === 'firm' ? goneFirm : goneForecast).push(action.id);
      } else {
        result.updated += 1;
        if (c.kind === 'firm') await updateFirmOrder(db, action.id, { qty: c.qty, mustShip: c.mustShip });
        else await updateForecastQty(db, action.id, c.qty);
      }
    }
    await deleteFirmOrders(db, goneFirm);
    await deleteForecasts(db, goneForecast);
    await insertFirmOrders(db, newFirm);
    await insertForecasts(db, newForecast);
    return result;
  });
}

/** Order references are compared without regard to case, like the unique key's collation. */
function firmKey(productId: number, weekStart: string, orderRef: string): string {
  return `${productId}|${weekStart}|${orderRef.toLowerCase()}`;
}

function describeCell(c: DemandChange, productCode: string): string {
  return c.kind === 'firm'
    ? `firm order ${c.orderRef} of ${productCode} in the week of ${c.weekStart}`
    : `the forecast of ${productCode} in the week of ${c.weekStart}`;
}

function decide(c: DemandChange, stored: StoredFirmOrder | StoredForecast | undefined): Action {
  if (!stored) return c.qty === 0 ? { kind: 'unchanged' } : { kind: 'insert' };
  if (c.qty === 0) return { kind: 'delete', id: stored.id };
  const markChanged = c.kind === 'firm' && c.mustShip !== undefined && c.mustShip !== (stored as StoredFirmOrder).mustShip;
  return stored.qty === c.qty && !markChanged ? { kind: 'unchanged' } : { kind: 'update', id: stored.id };
}
