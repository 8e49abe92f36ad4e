import { z } from 'zod';
import { isoDateSchema } from './dates';
import { planStateSchema } from './plans';

/**
 * Shift sheets (issue 8): the per-shift work lists of one week of an approved or released plan
 * version, per work center, day and shift. Times are plant wall-clock times "YYYY-MM-DDTHH:MM"
 * (no time zone); `*Minute` fields count minutes from the start of the week (its first day 00:00).
 */

/** Plan states that have shift sheets. Floor leads see released plans only. */
export const sheetPlanStates = ['approved', 'released'] as const;

/** Paper sizes of the printed sheets. */
export const paperSchema = z.enum(['a4', 'letter']);
export type Paper = z.infer<typeof paperSchema>;

const week = isoDateSchema.optional();

/** Query of GET /api/plans/:id/shift-sheets: the week (its start date); default the plan's first week. */
export const shiftSheetsQuerySchema = z.strictObject({ week });
export type ShiftSheetsQuery = z.infer<typeof shiftSheetsQuerySchema>;

/** Query of GET /api/plans/:id/shift-sheets.pdf: week, one work center (default all), paper (default A4). */
export const shiftSheetsPdfQuerySchema = z.strictObject({
  week,
  workCenter: z.string().trim().min(1, 'Name a work center code.').max(40).optional(),
  paper: paperSchema.default('a4'),
});
export type ShiftSheetsPdfQuery = z.input<typeof shiftSheetsPdfQuerySchema>;

export const sheetJobSchema = z.object({
  /** position in the shift's run order, 1-based */
  sequence: z.number().int(),
  product: z.string(),
  productName: z.string(),
  family: z.string().nullable(),
  /** routing step number */
  operation: z.number().int(),
  quantity: z.number(),
  unit: z.string(),
  setupStart: z.string(),
  start: z.string(),
  end: z.string(),
  setupStartMinute: z.number(),
  startMinute: z.number(),
  endMinute: z.number(),
  setupMinutes: z.number(),
  /** part of the job runs in overtime added to the shift */
  overtime: z.boolean(),
  /** continues a job begun in an earlier shift (no new setup) */
  continued: z.boolean(),
  /**
   * start date of the plan week whose production this is, when the job was carried over from an
   * earlier week the floor could not finish it in (it runs ahead of the week's own work); null
   * for the week's own work
   */
  carriedFromWeek: isoDateSchema.nullable(),
  /** start date of the week of the earliest firm order this production serves, null if none */
  dueWeek: isoDateSchema.nullable(),
  orderRefs: z.array(z.string()),
  previousWorkCenter: z.string().nullable(),
  nextWorkCenter: z.string().nullable(),
  nextWorkCenterName: z.string().nullable(),
  /** materials and sub-assemblies to issue for the job (on its first operation; scrap included) */
  materials: z.array(z.object({ item: z.string(), name: z.string(), quantity: z.number(), unit: z.string() })),
});
export type SheetJob = z.infer<typeof sheetJobSchema>;

/** One work center's shift on one day: the jobs in run order. */
export const shiftSheetSchema = z.object({
  workCenter: z.string(),
  workCenterName: z.string(),
  date: isoDateSchema,
  weekday: z.string(),
  /** 1-based shift number of the day */
  shift: z.number().int(),
  shiftStart: z.string(),
  shiftEnd: z.string(),
  overtimeEnd: z.string().nullable(),
  shiftStartMinute: z.number(),
  shiftEndMinute: z.number(),
  overtimeEndMinute: z.number().nullable(),
  availableMinutes: z.number(),
  overtimeMinutes: z.number(),
  plannedMinutes: z.number(),
  jobs: z.array(sheetJobSchema),
});
export type ShiftSheet = z.infer<typeof shiftSheetSchema>;

/** An open shift of the week (with or without work), for the timeline. */
export const openShiftSchema = z.object({
  date: isoDateSchema,
  weekday: z.string(),
  shift: z.number().int(),
  startMinute: z.number(),
  endMinute: z.number(),
  overtimeEndMinute: z.number(),
});
export type OpenShift = z.infer<typeof openShiftSchema>;

export const sheetDaySchema = z.object({
  date: isoDateSchema,
  weekday: z.string(),
  shifts: z.array(shiftSheetSchema),
});
export type SheetDay = z.infer<typeof sheetDaySchema>;

