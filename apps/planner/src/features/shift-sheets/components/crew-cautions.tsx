import type { ShiftSheetsWeek } from '@millrace/contracts';
import { Caution } from '@/components/ui/caution';
import { overtimeNotPlacedWords, showsOvertimeNotPlaced } from '../sheet-words';

const kindTitle = { weekly_hours: 'Weekly hours above the limit', daily_rest: 'Daily rest below the minimum', night_run: 'Long run of night shifts' } as const;

/**
 * Working-time cautions per crew for the week, with the limits in force and where their defaults
 * come from, the overtime the plan counts on that no sheet could hold (per work center), and the
 * line that local labour law decides (DOMAIN.md §5).
 */
export function CrewCautions({ week, workCenter }: { week: ShiftSheetsWeek; workCenter?: string }) {
  const cautions = week.cautions.filter((c) => !workCenter || c.workCenter === workCenter);
  const unplaced = week.workCenters.filter((c) => (!workCenter || c.code === workCenter) && showsOvertimeNotPlaced(c.overtimeNotPlacedHours));
  return (
    <section aria-labelledby="working-time-heading" className="flex flex-col gap-2">
      <h2 id="working-time-heading" className="text-lg font-semibold">
        Working time
      </h2>
      <p className="text-sm">
        Limits per crew: at most {week.limits.maxWeeklyHours} h a week, at least {week.limits.minDailyRestHours} h of rest between shifts. {week.limits.source}
      </p>
      {cautions.length === 0 ? (
        <p className="text-sm" role="status">
          ✓ No crew {workCenter ? `on ${workCenter} ` : ''}goes past these limits this week.
        </p>
      ) : (
        cautions.map((c) => (
          <Caution key={`${c.kind}-${c.workCenter}-${c.shift}-${c.message}`} title={`${kindTitle[c.kind]}: ${c.workCenter}, shift ${c.shift}`}>
            <p>{c.message}</p>
            <p className="mt-1 text-xs text-ink-soft">Source of the default: {c.source}</p>
          </Caution>
        ))
      )}
      {unplaced.map((c) => (
        <Caution key={`unplaced-${c.code}`} title={`Overtime not on the sheets: ${c.code} ${c.name}`}>
          <p>{overtimeNotPlacedWords(c.overtimeNotPlacedHours, c.code)}</p>
          <p className="mt-1 text-xs text-ink-soft">
            Overtime is a fatigue risk: wherever it goes, it counts towards the crew’s weekly hours and daily rest above.
          </p>
        </Caution>
      ))}
      <p className="text-sm text-ink-soft">{week.labourLawNote}</p>
    </section>
  );
}
