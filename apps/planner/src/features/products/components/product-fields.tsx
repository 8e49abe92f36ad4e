import { FormCheckbox, FormInput, FormSelect } from '@/components/ui/form';
import { productKindLabels } from './products-columns';

const kindOptions = Object.entries(productKindLabels).map(([value, label]) => ({ value, label }));

/** The fields of a product, shared by the create and edit forms. */
export function ProductFields() {
  return (
    <div className="grid grid-cols-2 gap-4 lg:grid-cols-3">
      <FormInput name="code" label="Code" hint="Part number, no spaces." />
      <FormInput name="name" label="Name" />
      <FormSelect name="kind" label="Kind" options={kindOptions} />
      <FormInput name="unit" label="Unit" hint="pcs, kg, m …" />
      <FormInput name="family" label="Changeover family" nullable hint="Optional. Products of one family follow each other without a full changeover." />
      <FormInput name="price" label="Price per unit" number="number" />
      <FormInput name="holdingCostRatePct" label="Holding cost (% of value per year)" number="number" />
      <FormInput name="safetyStock" label="Safety stock" number="number" />
      <FormInput name="batchMultiple" label="Batch multiple" number="number" hint="Made in multiples of this quantity." />
      <FormInput name="openingStock" label="Stock on hand" number="number" />
      <FormInput name="latePenalty" label="Late penalty per unit per week" number="number" />
      <div className="self-end pb-2">
        <FormCheckbox name="active" label="Active (planned)" />
      </div>
    </div>
  );
}
