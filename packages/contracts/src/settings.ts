import { z } from 'zod';
import { weekdaySchema } from './dates';
import { shiftPatternSchema } from './shift-pattern';

/**
 * Plant settings: one row. Working-time defaults: at most 48 h a week on average and at least
 * 11 h daily rest (EU Working Time Directive 2003/88/EC, Art. 6 and Art. 3); overtime premium 1.5×
 * (US Fair Labor Standards Act). Local law and collective agreements override them.
 */
export const plantSettingsDefaults = {
  maxWeeklyHours: 48,
  minDailyRestHours: 11,
  overtimePremium: 1.5,
} as const;

/** The line to show beside working-time limits and overtime figures (DOMAIN.md §5). */
export const workingTimeCaution =
  'Working-time defaults follow the EU Working Time Directive 2003/88/EC (at most 48 hours a week on average, at least 11 hours daily rest) and the US Fair Labor Standards Act overtime premium of 1.5×. Local labour law, collective agreements and licensed practice take precedence; Millrace gives no legal advice.';

const fields = {
  plantName: z.string().trim().min(1, 'Enter the plant name.').max(120, 'Use at most 120 characters.'),
  currency: z.string().trim().toUpperCase().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code such as EUR.'),
  weekStart: weekdaySchema,
  defaultShiftPattern: shiftPatternSchema,
  maxWeeklyHours: z.number().gt(0, 'Must be more than 0 hours.').max(168, 'A week has 168 hours.'),
  minDailyRestHours: z.number().min(0, 'Cannot be negative.').max(24, 'A day has 24 hours.'),
  overtimePremium: z.number().min(1, 'The premium is a multiplier of at least 1.').max(5, 'At most 5×.'),
};

export const plantSettingsSchema = z.object({
  ...fields,
  plantName: z.string(),
  currency: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type PlantSettings = z.infer<typeof plantSettingsSchema>;

/** Body of PUT /api/settings: every field, with the version read. */
export const plantSettingsUpdateSchema = z.strictObject({ ...fields, version: z.number().int().nonnegative() });
export type PlantSettingsUpdate = z.infer<typeof plantSettingsUpdateSchema>;
