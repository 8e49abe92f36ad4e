import type { PlanningData } from '../../src/planning-data';

/**
 * Winston, Operations Research: Applications and Algorithms, §3.10, the sailboat production
 * example (DOMAIN.md §2 row 3): quarterly demand 40, 60, 75, 25; opening stock 10; regular time
 * at most 40 boats a quarter at 400 each; overtime unlimited at 450 each; 20 per boat held at
 * the end of a quarter. Expressed as plant data: one "quarter" per planning week, one boat =
 * one hour on the yard, 40 regular hours (1 shift × 8 h × 5 days), 400 per boat as the extra
 * unit cost, overtime at 50 per hour on top (450 − 400), holding 20 per unit and period, a late
 * penalty high enough that every boat ships on time (as in the source, where demand must be met).
 */
export function sailboatPlant(): PlanningData {
  return {
    plant: { currency: 'USD', weekStart: 'monday', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 },
    weeks: [1, 2, 3, 4].map((index) => ({ index, startDate: `2026-0${index * 2}-01` })),
    products: [
      {
        code: 'BOAT', name: 'Sailboat', unit: 'boat', kind: 'finished', price: 0, extraUnitCost: 400,
        holdingCostPerUnitWeek: 20, safetyStock: 0, batchMultiple: 1, openingStock: 10, latePenalty: 10_000,
      },
    ],
    bom: [],
    routings: [{ product: 'BOAT', sequence: 10, workCenter: 'YARD', hoursPerUnit: 1, setupHours: 0 }],
    workCenters: [
      {
        code: 'YARD', name: 'Boat yard', efficiency: 1, overtimeCapHoursPerWeek: null, overtimeCostPerHour: 50,
        shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] }, exceptions: [],
      },
    ],
    materials: [],
    demand: [40, 60, 75, 25].map((qty, i) => ({ product: 'BOAT', week: i + 1, kind: 'firm' as const, qty, orderRef: `Q${i + 1}` })),
  };
}
