import { useFieldArray, useFormContext } from 'react-hook-form';
import { addDays, weekStartOf, type WorkCenterDetail, type Weekday } from '@millrace/contracts';
import { EditableRows } from '@/components/ui/editable-rows';
import { Form, FormInput } from '@/components/ui/form';
import { formatHours, formatWeekLong } from '@/lib/format';
import { calendarReplaceSchema, useReplaceCalendar, type CalendarReplace } from '../api/replace-calendar';

export function toCalendarValues(w: WorkCenterDetail): CalendarReplace {
  return {
    version: w.version,
    weeks: [...w.calendar]
      .sort((a, b) => a.weekStart.localeCompare(b.weekStart))
      .map((c) => ({ weekStart: c.weekStart, holidayDays: c.holidayDays, downtimeHours: c.downtimeHours, extraShifts: c.extraShifts, note: c.note })),
  };
}

function todayIso(): string {
  return new Date().toISOString().slice(0, 10);
}

function CalendarWeeks({ readOnly, weekStart }: { readOnly: boolean; weekStart: Weekday }) {
  const { control, getValues } = useFormContext<CalendarReplace>();
  const weeks = useFieldArray({ control, name: 'weeks' });

  const addWeek = () => {
    const listed = getValues('weeks').map((w) => w.weekStart).filter((d) => /^\d{4}-\d{2}-\d{2}$/.test(d)).sort();
    const thisWeek = weekStartOf(todayIso(), weekStart);
    const last = listed[listed.length - 1];
    const next = last && last >= thisWeek ? addDays(weekStartOf(last, weekStart), 7) : thisWeek;
    weeks.append({ weekStart: next, holidayDays: 0, downtimeHours: 0, extraShifts: 0, note: null });
  };

  return (
    <EditableRows
      rows={weeks}
      caption="Weeks that differ from the shift pattern"
      columns={[
        { header: 'Week starting' },
        { header: 'Holidays (days)', numeric: true },
        { header: 'Planned downtime (h)', numeric: true },
        { header: 'Extra shifts per day', numeric: true },
        { header: 'Note' },
      ]}
      emptyTitle="Every week follows the shift pattern"
      emptyText="Add a week for holidays, planned downtime or extra shifts."
      rowNoun="row"
      addLabel="Add week"
      onAdd={addWeek}
      readOnly={readOnly}
      renderCells={(index) => (
        <>
          <td className="w-44 px-2 py-1">
            <FormInput name={`weeks.${index}.weekStart`} type="date" label={`Week starting, row ${index + 1}`} hideLabel />
          </td>
          <td className="w-32 px-2 py-1">
            <FormInput name={`weeks.${index}.holidayDays`} label={`Holidays in days, row ${index + 1}`} hideLabel number="number" className="text-right" />
          </td>
          <td className="w-36 px-2 py-1">
            <FormInput name={`weeks.${index}.downtimeHours`} label={`Planned downtime in hours, row ${index + 1}`} hideLabel number="number" className="text-right" />
          </td>
          <td className="w-32 px-2 py-1">
            <FormInput name={`weeks.${index}.extraShifts`} label={`Extra shifts per day, row ${index + 1}`} hideLabel number="number" className="text-right" />
          </td>
          <td className="px-2 py-1">
            <FormInput name={`weeks.${index}.note`} label={`Note, row ${index + 1}`} hideLabel nullable />
          </td>
        </>
      )}
    />
  );
}

/**
 * The weekly calendar of a work center: the weeks that differ from its shift pattern (holidays,
 * planned downtime, extra shifts). Weeks start on the plant's week start.
 */
export function CalendarEditor({
  workCenter,
  weekStart,
  readOnly,
  reload,
}: {
  workCenter: WorkCenterDetail;
  weekStart: Weekday;
  readOnly: boolean;
  reload: () => Promise<WorkCenterDetail>;
}) {
  const replace = useReplaceCalendar();
  const p = workCenter.shiftPattern;
  return (
    <Form
      label={`Calendar of ${workCenter.code}`}
      schema={calendarReplaceSchema}
      defaultValues={toCalendarValues(workCenter)}
      readOnly={readOnly}
      submitLabel="Save calendar"
      onSubmit={async (values) => {
        await replace.mutateAsync({ id: workCenter.id, body: values });
        return toCalendarValues(await reload());
      }}
      onReload={async () => toCalendarValues(await reload())}
    >
      <p className="text-sm text-ink-soft">
        A normal week has {p.shiftsPerDay} shift{p.shiftsPerDay === 1 ? '' : 's'} × {p.hoursPerShift} h × {p.daysPerWeek} days ={' '}
        {formatHours(p.shiftsPerDay * p.hoursPerShift * p.daysPerWeek)} of clock time. Weeks start on {weekStart[0].toUpperCase() + weekStart.slice(1)}; today is in the{' '}
        {formatWeekLong(weekStartOf(todayIso(), weekStart))}.
      </p>
      <CalendarWeeks readOnly={readOnly} weekStart={weekStart} />
    </Form>
  );
}
