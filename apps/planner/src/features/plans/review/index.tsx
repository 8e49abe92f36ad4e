import { Link } from 'react-router-dom';
import type { PlanReview, Role } from '@millrace/contracts';
import { Caution } from '@/components/ui/caution';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { paths } from '@/config/paths';
import { formatNumber, formatWeek } from '@/lib/format';
import { usePlan } from '../api/get-plan';
import { usePlanReview } from '../api/get-plan-review';
import { CertificatePanel } from '../components/certificate-panel';
import { Delta } from '../components/delta';
import { PlanSubPageHeader } from '../components/plan-sub-page-header';
import { SignOffActions } from '../components/sign-off-actions';
import { formatMoney, solveStatusWords } from '../plan-words';

type ChangeRow = { item: string; weekStart: string; before: number; after: number; delta: number };

/** Without an approved version there is nothing to subtract: only this version's figures are shown. */
function ChangeTable({
  caption,
  itemHeader,
  rows,
  better,
  unit,
  hasBaseline,
}: {
  caption: string;
  itemHeader: string;
  rows: ChangeRow[];
  better: 'up' | 'down' | 'neutral';
  unit: string;
  hasBaseline: boolean;
}) {
  if (rows.length === 0) return <p className="text-sm text-ink-soft">{hasBaseline ? 'No change.' : 'None in this version.'}</p>;
  const headers = hasBaseline ? [itemHeader, 'Week', 'Last approved', 'This version', 'Change'] : [itemHeader, 'Week', 'This version'];
  return (
    <div className="max-h-80 overflow-auto rounded border border-line">
      <table className="w-full border-collapse bg-panel text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="sticky top-0 bg-race-50">
          <tr>
            {headers.map((h, i) => (
              <th key={h} scope="col" className={`border-b border-line px-2 py-1.5 ${i >= 2 ? 'text-right' : 'text-left'}`}>
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={`${r.item}|${r.weekStart}`} className="border-b border-line/60">
              <td className="px-2 py-1 font-semibold">{r.item}</td>
              <td className="px-2 py-1">{formatWeek(r.weekStart)}</td>
              {hasBaseline ? (
                <td className="px-2 py-1 text-right tabular-nums">
                  {formatNumber(r.before)}
                  {unit}
                </td>
              ) : null}
              <td className="px-2 py-1 text-right tabular-nums">
                {formatNumber(r.after)}
                {unit}
              </td>
              {hasBaseline ? (
                <td className="px-2 py-1 text-right">
                  <Delta value={r.delta} better={better} unit={unit} />
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function Headline({ review }: { review: PlanReview }) {
  const c = review.changes;
  const cur = review.plan.currency;
  const items: [string, string, string, React.ReactNode][] = [
    ['Margin', formatMoney(c.margin.before, cur), formatMoney(c.margin.after, cur), <Delta key="m" value={c.margin.delta} better="up" />],
    ['Overtime hours', formatNumber(c.overtimeHours.before), formatNumber(c.overtimeHours.after), <Delta key="o" value={c.overtimeHours.delta} better="down" />],
    ['Units short on firm orders', formatNumber(c.unmetQty.before), formatNumber(c.unmetQty.after), <Delta key="u" value={c.unmetQty.delta} better="down" />],
  ];
  return (
    <table className="w-full border-collapse bg-panel text-sm">
      <caption className="sr-only">Totals against the last approved version</caption>
      <thead className="bg-race-50">
        <tr>
          {['', review.baseline ? `Last approved (#${review.baseline.id})` : 'Last approved', 'This version', 'Change'].map((h, i) => (
            <th key={h || 'figure'} scope="col" className={`border border-line px-2 py-1.5 ${i === 0 ? 'text-left' : 'text-right'}`}>
              {h || <span className="sr-only">Figure</span>}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {items.map(([label, before, after, delta]) => (
          <tr key={label}>
            <th scope="row" className="border border-line px-2 py-1.5 text-left">
              {label}
            </th>
            <td className="border border-line px-2 py-1.5 text-right tabular-nums">{review.baseline ? before : '—'}</td>
            <td className="border border-line px-2 py-1.5 text-right tabular-nums">{after}</td>
            <td className="border border-line px-2 py-1.5 text-right">{review.baseline ? delta : '—'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/**
 * The supervisor's review: what changed against the last approved version (quantities, load,
 * overtime, unmet orders, margin), the certificate, the cautions, and approve / return / release.
 */
export function PlanReviewPage({ planId, role }: { planId: number; role: Role }) {
  const plan = usePlan(planId);
  const solved = plan.data?.solveStatus === 'solved';
  const review = usePlanReview(planId, solved);

  if (plan.isPending) return <Loading label="Loading the plan version…" />;
  if (plan.isError) return <ErrorState error={plan.error} onRetry={() => void plan.refetch()} />;
  const p = plan.data;
  const header = (
    <PlanSubPageHeader
      title="Review of"
      plan={p}
      links={[
        { to: paths.plan.getHref(p.id), label: 'Plan version and audit trail' },
        ...(solved ? [{ to: paths.planResults.getHref(p.id), label: 'Full results' }] : []),
      ]}
    />
  );
  if (!solved) {
    return (
      <>
        {header}
        <EmptyState title="Nothing to review yet">This version’s solve status is “{solveStatusWords[p.solveStatus]}”; only a solved and checked plan can be reviewed.</EmptyState>
      </>
    );
  }
  if (review.isPending) return (<>{header}<Loading label="Loading the review…" /></>);
  if (review.isError) return (<>{header}<ErrorState error={review.error} onRetry={() => void review.refetch()} /></>);
  const r = review.data;
  const c = r.changes;
  // Overtime within the limit is listed together; everything else is a caution of its own.
  const withinLimit = r.cautions.filter((x) => x.kind === 'overtime');
  const cautions = r.cautions.filter((x) => x.kind !== 'advisory' && x.kind !== 'overtime');
  const advisory = r.cautions.find((x) => x.kind === 'advisory');

  return (
    <>
      {header}
      <div className="grid grid-cols-1 gap-4 xl:grid-cols-[1fr_22rem]">
        <div className="flex min-w-0 flex-col gap-4">
          <p>
            {r.baseline ? (
              <>
                Compared with the last approved version{' '}
                <Link className="text-race-700 underline" to={paths.plan.getHref(r.baseline.id)}>
                  #{r.baseline.id} {r.baseline.name}
                </Link>
                .
              </>
            ) : (
              'There is no approved version to compare with yet: every figure below is new.'
            )}
          </p>
          <Headline review={r} />
          <SignOffActions plan={p} role={role} />
          <section aria-labelledby="cautions-heading" className="flex flex-col gap-2">
            <h2 id="cautions-heading" className="text-lg font-semibold">
              Cautions ({cautions.length + (withinLimit.length > 0 ? 1 : 0)})
            </h2>
            {cautions.length === 0 && withinLimit.length === 0 ? (
              <p className="text-sm text-ink-soft">No overtime, unmet orders or unverified results to flag.</p>
            ) : null}
            {cautions.map((x, i) => (
              <Caution key={i} title={x.kind === 'working_time' ? 'Above the working-time limit' : x.kind === 'unmet_orders' ? 'Unmet firm orders' : 'Not verified'}>
                {x.message}
              </Caution>
            ))}
            {withinLimit.length > 0 ? (
              <Caution title={`Overtime in ${withinLimit.length} work-center week${withinLimit.length === 1 ? '' : 's'}, within the plant’s limit`}>
                <p>Overtime rules, rest and pay follow local labour law, collective agreements and licensed practice.</p>
                <details className="mt-1">
                  <summary className="cursor-pointer font-semibold text-race-700">Show each week</summary>
                  <ul className="mt-1 list-disc pl-5">
                    {withinLimit.map((x, i) => (
                      <li key={i}>{x.message}</li>
                    ))}
                  </ul>
                </details>
              </Caution>
            ) : null}
            {advisory ? <Caution title="The plan is advice">{advisory.message}</Caution> : null}
          </section>
          <section aria-labelledby="quantities-heading" className="flex flex-col gap-2">
            <h2 id="quantities-heading" className="text-lg font-semibold">
              Quantities made ({c.quantities.length} {r.baseline ? 'changes' : 'product-weeks'})
            </h2>
            <ChangeTable caption="Changed quantities" itemHeader="Product" hasBaseline={r.baseline !== null} better="neutral" unit="" rows={c.quantities.map((q) => ({ item: q.product, ...q }))} />
          </section>
          <section aria-labelledby="load-heading" className="flex flex-col gap-2">
            <h2 id="load-heading" className="text-lg font-semibold">
              Load ({c.load.length} {r.baseline ? 'changes' : 'work-center weeks'})
            </h2>
            <ChangeTable caption="Changed load hours" itemHeader="Work center" hasBaseline={r.baseline !== null} better="neutral" unit=" h" rows={c.load.map((q) => ({ item: q.workCenter, ...q }))} />
          </section>
          <section aria-labelledby="overtime-heading" className="flex flex-col gap-2">
            <h2 id="overtime-heading" className="text-lg font-semibold">
              Overtime ({c.overtime.length} {r.baseline ? 'changes' : 'work-center weeks'})
            </h2>
            <ChangeTable caption="Changed overtime hours" itemHeader="Work center" hasBaseline={r.baseline !== null} better="down" unit=" h" rows={c.overtime.map((q) => ({ item: q.workCenter, ...q }))} />
          </section>
          <section aria-labelledby="unmet-heading" className="flex flex-col gap-2">
            <h2 id="unmet-heading" className="text-lg font-semibold">
              Unmet firm orders
            </h2>
            <div className="grid grid-cols-2 gap-3 text-sm">
              {(['before', 'after'] as const).map((side) => (
                <div key={side} className="rounded border border-line bg-panel p-3">
                  <h3 className="font-semibold">{side === 'before' ? 'Last approved' : 'This version'}</h3>
                  {side === 'before' && r.baseline === null ? (
                    <p className="text-ink-soft">No approved version yet.</p>
                  ) : r.unmet[side].length === 0 ? (
                    <p className="text-ink-soft">None.</p>
                  ) : (
                    <details open={r.unmet[side].length <= 5}>
                      <summary className="cursor-pointer font-semibold text-race-700">
                        {r.unmet[side].length} orders, {formatNumber(r.unmet[side].reduce((t, o) => t + o.qtyShort, 0))} units short
                      </summary>
                      <ul className="mt-1 list-disc pl-5">
                        {r.unmet[side].map((o) => (
                          <li key={`${o.orderRef}-${o.week}`}>{o.message}</li>
                        ))}
                      </ul>
                    </details>
                  )}
                </div>
              ))}
            </div>
          </section>
        </div>
        <div className="flex flex-col gap-4">
          <CertificatePanel certificate={r.certificate} currency={p.currency} />
        </div>
      </div>
    </>
  );
}
