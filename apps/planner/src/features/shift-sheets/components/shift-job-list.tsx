import type { SheetJob, SheetWorkCenter, ShiftSheet } from '@millrace/contracts';
import { carriedFromWords, clockOf, upperFirst, formatDay, formatMinutes, formatQuantityUnit, formatWeekOf, shiftLabel } from '../sheet-words';

/** Notes of a job in words: overtime, carried over from an earlier week, continuation, orders and due week. */
export function jobNotes(j: SheetJob): string[] {
  const notes: string[] = [];
  if (j.overtime) notes.push('Overtime');
  if (j.carriedFromWeek) notes.push(upperFirst(carriedFromWords(j.carriedFromWeek)));
  if (j.continued) notes.push('Continued from the previous shift');
  if (j.orderRefs.length > 0) notes.push(`Orders ${j.orderRefs.join(', ')}`);
  if (j.dueWeek) notes.push(`Due ${formatWeekOf(j.dueWeek)}`);
  return notes;
}

function ShiftTable({ sheet }: { sheet: ShiftSheet }) {
  const caption = `${sheet.workCenter}, ${formatDay(sheet.date)}, ${shiftLabel(sheet.shift, sheet.shiftStart, sheet.shiftEnd)}`;
  return (
    <div className="rounded border border-line bg-panel">
      <div className="flex flex-wrap items-baseline justify-between gap-2 border-b border-line bg-race-50 px-2 py-1.5">
        <h4 className="font-semibold">
          {formatDay(sheet.date)} · {shiftLabel(sheet.shift, sheet.shiftStart, sheet.shiftEnd)}
          {sheet.overtimeEnd ? <span className="ml-2 rounded border border-over-700 px-1 text-sm text-over-700">OT to {clockOf(sheet.overtimeEnd)}</span> : null}
        </h4>
        <span className="text-sm text-ink-soft">
          Planned {formatMinutes(sheet.plannedMinutes)} of {formatMinutes(sheet.availableMinutes)}
          {sheet.overtimeMinutes > 0 ? ` + ${formatMinutes(sheet.overtimeMinutes)} overtime` : ''}
        </span>
      </div>
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="text-left">
            {['Seq', 'Product', 'Op', 'Quantity', 'Setup', 'Start', 'Finish', 'Next', 'Notes'].map((h) => (
              <th key={h} scope="col" className={`border-b border-line px-2 py-1 ${h === 'Quantity' ? 'text-right' : ''}`}>
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {sheet.jobs.map((j) => (
            <tr key={`${j.sequence}`} className="border-b border-line/60 align-top">
              <td className="px-2 py-1 tabular-nums">{j.sequence}</td>
              <td className="px-2 py-1">
                <span className="font-semibold">{j.product}</span> {j.productName}
                {j.materials.length > 0 ? (
                  <span className="block text-xs text-ink-soft">Issue: {j.materials.map((m) => `${formatQuantityUnit(m.quantity, m.unit)} ${m.item}`).join(', ')}</span>
                ) : null}
              </td>
              <td className="px-2 py-1 tabular-nums">{j.operation}</td>
              <td className="px-2 py-1 text-right tabular-nums">
                {formatQuantityUnit(j.quantity, j.unit)}
              </td>
              <td className="px-2 py-1">{j.setupMinutes > 0 ? `${formatMinutes(j.setupMinutes)} from ${clockOf(j.setupStart)}` : '—'}</td>
              <td className="px-2 py-1 tabular-nums">{clockOf(j.start)}</td>
              <td className="px-2 py-1 tabular-nums">
                {clockOf(j.end)}
                {j.end.slice(0, 10) !== j.start.slice(0, 10) ? ' (next day)' : ''}
              </td>
              <td className="px-2 py-1">{j.nextWorkCenter ? `${j.nextWorkCenter} ${j.nextWorkCenterName ?? ''}` : 'Finished'}</td>
              <td className="px-2 py-1">
                {jobNotes(j).map((n) => (
                  <span key={n} className={`mr-1 inline-block ${n === 'Overtime' ? 'rounded border border-over-700 px-1 font-semibold text-over-700' : n.startsWith('Carried over') ? 'rounded border border-dashed border-ink px-1 font-semibold' : ''}`}>
                    {n === 'Overtime' ? '⏱ Overtime' : n}
                  </span>
                ))}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The work list of one work center for the week, shift by shift in run order. */
export function ShiftJobList({ workCenter }: { workCenter: SheetWorkCenter }) {
  if (workCenter.days.length === 0) return <p className="text-sm text-ink-soft">No work is planned on {workCenter.code} this week.</p>;
  return (
    <div className="flex flex-col gap-3">
      {workCenter.days.flatMap((d) => d.shifts).map((s) => (
        <ShiftTable key={`${s.date}-${s.shift}`} sheet={s} />
      ))}
    </div>
  );
}
