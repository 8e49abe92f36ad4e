import { useId } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { PlanComparison } from '@millrace/contracts';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { formatNumber, formatWhole } from '@/lib/format';
import { usePlanComparison } from '../api/compare-plans';
import { usePlans } from '../api/get-plans';
import { Delta } from '../components/delta';
import { formatMoney, planStateWords } from '../plan-words';
import { withSearchParam } from '@/lib/search-params';

const idOf = (raw: string | null) => (raw && /^\d+$/.test(raw) && Number(raw) > 0 ? Number(raw) : null);

function Picker({ label, value, onChange, options }: { label: string; value: number | null; onChange: (v: number | null) => void; options: { value: number; label: string }[] }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold">
        {label}
      </label>
      <select id={id} value={value ?? ''} onChange={(e) => onChange(idOf(e.target.value))} className="min-w-72 rounded border border-line bg-panel px-2 py-1.5">
        <option value="">Choose a plan version</option>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}

const cell = 'border border-line px-2 py-1.5';

/** The A figure, the B figure and the signed change from A to B, as three cells of a row. */
/** one header row's cells: the first `leftColumns` labels name rows (left), the rest are numbers (right) */
function HeaderCells({ labels, leftColumns }: { labels: string[]; leftColumns: number }) {
  return (
    <>
      {labels.map((h, i) => (
        <th key={`${h}${i}`} scope="col" className={`${cell} ${i < leftColumns ? 'text-left' : 'text-right'}`}>
          {h}
        </th>
      ))}
    </>
  );
}

function AbCells({ a, b, better }: { a: number; b: number; better?: 'up' | 'down' }) {
  return (
    <>
      <td className={`${cell} text-right tabular-nums`}>{formatNumber(a)}</td>
      <td className={`${cell} text-right tabular-nums`}>{formatNumber(b)}</td>
      <td className={`${cell} text-right`}>
        <Delta value={b - a} better={better} />
      </td>
    </>
  );
}

/** Hours to one decimal, as on the load board and the shift sheets. */
const hoursFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1 });
const hours = (v: number) => hoursFormat.format(v);

type TotalKind = 'money' | 'hours' | 'count';
const deltaStyle: Record<TotalKind, { digits: number; fixed: boolean }> = {
  money: { digits: 2, fixed: true },
  hours: { digits: 1, fixed: false },
  count: { digits: 2, fixed: false },
};

