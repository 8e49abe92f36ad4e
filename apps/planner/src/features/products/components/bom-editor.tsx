import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import type { ProductDetail } from '@millrace/contracts';
import { EditableRows } from '@/components/ui/editable-rows';
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
    <EditableRows
      rows={lines}
      caption="Bill of materials lines"
      columns={[{ header: '#' }, { header: 'Component' }, { header: 'Quantity per unit', numeric: true }, { header: 'Unit' }, { header: 'Scrap %', numeric: true }]}
      emptyTitle="No components yet"
      emptyText="A product without components needs no materials; add lines if it does."
      rowNoun="line"
      addLabel="Add component"
      onAdd={() => lines.append({ componentProductId: null, materialId: null, qtyPer: 1, scrapPct: 0 })}
      readOnly={readOnly}
      renderCells={(index) => (
        <>
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
        </>
      )}
    />
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
