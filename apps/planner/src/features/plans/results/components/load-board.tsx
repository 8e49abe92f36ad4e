import { useId } from 'react';
import type { Bottleneck, Caution, LoadRow } from '@millrace/contracts';
import { Caution as CautionNote } from '@/components/ui/caution';
import { formatHours, formatNumber, formatWeek, formatWeekLong, formatWhole } from '@/lib/format';
import { bindingEpsilon } from './bottleneck-summary';

const key = (workCenter: string, week: number) => `${workCenter}|${week}`;

/** Diagonal hatching for overtime, so it reads without colour too (paired with the "+h OT" text). */
const overtimeHatch = {
  backgroundImage: 'repeating-linear-gradient(135deg, rgba(138,75,15,0.16) 0 4px, transparent 4px 9px)',
};

type BoardCell = { row: LoadRow; binding: number | null; overLimit: Caution | null };

function Cell({ cell }: { cell: BoardCell }) {
  const { row, binding, overLimit } = cell;
  const pct = row.percentOfAvailable === null ? '—' : `${formatWhole(row.percentOfAvailable)} %`;
  const overtime = row.overtimeHours > 1e-6;
  const parts = [
    `${row.workCenterName}, ${formatWeekLong(row.weekStart)}: ${pct} of available`,
    `${formatHours(row.loadHours)} loaded of ${formatHours(row.availableHours)} available`,
    overtime ? `${formatHours(row.overtimeHours)} overtime` : null,
    binding !== null ? `binding, one more hour is worth ${formatNumber(binding)}` : null,
    overLimit ? 'overtime above the plant working-time limit' : null,
  ].filter(Boolean);
  return (
    <td
      aria-label={parts.join('; ')}
      className={`whitespace-nowrap border border-line px-2 py-1.5 text-right tabular-nums ${binding !== null ? 'font-semibold' : ''}`}
      style={overtime ? overtimeHatch : undefined}
      data-binding={binding !== null || undefined}
    >
      <div className="flex items-center justify-end gap-1">
        {binding !== null ? (
          <span aria-hidden="true" title="Binding: the plan uses every hour" className="text-race-800">
            ◆
          </span>
        ) : null}
        <span>{pct}</span>
      </div>
      <div className="text-xs font-normal text-ink-soft">
        {formatWhole(row.loadHours)} / {formatWhole(row.availableHours)} h
      </div>
      {overtime ? (
        <div className="text-xs font-semibold text-over-700">
          +{formatHours(row.overtimeHours)} OT
          {overLimit ? (
            <span title={overLimit.message}>
              {' '}
              <span aria-hidden="true">⚠</span> over limit
            </span>
          ) : null}
        </div>
      ) : null}
    </td>
  );
}

/**
 * Work center × week: load in % of available hours. ◆ marks a binding week (every hour used, its
 * bottleneck value above zero); hatching and "+h OT" mark overtime; "⚠ over limit" marks overtime
 * that takes a crew past the plant's working-time limit.
 */
export function LoadBoard({ load, bottlenecks, cautions }: { load: LoadRow[]; bottlenecks: Bottleneck[]; cautions: Caution[] }) {
  const binding = new Map<string, number>();
  for (const b of bottlenecks) {
    if (b.kind !== 'capacity') continue;
    for (const w of b.weeks) if (w.value > bindingEpsilon) binding.set(key(b.item, w.week), w.value);
  }
  const overLimit = new Map<string, Caution>();
  for (const c of cautions) if (c.kind === 'working_time' && c.item && c.week !== null) overLimit.set(key(c.item, c.week), c);

  const weeks = [...new Map(load.map((r) => [r.week, r.weekStart])).entries()].sort((a, b) => a[0] - b[0]);
  const centers = [...new Map(load.map((r) => [r.workCenter, r.workCenterName])).entries()].sort((a, b) => a[0].localeCompare(b[0]));
  const byKey = new Map(load.map((r) => [key(r.workCenter, r.week), r]));
  const anyOvertime = load.some((r) => r.overtimeHours > 1e-6);
  const keyId = useId();

  return (
    <div className="flex flex-col gap-3">
      {/* The key sits outside the scroller so it wraps to the page width, not the table's. */}
      <p id={keyId} className="text-sm text-ink-soft">
        Load as % of available hours. <span aria-hidden="true">◆</span> binding (every hour used; one more hour would add margin). Hatched cells with “+h
        OT” plan overtime; <span aria-hidden="true">⚠</span> “over limit” means a crew would pass the plant’s working-time limit.
      </p>
      <div className="overflow-x-auto">
        <table aria-describedby={keyId} className="w-full border-collapse bg-panel text-sm">
          <caption className="sr-only">Load per work center and week</caption>
          <thead>
            <tr className="bg-race-50">
              <th scope="col" className="sticky left-0 z-[1] border border-line bg-race-50 px-2 py-1.5 text-left">
                Work center
              </th>
              {weeks.map(([week, start]) => (
                <th key={week} scope="col" className="whitespace-nowrap border border-line px-2 py-1.5 text-right" aria-label={`Week ${week}, ${formatWeekLong(start)}`}>
                  W{week}
                  <div className="text-xs font-normal text-ink-soft">{formatWeek(start)}</div>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {centers.map(([code, name]) => (
              <tr key={code}>
                <th scope="row" className="sticky left-0 z-[1] border border-line bg-panel px-2 py-1.5 text-left font-normal">
                  <span className="font-semibold">{code}</span> {name}
                </th>
                {weeks.map(([week]) => {
                  const row = byKey.get(key(code, week));
                  return row ? (
                    <Cell key={week} cell={{ row, binding: binding.get(key(code, week)) ?? null, overLimit: overLimit.get(key(code, week)) ?? null }} />
                  ) : (
                    <td key={week} className="border border-line px-2 py-1.5 text-right text-ink-soft">
                      —
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {anyOvertime ? (
        <CautionNote title="Overtime in this plan">
          {overLimit.size > 0
            ? `${overLimit.size} work-center week${overLimit.size === 1 ? '' : 's'} would take a crew past the plant's working-time limit (marked ⚠ over limit). `
            : 'All planned overtime stays within the plant’s working-time limit. '}
          Overtime, rest breaks and pay follow local labour law, collective agreements and licensed practice, which override Millrace’s defaults; check
          them before approving. Fatigue risk rises with long and night shifts.
        </CautionNote>
      ) : null}
    </div>
  );
}
