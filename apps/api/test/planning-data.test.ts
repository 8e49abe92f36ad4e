import { describe, expect, it } from 'vitest';
import { toPlanningData } from '../src/planning-data/to-planning-data';
import type { MasterDataRows } from '../src/planning-data/planning-data.repository';

const stamp = { version: 1, createdAt: '2026-01-01T00:00:00.000Z', updatedAt: '2026-01-01T00:00:00.000Z' };
const product = (id: number, code: string, active = true) => ({
  id,
  code,
  name: code,
  unit: 'pcs',
  kind: 'finished' as const,
  price: 10,
  holdingCostRatePct: 24,
  safetyStock: 1,
  batchMultiple: 1,
  openingStock: 0,
  latePenalty: 2,
  family: null,
  active,
  ...stamp,
});

function rows(): MasterDataRows {
  return {
    settings: {
      plantName: 'Test plant',
      currency: 'EUR',
      weekStart: 'monday',
      defaultShiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] },
      maxWeeklyHours: 48,
      minDailyRestHours: 11,
      overtimePremium: 1.5,
      version: 1,
      updatedAt: stamp.updatedAt,
    },
    products: [product(1, 'FIN'), product(2, 'OLD-PART', false), product(3, 'RETIRED', false)],
    bom: [
      { parentProductId: 1, componentProductId: 2, materialId: null, qtyPer: 2, scrapPct: 0 },
      { parentProductId: 1, componentProductId: null, materialId: 7, qtyPer: 1.5, scrapPct: 10 },
      { parentProductId: 3, componentProductId: null, materialId: 7, qtyPer: 1, scrapPct: 0 },
    ],
    routings: [{ productId: 1, sequence: 10, workCenterId: 5, hoursPerUnit: 0.5, setupHours: 1 }],
    workCenters: [
      {
        id: 5,
        code: 'W',
        name: 'W',
        efficiency: 0.9,
        overtimeCapHoursPerWeek: null,
        overtimeCostPerHour: 30,
        shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] },
        ...stamp,
      },
    ],
    calendar: [{ workCenterId: 5, weekStart: '2026-01-12', holidayDays: 1, downtimeHours: 0, extraShifts: 0, note: null }],
    materials: [
      {
        id: 7,
        code: 'M',
        name: 'M',
        unit: 'kg',
        unitCost: 3,
        onHand: 5,
        leadTimeWeeks: 2,
        weeklySupplyCap: null,
        lotRule: 'lot_for_lot',
        lotSize: null,
        ...stamp,
      },
    ],
    receipts: [
      { id: 1, materialId: 7, weekStart: '2025-12-29', qty: 4, reference: 'late PO' },
      { id: 2, materialId: 7, weekStart: '2026-01-05', qty: 6, reference: null },
      { id: 3, materialId: 7, weekStart: '2026-01-12', qty: 8, reference: null },
      { id: 4, materialId: 7, weekStart: '2026-02-02', qty: 99, reference: 'beyond' },
    ],
    firmOrders: [
      { id: 1, productId: 1, weekStart: '2026-01-05', orderRef: 'SO-1', qty: 3, version: 1 },
      { id: 2, productId: 3, weekStart: '2026-01-05', orderRef: 'SO-2', qty: 3, version: 1 },
    ],
    forecasts: [{ id: 1, productId: 1, weekStart: '2026-01-12', qty: 4, version: 1 }],
  };
}

describe('planning data from stored rows', () => {
  const data = toPlanningData(rows(), ['2026-01-05', '2026-01-12']);

  it('when products are inactive, then they are left out unless an included BOM still uses them', () => {
    expect(data.products.map((p) => p.code)).toEqual(['FIN', 'OLD-PART']);
    expect(data.bom).toEqual([
      { parent: 'FIN', componentProduct: 'OLD-PART', qtyPer: 2, scrapPct: 0 },
      { parent: 'FIN', material: 'M', qtyPer: 1.5, scrapPct: 10 },
    ]);
    expect(data.demand).toEqual([
      { product: 'FIN', week: 1, kind: 'firm', qty: 3, orderRef: 'SO-1' },
      { product: 'FIN', week: 2, kind: 'forecast', qty: 4 },
    ]);
  });

  it('when rows carry dates and percentages, then weeks become indexes and the holding cost a yearly fraction', () => {
    expect(data.weeks).toEqual([
      { index: 1, startDate: '2026-01-05' },
      { index: 2, startDate: '2026-01-12' },
    ]);
    expect(data.products[0].holdingCostAnnualRate).toBeCloseTo(0.24, 12);
    expect(data.workCenters[0].exceptions).toEqual([{ week: 2, holidayDays: 1 }]);
    expect(data.routings).toEqual([{ product: 'FIN', sequence: 10, workCenter: 'W', hoursPerUnit: 0.5, setupHours: 1 }]);
    expect(data.plant).toMatchObject({ name: 'Test plant', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 });
  });

  it('when receipts fall before, inside and after the horizon, then overdue ones count in week 1 and later ones are left out', () => {
    expect(data.materials[0].scheduledReceipts).toEqual([
      { week: 1, qty: 10 },
      { week: 2, qty: 8 },
    ]);
    expect(data.materials[0]).not.toHaveProperty('lotSize');
  });
});
