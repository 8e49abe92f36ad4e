import {
  addDays,
  type CrewCaution,
  type OpenShift,
  type SheetDay,
  type SheetWorkCenter,
  type ShiftSheet,
  type ShiftSheetsWeek,
} from '@millrace/contracts';
import { shiftWindows, weekdayOf, type Plan, type PlanningData, type ShiftSheetResult } from '@millrace/plan-model';

export interface SheetsWeekParts {
  plan: ShiftSheetsWeek['plan'];
  data: PlanningData;
  modelPlan: Plan;
  weekIndex: number;
  result: ShiftSheetResult;
  labourLawNote: string;
}

/** Where the default working-time limits come from (shown with the limits). */
export const limitsSource =
  'Plant settings at the time the plan was built; defaults from the EU Working Time Directive 2003/88/EC (Art. 6: at most 48 h per 7 days on average, overtime included; Art. 3: at least 11 consecutive hours of daily rest).';

/**
 * plan-model's sheets of one week → the API's shape: per work center (in the plan's order) its
 * open shifts (the timeline's background) and its days and shifts with work, with due weeks as
 * dates and next work centers by name. Every work center of the plan (scope `all`); a floor
 * lead's scope is applied afterwards.
 */
export function toSheetsWeek(parts: SheetsWeekParts): ShiftSheetsWeek {
  const { data, modelPlan, weekIndex, result } = parts;
  const weekStart = data.weeks.find((w) => w.index === weekIndex)!.startDate;
  const weekDate = (index: number | null) => (index === null ? null : (data.weeks.find((w) => w.index === index)?.startDate ?? null));
  const wcName = new Map(data.workCenters.map((w) => [w.code, w.name]));
  // plan-model numbers weeks within the plan; the floor knows them by their dates
  const datedWeeks = (text: string) => text.replace(/\bweek (\d+)\b/g, (all, n: string) => (weekDate(Number(n)) ? `week of ${weekDate(Number(n))}` : all));

  const workCenters: SheetWorkCenter[] = data.workCenters.map((wc) => {
    const overtime = modelPlan.workCenters.find((l) => l.workCenter === wc.code && l.week === weekIndex)?.overtimeHours ?? 0;
    const openShifts: OpenShift[] = shiftWindows(wc, weekIndex, overtime).windows.map((w) => ({
      date: addDays(weekStart, w.day),
      weekday: weekdayOf(data.plant.weekStart, w.day),
      shift: w.shift,
      startMinute: w.start,
      endMinute: w.end,
      overtimeEndMinute: w.overtimeEnd,
    }));
    const sheets: ShiftSheet[] = result.sheets
      .filter((s) => s.workCenter === wc.code && s.week === weekIndex)
      .sort((a, b) => a.shiftStartMinute - b.shiftStartMinute)
      .map(({ week: _week, ...s }) => ({
        ...s,
        jobs: s.jobs.map((j) => ({
          sequence: j.sequence,
          product: j.product,
          productName: j.productName,
          family: j.family,
          operation: j.operation,
          quantity: j.quantity,
          unit: j.unit,
          setupStart: j.setupStart,
          start: j.start,
          end: j.end,
          setupStartMinute: j.setupStartMinute,
          startMinute: j.startMinute,
          endMinute: j.endMinute,
          setupMinutes: j.setupMinutes,
          overtime: j.overtime,
          continued: j.continued,
          carriedFromWeek: weekDate(j.carriedFromWeek),
          dueWeek: weekDate(j.dueWeek),
          orderRefs: j.orderRefs,
          previousWorkCenter: j.previousWorkCenter,
          nextWorkCenter: j.nextWorkCenter,
          nextWorkCenterName: j.nextWorkCenter === null ? null : (wcName.get(j.nextWorkCenter) ?? j.nextWorkCenter),
          materials: j.materials.map((m) => ({ item: m.item, name: m.name, quantity: m.quantity, unit: m.unit })),
        })),
      }));
    const days: SheetDay[] = [];
    for (const s of sheets) {
      const day = days.find((d) => d.date === s.date);
      if (day) day.shifts.push(s);
      else days.push({ date: s.date, weekday: s.weekday, shifts: [s] });
    }
    return {
      code: wc.code,
      name: wc.name,
      openShifts,
      days,
      plannedMinutes: sheets.reduce((a, s) => a + s.plannedMinutes, 0),
      availableMinutes: openShifts.reduce((a, w) => a + (w.endMinute - w.startMinute), 0),
      overtimeMinutes: openShifts.reduce((a, w) => a + (w.overtimeEndMinute - w.endMinute), 0),
      overtimeNotPlacedHours: result.overtimeNotPlaced.filter((o) => o.workCenter === wc.code && o.week === weekIndex).reduce((a, o) => a + o.hours, 0),
    };
  });

  const cautions: CrewCaution[] = result.cautions
    .filter((c) => c.week === weekIndex)
    .map((c) => ({ kind: c.kind, workCenter: c.workCenter, shift: c.shift, limit: c.limit, actual: c.actual, message: c.message, source: c.source }));

  return {
    plan: parts.plan,
    plantName: data.plant.name ?? 'Plant',
    week: { start: weekStart, index: weekIndex },
    weeks: data.weeks.map((w) => w.startDate),
    limits: { maxWeeklyHours: data.plant.maxWeeklyHours, minDailyRestHours: data.plant.minDailyRestHours, source: limitsSource },
    labourLawNote: parts.labourLawNote,
    workCenterScope: 'all',
    workCenters,
    cautions,
    // open after the plan's last week (plan-model lists it only when this is the last week)
    unscheduled: result.unscheduled.map((u) => ({
      workCenter: u.workCenter, planWeek: weekDate(u.week)!, product: u.product, operation: u.operation, quantity: u.quantity, hours: u.hours, reason: datedWeeks(u.reason),
    })),
    carriedOver: result.carriedOver
      .filter((c) => c.outOfWeek === weekIndex)
      .map((c) => ({
        workCenter: c.workCenter, planWeek: weekDate(c.fromWeek)!, intoWeek: addDays(weekStart, 7), product: c.product, operation: c.operation, quantity: c.quantity, hours: c.hours, reason: c.reason,
      })),
    sheetCount: workCenters.reduce((a, w) => a + w.days.reduce((b, d) => b + d.shifts.length, 0), 0),
  };
}
