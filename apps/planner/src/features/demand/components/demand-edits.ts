import type { DemandChange, DemandGrid, DemandKind, DemandRow, FirmOrder } from '@millrace/contracts';

/** One line of the grid: a product's firm orders or its forecast. */
export type GridLine = { row: DemandRow; kind: DemandKind };

/**
 * Edited quantities not yet saved. Keys: `cellKey(...)` for a forecast cell or a firm cell with
 * at most one order; `orderKey(id)` for one order of a firm cell that holds several.
 */
export type PendingEdits = ReadonlyMap<string, number>;

export const cellKey = (productId: number, weekStart: string, kind: DemandKind) => `${productId}|${weekStart}|${kind}`;
export const orderKey = (orderId: number) => `order|${orderId}`;

export function gridLines(rows: DemandRow[]): GridLine[] {
  return rows.flatMap((row) => [
    { row, kind: 'firm' as const },
    { row, kind: 'forecast' as const },
  ]);
}

export function savedQty(line: GridLine, week: number): number {
  const cell = line.row.cells[week];
  return line.kind === 'firm' ? cell.firmQty : cell.forecastQty;
}

/**
 * A firm cell holds customer orders; the grid types into it when it has at most one order (the
 * quantity of that order, or a new order). With several orders, each is changed in the order
 * list under the grid and the cell shows their total.
 */
export function isEditable(line: GridLine, week: number): boolean {
  return line.kind === 'forecast' || line.row.cells[week].firmOrders.length <= 1;
}

export function orderQty(order: FirmOrder, pending: PendingEdits): number {
  return pending.get(orderKey(order.id)) ?? order.qty;
}

export function shownQty(line: GridLine, week: number, pending: PendingEdits): number {
  const cell = line.row.cells[week];
  if (line.kind === 'firm' && cell.firmOrders.length > 1) return cell.firmOrders.reduce((s, o) => s + orderQty(o, pending), 0);
  return pending.get(cellKey(line.row.productId, cell.weekStart, line.kind)) ?? savedQty(line, week);
}

/** One pending change: what to send, or a firm quantity that still needs an order reference. */
type PendingChange = { key: string; change: DemandChange } | { key: string; needsOrderRef: true; productId: number; weekStart: string; qty: number };

/** Every pending edit that differs from what was read, in grid order. */
export function pendingChanges(rows: DemandRow[], pending: PendingEdits): PendingChange[] {
  const out: PendingChange[] = [];
  if (pending.size === 0) return out;
  for (const row of rows) {
    for (const cell of row.cells) {
      const firmKey = cellKey(row.productId, cell.weekStart, 'firm');
      if (cell.firmOrders.length > 1) {
        for (const order of cell.firmOrders) {
          const qty = pending.get(orderKey(order.id));
          if (qty !== undefined && qty !== order.qty)
            out.push({ key: firmKey, change: { kind: 'firm', productId: row.productId, weekStart: cell.weekStart, orderRef: order.orderRef, qty, version: order.version } });
        }
      } else {
        const qty = pending.get(firmKey);
        const order = cell.firmOrders[0];
        if (qty !== undefined && qty !== cell.firmQty) {
          if (order) out.push({ key: firmKey, change: { kind: 'firm', productId: row.productId, weekStart: cell.weekStart, orderRef: order.orderRef, qty, version: order.version } });
          else out.push({ key: firmKey, needsOrderRef: true, productId: row.productId, weekStart: cell.weekStart, qty });
        }
      }
      const forecastKey = cellKey(row.productId, cell.weekStart, 'forecast');
      const forecast = pending.get(forecastKey);
      if (forecast !== undefined && forecast !== cell.forecastQty) {
        out.push({ key: forecastKey, change: { kind: 'forecast', productId: row.productId, weekStart: cell.weekStart, qty: forecast, version: cell.forecastVersion } });
      }
    }
  }
  return out;
}

export type ChangeSet =
  | { outcome: 'ready'; changes: DemandChange[]; keys: string[] }
  | { outcome: 'needs-order-ref'; count: number };

/** The body of PUT /api/demand for the pending edits: each change carries the version it read. */
export function buildChanges(grid: DemandGrid, pending: PendingEdits, newOrderRef: string): ChangeSet {
  const ref = newOrderRef.trim();
  const list = pendingChanges(grid.rows, pending);
  const missing = list.filter((p) => 'needsOrderRef' in p).length;
  if (missing > 0 && !ref) return { outcome: 'needs-order-ref', count: missing };
  const changes: DemandChange[] = [];
  const keys: string[] = [];
  for (const p of list) {
    keys.push(p.key);
    changes.push(
      'needsOrderRef' in p ? { kind: 'firm', productId: p.productId, weekStart: p.weekStart, orderRef: ref, qty: p.qty, version: null } : p.change,
    );
  }
  return { outcome: 'ready', changes, keys };
}

/** Totals per week over the given lines, pending edits included. */
export function weekTotals(lines: GridLine[], weekCount: number, pending: PendingEdits): { firm: number[]; forecast: number[] } {
  const firm = new Array<number>(weekCount).fill(0);
  const forecast = new Array<number>(weekCount).fill(0);
  for (const line of lines) {
    for (let w = 0; w < weekCount; w++) {
      const q = shownQty(line, w, pending);
      if (line.kind === 'firm') firm[w] += q;
      else forecast[w] += q;
    }
  }
  return { firm, forecast };
}
