import { useFieldArray, useFormContext } from 'react-hook-form';
import type { MaterialDetail } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
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
    <div className="flex flex-col gap-3">
      {rows.fields.length === 0 ? (
        <EmptyState title="No scheduled receipts">Add purchase orders that are already placed and due to arrive.</EmptyState>
      ) : (
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Scheduled receipts</caption>
          <thead>
            <tr className="bg-race-50 text-left">
              <th scope="col" className="px-2 py-1.5">Arrives in week starting</th>
              <th scope="col" className="px-2 py-1.5 text-right">Quantity ({unit})</th>
              <th scope="col" className="px-2 py-1.5">Order reference</th>
              {!readOnly ? <th scope="col" className="px-2 py-1.5"><span className="sr-only">Actions</span></th> : null}
            </tr>
          </thead>
          <tbody>
            {rows.fields.map((field, index) => (
              <tr key={field.id} className="border-b border-line/60 align-top">
                <td className="w-48 px-2 py-1">
                  <FormInput name={`receipts.${index}.weekStart`} type="date" label={`Week starting, receipt ${index + 1}`} hideLabel />
                </td>
                <td className="w-40 px-2 py-1">
                  <FormInput name={`receipts.${index}.qty`} label={`Quantity, receipt ${index + 1}`} hideLabel number="number" className="text-right" />
                </td>
                <td className="px-2 py-1">
                  <FormInput name={`receipts.${index}.reference`} label={`Order reference, receipt ${index + 1}`} hideLabel nullable />
                </td>
                {!readOnly ? (
                  <td className="px-2 py-1">
                    <Button size="sm" variant="danger" onClick={() => rows.remove(index)} aria-label={`Remove receipt ${index + 1}`}>
                      Remove
                    </Button>
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {!readOnly ? (
        <div>
          <Button size="sm" onClick={() => rows.append({ weekStart: '', qty: 0, reference: null })}>
            Add receipt
          </Button>
        </div>
      ) : null}
    </div>
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
