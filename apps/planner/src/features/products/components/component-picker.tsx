import { useFormContext, useWatch } from 'react-hook-form';
import { Select } from '@/components/ui/field';
import { useFieldError, useRegisteredName } from '@/components/ui/form';

export type ComponentChoice = { value: string; label: string; unit: string };

/**
 * One select for the component of a BOM line: a material (`m:<id>`) or a sub-assembly (`p:<id>`).
 * It writes `materialId` / `componentProductId` of the line, exactly one of them set.
 */
export function ComponentPicker({ index, choices }: { index: number; choices: { materials: ComponentChoice[]; products: ComponentChoice[] } }) {
  const { setValue, control } = useFormContext();
  const productName = `lines.${index}.componentProductId`;
  const materialName = `lines.${index}.materialId`;
  useRegisteredName(productName);
  useRegisteredName(materialName);
  const productId = useWatch({ control, name: productName }) as number | null;
  const materialId = useWatch({ control, name: materialName }) as number | null;
  const productError = useFieldError(productName);
  const materialError = useFieldError(materialName);
  const error = productError ?? materialError;
  const value = materialId ? `m:${materialId}` : productId ? `p:${productId}` : '';

  return (
    <Select
      label={`Component, line ${index + 1}`}
      hideLabel
      value={value}
      error={error}
      placeholder="Choose a material or sub-assembly"
      options={[]}
      onChange={(e) => {
        const [kind, id] = e.target.value.split(':');
        const n = id ? Number(id) : null;
        setValue(materialName, kind === 'm' ? n : null, { shouldDirty: true, shouldValidate: false });
        setValue(productName, kind === 'p' ? n : null, { shouldDirty: true, shouldValidate: false });
      }}
    >
      <optgroup label="Materials">
        {choices.materials.map((c) => (
          <option key={c.value} value={c.value}>
            {c.label}
          </option>
        ))}
      </optgroup>
      <optgroup label="Sub-assemblies and products">
        {choices.products.map((c) => (
          <option key={c.value} value={c.value}>
            {c.label}
          </option>
        ))}
      </optgroup>
    </Select>
  );
}
