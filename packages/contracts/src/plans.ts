import { z } from 'zod';

/** Sign-off states of a plan version (DESIGN.md vocabulary). */
export const planStateSchema = z.enum(['draft', 'submitted', 'approved', 'returned', 'released', 'superseded']);
export type PlanState = z.infer<typeof planStateSchema>;

/**
 * Where the solve of a plan version stands.
 * - not_solved: created, never solved
 * - queued / solving: a run is waiting for a worker / running
 * - solved: optimal and the independent checker passed
 * - check_failed: optimal for the LP, but the checker found violations against the data (never shown as valid)
 * - infeasible: a hard requirement (must-ship order) cannot be met; `infeasibility` names the conflict
 * - stopped_early: iteration/time limit or numerical trouble before optimality
 * - cancelled: a person stopped the run
 * - failed: the run crashed; `solveMessage` says why
 */
export const solveStatusSchema = z.enum([
  'not_solved',
  'queued',
  'solving',
  'solved',
  'check_failed',
  'infeasible',
  'unbounded',
  'stopped_early',
  'cancelled',
  'failed',
]);
export type SolveStatus = z.infer<typeof solveStatusSchema>;

/** Which independent solver re-solved the LP after the main solve. */
export const crossCheckSolverSchema = z.enum(['javascript-lp-solver', 'highs', 'barrier']);
export type CrossCheckSolver = z.infer<typeof crossCheckSolverSchema>;

/** Outcome of the background cross-check. A check that could not finish is never "verified". */
export const crossCheckStatusSchema = z.enum(['running', 'verified', 'unverified', 'not_finished']);
export type CrossCheckStatus = z.infer<typeof crossCheckStatusSchema>;

export const crossCheckSchema = z.object({
  solver: crossCheckSolverSchema,
  status: crossCheckStatusSchema,
  /** objective found by the checking solver, in the plan's sense (margin); null when it did not finish */
  objective: z.number().nullable(),
  /** the plan's own objective it was compared with */
  planObjective: z.number().nullable(),
  /** |a − b| / max(1, |a|, |b|) */
  relativeDifference: z.number().nullable(),
  seconds: z.number().nullable(),
  message: z.string(),
});
export type CrossCheck = z.infer<typeof crossCheckSchema>;

/** Optimality proof shown with a plan (measured on the LP as solved). */
export const certificateSchema = z.object({
  primalResidual: z.number(),
  dualResidual: z.number(),
  relativeGap: z.number(),
  iterations: z.number().int(),
  seconds: z.number(),
  crossCheck: crossCheckSchema.nullable(),
});
export type Certificate = z.infer<typeof certificateSchema>;

export const smoothingSchema = z.strictObject({
  enabled: z.boolean(),
  /** λ in λ·Σ(make[t] − make[t−1])², currency per unit² */
  weight: z.number().min(0, 'The smoothing weight cannot be negative.').max(1e6, 'The smoothing weight is too large.'),
});
export type Smoothing = z.infer<typeof smoothingSchema>;

export const planHorizonMinWeeks = 4;
export const planHorizonMaxWeeks = 52;

const planName = z.string().trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.');

/** Body of POST /api/plans. */
export const planCreateSchema = z.strictObject({
  name: planName,
  horizonWeeks: z
    .number()
    .int('The horizon is a whole number of weeks.')
    .min(planHorizonMinWeeks, `Plan at least ${planHorizonMinWeeks} weeks.`)
    .max(planHorizonMaxWeeks, `Plan at most ${planHorizonMaxWeeks} weeks.`),
  scenarioId: z.number().int().positive().optional(),
  /** first week of the horizon (a plant week start, YYYY-MM-DD); default: the current week */
  firstWeek: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date as YYYY-MM-DD.').optional(),
  smoothing: smoothingSchema.default({ enabled: false, weight: 0 }),
  /** round quantities to whole units and batch multiples after the LP solve */
  wholeUnits: z.boolean().default(true),
});
export type PlanCreate = z.input<typeof planCreateSchema>;

/** Body of PATCH /api/plans/:id (rename a draft or returned version). */
export const planUpdateSchema = z.strictObject({
  name: planName,
  version: z.number().int().nonnegative(),
});
export type PlanUpdate = z.infer<typeof planUpdateSchema>;

export const planIdParamsSchema = z.strictObject({
  id: z.coerce.number().int().positive('The plan id must be a positive whole number.'),
});
export const planRunParamsSchema = z.strictObject({
  id: z.coerce.number().int().positive('The plan id must be a positive whole number.'),
  runId: z.coerce.number().int().positive('The run id must be a positive whole number.'),
});

const personRef = z.object({ id: z.number().int(), name: z.string() });

