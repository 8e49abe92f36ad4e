import { z } from 'zod';
import { clockTimeSchema } from './dates';

/**
 * A shift pattern: shifts per day × hours per shift × days per week. Common practice (no source):
 * 1 × 8 h × 5 days = 40 h a week, 2 shifts = 80 h, 3 shifts = 120 h.
 */
export const shiftPatternSchema = z
  .strictObject({
    shiftsPerDay: z.number().int('Shifts per day must be a whole number.').min(1, 'At least 1 shift per day.').max(4, 'At most 4 shifts per day.'),
    hoursPerShift: z.number().gt(0, 'Hours per shift must be more than 0.').max(24, 'A shift can last at most 24 hours.'),
    daysPerWeek: z.number().int('Days per week must be a whole number.').min(1, 'At least 1 day per week.').max(7, 'A week has 7 days.'),
    shiftStarts: z.array(clockTimeSchema).max(4),
  })
  .superRefine((p, ctx) => {
    if (p.shiftsPerDay * p.hoursPerShift > 24) {
      ctx.addIssue({ code: 'custom', path: ['hoursPerShift'], message: 'Shifts per day × hours per shift cannot exceed 24 hours.' });
    }
    if (p.shiftStarts.length !== p.shiftsPerDay) {
      ctx.addIssue({ code: 'custom', path: ['shiftStarts'], message: `Give one start time per shift (${p.shiftsPerDay}).` });
    }
  });
export type ShiftPattern = z.infer<typeof shiftPatternSchema>;
