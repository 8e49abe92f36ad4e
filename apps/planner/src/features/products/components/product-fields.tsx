import { FormCheckbox, FormInput, FormSelect } from '@/components/ui/form';
import { usePlantCurrency } from '../api/get-plant-currency';
import { productKindLabels } from './products-columns';

const kindOptions = Object.entries(productKindLabels).map(([value, label]) => ({ value, label }));

/** The fields of a product, shared by the create and edit forms; money fields name the plant currency. */
export function ProductFields() {
  const currency = usePlantCurrency().data;
  const inCurrency = currency ? ` (${currency})` : '';
  return (
    <div className="grid grid-cols-2 gap-4 lg:grid-cols-3">
      <FormInput name="code" label="Code" hint="Part number, no spaces." />
      <FormInput name="name" label="Name" />
      <FormSelect name="kind" label="Kind" options={kindOptions} />
      <FormInput name="unit" label="Unit" hint="pcs, kg, m …" />
      <FormInput name="family" label="Changeover family" nullable hint="Optional. Products of one family follow each other without a full changeover." />
      <FormInput name="price" label={`Price per unit${inCurrency}`} number="number" />
      <FormInput name="holdingCostRatePct" label="Holding cost (% of value per year)" number="number" />
      <FormInput name="safetyStock" label="Safety stock" number="number" />
      <FormInput name="batchMultiple" label="Batch multiple" number="number" hint="Made in multiples of this quantity." />
      <FormInput name="openingStock" label="Stock on hand" number="number" />
      <FormInput name="latePenalty" label={`Late penalty per unit per week${inCurrency}`} number="number" />
      <div className="self-end pb-2">
        <FormCheckbox name="active" label="Active (planned)" />
      </div>
    </div>
  );
}
