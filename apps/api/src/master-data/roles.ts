import type { Role } from '@millrace/contracts';

/** Who reads master data: every signed-in role except floor leads (they get the home page and shift sheets). */
export const masterDataReaders: Role[] = ['admin', 'planner', 'supervisor'];
/** Who changes master data and demand. */
export const masterDataWriters: Role[] = ['planner'];
/** Who changes plant settings. */
export const settingsWriters: Role[] = ['admin', 'planner'];
