import type { HomeSummary, WorkCenterLoadCell } from '@millrace/contracts';
import { formatHours, formatWeek, formatWeekLong, formatWhole } from '@/lib/format';

const statusText: Record<WorkCenterLoadCell['status'], string> = {
  within_capacity: 'within capacity',
  over_loaded: 'over-loaded',
  no_capacity: 'no hours available',
};

function LoadCell({ cell, workCenter }: { cell: WorkCenterLoadCell; workCenter: string }) {
  const over = cell.status === 'over_loaded';
  const none = cell.status === 'no_capacity';
  const pct = cell.loadPct === null ? '—' : `${formatWhole(cell.loadPct)} %`;
  const label = `${workCenter}, ${formatWeekLong(cell.weekStart)}: ${formatHours(cell.requiredHours)} needed of ${formatHours(cell.availableHours)} available, ${statusText[cell.status]}`;
  return (
    <td
      aria-label={label}
      className={`border border-line px-2 py-1.5 text-right tabular-nums ${over ? 'bg-over-50 font-semibold text-over-700' : none ? 'bg-paper text-ink-soft' : ''}`}
    >
      <div className="flex items-center justify-end gap-1">
        {over ? <span aria-hidden="true" title="Over-loaded">▲</span> : null}
        {none ? <span aria-hidden="true" title="No hours available">∅</span> : null}
        <span>{pct}</span>
      </div>
      <div className="text-xs font-normal text-ink-soft">
        {formatWhole(cell.requiredHours)} / {formatWhole(cell.availableHours)} h
      </div>
      {over ? <span className="sr-only">over-loaded</span> : null}
    </td>
  );
}

/** Work center × week: firm load in % of available hours; over-loaded cells carry ▲ and bold text. */
export function LoadGrid({ summary }: { summary: HomeSummary }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse bg-panel text-sm">
        <caption className="mb-2 text-left text-ink-soft">
          Firm demand as % of available hours. <span aria-hidden="true">▲</span> marks a week where a work center is
          over-loaded; ∅ marks a week without available hours.
        </caption>
        <thead>
          <tr className="bg-race-50">
            <th scope="col" className="border border-line px-2 py-1.5 text-left">
              Work center
            </th>
            {summary.weeks.map((w) => (
              <th key={w} scope="col" className="border border-line px-2 py-1.5 text-right" aria-label={formatWeekLong(w)}>
                {formatWeek(w)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {summary.workCenters.map((wc) => (
            <tr key={wc.code}>
              <th scope="row" className="border border-line px-2 py-1.5 text-left font-normal">
                <span className="font-semibold">{wc.code}</span> {wc.name}
              </th>
              {wc.cells.map((cell) => (
                <LoadCell key={cell.weekStart} cell={cell} workCenter={`${wc.code} ${wc.name}`} />
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
