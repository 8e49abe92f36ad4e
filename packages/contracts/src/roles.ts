import { z } from 'zod';

/** Every role a person can hold. The API decides what each may do; the UI only mirrors it. */
export const roleSchema = z.enum(['admin', 'planner', 'supervisor', 'floor_lead']);
export type Role = z.infer<typeof roleSchema>;
export const roles: readonly Role[] = roleSchema.options;
