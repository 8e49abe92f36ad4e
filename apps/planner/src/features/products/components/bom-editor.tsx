import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import type { ProductDetail } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Form, FormInput } from '@/components/ui/form';
import { Loading } from '@/components/ui/loading';
import { useMaterialChoices } from '../api/get-component-choices';
import { useProducts } from '../api/get-products';
import { bomReplaceSchema, useReplaceBom, type BomReplace } from '../api/replace-bom';
import { ComponentPicker, type ComponentChoice } from './component-picker';

export function toBomValues(p: ProductDetail): BomReplace {
  return {
    version: p.version,
    lines: [...p.bom]
      .sort((a, b) => a.position - b.position)
      .map((l) => ({ componentProductId: l.componentProductId, materialId: l.materialId, qtyPer: l.qtyPer, scrapPct: l.scrapPct })),
  };
}

function UnitOf({ index, units }: { index: number; units: Map<string, string> }) {
  const { control } = useFormContext();
  const materialId = useWatch({ control, name: `lines.${index}.materialId` }) as number | null;
  const productId = useWatch({ control, name: `lines.${index}.componentProductId` }) as number | null;
  const unit = materialId ? units.get(`m:${materialId}`) : productId ? units.get(`p:${productId}`) : undefined;
  return <span className="text-ink-soft">{unit ?? ''}</span>;
}

function BomLines({ choices, units, readOnly }: { choices: { materials: ComponentChoice[]; products: ComponentChoice[] }; units: Map<string, string>; readOnly: boolean }) {
  const { control } = useFormContext<BomReplace>();
  const lines = useFieldArray({ control, name: 'lines' });
  return (
    <div className="flex flex-col gap-3">
      {lines.fields.length === 0 ? (
        <EmptyState title="No components yet">A product without components needs no materials; add lines if it does.</EmptyState>
      ) : (
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Bill of materials lines</caption>
          <thead>
            <tr className="bg-race-50 text-left">
              <th scope="col" className="px-2 py-1.5">#</th>
              <th scope="col" className="px-2 py-1.5">Component</th>
              <th scope="col" className="px-2 py-1.5 text-right">Quantity per unit</th>
              <th scope="col" className="px-2 py-1.5">Unit</th>
              <th scope="col" className="px-2 py-1.5 text-right">Scrap %</th>
              {!readOnly ? <th scope="col" className="px-2 py-1.5"><span className="sr-only">Actions</span></th> : null}
            </tr>
          </thead>
          <tbody>
            {lines.fields.map((field, index) => (
              <tr key={field.id} className="border-b border-line/60 align-top">
                <td className="px-2 py-2 tabular-nums">{index + 1}</td>
                <td className="min-w-72 px-2 py-1">
                  <ComponentPicker index={index} choices={choices} />
                </td>
                <td className="w-36 px-2 py-1">
                  <FormInput name={`lines.${index}.qtyPer`} label={`Quantity per unit, line ${index + 1}`} hideLabel number="number" className="text-right" />
                </td>
                <td className="px-2 py-2">
                  <UnitOf index={index} units={units} />
                </td>
                <td className="w-28 px-2 py-1">
                  <FormInput name={`lines.${index}.scrapPct`} label={`Scrap %, line ${index + 1}`} hideLabel number="number" className="text-right" />
                </td>
                {!readOnly ? (
                  <td className="px-2 py-1">
                    <Button size="sm" variant="danger" onClick={() => lines.remove(index)} aria-label={`Remove line ${index + 1}`}>
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
          <Button size="sm" onClick={() => lines.append({ componentProductId: null, materialId: null, qtyPer: 1, scrapPct: 0 })}>
            Add component
          </Button>
        </div>
      ) : null}
    </div>
  );
}

/** Bill of materials of one product: materials and sub-assemblies with quantity per unit and scrap. */
export function BomEditor({ product, readOnly, reload }: { product: ProductDetail; readOnly: boolean; reload: () => Promise<ProductDetail> }) {
  const materials = useMaterialChoices();
  const products = useProducts();
  const replace = useReplaceBom();

  if (materials.isPending || products.isPending) return <Loading label="Loading materials and products…" />;
  if (materials.isError) return <ErrorState error={materials.error} onRetry={() => void materials.refetch()} />;
  if (products.isError) return <ErrorState error={products.error} onRetry={() => void products.refetch()} />;

  const units = new Map<string, string>();
  const materialChoices = materials.data.items.map((m) => {
    units.set(`m:${m.id}`, m.unit);
    return { value: `m:${m.id}`, label: `${m.code} — ${m.name}`, unit: m.unit };
  });
  const productChoices = products.data.items
    .filter((p) => p.id !== product.id)
    .map((p) => {
      units.set(`p:${p.id}`, p.unit);
      return { value: `p:${p.id}`, label: `${p.code} — ${p.name}${p.kind === 'subassembly' ? ' (sub-assembly)' : ''}`, unit: p.unit };
    });

  return (
    <Form
      label={`Bill of materials of ${product.code}`}
      schema={bomReplaceSchema}
      defaultValues={toBomValues(product)}
      readOnly={readOnly}
      submitLabel="Save bill of materials"
      onSubmit={async (values) => {
        await replace.mutateAsync({ id: product.id, body: values });
        return toBomValues(await reload());
      }}
      onReload={async () => toBomValues(await reload())}
    >
      <p className="text-sm text-ink-soft">
        Use per unit of {product.code} is the quantity divided by (1 − scrap %/100).
      </p>
      <BomLines choices={{ materials: materialChoices, products: productChoices }} units={units} readOnly={readOnly} />
    </Form>
  );
}
