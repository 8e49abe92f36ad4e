import { FormInput, FormSelect } from '@/components/ui/form';
import { lotRuleLabels } from './materials-columns';

const lotRuleOptions = Object.entries(lotRuleLabels).map(([value, label]) => ({ value, label }));

export function MaterialFields() {
  return (
    <div className="grid grid-cols-2 gap-4 lg:grid-cols-3">
      <FormInput name="code" label="Code" />
      <FormInput name="name" label="Name" />
      <FormInput name="unit" label="Unit" hint="pcs, kg, m …" />
      <FormInput name="unitCost" label="Unit cost" number="number" />
      <FormInput name="onHand" label="Stock on hand" number="number" />
      <FormInput name="leadTimeWeeks" label="Lead time (weeks)" number="number" />
      <FormInput name="weeklySupplyCap" label="Supply cap a week" number="optional-number" hint="Most that can arrive in one week; empty for no cap." />
      <FormSelect name="lotRule" label="Lot rule" options={lotRuleOptions} />
      <FormInput
        name="lotSize"
        label="Lot size"
        number="optional-number"
        hint="Order quantity (fixed or minimum), or weeks covered (period order quantity). Empty for lot-for-lot."
      />
    </div>
  );
}
