import type { DemandCell } from '@millrace/contracts';
import { formatNumber, formatWeekLong } from '@/lib/format';

/** The firm customer orders behind the active cell, by reference. */
export function CellOrders({ productCode, unit, cell }: { productCode: string; unit: string; cell: DemandCell }) {
  return (
    <section aria-label="Firm orders of the active cell" className="rounded border border-line bg-panel p-3 text-sm">
      <h2 className="font-semibold">
        Firm orders of {productCode}, {formatWeekLong(cell.weekStart)}
      </h2>
      {cell.firmOrders.length === 0 ? (
        <p className="text-ink-soft">No firm orders. A quantity typed in the firm line becomes a new order with the reference above the grid.</p>
      ) : (
        <ul className="mt-1">
          {cell.firmOrders.map((o) => (
            <li key={o.id}>
              {o.orderRef}: {formatNumber(o.qty)} {unit}
            </li>
          ))}
        </ul>
      )}
      {cell.firmOrders.length > 1 ? (
        <p className="mt-1 text-ink-soft">With several orders in one week the grid shows their total and leaves them as they are; change them through a demand import.</p>
      ) : null}
    </section>
  );
}
