import type { UnmetOrder } from '@millrace/contracts';
import { EmptyState } from '@/components/ui/empty-state';
import { formatNumber, formatWeek } from '@/lib/format';

const causeWords: Record<UnmetOrder['causes'][number]['kind'], string> = {
  capacity: 'Capacity',
  supply_cap: 'Supply cap',
  lead_time: 'Lead time',
  material: 'Material',
  economics: 'Not worth it',
};

/** Firm orders the plan does not ship in full on time, each with its causes in words. */
export function UnmetOrders({ unmet }: { unmet: UnmetOrder[] }) {
  if (unmet.length === 0) {
    return <EmptyState title="Every firm order ships in full on time">No backorders in this plan.</EmptyState>;
  }
  return (
    <ul aria-label="Unmet firm orders" className="flex flex-col gap-3">
      {unmet.map((o) => (
        <li key={`${o.orderRef}-${o.product}-${o.week}`} className="rounded border border-fault-700 bg-panel p-3">
          <p className="font-semibold">
            <span aria-hidden="true">⚑ </span>
            Order {o.orderRef}: {o.product}, {formatNumber(o.qtyShort)} of {formatNumber(o.qty)} short in week {o.week} ({formatWeek(o.weekStart)})
            {o.completeWeek === null ? ' — not complete within the horizon' : ` — complete in week ${o.completeWeek}`}
          </p>
          {o.causes.length === 0 ? <p className="mt-1">{o.message}</p> : null}
          {o.causes.length > 0 ? (
            <ul aria-label="Causes" className="mt-1 list-disc pl-5 text-sm">
              {o.causes.map((c, i) => (
                <li key={i}>
                  <span className="font-semibold">{causeWords[c.kind]}:</span> {c.message}
                </li>
              ))}
            </ul>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
