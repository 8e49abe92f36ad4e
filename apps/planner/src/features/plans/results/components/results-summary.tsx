import type { PlanResults } from '@millrace/contracts';
import { formatNumber } from '@/lib/format';
import { formatMoney } from '../../plan-words';
import { bottleneckSummary } from './bottleneck-summary';

/**
 * The sentence a planner reads first, and the plan's totals. With whole units on, the margin is
 * the rounded plan's and the LP optimum is shown beside it as the bound it was measured against.
 */
export function ResultsSummary({ results, wholeUnits }: { results: PlanResults; wholeUnits: boolean }) {
  const t = results.totals;
  return (
    <section aria-label="Summary" className="flex flex-col gap-2 rounded border border-race-600 bg-race-50 p-4">
      <p className="text-lg font-semibold">{bottleneckSummary(results)}</p>
      <p className="text-sm text-ink-soft">
        Values of one more hour or unit are bottleneck values (shadow prices): they hold only for small changes near this plan.
      </p>
      <dl className="mt-1 flex flex-wrap gap-x-6 gap-y-1 text-sm">
        <div>
          <dt className="inline font-semibold">{wholeUnits ? 'Margin, whole units' : 'Margin'}: </dt>
          <dd className="inline tabular-nums">{formatMoney(t.margin, results.currency)}</dd>
        </div>
        {wholeUnits ? (
          <div>
            <dt className="inline font-semibold">LP bound: </dt>
            <dd className="inline tabular-nums">{formatMoney(results.objective, results.currency)}</dd>
          </div>
        ) : null}
        <div>
          <dt className="inline font-semibold">Overtime: </dt>
          <dd className="inline tabular-nums">
            {formatNumber(t.overtimeHours)} h ({formatMoney(t.overtimeCost, results.currency)})
          </dd>
        </div>
        <div>
          <dt className="inline font-semibold">Material spend: </dt>
          <dd className="inline tabular-nums">{formatMoney(t.materialSpend, results.currency)}</dd>
        </div>
        <div>
          <dt className="inline font-semibold">Firm orders short: </dt>
          <dd className="inline tabular-nums">
            {results.unmet.length === 0 ? 'none' : `${results.unmet.length} orders, ${formatNumber(t.unmetQty)} units`}
          </dd>
        </div>
      </dl>
    </section>
  );
}
