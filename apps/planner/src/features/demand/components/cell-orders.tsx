import { useState } from 'react';
import type { DemandCell, FirmOrder } from '@millrace/contracts';
import { formatNumber, formatWeekLong } from '@/lib/format';
import { useSaveDemand } from '../api/save-demand';
import { cellKey, orderKey, orderQty, type PendingEdits } from './demand-edits';
import type { CellEdit, GridNotice } from './demand-grid';
import { parsePastedNumber } from './parse-pasted-block';

function OrderQtyInput({
  order,
  pending,
  readOnly,
  onEdit,
  onNotice,
}: {
  order: FirmOrder;
  pending: PendingEdits;
  readOnly: boolean;
  onEdit: (edits: CellEdit[]) => void;
  onNotice: (notice: GridNotice) => void;
}) {
  const shown = orderQty(order, pending);
  const [draft, setDraft] = useState<string | null>(null);
  const commit = () => {
    if (draft === null) return;
    const parsed = parsePastedNumber(draft);
    if (parsed === 'invalid') {
      onNotice({ kind: 'problem', text: `“${draft.trim()}” is not a quantity for order ${order.orderRef}.` });
      return;
    }
    onEdit([{ key: orderKey(order.id), qty: parsed ?? 0 }]);
    setDraft(null);
  };
  return (
    <input
      aria-label={`Quantity of order ${order.orderRef}`}
      inputMode="decimal"
      disabled={readOnly}
      value={draft ?? String(shown)}
      onChange={(e) => setDraft(e.target.value)}
      onBlur={commit}
      onKeyDown={(e) => {
        if (e.key === 'Enter') commit();
        if (e.key === 'Escape') setDraft(null);
      }}
      className={`w-28 rounded border border-line px-1.5 py-0.5 text-right ${shown !== order.qty ? 'bg-race-100 font-semibold' : 'bg-panel'}`}
    />
  );
}

/**
 * Marks one firm order must-ship (or not) and saves it at once: the plan must then ship it
 * complete in its week, or the solve reports it infeasible with the conflict in words. While the
 * order's quantity has an unsaved edit, the mark waits (saving it would move the order's version).
 */
function MustShipBox({
  productId,
  weekStart,
  order,
  qtyPending,
  readOnly,
  onNotice,
}: {
  productId: number;
  weekStart: string;
  order: FirmOrder;
  qtyPending: boolean;
  readOnly: boolean;
  onNotice: (notice: GridNotice) => void;
}) {
  const save = useSaveDemand();
  const toggle = (mustShip: boolean) =>
    save.mutate(
      { changes: [{ kind: 'firm', productId, weekStart, orderRef: order.orderRef, qty: order.qty, mustShip, version: order.version }] },
      {
        onSuccess: () =>
          onNotice({ kind: 'info', text: mustShip ? `Order ${order.orderRef} must ship complete in its week.` : `Order ${order.orderRef} may ship late if capacity runs short.` }),
        onError: (error) => onNotice({ kind: 'problem', text: `Order ${order.orderRef} was not changed: ${error instanceof Error ? error.message : 'unknown error'}` }),
      },
    );
  return (
    <label className="inline-flex items-center gap-1.5" title={qtyPending ? 'Save or discard the quantity change first.' : undefined}>
      <input
        type="checkbox"
        className="h-4 w-4 accent-race-700"
        aria-label={`Order ${order.orderRef} must ship`}
        checked={order.mustShip}
        disabled={readOnly || qtyPending || save.isPending}
        onChange={(e) => toggle(e.target.checked)}
      />
      <span aria-hidden="true">Must ship</span>
    </label>
  );
}

/** The firm customer orders behind the active cell; with several orders, each quantity is edited here. */
export function CellOrders({
  productId,
  productCode,
  unit,
  cell,
  pending,
  readOnly,
  onEdit,
  onNotice,
}: {
  productId: number;
  productCode: string;
  unit: string;
  cell: DemandCell;
  pending: PendingEdits;
  readOnly: boolean;
  onEdit: (edits: CellEdit[]) => void;
  onNotice: (notice: GridNotice) => void;
}) {
  const several = cell.firmOrders.length > 1;
  return (
    <section aria-label="Firm orders of the active cell" className="rounded border border-line bg-panel p-3 text-sm">
      <h2 className="font-semibold">
        Firm orders of {productCode}, {formatWeekLong(cell.weekStart)}
      </h2>
      {cell.firmOrders.length === 0 ? (
        <p className="text-ink-soft">No firm orders. A quantity typed in the firm line becomes a new order with the reference above the grid.</p>
      ) : several ? (
        <>
          <p className="text-ink-soft">Several orders share this week: change each here (0 removes it); the grid shows their total.</p>
          <table className="mt-2 border-collapse">
            <thead>
              <tr className="text-left">
                <th scope="col" className="pr-4">Order</th>
                <th scope="col" className="pr-4 text-right">Quantity ({unit})</th>
                <th scope="col">Must ship</th>
              </tr>
            </thead>
            <tbody>
              {cell.firmOrders.map((o) => (
                <tr key={o.id}>
                  <th scope="row" className="pr-4 text-left font-normal">
                    {o.orderRef}
                  </th>
                  <td className="py-0.5">
                    <OrderQtyInput order={o} pending={pending} readOnly={readOnly} onEdit={onEdit} onNotice={onNotice} />
                  </td>
                  <td className="py-0.5 pl-2">
                    <MustShipBox
                      productId={productId}
                      weekStart={cell.weekStart}
                      order={o}
                      qtyPending={pending.has(orderKey(o.id)) && pending.get(orderKey(o.id)) !== o.qty}
                      readOnly={readOnly}
                      onNotice={onNotice}
                    />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      ) : (
        <div className="flex flex-wrap items-center gap-4">
          <p>
            {cell.firmOrders[0].orderRef}: {formatNumber(cell.firmOrders[0].qty)} {unit} — type in the grid to change it.
          </p>
          <MustShipBox
            productId={productId}
            weekStart={cell.weekStart}
            order={cell.firmOrders[0]}
            qtyPending={pending.has(cellKey(productId, cell.weekStart, 'firm')) && pending.get(cellKey(productId, cell.weekStart, 'firm')) !== cell.firmQty}
            readOnly={readOnly}
            onNotice={onNotice}
          />
        </div>
      )}
    </section>
  );
}
