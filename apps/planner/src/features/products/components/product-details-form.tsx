import type { ProductDetail } from '@millrace/contracts';
import { Form } from '@/components/ui/form';
import { productUpdateSchema, useUpdateProduct, type ProductUpdate } from '../api/update-product';
import { ProductFields } from './product-fields';

export function toProductValues(p: ProductDetail): ProductUpdate {
  return {
    code: p.code,
    name: p.name,
    unit: p.unit,
    kind: p.kind,
    price: p.price,
    holdingCostRatePct: p.holdingCostRatePct,
    safetyStock: p.safetyStock,
    batchMultiple: p.batchMultiple,
    openingStock: p.openingStock,
    latePenalty: p.latePenalty,
    family: p.family,
    active: p.active,
    version: p.version,
  };
}

export function ProductDetailsForm({
  product,
  readOnly,
  reload,
}: {
  product: ProductDetail;
  readOnly: boolean;
  reload: () => Promise<ProductDetail>;
}) {
  const update = useUpdateProduct();
  return (
    <Form
      label={`Product ${product.code}`}
      schema={productUpdateSchema}
      defaultValues={toProductValues(product)}
      readOnly={readOnly}
      submitLabel="Save product"
      onSubmit={async (values) => {
        await update.mutateAsync({ id: product.id, body: values });
        return toProductValues(await reload());
      }}
      onReload={async () => toProductValues(await reload())}
    >
      <ProductFields />
    </Form>
  );
}
