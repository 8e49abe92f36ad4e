import type { Role } from '@millrace/contracts';

/**
 * The demo plant: Quillfen Joinery, a small furniture workshop of our own invention (not a real
 * company), making solid-wood tables, chairs, benches, beds and cabinets. Every number in
 * demo-plant/ is invented for the demo only; no test uses one as an expected value.
 */
export const demoPlant = {
  plantName: 'Quillfen Joinery (demo)',
  currency: 'EUR',
  weekStart: 'monday' as const,
  defaultShiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] },
};

/** The README's demo sign-ins, one per role (demo data only). */
export const demoPassword = 'millrace-demo';
export const demoPeople: Array<{ email: string; name: string; role: Role }> = [
  { email: 'admin@millrace.test', name: 'Ada Admin', role: 'admin' },
  { email: 'planner@millrace.test', name: 'Pia Planner', role: 'planner' },
  { email: 'supervisor@millrace.test', name: 'Sam Supervisor', role: 'supervisor' },
  { email: 'floor@millrace.test', name: 'Flo Floorlead', role: 'floor_lead' },
];

/** Work centers assigned to demo people, by e-mail: the demo floor lead runs the panel and machining shop. */
export const demoWorkCenterAssignments: Record<string, string[]> = {
  'floor@millrace.test': ['SAW', 'PRESS', 'CNC'],
};
