import type { HomeSummary } from '@millrace/contracts';
import { formatWeek, formatWeekLong, formatWhole } from '@/lib/format';

/** Firm order quantities per product and week, with the week totals underneath. */
export function FirmDemandTable({ summary }: { summary: HomeSummary }) {
  return (
    <div className="max-h-[28rem] overflow-auto rounded border border-line">
      <table className="w-full border-collapse bg-panel text-sm">
        <caption className="sr-only">Firm demand per product and week</caption>
        <thead className="sticky top-0 bg-race-50">
          <tr>
            <th scope="col" className="px-2 py-1.5 text-left">
              Product
            </th>
            {summary.weeks.map((w) => (
              <th key={w} scope="col" className="px-2 py-1.5 text-right" aria-label={formatWeekLong(w)}>
                {formatWeek(w)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {summary.firmDemand.map((row) => (
            <tr key={row.productCode} className="border-t border-line/60">
              <th scope="row" className="px-2 py-1 text-left font-normal">
                <span className="font-semibold">{row.productCode}</span> {row.productName}
              </th>
              {row.qtyByWeek.map((q, i) => (
                <td key={summary.weeks[i]} className="px-2 py-1 text-right tabular-nums">
                  {q === 0 ? <span className="text-ink-soft">·</span> : `${formatWhole(q)} ${row.unit}`}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
        <tfoot className="sticky bottom-0 bg-race-50 font-semibold">
          <tr>
            <th scope="row" className="px-2 py-1.5 text-left">
              All products (units)
            </th>
            {summary.firmUnitsByWeek.map((q, i) => (
              <td key={summary.weeks[i]} className="px-2 py-1.5 text-right tabular-nums">
                {formatWhole(q)}
              </td>
            ))}
          </tr>
        </tfoot>
      </table>
    </div>
  );
}
