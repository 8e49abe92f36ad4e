import { useQueryClient } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { ReadOnlyNote } from '@/components/ui/read-only-note';
import { DataTable } from '@/components/ui/table/data-table';
import { Tabs } from '@/components/ui/tabs';
import { paths } from '@/config/paths';
import { usePlantWeekStart } from './api/get-plant-week-start';
import { useWorkCenter, workCenterQueryOptions } from './api/get-work-center';
import { useWorkCenters } from './api/get-work-centers';
import { CalendarEditor } from './components/calendar-editor';
import { WorkCenterCreateForm } from './components/work-center-create-form';
import { WorkCenterDetailsForm } from './components/work-center-details-form';
import { workCentersColumns } from './components/work-centers-columns';

const newLinkClass = 'rounded border border-race-700 bg-race-700 px-3 py-1.5 font-semibold text-white hover:bg-race-800';

export function WorkCentersListPage({ canEdit }: { canEdit: boolean }) {
  const workCenters = useWorkCenters();
  const newLink = canEdit ? <Link className={newLinkClass} to={paths.workCenterNew.getHref()}>New work center</Link> : null;
  return (
    <>
      <PageHeader title="Work centers" description="Machines and crews, their shift patterns and overtime limits." actions={newLink} />
      {workCenters.isPending ? <Loading label="Loading work centers…" /> : null}
      {workCenters.isError ? <ErrorState error={workCenters.error} onRetry={() => void workCenters.refetch()} /> : null}
      {workCenters.data ? (
        <DataTable
          label="Work centers"
          columns={workCentersColumns}
          data={workCenters.data.items}
          getRowId={(w) => String(w.id)}
          empty={<EmptyState title="No work centers yet" action={newLink}>Work centers are where routing steps take their hours.</EmptyState>}
        />
      ) : null}
    </>
  );
}

export function WorkCenterNewPage() {
  return (
    <>
      <PageHeader title="New work center" description={<Link className="text-race-700 underline" to={paths.workCenters.getHref()}>Back to work centers</Link>} />
      <WorkCenterCreateForm />
    </>
  );
}

export function WorkCenterEditorPage({ workCenterId, canEdit }: { workCenterId: number; canEdit: boolean }) {
  const workCenter = useWorkCenter(workCenterId);
  const weekStart = usePlantWeekStart();
  const queryClient = useQueryClient();
  const reload = async () => {
    await queryClient.invalidateQueries({ queryKey: workCenterQueryOptions(workCenterId).queryKey });
    return queryClient.fetchQuery(workCenterQueryOptions(workCenterId));
  };

  if (workCenter.isPending) return <Loading label="Loading work center…" />;
  if (workCenter.isError) return <ErrorState error={workCenter.error} onRetry={() => void workCenter.refetch()} />;
  const w = workCenter.data;

  return (
    <>
      <PageHeader
        title={`${w.code} — ${w.name}`}
        description={<Link className="text-race-700 underline" to={paths.workCenters.getHref()}>All work centers</Link>}
      />
      {!canEdit ? <ReadOnlyNote who="planners" /> : null}
      <Tabs
        label={`Parts of work center ${w.code}`}
        items={[
          { id: 'details', label: 'Details and shifts', content: () => <WorkCenterDetailsForm workCenter={w} readOnly={!canEdit} reload={reload} /> },
          {
            id: 'calendar',
            label: `Calendar (${w.calendar.length})`,
            content: () =>
              weekStart.isPending ? (
                <Loading label="Loading the plant's week start…" />
              ) : weekStart.isError ? (
                <ErrorState error={weekStart.error} onRetry={() => void weekStart.refetch()} />
              ) : (
                <CalendarEditor workCenter={w} weekStart={weekStart.data} readOnly={!canEdit} reload={reload} />
              ),
          },
        ]}
      />
    </>
  );
}
