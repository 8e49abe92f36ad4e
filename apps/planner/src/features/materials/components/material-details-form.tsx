import type { MaterialDetail } from '@millrace/contracts';
import { Form } from '@/components/ui/form';
import { materialUpdateSchema, useUpdateMaterial, type MaterialUpdate } from '../api/update-material';
import { MaterialFields } from './material-fields';

export function toMaterialValues(m: MaterialDetail): MaterialUpdate {
  return {
    code: m.code,
    name: m.name,
    unit: m.unit,
    unitCost: m.unitCost,
    onHand: m.onHand,
    leadTimeWeeks: m.leadTimeWeeks,
    weeklySupplyCap: m.weeklySupplyCap,
    lotRule: m.lotRule,
    lotSize: m.lotSize,
    version: m.version,
  };
}

export function MaterialDetailsForm({ material, readOnly, reload }: { material: MaterialDetail; readOnly: boolean; reload: () => Promise<MaterialDetail> }) {
  const update = useUpdateMaterial();
  return (
    <Form
      label={`Material ${material.code}`}
      schema={materialUpdateSchema}
      defaultValues={toMaterialValues(material)}
      readOnly={readOnly}
      submitLabel="Save material"
      onSubmit={async (values) => {
        await update.mutateAsync({ id: material.id, body: values });
        return toMaterialValues(await reload());
      }}
      onReload={async () => toMaterialValues(await reload())}
    >
      <MaterialFields />
    </Form>
  );
}
