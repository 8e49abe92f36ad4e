import { z } from 'zod';
import { codeSchema, nameSchema } from './codes';
import { isoDateSchema } from './dates';
import { hoursSchema, moneySchema } from './numbers';
import { pageOf, pageQueryShape, versionSchema } from './paging';
import { shiftPatternSchema } from './shift-pattern';

const fields = {
  code: codeSchema,
  name: nameSchema,
  /** standard hours produced per clock hour (OEE-style factor; 0.80–0.90 is usual without measurements, common practice, no source) */
  efficiency: z.number().gt(0, 'Efficiency must be more than 0.').max(1.5, 'Efficiency can be at most 1.5.'),
  /** overtime clock hours allowed per week; null = no cap */
  overtimeCapHoursPerWeek: hoursSchema.nullable(),
  overtimeCostPerHour: moneySchema,
  shiftPattern: shiftPatternSchema,
};

/** One week of a work center's calendar. */
export const calendarWeekSchema = z.object({
  weekStart: z.string(),
  holidayDays: z.number(),
  downtimeHours: z.number(),
  extraShifts: z.number().int(),
  note: z.string().nullable(),
});
export type CalendarWeek = z.infer<typeof calendarWeekSchema>;

export const workCenterSchema = z.object({
  id: z.number().int(),
  code: z.string(),
  name: z.string(),
  efficiency: z.number(),
  overtimeCapHoursPerWeek: z.number().nullable(),
  overtimeCostPerHour: z.number(),
  shiftPattern: z.object({
    shiftsPerDay: z.number().int(),
    hoursPerShift: z.number(),
    daysPerWeek: z.number().int(),
    shiftStarts: z.array(z.string()),
  }),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type WorkCenter = z.infer<typeof workCenterSchema>;

/** A work center with its calendar weeks (GET /api/work-centers/:id). */
export const workCenterDetailSchema = workCenterSchema.extend({ calendar: z.array(calendarWeekSchema) });
export type WorkCenterDetail = z.infer<typeof workCenterDetailSchema>;

/** Body of POST /api/work-centers. */
export const workCenterCreateSchema = z.strictObject({
  ...fields,
  efficiency: fields.efficiency.default(1),
  overtimeCapHoursPerWeek: fields.overtimeCapHoursPerWeek.default(null),
  overtimeCostPerHour: fields.overtimeCostPerHour.default(0),
});
export type WorkCenterCreate = z.infer<typeof workCenterCreateSchema>;

/** Body of PATCH /api/work-centers/:id. */
export const workCenterUpdateSchema = z.strictObject({
  code: fields.code.optional(),
  name: fields.name.optional(),
  efficiency: fields.efficiency.optional(),
  overtimeCapHoursPerWeek: fields.overtimeCapHoursPerWeek.optional(),
  overtimeCostPerHour: fields.overtimeCostPerHour.optional(),
  shiftPattern: fields.shiftPattern.optional(),
  version: versionSchema,
});
export type WorkCenterUpdate = z.infer<typeof workCenterUpdateSchema>;

export const calendarWeekInputSchema = z.strictObject({
  weekStart: isoDateSchema,
  holidayDays: z.number().int('Holidays are whole days.').min(0, 'Cannot be negative.').max(7, 'A week has 7 days.').default(0),
  downtimeHours: hoursSchema.max(168, 'A week has 168 hours.').default(0),
  extraShifts: z.number().int('Extra shifts are whole shifts per day.').min(0, 'Cannot be negative.').max(3, 'At most 3 extra shifts per day.').default(0),
  note: z.string().trim().max(200, 'Use at most 200 characters.').nullable().default(null),
});
export type CalendarWeekInput = z.infer<typeof calendarWeekInputSchema>;

/** Body of PUT /api/work-centers/:id/calendar: the whole list of exceptional weeks replaces the old one. */
export const calendarReplaceSchema = z
  .strictObject({
    version: versionSchema,
    weeks: z.array(calendarWeekInputSchema).max(520, 'At most 520 weeks.'),
  })
  .superRefine((c, ctx) => {
    const seen = new Set<string>();
    c.weeks.forEach((w, i) => {
      if (seen.has(w.weekStart)) {
        ctx.addIssue({ code: 'custom', path: ['weeks', i, 'weekStart'], message: `The week of ${w.weekStart} is listed twice.` });
      }
      seen.add(w.weekStart);
    });
  });
export type CalendarReplace = z.infer<typeof calendarReplaceSchema>;

export const workCenterSortSchema = z.enum(['code', 'name', 'efficiency', 'updatedAt']);
export const workCenterListQuerySchema = z.strictObject({
  ...pageQueryShape,
  sort: workCenterSortSchema.default('code'),
});
export type WorkCenterListQuery = z.infer<typeof workCenterListQuerySchema>;

export const workCenterPageSchema = pageOf(workCenterSchema);
export type WorkCenterPage = z.infer<typeof workCenterPageSchema>;
