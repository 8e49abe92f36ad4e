import { useId } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { PlanComparison } from '@millrace/contracts';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { formatNumber } from '@/lib/format';
import { usePlanComparison } from '../api/compare-plans';
import { usePlans } from '../api/get-plans';
import { Delta } from '../components/delta';
import { formatMoney, planStateWords } from '../plan-words';

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

function Comparison({ c }: { c: PlanComparison }) {
  const cur = c.a.currency;
  const totals: [string, { a: number; b: number; delta: number }, 'up' | 'down', (v: number) => string][] = [
    ['Margin', c.margin, 'up', (v) => formatMoney(v, cur)],
    ['Overtime hours', c.overtimeHours, 'down', formatNumber],
    ['Overtime cost', c.overtimeCost, 'down', (v) => formatMoney(v, cur)],
    ['Material spend', c.materialSpend, 'down', (v) => formatMoney(v, cur)],
    ['Units short on firm orders', c.unmetQty, 'down', formatNumber],
  ];
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
          {totals.map(([label, pair, better, fmt]) => (
            <tr key={label} className={Math.abs(pair.delta) > 1e-9 ? 'bg-over-50' : ''}>
              <th scope="row" className={`${cell} text-left`}>
                {label}
              </th>
              <td className={`${cell} text-right tabular-nums`}>{fmt(pair.a)}</td>
              <td className={`${cell} text-right tabular-nums`}>{fmt(pair.b)}</td>
              <td className={`${cell} text-right`}>
                <Delta value={pair.delta} better={better} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <table className="w-full border-collapse bg-panel text-sm">
        <caption className="mb-1 text-left font-semibold">Load per work center over the horizon</caption>
        <thead className="bg-race-50">
          <tr>
            {['Work center', 'Load A (h)', 'Load B (h)', 'Change', 'Overtime A (h)', 'Overtime B (h)', 'Change', 'Peak % A', 'Peak % B'].map((h, i) => (
              <th key={`${h}${i}`} scope="col" className={`${cell} ${i === 0 ? 'text-left' : 'text-right'}`}>
                {h}
              </th>
            ))}
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
                <td className={`${cell} text-right tabular-nums`}>{formatNumber(w.loadHours.a)}</td>
                <td className={`${cell} text-right tabular-nums`}>{formatNumber(w.loadHours.b)}</td>
                <td className={`${cell} text-right`}>
                  <Delta value={w.loadHours.delta} />
                </td>
                <td className={`${cell} text-right tabular-nums`}>{formatNumber(w.overtimeHours.a)}</td>
                <td className={`${cell} text-right tabular-nums`}>{formatNumber(w.overtimeHours.b)}</td>
                <td className={`${cell} text-right`}>
                  <Delta value={w.overtimeHours.delta} better="down" />
                </td>
                <td className={`${cell} text-right tabular-nums`}>{w.peakPercent.a === null ? '—' : `${formatNumber(w.peakPercent.a)} %`}</td>
                <td className={`${cell} text-right tabular-nums`}>{w.peakPercent.b === null ? '—' : `${formatNumber(w.peakPercent.b)} %`}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <div className="grid grid-cols-2 gap-3 text-sm">
        {(['a', 'b'] as const).map((side) => (
          <section key={side} aria-label={`Unmet orders of ${side.toUpperCase()}`} className="rounded border border-line bg-panel p-3">
            <h2 className="font-semibold">
              Unmet firm orders of {side.toUpperCase()} ({c.unmet[side].length})
            </h2>
            {c.unmet[side].length === 0 ? (
              <p className="text-ink-soft">None.</p>
            ) : (
              <details open={c.unmet[side].length <= 5}>
                <summary className="cursor-pointer font-semibold text-race-700">
                  {c.unmet[side].length} orders, {formatNumber(c.unmet[side].reduce((t, o) => t + o.qtyShort, 0))} units short
                </summary>
                <ul className="mt-1 list-disc pl-5">
                  {c.unmet[side].map((o) => (
                    <li key={`${o.orderRef}-${o.week}`}>{o.message}</li>
                  ))}
                </ul>
              </details>
            )}
          </section>
        ))}
      </div>
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
  const set = (key: 'a' | 'b', v: number | null) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (v === null) next.delete(key);
        else next.set(key, String(v));
        return next;
      },
      { replace: true },
    );
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
