import { useState } from 'react';
import type { DemandCell, FirmOrder } from '@millrace/contracts';
import { formatNumber, formatWeekLong } from '@/lib/format';
import { orderKey, orderQty, type PendingEdits } from './demand-edits';
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

/** The firm customer orders behind the active cell; with several orders, each quantity is edited here. */
export function CellOrders({
  productCode,
  unit,
  cell,
  pending,
  readOnly,
  onEdit,
  onNotice,
}: {
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
                </tr>
              ))}
            </tbody>
          </table>
        </>
      ) : (
        <p>
          {cell.firmOrders[0].orderRef}: {formatNumber(cell.firmOrders[0].qty)} {unit} — type in the grid to change it.
        </p>
      )}
    </section>
  );
}
