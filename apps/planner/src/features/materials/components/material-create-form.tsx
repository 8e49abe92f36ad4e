import { useNavigate } from 'react-router-dom';
import { Form } from '@/components/ui/form';
import { paths } from '@/config/paths';
import { materialCreateSchema, useCreateMaterial } from '../api/create-material';
import { MaterialFields } from './material-fields';

export function MaterialCreateForm() {
  const create = useCreateMaterial();
  const navigate = useNavigate();
  return (
    <Form
      label="New material"
      schema={materialCreateSchema}
      defaultValues={{
        code: '',
        name: '',
        unit: 'pcs',
        unitCost: 0,
        onHand: 0,
        leadTimeWeeks: 1,
        weeklySupplyCap: null,
        lotRule: 'lot_for_lot',
        lotSize: null,
      }}
      submitLabel="Create material"
      savedMessage="Created."
      onSubmit={async (values) => {
        const material = await create.mutateAsync(values);
        void navigate(paths.material.getHref(material.id));
      }}
    >
      <MaterialFields />
    </Form>
  );
}
