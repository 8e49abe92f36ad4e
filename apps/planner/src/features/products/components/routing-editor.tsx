import { useFieldArray, useFormContext } from 'react-hook-form';
import type { ProductDetail } from '@millrace/contracts';
import { EditableRows } from '@/components/ui/editable-rows';
import { ErrorState } from '@/components/ui/error-state';
import { Form, FormInput, FormSelect } from '@/components/ui/form';
import { Loading } from '@/components/ui/loading';
import { useWorkCenterChoices } from '../api/get-component-choices';
import { routingReplaceSchema, useReplaceRouting, type RoutingReplace } from '../api/replace-routing';


/** Gap between sequence numbers when steps are renumbered (leaves room to insert; common practice, no source). */
const sequenceStep = 10;

export function toRoutingValues(p: ProductDetail): RoutingReplace {
  return {
    version: p.version,
    steps: [...p.routing]
      .sort((a, b) => a.sequence - b.sequence)
      .map((s) => ({ sequence: s.sequence, workCenterId: s.workCenterId, hoursPerUnit: s.hoursPerUnit, setupHours: s.setupHours })),
  };
}

function RoutingSteps({ options, readOnly }: { options: { value: string; label: string }[]; readOnly: boolean }) {
  const { control, getValues, setValue } = useFormContext<RoutingReplace>();
  const steps = useFieldArray({ control, name: 'steps' });

  const renumber = () => getValues('steps').forEach((_s, i) => setValue(`steps.${i}.sequence`, (i + 1) * sequenceStep, { shouldDirty: true }));

  return (
    <EditableRows
      rows={steps}
      caption="Routing steps in order"
      columns={[{ header: 'Sequence' }, { header: 'Work center' }, { header: 'Hours per unit', numeric: true }, { header: 'Setup hours', numeric: true }]}
      emptyTitle="No routing steps yet"
      emptyText="Without steps the product takes no work-center time."
      rowNoun="step"
      addLabel="Add step"
      onAdd={() => {
        const last = getValues('steps').reduce((m, s) => Math.max(m, Number(s.sequence) || 0), 0);
        steps.append({ sequence: last + sequenceStep, workCenterId: 0, hoursPerUnit: 0, setupHours: 0 });
      }}
      onMoved={renumber}
      readOnly={readOnly}
      renderCells={(index) => (
        <>
          <td className="w-28 px-2 py-1">
            <FormInput name={`steps.${index}.sequence`} label={`Sequence, step ${index + 1}`} hideLabel number="number" />
          </td>
          <td className="min-w-64 px-2 py-1">
            <FormSelect name={`steps.${index}.workCenterId`} label={`Work center, step ${index + 1}`} hideLabel number options={options} placeholder="Choose a work center" />
          </td>
          <td className="w-32 px-2 py-1">
            <FormInput name={`steps.${index}.hoursPerUnit`} label={`Hours per unit, step ${index + 1}`} hideLabel number="number" className="text-right" />
          </td>
          <td className="w-32 px-2 py-1">
            <FormInput name={`steps.${index}.setupHours`} label={`Setup hours, step ${index + 1}`} hideLabel number="number" className="text-right" />
          </td>
        </>
      )}
    />
  );
}

/** Routing of one product: ordered steps on work centers with run hours per unit and setup hours. */
export function RoutingEditor({ product, readOnly, reload }: { product: ProductDetail; readOnly: boolean; reload: () => Promise<ProductDetail> }) {
  const workCenters = useWorkCenterChoices();
  const replace = useReplaceRouting();

  if (workCenters.isPending) return <Loading label="Loading work centers…" />;
  if (workCenters.isError) return <ErrorState error={workCenters.error} onRetry={() => void workCenters.refetch()} />;

  const options = workCenters.data.items.map((w) => ({ value: String(w.id), label: `${w.code} — ${w.name}` }));

  return (
    <Form
      label={`Routing of ${product.code}`}
      schema={routingReplaceSchema}
      defaultValues={toRoutingValues(product)}
      readOnly={readOnly}
      submitLabel="Save routing"
      onSubmit={async (values) => {
        await replace.mutateAsync({ id: product.id, body: values });
        return toRoutingValues(await reload());
      }}
      onReload={async () => toRoutingValues(await reload())}
    >
      <RoutingSteps options={options} readOnly={readOnly} />
    </Form>
  );
}
