import { z } from 'zod';

/** A week-start date; an empty field asks for the week instead of naming a format the date picker hides. */
const isoDate = z
  .string()
  .min(1, { message: 'Choose a week.', abort: true })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date as YYYY-MM-DD.');
const code = z.string().trim().min(1, 'Enter a code.').max(40, 'Use at most 40 characters.');

/** Weeks an override applies to, as ISO week-start dates (inclusive). */
const weekRange = {
  fromWeek: isoDate,
  toWeek: isoDate,
};

/** One what-if change to the plant's data. */
export const scenarioOverrideSchema = z.discriminatedUnion('kind', [
  z.strictObject({
    kind: z.literal('extra_shift'),
    workCenter: code,
    ...weekRange,
    extraShiftsPerDay: z.number().int().min(1, 'Add at least one shift.').max(3, 'At most 3 extra shifts a day.'),
  }),
  z.strictObject({
    kind: z.literal('supply_cap'),
    material: code,
    ...weekRange,
    /** the weekly supply cap in those weeks (units of the material) */
    weeklySupplyCap: z.number().min(0, 'The supply cap cannot be negative.'),
  }),
  z.strictObject({
    kind: z.literal('demand_scale'),
    /** a product code, or absent for every product */
    product: code.optional(),
    ...weekRange,
    /** multiplies demand quantities (0.5 = half, 1.2 = 20 % more) */
    factor: z.number().min(0, 'The factor cannot be negative.').max(10, 'Use a factor of at most 10.'),
    /** only firm orders or only forecasts; absent = both */
    demandKind: z.enum(['firm', 'forecast']).optional(),
  }),
  z.strictObject({
    kind: z.literal('maintenance'),
    /** the work center is down (closed) for maintenance in these weeks */
    workCenter: code,
    ...weekRange,
  }),
]);
export type ScenarioOverride = z.infer<typeof scenarioOverrideSchema>;
export type ScenarioOverrideKind = ScenarioOverride['kind'];

const overrides = z
  .array(scenarioOverrideSchema)
  .max(200, 'Use at most 200 overrides.')
  .refine((list) => list.every((o) => o.fromWeek <= o.toWeek), { message: 'Each override must end on or after its first week.' });

export const scenarioSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  description: z.string(),
  overrides: z.array(scenarioOverrideSchema),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
  /** plan versions built from it; an approved or released one makes the scenario read-only */
  usedByPlanIds: z.array(z.number().int()),
  locked: z.boolean(),
});
export type Scenario = z.infer<typeof scenarioSchema>;

export const scenarioCreateSchema = z.strictObject({
  name: z.string().trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.'),
  description: z.string().trim().max(2000, 'Use at most 2000 characters.').default(''),
  overrides,
});
export type ScenarioCreate = z.input<typeof scenarioCreateSchema>;

export const scenarioUpdateSchema = z.strictObject({
  name: z.string().trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.').optional(),
  description: z.string().trim().max(2000, 'Use at most 2000 characters.').optional(),
  overrides: overrides.optional(),
  version: z.number().int().nonnegative(),
});
export type ScenarioUpdate = z.infer<typeof scenarioUpdateSchema>;

export const scenarioIdParamsSchema = z.strictObject({
  id: z.coerce.number().int().positive('The scenario id must be a positive whole number.'),
});
