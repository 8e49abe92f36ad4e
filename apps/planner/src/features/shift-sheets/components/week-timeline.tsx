import type { CSSProperties } from 'react';
import type { ShiftSheetsWeek } from '@millrace/contracts';
import { addDays } from '@millrace/contracts';
import { carriedFromWords, formatMinutes, formatQuantity, formatQuantityUnit, formatShortDay } from '../sheet-words';

/** Open time closer than this joins one stretch of the axis (minutes; common practice, no source). */
const joinGapMinutes = 60;

/** Day labels closer than this share of the axis are left out so they never overlap. */
const minLabelGapPercent = 7;

/** Overtime is drawn hatched and labelled "OT", never told by colour alone. */
export const overtimeHatch: CSSProperties = {
  backgroundImage: 'repeating-linear-gradient(135deg, rgba(0,0,0,0.28) 0 2px, transparent 2px 6px)',
};
const setupHatch: CSSProperties = {
  backgroundImage: 'repeating-linear-gradient(90deg, rgba(255,255,255,0.55) 0 2px, transparent 2px 4px)',
};

interface Stretch {
  from: number;
  to: number;
}

/** The stretches of the week in which any work center is open (the axis leaves closed nights and weekends out). */
export function openStretches(week: ShiftSheetsWeek): Stretch[] {
  const spans = week.workCenters
    .flatMap((c) => c.openShifts.map((s) => ({ from: s.startMinute, to: s.overtimeEndMinute })))
    .sort((a, b) => a.from - b.from);
  const out: Stretch[] = [];
  for (const s of spans) {
    const last = out[out.length - 1];
    if (last && s.from <= last.to + joinGapMinutes) last.to = Math.max(last.to, s.to);
    else out.push({ ...s });
  }
  return out;
}