function Comparison({ c }: { c: PlanComparison }) {
  const cur = c.a.currency;
  const money = (v: number) => formatMoney(v, cur);
  const totals: [string, { a: number; b: number; delta: number }, 'up' | 'down', TotalKind][] = [
    [c.a.wholeUnits && c.b.wholeUnits ? 'Margin, whole units' : c.a.wholeUnits || c.b.wholeUnits ? 'Margin (whole units where on)' : 'Margin', c.margin, 'up', 'money'],
    ['Revenue', c.revenue, 'up', 'money'],
    ['Material spend', c.materialSpend, 'down', 'money'],
    ['Overtime hours', c.overtimeHours, 'down', 'hours'],
    ['Overtime cost', c.overtimeCost, 'down', 'money'],
    ['Holding cost', c.holdingCost, 'down', 'money'],
    ['Late penalties', c.latePenalties, 'down', 'money'],
    ['Firm orders short', c.unmetOrderCount, 'down', 'count'],
    ['Units short on firm orders', c.unmetQty, 'down', 'count'],
  ];
  const show: Record<TotalKind, (v: number) => string> = { money, hours, count: formatNumber };
  return (
    <div className="flex flex-col gap-6">
      <p className="text-sm text-ink-soft">
        Changes read as B − A. <span aria-hidden="true">▲</span>/<span aria-hidden="true">▼</span> and the + / − sign show the direction; green or red
        only repeats whether the change is good for the plant.
      </p>
      <table className="w-full border-collapse bg-panel text-sm">
        <caption className="mb-1 text-left font-semibold">Totals</caption>
        <thead className="bg-race-50">
          <tr>
            <th scope="col" className={`${cell} text-left`}>
              Figure
            </th>
            <th scope="col" className={`${cell} text-right`}>
              A: #{c.a.id} {c.a.name}
            </th>
            <th scope="col" className={`${cell} text-right`}>
              B: #{c.b.id} {c.b.name}
            </th>
            <th scope="col" className={`${cell} text-right`}>
              Change (B − A)
            </th>
          </tr>
        </thead>
        <tbody>
          {totals.map(([label, pair, better, kind]) => (
            <tr key={label} className={Math.abs(pair.delta) > 1e-9 ? 'bg-over-50' : ''}>
              <th scope="row" className={`${cell} text-left`}>
                {label}
              </th>
              <td className={`${cell} text-right tabular-nums`}>{show[kind](pair.a)}</td>
              <td className={`${cell} text-right tabular-nums`}>{show[kind](pair.b)}</td>
              <td className={`${cell} text-right`}>
                <Delta value={pair.delta} better={better} {...deltaStyle[kind]} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <table className="w-full border-collapse bg-panel text-sm">
        <caption className="mb-1 text-left font-semibold">Load per work center over the horizon</caption>
        <thead className="bg-race-50">
          <tr>
            <HeaderCells labels={['Work center', 'Load A (h)', 'Load B (h)', 'Change', 'Overtime A (h)', 'Overtime B (h)', 'Change', 'Peak % A', 'Peak % B', 'Binding weeks A', 'Binding weeks B']} leftColumns={1} />
          </tr>
        </thead>
        <tbody>
          {c.loadByWorkCenter.map((w) => {
            const changed = Math.abs(w.loadHours.delta) > 1e-9 || Math.abs(w.overtimeHours.delta) > 1e-9;
            return (
              <tr key={w.workCenter} className={changed ? 'bg-over-50' : ''}>
                <th scope="row" className={`${cell} text-left font-normal`}>
                  <span className="font-semibold">{w.workCenter}</span> {w.workCenterName}
                  {changed ? <span className="sr-only"> (changed)</span> : null}
                </th>
                <td className={`${cell} text-right tabular-nums`}>{hours(w.loadHours.a)}</td>
                <td className={`${cell} text-right tabular-nums`}>{hours(w.loadHours.b)}</td>
                <td className={`${cell} text-right`}>
                  <Delta value={w.loadHours.delta} digits={1} />
                </td>
                <td className={`${cell} text-right tabular-nums`}>{hours(w.overtimeHours.a)}</td>
                <td className={`${cell} text-right tabular-nums`}>{hours(w.overtimeHours.b)}</td>
                <td className={`${cell} text-right`}>
                  <Delta value={w.overtimeHours.delta} better="down" digits={1} />
                </td>
                <td className={`${cell} text-right tabular-nums`}>{w.peakPercent.a === null ? '—' : `${formatWhole(w.peakPercent.a)} %`}</td>
                <td className={`${cell} text-right tabular-nums`}>{w.peakPercent.b === null ? '—' : `${formatWhole(w.peakPercent.b)} %`}</td>
                <td className={`${cell} text-right tabular-nums`}>{w.bindingWeeks.a.length === 0 ? '—' : w.bindingWeeks.a.join(', ')}</td>
                <td className={`${cell} text-right tabular-nums`}>{w.bindingWeeks.b.length === 0 ? '—' : w.bindingWeeks.b.join(', ')}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <section aria-labelledby="orders-heading" className="flex flex-col gap-1">
        <h2 id="orders-heading" className="font-semibold">
          Firm orders short in either version ({c.unmetOrders.length})
        </h2>
        {c.unmetOrders.length === 0 ? (
          <p className="text-sm text-ink-soft">Every firm order ships in full on time in both versions.</p>
        ) : (
          <div className="max-h-96 overflow-auto rounded border border-line">
            <table className="w-full border-collapse bg-panel text-sm">
              <caption className="sr-only">Shortfall per firm order in A and B</caption>
              <thead className="sticky top-0 bg-race-50">
                <tr>
                  <HeaderCells labels={['Order', 'Product', 'Week', 'Short in A', 'Short in B', 'Change']} leftColumns={2} />
                </tr>
              </thead>
              <tbody>
                {c.unmetOrders.map((o) => (
                  <tr key={`${o.orderRef}-${o.product}-${o.week}`} className={Math.abs(o.shortB - o.shortA) > 1e-9 ? 'bg-over-50' : ''}>
                    <th scope="row" className={`${cell} text-left`}>
                      {o.orderRef}
                    </th>
                    <td className={cell}>{o.product}</td>
                    <td className={`${cell} text-right tabular-nums`}>{o.week}</td>
                    <AbCells a={o.shortA} b={o.shortB} better="down" />
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
      <section aria-labelledby="quantities-heading" className="flex flex-col gap-1">
        <h2 id="quantities-heading" className="font-semibold">
          Quantities that differ ({c.quantityDifferences.length} product-weeks)
        </h2>
        {c.quantityDifferences.length === 0 ? (
          <p className="text-sm text-ink-soft">Both versions make, ship and carry late the same quantities.</p>
        ) : (
          <div className="max-h-96 overflow-auto rounded border border-line">
            <table className="w-full border-collapse bg-panel text-sm">
              <caption className="sr-only">Make, ship and late quantities that differ between A and B</caption>
              <thead className="sticky top-0 bg-race-50">
                <tr>
                  <HeaderCells labels={['Product', 'Week', 'Make A', 'Make B', 'Change', 'Ship A', 'Ship B', 'Change', 'Late A', 'Late B', 'Change']} leftColumns={1} />
                </tr>
              </thead>
              <tbody>
                {c.quantityDifferences.map((q) => (
                  <tr key={`${q.product}-${q.week}`}>
                    <th scope="row" className={`${cell} text-left`}>
                      {q.product}
                    </th>
                    <td className={`${cell} text-right tabular-nums`}>{q.week}</td>
                    <AbCells a={q.makeA} b={q.makeB} />
                    <AbCells a={q.shipA} b={q.shipB} better="up" />
                    <AbCells a={q.lateA} b={q.lateB} better="down" />
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}

/** Two plan versions side by side, the differences signed and marked. Choices live in the URL. */
export function PlanComparePage() {
  const [params, setParams] = useSearchParams();
  const a = idOf(params.get('a'));
  const b = idOf(params.get('b'));
  const plans = usePlans();
  const comparison = usePlanComparison(a, b);
  const set = (key: 'a' | 'b', v: number | null) => setParams((prev) => withSearchParam(prev, key, v === null ? null : String(v)), { replace: true });
  const options = (plans.data ?? [])
    .filter((p) => p.solveStatus === 'solved')
    .map((p) => ({ value: p.id, label: `#${p.id} ${p.name} (${planStateWords[p.state].label})` }));

  return (
    <>
      <PageHeader
        title="Compare plan versions"
        description={
          <Link className="text-race-700 underline" to={paths.plans.getHref()}>
            All plan versions
          </Link>
        }
      />
      {plans.isPending ? <Loading label="Loading plan versions…" /> : null}
      {plans.isError ? <ErrorState error={plans.error} onRetry={() => void plans.refetch()} /> : null}
      {plans.data ? (
        <div className="flex flex-col gap-4">
          <div className="flex flex-wrap gap-4">
            <Picker label="Version A" value={a} onChange={(v) => set('a', v)} options={options} />
            <Picker label="Version B" value={b} onChange={(v) => set('b', v)} options={options} />
          </div>
          {options.length < 2 ? <EmptyState title="Two solved versions are needed">Solve at least two plan versions to compare them.</EmptyState> : null}
          {a !== null && b !== null && a === b ? <p role="alert">Choose two different versions.</p> : null}
          {a === null || b === null ? <p className="text-ink-soft">Choose version A and version B.</p> : null}
          {comparison.isFetching && !comparison.data ? <Loading label="Comparing…" /> : null}
          {comparison.isError ? <ErrorState error={comparison.error} title="These versions cannot be compared" onRetry={() => void comparison.refetch()} /> : null}
          {comparison.data && a !== b ? <Comparison c={comparison.data} /> : null}
        </div>
      ) : null}
    </>
  );
}
