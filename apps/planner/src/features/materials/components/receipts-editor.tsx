import { useFieldArray, useFormContext } from 'react-hook-form';
import type { MaterialDetail } from '@millrace/contracts';
import { EditableRows } from '@/components/ui/editable-rows';
import { Form, FormInput } from '@/components/ui/form';
import { receiptsReplaceSchema, useReplaceReceipts, type ReceiptsReplace } from '../api/replace-receipts';

export function toReceiptValues(m: MaterialDetail): ReceiptsReplace {
  return {
    version: m.version,
    receipts: [...m.receipts]
      .sort((a, b) => a.weekStart.localeCompare(b.weekStart))
      .map((r) => ({ weekStart: r.weekStart, qty: r.qty, reference: r.reference })),
  };
}

function ReceiptRows({ readOnly, unit }: { readOnly: boolean; unit: string }) {
  const { control } = useFormContext<ReceiptsReplace>();
  const rows = useFieldArray({ control, name: 'receipts' });
  return (
    <EditableRows
      rows={rows}
      caption="Scheduled receipts"
      columns={[{ header: 'Arrives in week starting' }, { header: `Quantity (${unit})`, numeric: true }, { header: 'Order reference' }]}
      emptyTitle="No scheduled receipts"
      emptyText="Add purchase orders that are already placed and due to arrive."
      rowNoun="receipt"
      addLabel="Add receipt"
      onAdd={() => rows.append({ weekStart: '', qty: 0, reference: null })}
      readOnly={readOnly}
      renderCells={(index) => (
        <>
          <td className="w-48 px-2 py-1">
            <FormInput name={`receipts.${index}.weekStart`} type="date" label={`Week starting, receipt ${index + 1}`} hideLabel />
          </td>
          <td className="w-40 px-2 py-1">
            <FormInput name={`receipts.${index}.qty`} label={`Quantity, receipt ${index + 1}`} hideLabel number="number" className="text-right" />
          </td>
          <td className="px-2 py-1">
            <FormInput name={`receipts.${index}.reference`} label={`Order reference, receipt ${index + 1}`} hideLabel nullable />
          </td>
        </>
      )}
    />
  );
}

/** Purchase orders already placed for a material, by the week they arrive. */
export function ReceiptsEditor({ material, readOnly, reload }: { material: MaterialDetail; readOnly: boolean; reload: () => Promise<MaterialDetail> }) {
  const replace = useReplaceReceipts();
  return (
    <Form
      label={`Scheduled receipts of ${material.code}`}
      schema={receiptsReplaceSchema}
      defaultValues={toReceiptValues(material)}
      readOnly={readOnly}
      submitLabel="Save receipts"
      onSubmit={async (values) => {
        await replace.mutateAsync({ id: material.id, body: values });
        return toReceiptValues(await reload());
      }}
      onReload={async () => toReceiptValues(await reload())}
    >
      <ReceiptRows readOnly={readOnly} unit={material.unit} />
    </Form>
  );
}
