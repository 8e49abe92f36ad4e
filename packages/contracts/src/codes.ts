import { z } from 'zod';

/** A part number / code: 1–40 characters without spaces. Codes are unique within their kind. */
export const codeSchema = z
  .string()
  .trim()
  .min(1, 'Enter a code.')
  .max(40, 'Use at most 40 characters.')
  .regex(/^\S+$/, 'A code cannot contain spaces.');

/** A display name. */
export const nameSchema = z.string().trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.');

/** A unit of measure such as pcs, kg, m, m2. */
export const unitSchema = z.string().trim().min(1, 'Enter a unit.').max(16, 'Use at most 16 characters.');
