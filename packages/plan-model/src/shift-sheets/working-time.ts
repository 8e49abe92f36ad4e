import type { PlanningData } from '../planning-data';
import type { ShiftSheet, WorkingTimeCaution } from './shift-sheet';

/**
 * Working-time checks per crew — the crew of one shift number on one work center — over the
 * shifts that have work (shift length plus the overtime added to it). Limits are the plant's
 * settings; their defaults come from the EU Working Time Directive 2003/88/EC: at most 48 hours
 * per 7 days including overtime (Art. 6; the directive averages over up to 4 months, Art. 16 —
 * checking each week on its own is stricter) and at least 11 consecutive hours of daily rest
 * (Art. 3). Long runs of night shifts get a fatigue caution (NIOSH 2004, Overtime and Extended
 * Work Shifts, from memory). These are cautions: local law, collective agreements and licensed
 * practice decide.
 */
const WEEKLY_SOURCE = 'EU Working Time Directive 2003/88/EC, Art. 6 (48 h per 7 days on average, overtime included)';
const REST_SOURCE = 'EU Working Time Directive 2003/88/EC, Art. 3 (11 consecutive hours of daily rest)';
const NIGHT_SOURCE = 'NIOSH 2004, Overtime and Extended Work Shifts (fatigue risk rises with runs of night shifts)';

/** a shift is a night shift when it works any time between 00:00 and 05:00 */
const NIGHT_END_MINUTE = 5 * 60;

export function workingTimeCautions(data: PlanningData, sheets: ShiftSheet[], nightRunDays = 5): WorkingTimeCaution[] {
  const maxWeekly = data.plant.maxWeeklyHours;
  const minRest = data.plant.minDailyRestHours;
  const crews = new Map<string, ShiftSheet[]>();
  for (const s of sheets) {
    const key = `${s.workCenter}|${s.week}|${s.shift}`;
    crews.set(key, [...(crews.get(key) ?? []), s]);
  }
  const out: WorkingTimeCaution[] = [];
  for (const crew of crews.values()) {
    crew.sort((a, b) => a.shiftStartMinute - b.shiftStartMinute);
    const { workCenter, week, shift, workCenterName } = { ...crew[0] };
    const end = (s: ShiftSheet) => s.overtimeEndMinute ?? s.shiftEndMinute;
    const hours = crew.reduce((a, s) => a + (end(s) - s.shiftStartMinute) / 60, 0);
    if (hours > maxWeekly + 1e-9)
      out.push({
        kind: 'weekly_hours', workCenter, week, shift, limit: maxWeekly, actual: hours, source: WEEKLY_SOURCE,
        message: `${workCenterName}, shift ${shift}, week ${week}: the crew is planned for ${hours.toFixed(1)} h, above the ${maxWeekly} h weekly limit. Check local labour law and agreements.`,
      });
    for (let i = 1; i < crew.length; i++) {
      const rest = (crew[i].shiftStartMinute - end(crew[i - 1])) / 60;
      if (rest < minRest - 1e-9)
        out.push({
          kind: 'daily_rest', workCenter, week, shift, limit: minRest, actual: rest, source: REST_SOURCE,
          message: `${workCenterName}, shift ${shift}: only ${rest.toFixed(1)} h of rest between ${crew[i - 1].date} and ${crew[i].date}, below the ${minRest} h minimum. Check local labour law and agreements.`,
        });
    }
    let run = 0;
    let best = 0;
    let prevDay = -2;
    for (const s of crew) {
      const day = Math.floor(s.shiftStartMinute / 1440);
      const nightStart = (s.shiftStartMinute % 1440 < NIGHT_END_MINUTE ? day : day + 1) * 1440;
      const isNight = s.shiftStartMinute < nightStart + NIGHT_END_MINUTE && end(s) > nightStart;
      run = isNight ? (day === prevDay + 1 ? run + 1 : 1) : 0;
      prevDay = day;
      best = Math.max(best, run);
    }
    if (best >= nightRunDays)
      out.push({
        kind: 'night_run', workCenter, week, shift, limit: nightRunDays, actual: best, source: NIGHT_SOURCE,
        message: `${workCenterName}, shift ${shift}, week ${week}: ${best} night shifts in a row. Fatigue risk rises with runs of night shifts; plan rest days.`,
      });
  }
  return out;
}
