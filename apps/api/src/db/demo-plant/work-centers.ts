import type { WorkCenterCreate } from '@millrace/contracts';

const day = (starts: string[], hoursPerShift = 8, daysPerWeek = 5) => ({ shiftsPerDay: starts.length, hoursPerShift, daysPerWeek, shiftStarts: starts });

/** Ten work centers on one, two and three shifts (demo data). */
export const demoWorkCenters: WorkCenterCreate[] = [
  { code: 'SAW', name: 'Rip and panel saw', efficiency: 0.85, overtimeCapHoursPerWeek: 10, overtimeCostPerHour: 52, shiftPattern: day(['06:00', '14:00']) },
  { code: 'PRESS', name: 'Glue press', efficiency: 0.9, overtimeCapHoursPerWeek: 6, overtimeCostPerHour: 48, shiftPattern: day(['07:00']) },
  { code: 'CNC', name: 'CNC router', efficiency: 0.9, overtimeCapHoursPerWeek: 12, overtimeCostPerHour: 75, shiftPattern: day(['06:00', '13:30', '21:00'], 7.5) },
  { code: 'TURN', name: 'Lathe and leg turning', efficiency: 0.9, overtimeCapHoursPerWeek: 6, overtimeCostPerHour: 50, shiftPattern: day(['07:00']) },
  { code: 'EDGE', name: 'Edge bander', efficiency: 0.85, overtimeCapHoursPerWeek: 6, overtimeCostPerHour: 48, shiftPattern: day(['07:00']) },
  { code: 'SAND', name: 'Sanding', efficiency: 0.85, overtimeCapHoursPerWeek: 10, overtimeCostPerHour: 44, shiftPattern: day(['06:00', '14:00']) },
  { code: 'SPRAY', name: 'Spray booth and oiling', efficiency: 0.8, overtimeCapHoursPerWeek: 8, overtimeCostPerHour: 58, shiftPattern: day(['07:00']) },
  { code: 'UPH', name: 'Upholstery bench', efficiency: 0.9, overtimeCapHoursPerWeek: 8, overtimeCostPerHour: 46, shiftPattern: day(['07:00']) },
  { code: 'ASM', name: 'Assembly', efficiency: 0.9, overtimeCapHoursPerWeek: 16, overtimeCostPerHour: 46, shiftPattern: day(['06:00', '14:00']) },
  { code: 'PACK', name: 'Inspection and packing', efficiency: 0.95, overtimeCapHoursPerWeek: 8, overtimeCostPerHour: 40, shiftPattern: day(['08:00']) },
];

/**
 * Calendar weeks relative to the first demo week (0 = the current week): a public holiday in
 * week 4 for everyone, planned maintenance on the CNC router and the spray booth, an extra
 * Saturday-style shift nowhere (left to the planner).
 */
export const demoCalendar: Array<{ workCenter: string; weekOffset: number; holidayDays: number; downtimeHours: number; note: string }> = [
  ...demoWorkCenters.map((w) => ({ workCenter: w.code, weekOffset: 4, holidayDays: 1, downtimeHours: 0, note: 'Public holiday (demo)' })),
  { workCenter: 'CNC', weekOffset: 2, holidayDays: 0, downtimeHours: 12, note: 'Spindle service' },
  { workCenter: 'SPRAY', weekOffset: 6, holidayDays: 0, downtimeHours: 8, note: 'Filter change and booth clean' },
];
