import { z } from 'zod';
import { roleSchema } from './roles';
import { certificateSchema, planStateSchema, planSummarySchema, unmetOrderSchema } from './plans';

/** What a person can do to a plan version in sign-off. */
export const planActionSchema = z.enum(['submit', 'approve', 'return', 'release']);
export type PlanAction = z.infer<typeof planActionSchema>;

/** What the system itself does (never a person's request). */
export const systemActionSchema = z.enum(['supersede']);
export type SystemAction = z.infer<typeof systemActionSchema>;

const comment = z.string().trim().max(2000, 'Use at most 2000 characters.');

/** Body of POST /api/plans/:id/submit|approve|release (comment optional). */
export const transitionSchema = z.strictObject({ comment: comment.optional() });
export type Transition = z.infer<typeof transitionSchema>;

/** Body of POST /api/plans/:id/return: the supervisor says why. */
export const returnTransitionSchema = z.strictObject({
  comment: comment.min(1, 'Say why the plan goes back to the planner.'),
});
export type ReturnTransition = z.infer<typeof returnTransitionSchema>;

/** One row of the append-only audit trail. */
export const auditEntrySchema = z.object({
  id: z.number().int(),
  planId: z.number().int(),
  at: z.string(),
  actor: z.object({ id: z.number().int().nullable(), name: z.string(), role: roleSchema.nullable() }),
  /** 'solve' notes a queued run; 'solved' a finished one (outcome and objective in the comment, with its results hash) */
  action: z.union([planActionSchema, systemActionSchema, z.literal('create'), z.literal('solve'), z.literal('solved')]),
  fromState: planStateSchema.nullable(),
  toState: planStateSchema,
  comment: z.string().nullable(),
  inputsHash: z.string(),
  resultsHash: z.string().nullable(),
});
export type AuditEntry = z.infer<typeof auditEntrySchema>;

const change = z.object({ before: z.number(), after: z.number(), delta: z.number() });

/** A caution shown with a plan under review. */
export const cautionSchema = z.object({
  kind: z.enum(['working_time', 'overtime', 'unmet_orders', 'unverified', 'advisory']),
  item: z.string().nullable(),
  week: z.number().int().nullable(),
  message: z.string(),
});
export type Caution = z.infer<typeof cautionSchema>;

/** GET /api/plans/:id/review — what changed against the last approved version. */
export const planReviewSchema = z.object({
  plan: planSummarySchema,
  /** the last approved (or released) version it is compared with; null when there is none */
  baseline: planSummarySchema.nullable(),
  certificate: certificateSchema.nullable(),
  changes: z.object({
    margin: change,
    overtimeHours: change,
    unmetQty: change,
    quantities: z.array(z.object({ product: z.string(), weekStart: z.string(), before: z.number(), after: z.number(), delta: z.number() })),
    load: z.array(z.object({ workCenter: z.string(), weekStart: z.string(), before: z.number(), after: z.number(), delta: z.number() })),
    overtime: z.array(z.object({ workCenter: z.string(), weekStart: z.string(), before: z.number(), after: z.number(), delta: z.number() })),
  }),
  unmet: z.object({ before: z.array(unmetOrderSchema), after: z.array(unmetOrderSchema) }),
  cautions: z.array(cautionSchema),
});
export type PlanReview = z.infer<typeof planReviewSchema>;

/** State of one e-mail in the outbox. */
export const outboxStateSchema = z.enum(['pending', 'sent', 'failed']);
export type OutboxState = z.infer<typeof outboxStateSchema>;

export const outboxMessageSchema = z.object({
  id: z.number().int(),
  to: z.string(),
  subject: z.string(),
  state: outboxStateSchema,
  attempts: z.number().int(),
  nextAttemptAt: z.string().nullable(),
  lastError: z.string().nullable(),
  planId: z.number().int().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

/** GET /api/outbox?state= (admin). Without state: pending and failed. */
export const outboxQuerySchema = z.strictObject({ state: outboxStateSchema.optional() });