const clock = (minute: number) => {
  const m = ((Math.round(minute) % 1440) + 1440) % 1440;
  return `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
};

/**
 * The week as a timeline: one row per work center, time running left to right over the stretches
 * when the plant is open; open shifts as pale bands, jobs as labelled blocks (setup striped,
 * overtime hatched and marked "OT").
 */
export function WeekTimeline({ week, highlight }: { week: ShiftSheetsWeek; highlight?: string }) {
  const stretches = openStretches(week);
  if (stretches.length === 0) return <p className="text-sm text-ink-soft">No work center has an open shift this week.</p>;
  const total = stretches.reduce((a, s) => a + (s.to - s.from), 0);
  const dayOf = (minute: number) => addDays(week.week.start, Math.floor(minute / 1440));

  // place [from, to) of the week on the axis, in % of its width (null when outside every stretch)
  const place = (from: number, to: number): { left: number; width: number } | null => {
    let offset = 0;
    for (const s of stretches) {
      if (from < s.to && to > s.from) {
        const a = Math.max(from, s.from);
        const b = Math.min(to, s.to);
        return { left: ((offset + a - s.from) / total) * 100, width: (Math.max(b - a, 1) / total) * 100 };
      }
      offset += s.to - s.from;
    }
    return null;
  };

  // one label per day, where that day first appears on the axis (a stretch start or a midnight)
  const ticks: { at: number; label: string }[] = [];
  const labelled = new Set<string>();
  let offset = 0;
  for (const s of stretches) {
    const points = [s.from];
    for (let m = Math.ceil((s.from + 1) / 1440) * 1440; m < s.to; m += 1440) points.push(m);
    for (const m of points) {
      const day = dayOf(m);
      const at = ((offset + m - s.from) / total) * 100;
      if (labelled.has(day) || (ticks.length > 0 && at - ticks[ticks.length - 1].at < minLabelGapPercent)) continue;
      labelled.add(day);
      ticks.push({ at, label: m % 1440 === 0 ? formatShortDay(day) : `${formatShortDay(day)} ${clock(m)}` });
    }
    offset += s.to - s.from;
  }

  return (
    <figure aria-label={`Timeline of the week starting ${week.week.start}`} className="overflow-x-auto rounded border border-line bg-panel">
      <div className="min-w-[900px]">
        <div className="flex border-b border-line text-xs text-ink-soft" aria-hidden="true">
          <div className="w-36 shrink-0 px-2 py-1 font-semibold">Work center</div>
          <div className="relative h-6 flex-1">
            {ticks.map((t) => (
              <span key={`${t.at}-${t.label}`} className="absolute top-0 h-full border-l border-line pl-1 whitespace-nowrap" style={{ left: `${t.at}%` }}>
                {t.label}
              </span>
            ))}
          </div>
        </div>
        <ul>
          {week.workCenters.map((c) => {
            const jobs = c.days.flatMap((d) => d.shifts.flatMap((s) => s.jobs));
            return (
              <li key={c.code} className={`flex border-b border-line/70 ${highlight === c.code ? 'bg-race-50' : ''}`}>
                <div className="w-36 shrink-0 px-2 py-2 text-sm">
                  <span className="font-semibold">{c.code}</span> <span className="text-ink-soft">{c.name}</span>
                  <span className="block text-xs text-ink-soft">
                    {formatMinutes(c.plannedMinutes)} of {formatMinutes(c.availableMinutes)}
                    {c.overtimeMinutes > 0 ? ` + ${formatMinutes(c.overtimeMinutes)} OT` : ''}
                  </span>
                </div>
                <div className="relative h-14 flex-1">
                  {c.openShifts.map((s) => {
                    const regular = place(s.startMinute, s.endMinute);
                    const over = s.overtimeEndMinute > s.endMinute ? place(s.endMinute, s.overtimeEndMinute) : null;
                    return (
                      <span key={`${s.date}-${s.shift}`}>
                        {regular ? <span className="absolute top-1 bottom-1 rounded-sm bg-race-50 ring-1 ring-race-100" style={{ left: `${regular.left}%`, width: `${regular.width}%` }} /> : null}
                        {over ? <span className="absolute top-1 bottom-1 rounded-sm bg-over-50 ring-1 ring-over-200" style={{ left: `${over.left}%`, width: `${over.width}%`, ...overtimeHatch }} /> : null}
                      </span>
                    );
                  })}
                  {jobs.map((j) => {
                    const at = place(j.setupStartMinute, j.endMinute);
                    if (!at) return null;
                    const setupShare = j.endMinute > j.setupStartMinute ? ((j.startMinute - j.setupStartMinute) / (j.endMinute - j.setupStartMinute)) * 100 : 0;
                    const title = `${j.product} ${j.productName}, operation ${j.operation}: ${formatQuantityUnit(j.quantity, j.unit)}, ${j.setupStart.slice(11)}–${j.end.slice(11)}${j.setupMinutes > 0 ? `, setup ${formatMinutes(j.setupMinutes)}` : ''}${j.overtime ? ', runs into overtime' : ''}${j.carriedFromWeek ? `, ${carriedFromWords(j.carriedFromWeek)}` : ''}`;
                    return (
                      <span
                        key={`${j.product}-${j.operation}-${j.startMinute}`}
                        title={title}
                        className={`absolute top-2 bottom-2 overflow-hidden rounded-sm border px-0.5 text-[11px] leading-tight whitespace-nowrap ${j.overtime ? 'border-over-700 bg-over-200 text-ink' : 'border-race-800 bg-race-600 text-white'} ${j.carriedFromWeek ? 'border-2 border-dashed' : ''}`}
                        style={{ left: `${at.left}%`, width: `${at.width}%`, ...(j.overtime ? overtimeHatch : {}) }}
                      >
                        {setupShare > 0 ? <span aria-hidden="true" className="absolute inset-y-0 left-0" style={{ width: `${setupShare}%`, ...setupHatch }} /> : null}
                        <span className="relative font-semibold">{j.product}</span>
                        <span className="relative"> {formatQuantity(j.quantity)}</span>
                        {j.overtime ? <span className="relative font-semibold"> OT</span> : null}
                        {j.carriedFromWeek ? <span className="relative font-semibold"> CO</span> : null}
                        <span className="sr-only">{title}</span>
                      </span>
                    );
                  })}
                </div>
              </li>
            );
          })}
        </ul>
        <p className="flex flex-wrap gap-4 px-2 py-1.5 text-xs text-ink-soft">
          <span>
            <span className="mr-1 inline-block h-3 w-5 rounded-sm border border-race-800 bg-race-600 align-middle" /> job (product code, quantity)
          </span>
          <span>
            <span className="mr-1 inline-block h-3 w-5 rounded-sm border border-race-800 bg-race-600 align-middle" style={setupHatch} /> setup or changeover (striped start)
          </span>
          <span>
            <span className="mr-1 inline-block h-3 w-5 rounded-sm border border-over-700 bg-over-200 align-middle" style={overtimeHatch} /> overtime, marked OT
          </span>
          <span>
            <span className="mr-1 inline-block h-3 w-5 rounded-sm border-2 border-dashed border-race-800 bg-race-600 align-middle" /> carried over from an earlier week, marked CO
          </span>
          <span>
            <span className="mr-1 inline-block h-3 w-5 rounded-sm bg-race-50 ring-1 ring-race-100 align-middle" /> open shift
          </span>
        </p>
      </div>
    </figure>
  );
}
