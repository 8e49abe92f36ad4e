import type { Caution, PlanResults } from '@millrace/contracts';
import type { PlanningData } from '@millrace/plan-model';

/** Words every review carries: the plan is advice; law, agreements and licensed practice come first. */
export const advisoryCaution: Caution = {
  kind: 'advisory',
  item: null,
  week: null,
  message:
    'This plan is advisory. Local labour law, collective agreements and licensed practice override Millrace’s defaults; Millrace gives no legal advice.',
};

/**
 * Cautions for overtime: per work center and week, the hours one crew would work when the
 * week's overtime is shared by its shifts, against the plant's weekly working-time limit
 * (default 48 h, EU Working Time Directive 2003/88/EC Art. 6), deferring to local labour law.
 */
export function workingTimeCautions(data: PlanningData, results: PlanResults): Caution[] {
  const limit = data.plant.maxWeeklyHours;
  const wc = new Map(data.workCenters.map((w) => [w.code, w]));
  const cautions: Caution[] = [];
  for (const row of results.load) {
    if (row.overtimeHours <= 1e-6) continue;
    const pattern = wc.get(row.workCenter)?.shiftPattern;
    if (!pattern) continue;
    const regularPerCrew = pattern.hoursPerShift * pattern.daysPerWeek;
    const perCrew = regularPerCrew + row.overtimeHours / pattern.shiftsPerDay;
    const base = `${row.workCenterName}, week of ${row.weekStart}: ${round1(row.overtimeHours)} h overtime`;
    if (perCrew > limit + 1e-6) {
      cautions.push({
        kind: 'working_time',
        item: row.workCenter,
        week: row.week,
        message: `${base} puts each crew at about ${round1(perCrew)} h that week, above the plant's limit of ${limit} h. Check it against local labour law and agreements before approving.`,
      });
    } else {
      cautions.push({
        kind: 'overtime',
        item: row.workCenter,
        week: row.week,
        message: `${base} (about ${round1(perCrew)} h per crew, within the plant's ${limit} h limit). Overtime rules and pay follow local labour law.`,
      });
    }
  }
  return cautions;
}

const round1 = (v: number) => Math.round(v * 10) / 10;
