import type { CrewCaution, ShiftSheet, ShiftSheetsWeek } from '@millrace/contracts';
import { carriedFromWords, clockOf, formatDay, formatMinutes, formatQuantityUnit, formatStamp, formatWeekOf, overtimeNotPlacedWords, showsOvertimeNotPlaced, upperFirst } from '../sheet-words';

const cell = 'border border-black px-1 py-0.5 align-top';
const blank = `${cell} h-9`;

/** The tick box the operator marks when the job is done. */
function TickBox({ label }: { label: string }) {
  return <span role="img" aria-label={label} className="mx-auto block h-4 w-4 border-[1.5px] border-black" />;
}

function HeaderField({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="border-r border-black px-1.5 py-0.5 last:border-r-0">
      <div className="text-[9px] font-semibold tracking-wide uppercase">{label}</div>
      <div className="text-[12px] leading-tight">{children}</div>
    </div>
  );
}

/**
 * One shift of one work center on one page of paper (DOMAIN.md §4, common practice): header with
 * plant, work center, date, shift, plan version, approval and print time; the jobs in run order
 * with blanks for what actually happened; planned against available hours, the crew's
 * working-time cautions and the sheet number at the foot. Black on white, no meaning in colour.
 */
export function PrintedSheet({
  week,
  sheet,
  number,
  count,
  printedAt,
  cautions,
}: {
  week: ShiftSheetsWeek;
  sheet: ShiftSheet;
  number: number;
  count: number;
  printedAt: Date;
  cautions: CrewCaution[];
}) {
  const plan = week.plan;
  const end = sheet.overtimeEnd ?? sheet.shiftEnd;
  const notPlaced = week.workCenters.find((c) => c.code === sheet.workCenter)?.overtimeNotPlacedHours ?? 0;
  return (
    <section className="printed-sheet flex flex-col gap-1.5 text-black" aria-label={`Sheet ${number} of ${count}: ${sheet.workCenter}, ${sheet.date}, shift ${sheet.shift}`}>
      <div className="flex items-baseline justify-between border-b-2 border-black pb-0.5">
        <h2 className="text-[17px] font-semibold">
          Shift sheet · {sheet.workCenter} {sheet.workCenterName} · {formatDay(sheet.date)} · Shift {sheet.shift}
        </h2>
        <span className="text-[10px]">Millrace</span>
      </div>
      <div className="grid grid-cols-[1.1fr_1.3fr_1.2fr_1.3fr_1.6fr_1.5fr_1.2fr] border border-black">
        <HeaderField label="Plant">{week.plantName}</HeaderField>
        <HeaderField label="Work center">
          {sheet.workCenter} — {sheet.workCenterName}
        </HeaderField>
        <HeaderField label="Date">{formatDay(sheet.date)}</HeaderField>
        <HeaderField label="Shift">
          Shift {sheet.shift}, {clockOf(sheet.shiftStart)}–{clockOf(sheet.shiftEnd)}
          {sheet.overtimeEnd ? `, overtime to ${clockOf(sheet.overtimeEnd)}` : ''}
        </HeaderField>
        <HeaderField label="Plan version">
          #{plan.id} {plan.name} ({plan.state})
        </HeaderField>
        <HeaderField label="Approved by">
          {plan.approvedBy ?? '—'}
          {plan.approvedAt ? `, ${formatStamp(plan.approvedAt)}` : ''}
        </HeaderField>
        <HeaderField label="Printed">{formatStamp(printedAt)}</HeaderField>
      </div>
      <p className="text-[11px]">Crew lead: ______________________ &nbsp; Crew size: ______</p>

      <table className="w-full border-collapse text-[11.5px] leading-tight">
        <caption className="sr-only">
          Jobs of {sheet.workCenter} on {sheet.date}, shift {sheet.shift}, in run order
        </caption>
        <thead>
          <tr className="text-left">
            <th scope="col" className={`${cell} w-6`}>Seq</th>
            <th scope="col" className={cell}>Product / materials to issue</th>
            <th scope="col" className={`${cell} w-7`}>Op</th>
            <th scope="col" className={`${cell} w-16 text-right`}>Quantity</th>
            <th scope="col" className={`${cell} w-20`}>Setup</th>
            <th scope="col" className={`${cell} w-12`}>Planned start</th>
            <th scope="col" className={`${cell} w-12`}>Planned finish</th>
            <th scope="col" className={`${cell} w-24`}>Next / due</th>
            <th scope="col" className={`${cell} w-9 text-center`}>Done</th>
            <th scope="col" className={`${cell} w-12`}>Actual start</th>
            <th scope="col" className={`${cell} w-12`}>Actual finish</th>
            <th scope="col" className={`${cell} w-12`}>Good qty</th>
            <th scope="col" className={`${cell} w-11`}>Scrap</th>
            <th scope="col" className={`${cell} w-24`}>Downtime / notes</th>
            <th scope="col" className={`${cell} w-14`}>Initials</th>
          </tr>
        </thead>
        <tbody>
          {sheet.jobs.map((j) => (
            <tr key={j.sequence} className="break-inside-avoid">
              <td className={`${cell} font-semibold`}>{j.sequence}</td>
              <td className={cell}>
                <span className="font-semibold">{j.product}</span> {j.productName}
                {j.overtime ? <span className="ml-1 border border-black px-0.5 font-semibold">OVERTIME</span> : null}
                {j.continued ? <span className="ml-1 italic">(continued)</span> : null}
                {j.carriedFromWeek ? <span className="block font-semibold">{upperFirst(carriedFromWords(j.carriedFromWeek))}</span> : null}
                {j.materials.length > 0 ? <span className="block">Issue: {j.materials.map((m) => `${formatQuantityUnit(m.quantity, m.unit)} ${m.item}`).join('; ')}</span> : null}
              </td>
              <td className={cell}>{j.operation}</td>
              <td className={`${cell} text-right font-semibold`}>
                {formatQuantityUnit(j.quantity, j.unit)}
              </td>
              <td className={cell}>{j.setupMinutes > 0 ? `${formatMinutes(j.setupMinutes)} from ${clockOf(j.setupStart)}` : 'none'}</td>
              <td className={cell}>{clockOf(j.start)}</td>
              <td className={cell}>{clockOf(j.end)}</td>
              <td className={cell}>
                {j.nextWorkCenter ? `→ ${j.nextWorkCenter}` : 'finished goods'}
                {j.dueWeek ? <span className="block whitespace-nowrap">due {formatWeekOf(j.dueWeek)}</span> : null}
                {j.orderRefs.length > 0 ? <span className="block">{j.orderRefs.join(', ')}</span> : null}
              </td>
              <td className={cell}>
                <TickBox label={`Done: job ${j.sequence}`} />
              </td>
              <td className={blank} />
              <td className={blank} />
              <td className={blank} />
              <td className={blank} />
              <td className={blank} />
              <td className={`${cell} align-bottom`}>
                <span className="mt-5 block border-b border-black" />
              </td>
            </tr>
          ))}
        </tbody>
      </table>

      <div className="mt-auto flex flex-col gap-0.5 border-t border-black pt-1 text-[10px]">
        <p>
          <span className="font-semibold">Planned {formatMinutes(sheet.plannedMinutes)}</span> of {formatMinutes(sheet.availableMinutes)} available
          {sheet.overtimeMinutes > 0 ? ` + ${formatMinutes(sheet.overtimeMinutes)} overtime (to ${clockOf(end)})` : ''}. Breaks, maintenance and lockout/tagout during setups follow the plant’s rules.
        </p>
        {cautions.map((c) => (
          <p key={c.message} className="font-semibold">
            ⚠ Working time: {c.message}
          </p>
        ))}
        {showsOvertimeNotPlaced(notPlaced) ? (
          <p className="font-semibold">
            ⚠ Overtime: {overtimeNotPlacedWords(notPlaced, sheet.workCenter)} It counts towards the crew’s working time.
          </p>
        ) : null}
        <p>{week.labourLawNote}</p>
        <p className="flex justify-between">
          <span>
            {week.plantName} · plan version #{plan.id} · week of {week.week.start}
          </span>
          <span className="font-semibold">
            Sheet {number} of {count}
          </span>
        </p>
      </div>
    </section>
  );
}