/** A plan version as listed. */
export const planSummarySchema = z.object({
  id: z.number().int(),
  name: z.string(),
  state: planStateSchema,
  solveStatus: solveStatusSchema,
  horizonWeeks: z.number().int(),
  /** ISO start date of the first and last week of the horizon */
  firstWeek: z.string(),
  lastWeek: z.string(),
  scenarioId: z.number().int().nullable(),
  scenarioName: z.string().nullable(),
  smoothing: smoothingSchema,
  wholeUnits: z.boolean(),
  /** contribution margin of the LP optimum (the objective; the MPS minimises its negative) */
  objective: z.number().nullable(),
  currency: z.string(),
  inputsHash: z.string(),
  createdBy: personRef.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  version: z.number().int(),
  latestRunId: z.number().int().nullable(),
});
export type PlanSummary = z.infer<typeof planSummarySchema>;

/** One violation the independent checker found. */
export const checkViolationSchema = z.object({ kind: z.string(), item: z.string(), week: z.number().int().nullable(), message: z.string() });
export type CheckViolation = z.infer<typeof checkViolationSchema>;

/** Whole-unit rounding outcome: the rounded plan's margin against the LP bound. */
export const roundingSchema = z.object({
  /** repaired: every row holds after rounding; violations_remain: the repair pass could not fix all (the check then fails) */
  outcome: z.enum(['repaired', 'violations_remain']),
  margin: z.number(),
  lpBound: z.number(),
  /** lpBound − margin (≥ 0 up to rounding of the repair pass) */
  gap: z.number(),
  relativeGap: z.number(),
});
export type Rounding = z.infer<typeof roundingSchema>;

/** Why a plan with a must-ship requirement has no feasible plan, in words. */
export const infeasibilitySchema = z.object({
  summary: z.string(),
  /** one sentence per conflicting requirement (rows of the infeasibility certificate), must-ship orders first */
  conflicts: z.array(z.string()),
});
export type Infeasibility = z.infer<typeof infeasibilitySchema>;

/** GET /api/plans/:id */
export const planDetailSchema = planSummarySchema.extend({
  certificate: certificateSchema.nullable(),
  solveMessage: z.string().nullable(),
  checkViolations: z.array(checkViolationSchema),
  rounding: roundingSchema.nullable(),
  infeasibility: infeasibilitySchema.nullable(),
  resultsHash: z.string().nullable(),
  /** LP size, for the record */
  modelSize: z.object({ rows: z.number().int(), columns: z.number().int(), nonzeros: z.number().int() }).nullable(),
});
export type PlanDetail = z.infer<typeof planDetailSchema>;

/** State of one solve run (a row of the job table). */
export const runStateSchema = z.enum(['queued', 'running', 'finished', 'failed', 'cancelled']);
export type RunState = z.infer<typeof runStateSchema>;

/** Answer of POST /api/plans/:id/solve (202). */
export const solveAcceptedSchema = z.object({ runId: z.number().int() });
export type SolveAccepted = z.infer<typeof solveAcceptedSchema>;

