import { useNavigate } from 'react-router-dom';
import { Form } from '@/components/ui/form';
import { paths } from '@/config/paths';
import { productCreateSchema, useCreateProduct } from '../api/create-product';
import { ProductFields } from './product-fields';

export function ProductCreateForm() {
  const create = useCreateProduct();
  const navigate = useNavigate();
  return (
    <Form
      label="New product"
      schema={productCreateSchema}
      defaultValues={{
        code: '',
        name: '',
        unit: 'pcs',
        kind: 'finished',
        price: 0,
        holdingCostRatePct: 24,
        safetyStock: 0,
        batchMultiple: 1,
        openingStock: 0,
        latePenalty: 0,
        family: null,
        active: true,
      }}
      submitLabel="Create product"
      savedMessage="Created."
      onSubmit={async (values) => {
        const product = await create.mutateAsync(values);
        void navigate(paths.product.getHref(product.id));
      }}
    >
      <ProductFields />
    </Form>
  );
}
