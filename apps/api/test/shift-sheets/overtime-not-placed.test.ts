import { describe, expect, it } from 'vitest';
import { sheetLabourLawNote, shiftSheetsWeekSchema } from '@millrace/contracts';
import { buildShiftSheets, type Plan, type PlanningData } from '@millrace/plan-model';
import { toSheetsWeek } from '../../src/shift-sheets/to-sheets-week';
import { scopeSheetsWeek } from '../../src/shift-sheets/work-center-scope';

/**
 * The week JSON carries, per work center, the plan's overtime that finds no room after the day's
 * last shift. Worked by hand from the rule that overtime goes after each working day's last shift
 * as far as the next shift allows: CNC runs three 7.5 h shifts from 06:00 on seven days
 * (06:00–13:30, 13:30–21:00, 21:00–04:30), leaving 04:30–06:00 = 1.5 h after each of six days'
 * last shifts (the seventh day's ends after the week): of the plan's 12.5 h, 9 h fit and 3.5 h
 * do not. SAW (one 8 h shift from 07:00, five days) fits its 4 h.
 */
const workCenter = (code: string, name: string, shiftPattern: { shiftsPerDay: number; hoursPerShift: number; daysPerWeek: number; shiftStarts: string[] }) => ({
  code, name, efficiency: 1, overtimeCapHoursPerWeek: null, overtimeCostPerHour: 0, shiftPattern, exceptions: [],
});
const data = {
  plant: { name: 'Hand-worked plant', currency: 'EUR', weekStart: 'monday', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 },
  weeks: [{ index: 1, startDate: '2027-01-04' }],
  products: [{ code: 'P', name: 'P', unit: 'pcs', kind: 'finished', price: 1, safetyStock: 0, batchMultiple: 1, openingStock: 0, latePenalty: 0 }],
  bom: [],
  routings: [{ product: 'P', sequence: 10, workCenter: 'CNC', hoursPerUnit: 1, setupHours: 0 }],
  workCenters: [
    workCenter('CNC', 'CNC mill', { shiftsPerDay: 3, hoursPerShift: 7.5, daysPerWeek: 7, shiftStarts: ['06:00', '13:30', '21:00'] }),
    workCenter('SAW', 'Saw', { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] }),
  ],
  materials: [],
  demand: [],
} as unknown as PlanningData;
const modelPlan = {
  horizonWeeks: 1,
  outcome: 'optimal',
  products: [{ product: 'P', week: 1, make: 10 }],
  workCenters: [
    { workCenter: 'CNC', week: 1, overtimeHours: 12.5 },
    { workCenter: 'SAW', week: 1, overtimeHours: 4 },
  ],
} as unknown as Plan;

describe('shift sheets JSON: overtime the plan counts on that found no room', () => {
  const week = toSheetsWeek({
    plan: { id: 1, name: 'Hand-worked', state: 'approved', approvedBy: null, approvedAt: null },
    data,
    modelPlan,
    weekIndex: 1,
    result: buildShiftSheets(data, modelPlan, { weeks: [1] }),
    labourLawNote: sheetLabourLawNote,
  });

  it('carries 3.5 h at CNC and 0 h at SAW, per work center of the week, and passes the contract', () => {
    const parsed = shiftSheetsWeekSchema.parse(week);
    expect(parsed.workCenters.map((c) => [c.code, Number(c.overtimeNotPlacedHours.toFixed(9))])).toEqual([['CNC', 3.5], ['SAW', 0]]);
    // the overtime that did fit is on the open shifts: 9 h at CNC, 4 h at SAW
    expect(parsed.workCenters.map((c) => c.overtimeMinutes)).toEqual([9 * 60, 4 * 60]);
  });

  it('keeps it with the work center when a floor lead sees only that one', () => {
    const scoped = scopeSheetsWeek(week, { kind: 'assigned', workCenters: [{ id: 1, code: 'CNC', name: 'CNC mill' }] });
    expect(scoped.workCenters.map((c) => [c.code, Number(c.overtimeNotPlacedHours.toFixed(9))])).toEqual([['CNC', 3.5]]);
  });
});
