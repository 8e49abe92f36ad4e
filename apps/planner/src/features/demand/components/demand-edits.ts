import type { DemandChange, DemandGrid, DemandKind, DemandRow } from '@millrace/contracts';

/** One line of the grid: a product's firm orders or its forecast. */
export type GridLine = { row: DemandRow; kind: DemandKind };

/** Edited quantities not yet saved, by cell. */
export type PendingEdits = ReadonlyMap<string, number>;

export const cellKey = (productId: number, weekStart: string, kind: DemandKind) => `${productId}|${weekStart}|${kind}`;

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
 * A firm cell holds customer orders; the grid edits it when it has at most one order (the
 * quantity of that order, or a new order). Cells with several orders are read-only in the grid.
 */
export function isEditable(line: GridLine, week: number): boolean {
  return line.kind === 'forecast' || line.row.cells[week].firmOrders.length <= 1;
}

export function shownQty(line: GridLine, week: number, pending: PendingEdits): number {
  return pending.get(cellKey(line.row.productId, line.row.cells[week].weekStart, line.kind)) ?? savedQty(line, week);
}

export type ChangeSet =
  | { outcome: 'ready'; changes: DemandChange[]; keys: string[] }
  | { outcome: 'needs-order-ref'; count: number };

/** The body of PUT /api/demand for the pending edits: each change carries the version it read. */
export function buildChanges(grid: DemandGrid, pending: PendingEdits, newOrderRef: string): ChangeSet {
  const changes: DemandChange[] = [];
  const keys: string[] = [];
  let missingRef = 0;
  for (const row of grid.rows) {
    row.cells.forEach((cell) => {
      const forecastKey = cellKey(row.productId, cell.weekStart, 'forecast');
      const forecast = pending.get(forecastKey);
      if (forecast !== undefined && forecast !== cell.forecastQty) {
        changes.push({ kind: 'forecast', productId: row.productId, weekStart: cell.weekStart, qty: forecast, version: cell.forecastVersion });
        keys.push(forecastKey);
      }
      const firmKey = cellKey(row.productId, cell.weekStart, 'firm');
      const firm = pending.get(firmKey);
      if (firm !== undefined && firm !== cell.firmQty) {
        const order = cell.firmOrders[0];
        if (order) {
          changes.push({ kind: 'firm', productId: row.productId, weekStart: cell.weekStart, orderRef: order.orderRef, qty: firm, version: order.version });
          keys.push(firmKey);
        } else if (newOrderRef.trim()) {
          changes.push({ kind: 'firm', productId: row.productId, weekStart: cell.weekStart, orderRef: newOrderRef.trim(), qty: firm, version: null });
          keys.push(firmKey);
        } else missingRef += 1;
      }
    });
  }
  if (missingRef > 0) return { outcome: 'needs-order-ref', count: missingRef };
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