/** GET /api/plans/:id/runs/:runId — progress of a run, written at a throttled rate. */
export const runProgressSchema = z.object({
  runId: z.number().int(),
  planId: z.number().int(),
  state: runStateSchema,
  cancelRequested: z.boolean(),
  iteration: z.number().int(),
  relativeGap: z.number().nullable(),
  primalObjective: z.number().nullable(),
  elapsedSeconds: z.number(),
  message: z.string().nullable(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type RunProgress = z.infer<typeof runProgressSchema>;

// ---- results ----

/** Per product and week: what to make, ship, keep and carry late. */
export const planLineSchema = z.object({
  product: z.string(),
  productName: z.string(),
  week: z.number().int(),
  weekStart: z.string(),
  demand: z.number(),
  make: z.number(),
  ship: z.number(),
  stock: z.number(),
  late: z.number(),
});
export type PlanLine = z.infer<typeof planLineSchema>;

/** Per work center and week: load against what the calendar gives. */
export const loadRowSchema = z.object({
  workCenter: z.string(),
  workCenterName: z.string(),
  week: z.number().int(),
  weekStart: z.string(),
  loadHours: z.number(),
  availableHours: z.number(),
  /** load ÷ available × 100 (null when nothing is available) */
  percentOfAvailable: z.number().nullable(),
  overtimeHours: z.number(),
});
export type LoadRow = z.infer<typeof loadRowSchema>;

/** A purchase suggestion from the plan (MRP netting with the material's lot rule). */
export const materialCallSchema = z.object({
  material: z.string(),
  materialName: z.string(),
  unit: z.string(),
  /** week the material is needed */
  week: z.number().int(),
  weekStart: z.string(),
  grossRequirement: z.number(),
  scheduledReceipt: z.number(),
  projectedAvailable: z.number(),
  netRequirement: z.number(),
  plannedReceipt: z.number(),
  /** order release week = need week − lead time; < 1 means past due */
  releaseWeek: z.number().int(),
  pastDue: z.boolean(),
  spend: z.number(),
});
export type MaterialCall = z.infer<typeof materialCallSchema>;

/** Value of one more unit of a limited resource (dual of a capacity, material or supply-cap row), in the weeks it binds. */
export const bottleneckSchema = z.object({
  kind: z.enum(['capacity', 'material', 'supply_cap']),
  item: z.string(),
  itemName: z.string(),
  /** currency per hour (capacity) or per unit (material, supply cap) */
  unit: z.enum(['per_hour', 'per_unit']),
  weeks: z.array(z.object({ week: z.number().int(), weekStart: z.string(), value: z.number() })),
  message: z.string(),
});
export type Bottleneck = z.infer<typeof bottleneckSchema>;

/** Reduced costs of making a product: which products lose money at the margin. */
export const reducedCostSchema = z.object({
  product: z.string(),
  productName: z.string(),
  made: z.number(),
  outcome: z.enum(['made', 'not_worth_making', 'not_needed']),
  /** margin lost by one more unit made, per week of the horizon */
  reducedCostByWeek: z.array(z.number()),
  message: z.string(),
});
export type ReducedCost = z.infer<typeof reducedCostSchema>;

/** A firm order the plan does not ship in full on time, and why. */
export const unmetOrderSchema = z.object({
  product: z.string(),
  orderRef: z.string(),
  week: z.number().int(),
  weekStart: z.string(),
  qty: z.number(),
  qtyShort: z.number(),
  /** week the order is complete, or null when not within the horizon */
  completeWeek: z.number().int().nullable(),
  causes: z.array(z.object({ kind: z.enum(['capacity', 'supply_cap', 'lead_time', 'material', 'economics']), item: z.string(), message: z.string() })),
  message: z.string(),
});
export type UnmetOrder = z.infer<typeof unmetOrderSchema>;

/** GET /api/plans/:id/results — everything the plan says, typed. */
export const planResultsSchema = z.object({
  planId: z.number().int(),
  objective: z.number(),
  currency: z.string(),
  lines: z.array(planLineSchema),
  load: z.array(loadRowSchema),
  materialCalls: z.array(materialCallSchema),
  bottlenecks: z.array(bottleneckSchema),
  reducedCosts: z.array(reducedCostSchema),
  unmet: z.array(unmetOrderSchema),
  /** contribution margin of the plan as shown (rounded when whole units were asked), from the data */
  totals: z.object({
    margin: z.number(),
    revenue: z.number(),
    materialSpend: z.number(),
    extraUnitCost: z.number(),
    overtimeCost: z.number(),
    holdingCost: z.number(),
    latePenalty: z.number(),
    endBackorderPenalty: z.number(),
    safetyShortfallPenalty: z.number(),
    smoothingCost: z.number(),
    overtimeHours: z.number(),
    unmetQty: z.number(),
  }),
});
export type PlanResults = z.infer<typeof planResultsSchema>;

/** GET /api/plans/compare?a=&b= */
export const planCompareQuerySchema = z.strictObject({
  a: z.coerce.number().int().positive('Give plan a as a positive whole number.'),
  b: z.coerce.number().int().positive('Give plan b as a positive whole number.'),
});

const pair = z.object({ a: z.number(), b: z.number(), delta: z.number() });

export const planComparisonSchema = z.object({
  a: planSummarySchema,
  b: planSummarySchema,
  margin: pair,
  revenue: pair,
  materialSpend: pair,
  overtimeCost: pair,
  overtimeHours: pair,
  holdingCost: pair,
  latePenalties: pair,
  unmetOrderCount: pair,
  unmetQty: pair,
  loadByWorkCenter: z.array(
    z.object({
      workCenter: z.string(),
      workCenterName: z.string(),
      loadHours: pair,
      overtimeHours: pair,
      peakPercent: z.object({ a: z.number().nullable(), b: z.number().nullable() }),
      bindingWeeks: z.object({ a: z.array(z.number().int()), b: z.array(z.number().int()) }),
    }),
  ),
  /** every firm order short in either plan, with its shortfall in each */
  unmetOrders: z.array(z.object({ orderRef: z.string(), product: z.string(), week: z.number().int(), shortA: z.number(), shortB: z.number() })),
  unmet: z.object({ a: z.array(unmetOrderSchema), b: z.array(unmetOrderSchema) }),
  /** product-weeks whose make, ship or late differ */
  quantityDifferences: z.array(
    z.object({
      product: z.string(),
      week: z.number().int(),
      makeA: z.number(),
      makeB: z.number(),
      shipA: z.number(),
      shipB: z.number(),
      lateA: z.number(),
      lateB: z.number(),
    }),
  ),
});
export type PlanComparison = z.infer<typeof planComparisonSchema>;
