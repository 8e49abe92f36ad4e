import type { WorkCenter } from '../planning-data';
import { availableHours, isClosed, shiftsPerDay, workingDays } from '../capacity';
import { clockMinutes } from './plant-clock';

/**
 * The open time of a work center in one plan week, shift by shift, in minutes from the week's
 * first day 00:00. The week holds exactly the clock time the plan's capacity model gives it
 * (capacity.ts, the one source of truth): regular time = availableHours ÷ efficiency clock hours
 * (available hours are standard hours; DOMAIN.md §4, operation time = setup + quantity × run
 * time ÷ efficiency), plus the plan's overtime clock hours. Working days are the first days of
 * the week; the shifts of the pattern (extra shifts back to back after the last) run on each;
 * whatever capacity.ts takes off — holidays (a part day too) and downtime, in its units — comes
 * off the last open minutes of the week; a closed week has no windows. Overtime is spread
 * evenly over the working days and added after the day's last shift, where the next shift
 * leaves room; what finds no room is returned as unplaced.
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

/** regular clock minutes of a work center in a week by the plan's capacity model */
export function regularClockMinutes(wc: WorkCenter, week: number): number {
  return wc.efficiency > 0 ? (availableHours(wc, week) / wc.efficiency) * 60 : 0;
}

export function shiftWindows(wc: WorkCenter, week: number, overtimeHours: number): { windows: ShiftWindow[]; unplacedOvertimeMinutes: number } {
  const s = wc.shiftPattern;
  if (!s || isClosed(wc, week)) return { windows: [], unplacedOvertimeMinutes: overtimeHours * 60 };
  const days = Math.min(7, Math.ceil(workingDays(wc, week) - 1e-9));
  const starts = s.shiftStarts.map(clockMinutes);
  // extra shifts follow the last shift of the pattern back to back
  for (let k = starts.length; k < shiftsPerDay(wc, week); k++) starts.push(starts[starts.length - 1] + s.hoursPerShift * 60);
  const windows: ShiftWindow[] = [];
  for (let day = 0; day < days; day++)
    starts.forEach((st, i) => {
      const start = day * 1440 + st;
      windows.push({ day, shift: i + 1, start, end: start + s.hoursPerShift * 60, overtimeEnd: start + s.hoursPerShift * 60 });
    });
  windows.sort((a, b) => a.start - b.start);

  // what the capacity model takes off (part-day holidays, downtime) blocks the last open minutes
  let cut = windows.reduce((a, w) => a + (w.end - w.start), 0) - regularClockMinutes(wc, week);
  for (let i = windows.length - 1; i >= 0 && cut > 1e-9; i--) {
    const c = Math.min(cut, windows[i].end - windows[i].start);
    windows[i].end -= c;
    windows[i].overtimeEnd = windows[i].end;
    cut -= c;
  }
  const open = windows.filter((w) => w.end > w.start + 1e-9);

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
