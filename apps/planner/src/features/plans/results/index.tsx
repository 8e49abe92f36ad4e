import { DataTable } from '@/components/ui/table/data-table';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Tabs } from '@/components/ui/tabs';
import { paths } from '@/config/paths';
import { usePlan } from '../api/get-plan';
import { usePlanResults } from '../api/get-plan-results';
import { usePlanReview } from '../api/get-plan-review';
import { CertificatePanel } from '../components/certificate-panel';
import { PlanSubPageHeader } from '../components/plan-sub-page-header';
import { solveStatusWords } from '../plan-words';
import { BottleneckChart } from './components/bottleneck-chart';
import { Downloads } from './components/downloads';
import { LoadBoard } from './components/load-board';
import { LoadChart } from './components/load-chart';
import { materialCallsColumns } from './components/material-calls-columns';
import { planLinesColumns } from './components/plan-lines-columns';
import { ResultsSummary } from './components/results-summary';
import { StockChart } from './components/stock-chart';
import { NotWorthMaking } from './components/not-worth-making';
import { UnmetOrders } from './components/unmet-orders';

/**
 * Results of a plan version: the one-sentence summary, the plan table, the load board, charts,
 * material calls, unmet orders, the certificate and downloads. The only route with charts.
 */
export function PlanResultsPage({ planId }: { planId: number }) {
  const plan = usePlan(planId);
  const solved = plan.data?.solveStatus === 'solved';
  const results = usePlanResults(planId, solved);
  // The review carries the working-time cautions per work center and week.
  const review = usePlanReview(planId, solved);

  if (plan.isPending) return <Loading label="Loading the plan version…" />;
  if (plan.isError) return <ErrorState error={plan.error} onRetry={() => void plan.refetch()} />;
  const p = plan.data;
  const header = (
    <PlanSubPageHeader
      title="Results of"
      plan={p}
      links={[
        { to: paths.plan.getHref(p.id), label: 'Back to the plan version' },
        { to: paths.planCompare.getHref(p.id), label: 'Compare with another version' },
      ]}
      actions={solved ? <Downloads planId={p.id} /> : undefined}
    />
  );
  if (!solved) {
    return (
      <>
        {header}
        <EmptyState title="No results to show">
          This version’s solve status is “{solveStatusWords[p.solveStatus]}”. Results appear once it is solved and checked.
        </EmptyState>
      </>
    );
  }
  if (results.isPending) return (<>{header}<Loading label="Loading the results…" /></>);
  if (results.isError) return (<>{header}<ErrorState error={results.error} onRetry={() => void results.refetch()} /></>);
  const r = results.data;
  const cautions = review.data?.cautions ?? [];

  return (
    <>
      {header}
      <div className="flex flex-col gap-4">
        <ResultsSummary results={r} wholeUnits={p.wholeUnits} />
        {review.isError ? (
          <p role="note" className="text-sm text-over-700">
            <span aria-hidden="true">⚠ </span>Working-time cautions could not be read ({review.error.message}); check overtime against the plant’s limits by hand.
          </p>
        ) : null}
        <div className="grid grid-cols-1 gap-4 xl:grid-cols-[1fr_20rem]">
          <div className="min-w-0">
            <Tabs
              label="Parts of the results"
              items={[
                { id: 'load', label: 'Load board', content: () => <LoadBoard load={r.load} bottlenecks={r.bottlenecks} cautions={cautions} /> },
                {
                  id: 'lines',
                  label: 'Plan table',
                  content: () => (
                    <DataTable
                      label="Plan lines"
                      columns={planLinesColumns}
                      data={r.lines}
                      getRowId={(l) => `${l.product}|${l.week}`}
                      empty={<EmptyState title="The plan has no lines" />}
                    />
                  ),
                },
                {
                  id: 'charts',
                  label: 'Charts',
                  content: () => (
                    <div className="flex flex-col gap-4">
                      <BottleneckChart bottlenecks={r.bottlenecks} currency={r.currency} />
                      <LoadChart load={r.load} />
                      <StockChart lines={r.lines} />
                    </div>
                  ),
                },
                {
                  id: 'materials',
                  label: 'Material calls',
                  content: () => (
                    <DataTable
                      label="Material calls"
                      columns={materialCallsColumns}
                      data={r.materialCalls.filter((c) => c.plannedReceipt > 1e-9 || c.pastDue)}
                      getRowId={(c) => `${c.material}|${c.week}`}
                      empty={<EmptyState title="Nothing to buy">Stock and scheduled receipts cover every need in the horizon.</EmptyState>}
                    />
                  ),
                },
                {
                  id: 'unmet',
                  label: `Unmet orders (${r.unmet.length})`,
                  content: () => (
                    <>
                      <UnmetOrders unmet={r.unmet} />
                      <NotWorthMaking reducedCosts={r.reducedCosts} />
                    </>
                  ),
                },
              ]}
            />
          </div>
          <div className="flex flex-col gap-4">
            <CertificatePanel certificate={p.certificate} currency={p.currency} />
          </div>
        </div>
      </div>
    </>
  );
}
