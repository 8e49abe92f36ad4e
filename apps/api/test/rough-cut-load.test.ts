import { describe, expect, it } from 'vitest';
import type { PlanningData, WorkCenter } from '@millrace/plan-model';
import { loadStatus, roughCutLoad } from '../src/home/rough-cut-load';

const pattern = (shiftsPerDay: number, hoursPerShift: number, daysPerWeek: number) => ({
  shiftsPerDay,
  hoursPerShift,
  daysPerWeek,
  shiftStarts: ['06:00', '14:00', '22:00'].slice(0, shiftsPerDay),
});
const wc = (code: string, shiftPattern: WorkCenter['shiftPattern'], efficiency = 1, exceptions: WorkCenter['exceptions'] = []): WorkCenter => ({
  code,
  name: code,
  efficiency,
  overtimeCapHoursPerWeek: null,
  overtimeCostPerHour: 0,
  shiftPattern,
  exceptions,
});

function data(workCenters: WorkCenter[], extra: Partial<PlanningData> = {}): PlanningData {
  return {
    plant: { name: 'Test plant', currency: 'EUR', weekStart: 'monday', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 },
    weeks: [
      { index: 1, startDate: '2026-01-05' },
      { index: 2, startDate: '2026-01-12' },
    ],
    products: [],
    bom: [],
    routings: [],
    workCenters,
    materials: [],
    demand: [],
    ...extra,
  };
}
const product = (code: string) => ({ code, name: code, unit: 'pcs', kind: 'finished' as const, price: 1, safetyStock: 0, batchMultiple: 1, openingStock: 0, latePenalty: 0 });

describe('rough-cut load: available hours per work center', () => {
  it('when shift patterns are 1, 2 and 3 × 8 h × 5 days and 3 × 8 h × 7 days at full efficiency, then 40, 80, 120 and 168 hours are available', () => {
    // Shift patterns: 1 × 8 h × 5 days = 40 h; 2 shifts = 80 h; 3 shifts = 120 h; 24/7 = 168 h
    // (DOMAIN.md §3, common practice, no source).
    const summary = roughCutLoad(data([wc('ONE', pattern(1, 8, 5)), wc('TWO', pattern(2, 8, 5)), wc('THREE', pattern(3, 8, 5)), wc('ALLWEEK', pattern(3, 8, 7))]));
    expect(summary.workCenters.map((w) => w.cells[0].availableHours)).toEqual([40, 80, 120, 168]);
    expect(summary.workCenters.every((w) => w.cells.every((c) => c.status === 'within_capacity' && c.requiredHours === 0))).toBe(true);
  });

  it('when a week has a holiday, downtime, an extra shift or a lower efficiency, then available = shifts × hours × (days − holidays) × efficiency − downtime', () => {
    // 1 × 8 h × 5 days = 40 h (common practice, no source), then the model's formula (DESIGN.md):
    // one holiday → 1 × 8 × 4 = 32; 6 h downtime → 40 − 6 = 34; one extra shift → 2 × 8 × 5 = 80;
    // efficiency 0.85 → 40 × 0.85 = 34.
    const summary = roughCutLoad(
      data([
        wc('HOL', pattern(1, 8, 5), 1, [{ week: 1, holidayDays: 1 }]),
        wc('DOWN', pattern(1, 8, 5), 1, [{ week: 1, downtimeHours: 6 }]),
        wc('EXTRA', pattern(1, 8, 5), 1, [{ week: 1, extraShiftsPerDay: 1 }]),
        wc('EFF', pattern(1, 8, 5), 0.85),
      ]),
    );
    expect(summary.workCenters.map((w) => w.cells[0].availableHours)).toEqual([32, 34, 80, 34]);
    // the exceptions belong to week 1 only
    expect(summary.workCenters.map((w) => w.cells[1].availableHours)).toEqual([40, 40, 40, 34]);
  });
});

