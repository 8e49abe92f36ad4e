import { useEffect } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import { FormInput } from '@/components/ui/form';

/** 'HH:MM' + hours, wrapped to the 24-hour clock. */
function addHours(start: string, hours: number): string {
  const m = /^(\d{2}):(\d{2})$/.exec(start);
  if (!m || !Number.isFinite(hours)) return '';
  const minutes = (Number(m[1]) * 60 + Number(m[2]) + Math.round(hours * 60)) % (24 * 60);
  return `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
}

/**
 * Shifts per day × hours per shift × days per week, and one start time per shift. The list of
 * start times follows the number of shifts (a new shift starts where the previous one ends).
 */
export function ShiftPatternFields({ prefix, legend }: { prefix: string; legend: string }) {
  const { control, getValues, setValue } = useFormContext();
  const shiftsPerDay = Number(useWatch({ control, name: `${prefix}.shiftsPerDay` }));
  const count = Number.isInteger(shiftsPerDay) && shiftsPerDay >= 1 && shiftsPerDay <= 4 ? shiftsPerDay : 0;

  useEffect(() => {
    if (!count) return;
    const starts = [...((getValues(`${prefix}.shiftStarts`) as string[] | undefined) ?? [])];
    if (starts.length === count) return;
    const hours = Number(getValues(`${prefix}.hoursPerShift`));
    while (starts.length < count) starts.push(starts.length ? addHours(starts[starts.length - 1], hours) : '06:00');
    setValue(`${prefix}.shiftStarts`, starts.slice(0, count), { shouldDirty: true });
  }, [count, prefix, getValues, setValue]);

  return (
    <fieldset className="rounded border border-line p-3">
      <legend className="px-1 font-semibold">{legend}</legend>
      <div className="grid grid-cols-3 gap-4">
        <FormInput name={`${prefix}.shiftsPerDay`} label="Shifts per day" number="number" />
        <FormInput name={`${prefix}.hoursPerShift`} label="Hours per shift" number="number" />
        <FormInput name={`${prefix}.daysPerWeek`} label="Days per week" number="number" />
      </div>
      <div className="mt-3 grid grid-cols-4 gap-4">
        {Array.from({ length: count }, (_, i) => (
          <FormInput key={i} name={`${prefix}.shiftStarts.${i}`} label={`Shift ${i + 1} starts`} placeholder="HH:MM" hint="24-hour clock" />
        ))}
      </div>
      <FormErrorLine name={`${prefix}.shiftStarts`} />
    </fieldset>
  );
}

/** An error on the list itself (e.g. wrong number of start times). */
function FormErrorLine({ name }: { name: string }) {
  const { formState } = useFormContext();
  const parts = name.split('.');
  let error: unknown = formState.errors;
  for (const p of parts) error = (error as Record<string, unknown> | undefined)?.[p];
  const message = (error as { message?: string } | undefined)?.message ?? (error as { root?: { message?: string } } | undefined)?.root?.message;
  return message ? (
    <p className="mt-2 text-sm text-fault-700">
      <span aria-hidden="true">✕ </span>
      {message}
    </p>
  ) : null;
}
