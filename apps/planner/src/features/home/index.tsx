import { useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { useHome } from './api/get-home';
import { FirmDemandTable } from './components/firm-demand-table';
import { LoadGrid } from './components/load-grid';

/** Horizons offered on the home page (weeks). */
const horizonChoices = [4, 6, 8, 13] as const;
const defaultWeeks = 6;

export function HomePage({ showDemand }: { showDemand: boolean }) {
  const [params, setParams] = useSearchParams();
  const asked = Number(params.get('weeks'));
  const weeks = (horizonChoices as readonly number[]).includes(asked) ? asked : defaultWeeks;
  const home = useHome(weeks);

  return (
    <>
      <PageHeader
        title={home.data ? home.data.plantName : 'Home'}
        description="Firm orders of the coming weeks against the hours each work center has."
        actions={
          <label className="flex items-center gap-2 text-sm font-semibold">
            Weeks ahead
            <select
              value={weeks}
              onChange={(e) => setParams({ weeks: e.target.value }, { replace: true })}
              className="rounded border border-line bg-panel px-2 py-1 font-normal"
            >
              {horizonChoices.map((w) => (
                <option key={w} value={w}>
                  {w}
                </option>
              ))}
            </select>
          </label>
        }
      />
      {home.isPending ? <Loading label="Adding up the load…" /> : null}
      {home.isError ? <ErrorState error={home.error} onRetry={() => void home.refetch()} /> : null}
      {home.data ? (
        home.data.workCenters.length === 0 ? (
          <EmptyState title="No work centers yet">Once work centers and routings are in, their load shows here.</EmptyState>
        ) : (
          <div className="flex flex-col gap-8">
            <section aria-labelledby="load-heading">
              <h2 id="load-heading" className="mb-1 text-lg font-semibold">
                Load per work center
              </h2>
              <p className="mb-2 text-sm" role="status">
                {home.data.overLoadedCells === 0
                  ? '✓ No work center is over-loaded by firm orders in these weeks.'
                  : `▲ ${home.data.overLoadedCells} work-center week${home.data.overLoadedCells === 1 ? ' is' : 's are'} over-loaded by firm orders.`}
              </p>
              <LoadGrid summary={home.data} />
            </section>
            {showDemand ? (
              <section aria-labelledby="firm-heading">
                <h2 id="firm-heading" className="mb-2 text-lg font-semibold">
                  Firm orders
                </h2>
                {home.data.firmDemand.length === 0 ? (
                  <EmptyState title="No firm orders in these weeks" />
                ) : (
                  <FirmDemandTable summary={home.data} />
                )}
              </section>
            ) : null}
          </div>
        )
      ) : null}
    </>
  );
}