describe('rough-cut load: required hours and status', () => {
  it('when firm demand needs more hours than a 40-hour week holds, then the cell is over-loaded and the forecast shows only beside it', () => {
    const summary = roughCutLoad(
      data([wc('W1', pattern(1, 8, 5))], {
        products: [product('A')],
        routings: [{ product: 'A', sequence: 10, workCenter: 'W1', hoursPerUnit: 0.5, setupHours: 0 }],
        demand: [
          { product: 'A', week: 1, kind: 'firm', qty: 60, orderRef: 'O-1' },
          { product: 'A', week: 1, kind: 'firm', qty: 40, orderRef: 'O-2' },
          { product: 'A', week: 2, kind: 'firm', qty: 30, orderRef: 'O-3' },
          { product: 'A', week: 2, kind: 'forecast', qty: 100 },
        ],
      }),
    );
    const [week1, week2] = summary.workCenters[0].cells;
    // 100 units × 0.5 h = 50 h against 40 h
    expect(week1).toMatchObject({ requiredHours: 50, availableHours: 40, loadPct: 125, status: 'over_loaded' });
    // 30 × 0.5 = 15 h firm; with the forecast (30 + 100) × 0.5 = 65 h, but the status follows firm demand
    expect(week2).toMatchObject({ requiredHours: 15, requiredHoursWithForecast: 65, loadPct: 37.5, status: 'within_capacity' });
    expect(summary.overLoadedCells).toBe(1);
    expect(summary.firmDemand).toEqual([{ productCode: 'A', productName: 'A', unit: 'pcs', qtyByWeek: [100, 30] }]);
    expect(summary.firmUnitsByWeek).toEqual([100, 30]);
  });

  it('when a finished good uses a sub-assembly with scrap, then the sub-assembly load comes through the bill of materials', () => {
    // Component use per parent unit = qty per ÷ (1 − scrap) (Orlicky, MRP): 2 ÷ 0.8 = 2.5.
    const summary = roughCutLoad(
      data([wc('FIN', pattern(1, 8, 5)), wc('SUB', pattern(2, 8, 5))], {
        products: [product('F'), { ...product('S'), kind: 'subassembly' }, { ...product('S2'), kind: 'subassembly' }],
        bom: [
          { parent: 'F', componentProduct: 'S', qtyPer: 2, scrapPct: 20 },
          { parent: 'S', componentProduct: 'S2', qtyPer: 3, scrapPct: 0 },
        ],
        routings: [
          { product: 'F', sequence: 10, workCenter: 'FIN', hoursPerUnit: 1, setupHours: 0 },
          { product: 'S', sequence: 10, workCenter: 'SUB', hoursPerUnit: 1, setupHours: 0 },
          { product: 'S2', sequence: 10, workCenter: 'SUB', hoursPerUnit: 0.5, setupHours: 0 },
        ],
        demand: [{ product: 'F', week: 1, kind: 'firm', qty: 10 }],
      }),
    );
    // F: 10 h on FIN. S: 10 × 2.5 = 25 units → 25 h; S2: 25 × 3 = 75 units × 0.5 = 37.5 h; SUB total 62.5 h of 80.
    expect(summary.workCenters.map((w) => [w.code, w.cells[0].requiredHours])).toEqual([
      ['FIN', 10],
      ['SUB', 62.5],
    ]);
    // only finished demand is listed as firm demand
    expect(summary.firmDemand.map((r) => r.productCode)).toEqual(['F']);
  });

  it('when every working day of a week is a holiday but work is due, then the cell says no capacity', () => {
    const summary = roughCutLoad(
      data([wc('W1', pattern(1, 8, 5), 1, [{ week: 1, holidayDays: 5 }])], {
        products: [product('A')],
        routings: [{ product: 'A', sequence: 10, workCenter: 'W1', hoursPerUnit: 1, setupHours: 0 }],
        demand: [{ product: 'A', week: 1, kind: 'firm', qty: 1 }],
      }),
    );
    expect(summary.workCenters[0].cells[0]).toMatchObject({ availableHours: 0, requiredHours: 1, loadPct: null, status: 'no_capacity' });
  });

  it('when load equals the available hours exactly, then it is within capacity; a little more is over-loaded', () => {
    expect(loadStatus(40, 40)).toBe('within_capacity');
    expect(loadStatus(40.01, 40)).toBe('over_loaded');
    expect(loadStatus(0, 0)).toBe('within_capacity');
  });
});
