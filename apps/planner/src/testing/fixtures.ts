import type { HomeSummary, Me, Role } from '@millrace/contracts';

/** Small hand-made answers for component tests (shapes from @millrace/contracts; values invented for the test only). */
export const people: Record<Role, Me> = {
  admin: { email: 'admin@example.test', name: 'Ada Admin', role: 'admin' },
  planner: { email: 'planner@example.test', name: 'Pat Planner', role: 'planner' },
  supervisor: { email: 'supervisor@example.test', name: 'Sam Supervisor', role: 'supervisor' },
  floor_lead: { email: 'floor@example.test', name: 'Flo Lead', role: 'floor_lead' },
};

export const homeSummary: HomeSummary = {
  plantName: 'Test Works',
  weeks: ['2026-12-07', '2026-12-14'],
  firmDemand: [{ productCode: 'T-1', productName: 'Test table', unit: 'pcs', qtyByWeek: [10, 0] }],
  firmUnitsByWeek: [10, 0],
  workCenters: [
    {
      code: 'SAW',
      name: 'Saw',
      cells: [
        { weekStart: '2026-12-07', requiredHours: 50, requiredHoursWithForecast: 60, availableHours: 40, loadPct: 125, status: 'over_loaded' },
        { weekStart: '2026-12-14', requiredHours: 0, requiredHoursWithForecast: 5, availableHours: 40, loadPct: 0, status: 'within_capacity' },
      ],
    },
  ],
  overLoadedCells: 1,
};
