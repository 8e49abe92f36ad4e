import { weekdaySchema, type PlantSettings } from '@millrace/contracts';
import { ShiftPatternFields } from '@/components/shift-pattern-fields';
import { Caution } from '@/components/ui/caution';
import { Form, FormInput, FormSelect } from '@/components/ui/form';
import { plantSettingsUpdateSchema, useUpdateSettings, type PlantSettingsUpdate } from '../api/update-settings';

const weekdayOptions = weekdaySchema.options.map((d) => ({ value: d, label: d[0].toUpperCase() + d.slice(1) }));

export function toSettingsValues(s: PlantSettings): PlantSettingsUpdate {
  return {
    plantName: s.plantName,
    currency: s.currency,
    weekStart: s.weekStart,
    defaultShiftPattern: { ...s.defaultShiftPattern, shiftStarts: [...s.defaultShiftPattern.shiftStarts] },
    maxWeeklyHours: s.maxWeeklyHours,
    minDailyRestHours: s.minDailyRestHours,
    overtimePremium: s.overtimePremium,
    version: s.version,
  };
}

export function SettingsForm({ settings, readOnly, reload }: { settings: PlantSettings; readOnly: boolean; reload: () => Promise<PlantSettings> }) {
  const update = useUpdateSettings();
  return (
    <Form
      label="Plant settings"
      schema={plantSettingsUpdateSchema}
      defaultValues={toSettingsValues(settings)}
      readOnly={readOnly}
      submitLabel="Save settings"
      onSubmit={async (values) => toSettingsValues(await update.mutateAsync(values))}
      onReload={async () => toSettingsValues(await reload())}
    >
      <div className="grid grid-cols-3 gap-4">
        <FormInput name="plantName" label="Plant name" />
        <FormInput name="currency" label="Currency" hint="Three-letter code, e.g. EUR." />
        <FormSelect name="weekStart" label="Weeks start on" options={weekdayOptions} />
      </div>
      <ShiftPatternFields prefix="defaultShiftPattern" legend="Default shift pattern for new work centers" />
      <fieldset className="rounded border border-line p-3">
        <legend className="px-1 font-semibold">Working-time limits</legend>
        <div className="grid grid-cols-3 gap-4">
          <FormInput name="maxWeeklyHours" label="Most hours a week per person (average)" number="number" />
          <FormInput name="minDailyRestHours" label="Least daily rest (hours)" number="number" />
          <FormInput name="overtimePremium" label="Overtime pay multiplier" number="number" hint="1.5 means time and a half." />
        </div>
        <div className="mt-3">
          <Caution title="Working time, fatigue and the law">
            Plans flag overtime beyond these limits. The defaults (48 h a week on average, 11 h daily rest) follow the EU Working Time
            Directive; your local labour law, collective agreements and occupational-health advice come first. Long hours raise the
            risk of fatigue and accidents.
          </Caution>
        </div>
      </fieldset>
    </Form>
  );
}
