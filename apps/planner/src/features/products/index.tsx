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
import { productQueryOptions, useProduct } from './api/get-product';
import { useProducts } from './api/get-products';
import { BomEditor } from './components/bom-editor';
import { ProductCreateForm } from './components/product-create-form';
import { ProductDetailsForm } from './components/product-details-form';
import { productKindLabels, productsColumns } from './components/products-columns';
import { RoutingEditor } from './components/routing-editor';

const newLinkClass = 'rounded border border-race-700 bg-race-700 px-3 py-1.5 font-semibold text-white hover:bg-race-800';

export function ProductsListPage({ canEdit }: { canEdit: boolean }) {
  const products = useProducts();
  return (
    <>
      <PageHeader
        title="Products"
        description="Finished goods and sub-assemblies, with their bills of materials and routings."
        actions={canEdit ? <Link className={newLinkClass} to={paths.productNew.getHref()}>New product</Link> : null}
      />
      {products.isPending ? <Loading label="Loading products…" /> : null}
      {products.isError ? <ErrorState error={products.error} onRetry={() => void products.refetch()} /> : null}
      {products.data ? (
        <DataTable
          label="Products"
          columns={productsColumns}
          data={products.data.items}
          getRowId={(p) => String(p.id)}
          empty={
            <EmptyState title="No products yet" action={canEdit ? <Link className={newLinkClass} to={paths.productNew.getHref()}>New product</Link> : null}>
              Products are what the plant makes and sells.
            </EmptyState>
          }
        />
      ) : null}
    </>
  );
}

export function ProductNewPage() {
  return (
    <>
      <PageHeader title="New product" description={<Link className="text-race-700 underline" to={paths.products.getHref()}>Back to products</Link>} />
      <ProductCreateForm />
    </>
  );
}

export function ProductEditorPage({ productId, canEdit }: { productId: number; canEdit: boolean }) {
  const product = useProduct(productId);
  const queryClient = useQueryClient();
  const reload = async () => {
    await queryClient.invalidateQueries({ queryKey: productQueryOptions(productId).queryKey });
    return queryClient.fetchQuery(productQueryOptions(productId));
  };

  if (product.isPending) return <Loading label="Loading product…" />;
  if (product.isError) return <ErrorState error={product.error} onRetry={() => void product.refetch()} />;
  const p = product.data;

  return (
    <>
      <PageHeader
        title={`${p.code} — ${p.name}`}
        description={
          <>
            {productKindLabels[p.kind]} · <Link className="text-race-700 underline" to={paths.products.getHref()}>All products</Link>
          </>
        }
      />
      {!canEdit ? <ReadOnlyNote who="planners" /> : null}
      <Tabs
        label={`Parts of product ${p.code}`}
        items={[
          { id: 'details', label: 'Details', content: () => <ProductDetailsForm product={p} readOnly={!canEdit} reload={reload} /> },
          { id: 'bom', label: `Bill of materials (${p.bom.length})`, content: () => <BomEditor product={p} readOnly={!canEdit} reload={reload} /> },
          { id: 'routing', label: `Routing (${p.routing.length})`, content: () => <RoutingEditor product={p} readOnly={!canEdit} reload={reload} /> },
        ]}
      />
    </>
  );
}
