import { ShiftPatternFields } from '@/components/shift-pattern-fields';
import { FormInput } from '@/components/ui/form';

export function WorkCenterFields() {
  return (
    <>
      <div className="grid grid-cols-2 gap-4 lg:grid-cols-3">
        <FormInput name="code" label="Code" />
        <FormInput name="name" label="Name" />
        <FormInput name="efficiency" label="Efficiency" number="number" hint="Standard hours per clock hour, e.g. 0.85." />
        <FormInput name="overtimeCapHoursPerWeek" label="Overtime cap (hours a week)" number="optional-number" hint="Leave empty for no cap." />
        <FormInput name="overtimeCostPerHour" label="Overtime cost per hour" number="number" />
      </div>
      <ShiftPatternFields prefix="shiftPattern" legend="Shift pattern" />
    </>
  );
}
