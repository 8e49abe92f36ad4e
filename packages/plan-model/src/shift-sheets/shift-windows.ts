import type { WorkCenter } from '../planning-data';
import { clockMinutes } from './plant-clock';

/**
 * The open time of a work center in one plan week, shift by shift, in minutes from the week's
 * first day 00:00. Working days are the first `daysPerWeek` days of the week; holidays take
 * working days off the end of the week; downtime (maintenance) blocks the last open minutes of
 * the week; a closed week has no windows. Overtime (clock hours from the plan) is spread evenly
 * over the working days and added after the day's last shift, where the next shift leaves room.
 */
export interface ShiftWindow {
  day: number;
  /** 1-based shift number */
  shift: number;
  start: number;
  /** end of regular time */
  end: number;
  /** end of overtime added to this shift (= end without overtime) */
  overtimeEnd: number;
}

export function shiftWindows(wc: WorkCenter, week: number, overtimeHours: number): { windows: ShiftWindow[]; unplacedOvertimeMinutes: number } {
  const s = wc.shiftPattern;
  const exceptions = wc.exceptions.filter((e) => e.week === week);
  if (!s || exceptions.some((e) => e.closed)) return { windows: [], unplacedOvertimeMinutes: overtimeHours * 60 };
  const holidays = exceptions.reduce((a, e) => a + (e.holidayDays ?? 0), 0);
  const extra = exceptions.reduce((a, e) => a + (e.extraShiftsPerDay ?? 0), 0);
  const days = Math.max(0, Math.floor(s.daysPerWeek - holidays));
  const starts = s.shiftStarts.map(clockMinutes);
  // extra shifts follow the last shift of the pattern back to back
  for (let k = 0; k < extra; k++) starts.push(starts[starts.length - 1] + s.hoursPerShift * 60);
  const windows: ShiftWindow[] = [];
  for (let day = 0; day < days; day++)
    starts.forEach((st, i) => {
      const start = day * 1440 + st;
      windows.push({ day, shift: i + 1, start, end: start + s.hoursPerShift * 60, overtimeEnd: start + s.hoursPerShift * 60 });
    });
  windows.sort((a, b) => a.start - b.start);

  // downtime blocks the last open minutes of the week
  let downtime = exceptions.reduce((a, e) => a + (e.downtimeHours ?? 0), 0) * 60;
  for (let i = windows.length - 1; i >= 0 && downtime > 0; i--) {
    const cut = Math.min(downtime, windows[i].end - windows[i].start);
    windows[i].end -= cut;
    windows[i].overtimeEnd = windows[i].end;
    downtime -= cut;
  }
  const open = windows.filter((w) => w.end > w.start);

  // overtime after each working day's last shift, evenly, as far as the next shift allows
  let left = overtimeHours * 60;
  const lastOfDay = [...new Set(open.map((w) => w.day))].map((d) => open.filter((w) => w.day === d).reduce((a, b) => (b.end > a.end ? b : a)));
  for (let round = 0; round < 3 && left > 1e-9; round++) {
    const roomOf = (w: ShiftWindow) => {
      const next = open.find((x) => x.start >= w.end && x !== w);
      return (next ? next.start : (lastOfDay.length ? 7 * 1440 : 0)) - w.overtimeEnd;
    };
    const withRoom = lastOfDay.filter((w) => roomOf(w) > 1e-9);
    if (withRoom.length === 0) break;
    const share = left / withRoom.length;
    for (const w of withRoom) {
      const add = Math.min(share, roomOf(w));
      w.overtimeEnd += add;
      left -= add;
    }
  }
  return { windows: open, unplacedOvertimeMinutes: Math.max(0, left) };
}
