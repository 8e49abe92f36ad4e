import { useFormContext } from 'react-hook-form';
import type { ScenarioOverride, ScenarioOverrideKind } from '@millrace/contracts';
import { Select } from '@/components/ui/field';
import { FormInput, useFieldError, useRegisteredName } from '@/components/ui/form';
import type { MasterChoices } from '../../api/get-master-choices';

/** Words for each kind of override (our own names). */
export const overrideKindWords: Record<ScenarioOverrideKind, string> = {
  extra_shift: 'Extra shift on a work center',
  supply_cap: 'Supply cap on a material',
  demand_scale: 'Demand scaled',
  maintenance: 'Work center closed for maintenance',
};

/** A fresh override of a kind, keeping the weeks already chosen. */
export function blankOverride(kind: ScenarioOverrideKind, weeks: { fromWeek: string; toWeek: string }): ScenarioOverride {
  switch (kind) {
    case 'extra_shift':
      return { kind, workCenter: '', ...weeks, extraShiftsPerDay: 1 };
    case 'supply_cap':
      return { kind, material: '', ...weeks, weeklySupplyCap: 0 };
    case 'demand_scale':
      return { kind, ...weeks, factor: 1 };
    case 'maintenance':
      return { kind, workCenter: '', ...weeks };
  }
}

/** A select bound by name whose empty choice means "not given" (undefined). */
function CodeSelect({
  name,
  label,
  options,
  emptyLabel,
  optional,
  showCode = true,
}: {
  name: string;
  label: string;
  options: { code: string; name: string }[];
  emptyLabel: string;
  optional?: boolean;
  showCode?: boolean;
}) {
  const { register } = useFormContext();
  useRegisteredName(name);
  const error = useFieldError(name);
  return (
    <Select
      {...register(name, { setValueAs: (v: unknown) => (v === '' || v == null ? (optional ? undefined : '') : v) })}
      label={label}
      error={error}
      placeholder={emptyLabel}
      options={options.map((o) => ({ value: o.code, label: showCode ? `${o.code} ${o.name}` : o.name }))}
    />
  );
}

/** The fields of one override, by its kind. */
export function OverrideFields({ index, kind, choices }: { index: number; kind: ScenarioOverrideKind; choices: MasterChoices }) {
  const at = (field: string) => `overrides.${index}.${field}`;
  const weeks = (
    <>
      <FormInput name={at('fromWeek')} label="From week" type="date" hint="A week-start date." />
      <FormInput name={at('toWeek')} label="To week (inclusive)" type="date" hint="A week-start date." />
    </>
  );
  switch (kind) {
    case 'extra_shift':
      return (
        <div className="grid grid-cols-4 gap-3">
          <CodeSelect name={at('workCenter')} label="Work center" options={choices.workCenters} emptyLabel="Choose a work center" />
          {weeks}
          <FormInput name={at('extraShiftsPerDay')} label="Extra shifts a day" number="number" hint="1 to 3." />
        </div>
      );
    case 'supply_cap':
      return (
        <div className="grid grid-cols-4 gap-3">
          <CodeSelect name={at('material')} label="Material" options={choices.materials} emptyLabel="Choose a material" />
          {weeks}
          <FormInput name={at('weeklySupplyCap')} label="Supply cap a week" number="number" hint="Units of the material." />
        </div>
      );
    case 'demand_scale':
      return (
        <div className="grid grid-cols-4 gap-3">
          <CodeSelect name={at('product')} label="Product" options={choices.products} emptyLabel="Every product" optional />
          {weeks}
          <FormInput name={at('factor')} label="Factor" number="number" hint="0.5 halves demand, 1.2 adds 20 %." />
          <CodeSelect
            name={at('demandKind')}
            label="Which demand"
            options={[
              { code: 'firm', name: 'firm orders only' },
              { code: 'forecast', name: 'forecasts only' },
            ]}
            emptyLabel="Firm orders and forecasts"
            optional
            showCode={false}
          />
        </div>
      );
    case 'maintenance':
      return (
        <div className="grid grid-cols-4 gap-3">
          <CodeSelect name={at('workCenter')} label="Work center" options={choices.workCenters} emptyLabel="Choose a work center" />
          {weeks}
          <p className="self-center text-sm text-ink-soft">Closed for the whole of each week. Lockout/tagout applies during maintenance.</p>
        </div>
      );
  }
}