export const sheetWorkCenterSchema = z.object({
  code: z.string(),
  name: z.string(),
  openShifts: z.array(openShiftSchema),
  /** days with work, each with its shifts with work */
  days: z.array(sheetDaySchema),
  plannedMinutes: z.number(),
  availableMinutes: z.number(),
  overtimeMinutes: z.number(),
  /**
   * overtime hours the plan counts on at this work center in this week that find no room after
   * the day's last shift (the next shift starts first): on no sheet; the supervisor decides
   * where they go (0 when all of the plan's overtime is on the sheets)
   */
  overtimeNotPlacedHours: z.number().nonnegative(),
});
export type SheetWorkCenter = z.infer<typeof sheetWorkCenterSchema>;

export const workingTimeCautionKindSchema = z.enum(['weekly_hours', 'daily_rest', 'night_run']);
export type WorkingTimeCautionKind = z.infer<typeof workingTimeCautionKindSchema>;

/** A working-time caution for one crew (the crew of one shift number on one work center). */
export const crewCautionSchema = z.object({
  kind: workingTimeCautionKindSchema,
  workCenter: z.string(),
  shift: z.number().int(),
  limit: z.number(),
  actual: z.number(),
  message: z.string(),
  /** where the default limit comes from */
  source: z.string(),
});
export type CrewCaution = z.infer<typeof crewCautionSchema>;

/**
 * Work still open after the plan's last week (shown with that week), listed openly with its
 * reason, never dropped; `planWeek` is the start date of the plan week it belongs to.
 */
export const unscheduledWorkSchema = z.object({
  workCenter: z.string(),
  planWeek: isoDateSchema,
  product: z.string(),
  operation: z.number().int(),
  quantity: z.number(),
  hours: z.number(),
  reason: z.string(),
});
export type UnscheduledWorkLine = z.infer<typeof unscheduledWorkSchema>;

/**
 * Work the week could not finish (its open time was used up, or the previous operation finished
 * late), carried over into the next week's first open time, ahead of that week's own work.
 * `planWeek` is the start date of the plan week it belongs to.
 */
export const carriedWorkSchema = z.object({
  workCenter: z.string(),
  planWeek: isoDateSchema,
  /** start date of the week it continues in */
  intoWeek: isoDateSchema,
  product: z.string(),
  operation: z.number().int(),
  quantity: z.number(),
  hours: z.number(),
  reason: z.string(),
});
export type CarriedWorkLine = z.infer<typeof carriedWorkSchema>;

/** The line every sheet view carries beside working-time figures (DOMAIN.md §5). */
export const sheetLabourLawNote =
  'Working-time limits here are the plant’s settings; their defaults follow the EU Working Time Directive 2003/88/EC (at most 48 hours a week on average including overtime, at least 11 consecutive hours of daily rest). Local labour law, collective agreements and licensed practice take precedence; Millrace gives no legal advice.';

/**
 * Which work centers a week of sheets holds: `all` for planners, supervisors and admins;
 * `assigned` for a floor lead with assigned work centers (only those); `none_assigned` for a
 * floor lead with none assigned, who sees every work center (the UI says so).
 */
export const sheetWorkCenterScopeSchema = z.enum(['all', 'assigned', 'none_assigned']);
export type SheetWorkCenterScope = z.infer<typeof sheetWorkCenterScopeSchema>;

/** GET /api/plans/:id/shift-sheets answer: one week of a plan version. */
export const shiftSheetsWeekSchema = z.object({
  plan: z.object({
    id: z.number().int(),
    name: z.string(),
    state: planStateSchema,
    approvedBy: z.string().nullable(),
    approvedAt: z.string().nullable(),
  }),
  plantName: z.string(),
  week: z.object({ start: isoDateSchema, index: z.number().int() }),
  /** start dates of every week of the plan, for choosing another */
  weeks: z.array(isoDateSchema),
  limits: z.object({ maxWeeklyHours: z.number(), minDailyRestHours: z.number(), source: z.string() }),
  labourLawNote: z.string(),
  workCenterScope: sheetWorkCenterScopeSchema,
  /** the work centers, their cautions and unscheduled work are those of the scope */
  workCenters: z.array(sheetWorkCenterSchema),
  cautions: z.array(crewCautionSchema),
  unscheduled: z.array(unscheduledWorkSchema),
  /** what this week hands on to the next (its jobs there are marked as carried over) */
  carriedOver: z.array(carriedWorkSchema),
  /** work-center shifts with work in the week (= pages of the printed week) */
  sheetCount: z.number().int(),
});
export type ShiftSheetsWeek = z.infer<typeof shiftSheetsWeekSchema>;

/** GET /api/shift-sheets/plans: plan versions whose sheets the signed-in person may read. */
export const sheetPlanSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  state: planStateSchema,
  firstWeek: isoDateSchema,
  lastWeek: isoDateSchema,
  approvedBy: z.string().nullable(),
  approvedAt: z.string().nullable(),
});
export type SheetPlan = z.infer<typeof sheetPlanSchema>;
