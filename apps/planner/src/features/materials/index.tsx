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
import { materialQueryOptions, useMaterial } from './api/get-material';
import { useMaterials } from './api/get-materials';
import { MaterialCreateForm } from './components/material-create-form';
import { MaterialDetailsForm } from './components/material-details-form';
import { materialsColumns } from './components/materials-columns';
import { ReceiptsEditor } from './components/receipts-editor';

const newLinkClass = 'rounded border border-race-700 bg-race-700 px-3 py-1.5 font-semibold text-white hover:bg-race-800';

export function MaterialsListPage({ canEdit }: { canEdit: boolean }) {
  const materials = useMaterials();
  const newLink = canEdit ? <Link className={newLinkClass} to={paths.materialNew.getHref()}>New material</Link> : null;
  return (
    <>
      <PageHeader title="Materials" description="Purchased materials: stock, lead times, supply limits and lot rules." actions={newLink} />
      {materials.isPending ? <Loading label="Loading materials…" /> : null}
      {materials.isError ? <ErrorState error={materials.error} onRetry={() => void materials.refetch()} /> : null}
      {materials.data ? (
        <DataTable
          label="Materials"
          columns={materialsColumns}
          data={materials.data.items}
          getRowId={(m) => String(m.id)}
          empty={<EmptyState title="No materials yet" action={newLink}>Materials are what bills of materials buy in.</EmptyState>}
        />
      ) : null}
    </>
  );
}

export function MaterialNewPage() {
  return (
    <>
      <PageHeader title="New material" description={<Link className="text-race-700 underline" to={paths.materials.getHref()}>Back to materials</Link>} />
      <MaterialCreateForm />
    </>
  );
}

export function MaterialEditorPage({ materialId, canEdit }: { materialId: number; canEdit: boolean }) {
  const material = useMaterial(materialId);
  const queryClient = useQueryClient();
  const reload = async () => {
    await queryClient.invalidateQueries({ queryKey: materialQueryOptions(materialId).queryKey });
    return queryClient.fetchQuery(materialQueryOptions(materialId));
  };
  if (material.isPending) return <Loading label="Loading material…" />;
  if (material.isError) return <ErrorState error={material.error} onRetry={() => void material.refetch()} />;
  const m = material.data;
  return (
    <>
      <PageHeader title={`${m.code} — ${m.name}`} description={<Link className="text-race-700 underline" to={paths.materials.getHref()}>All materials</Link>} />
      {!canEdit ? <ReadOnlyNote who="planners" /> : null}
      <Tabs
        label={`Parts of material ${m.code}`}
        items={[
          { id: 'details', label: 'Details', content: () => <MaterialDetailsForm material={m} readOnly={!canEdit} reload={reload} /> },
          { id: 'receipts', label: `Scheduled receipts (${m.receipts.length})`, content: () => <ReceiptsEditor material={m} readOnly={!canEdit} reload={reload} /> },
        ]}
      />
    </>
  );
}
