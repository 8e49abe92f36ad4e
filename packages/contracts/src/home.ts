import { z } from 'zod';

/**
 * Home page: the next weeks' firm demand against the available hours per work center (a
 * rough-cut capacity check: load = Σ hours per unit × quantity through the routings, exploded
 * through the bills of materials; available = shifts × hours × days × efficiency − downtime).
 */
export const loadStatusSchema = z.enum(['within_capacity', 'over_loaded', 'no_capacity']);
export type LoadStatus = z.infer<typeof loadStatusSchema>;

export const homeQuerySchema = z.strictObject({
  weeks: z.coerce.number().int('Weeks must be a whole number.').min(1, 'At least 1 week.').max(26, 'At most 26 weeks.').default(6),
});
export type HomeQuery = z.infer<typeof homeQuerySchema>;

export const workCenterLoadCellSchema = z.object({
  weekStart: z.string(),
  /** standard hours needed by firm demand */
  requiredHours: z.number(),
  /** standard hours needed by firm and forecast demand together */
  requiredHoursWithForecast: z.number(),
  availableHours: z.number(),
  /** requiredHours ÷ availableHours × 100; null when nothing is available */
  loadPct: z.number().nullable(),
  status: loadStatusSchema,
});
export type WorkCenterLoadCell = z.infer<typeof workCenterLoadCellSchema>;

export const homeSummarySchema = z.object({
  plantName: z.string(),
  weeks: z.array(z.string()),
  firmDemand: z.array(
    z.object({
      productCode: z.string(),
      productName: z.string(),
      unit: z.string(),
      qtyByWeek: z.array(z.number()),
    }),
  ),
  firmUnitsByWeek: z.array(z.number()),
  workCenters: z.array(
    z.object({
      code: z.string(),
      name: z.string(),
      cells: z.array(workCenterLoadCellSchema),
    }),
  ),
  overLoadedCells: z.number().int(),
});
export type HomeSummary = z.infer<typeof homeSummarySchema>;
