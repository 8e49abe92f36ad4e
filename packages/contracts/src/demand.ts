import { z } from 'zod';
import { isoDateSchema } from './dates';
import { quantitySchema } from './numbers';
import { maxPageSize } from './paging';
import { productKindSchema } from './products';

/**
 * Demand per product and week: firm customer orders (several per product-week, each with its
 * customer order reference) and one forecast quantity. Weeks are identified by their start date.
 */
export const demandKindSchema = z.enum(['firm', 'forecast']);
export type DemandKind = z.infer<typeof demandKindSchema>;

export const firmOrderSchema = z.object({
  id: z.number().int(),
  orderRef: z.string(),
  qty: z.number(),
  /** The customer order must ship complete by its week: a plan that cannot do so is infeasible. */
  mustShip: z.boolean(),
  version: z.number().int(),
});
export type FirmOrder = z.infer<typeof firmOrderSchema>;

export const demandCellSchema = z.object({
  weekStart: z.string(),
  firmQty: z.number(),
  firmOrders: z.array(firmOrderSchema),
  forecastQty: z.number(),
  /** null when no forecast row is stored for this cell */
  forecastVersion: z.number().int().nullable(),
});
export type DemandCell = z.infer<typeof demandCellSchema>;

export const demandRowSchema = z.object({
  productId: z.number().int(),
  productCode: z.string(),
  productName: z.string(),
  unit: z.string(),
  kind: productKindSchema,
  cells: z.array(demandCellSchema),
});
export type DemandRow = z.infer<typeof demandRowSchema>;

/** Answer of GET /api/demand: products × weeks. */
export const demandGridSchema = z.object({
  weeks: z.array(z.string()),
  rows: z.array(demandRowSchema),
  /** totals per week over every product matching the filter (not only this page) */
  weekTotals: z.array(z.object({ weekStart: z.string(), firmQty: z.number(), forecastQty: z.number() })),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type DemandGrid = z.infer<typeof demandGridSchema>;

/** Query of GET /api/demand. `from` defaults to the current week; it must be a week start. */
export const demandQuerySchema = z.strictObject({
  from: isoDateSchema.optional(),
  weeks: z.coerce.number().int('Weeks must be a whole number.').min(1, 'At least 1 week.').max(104, 'At most 104 weeks.').default(13),
  page: z.coerce.number().int().min(1, 'Pages start at 1.').default(1),
  pageSize: z.coerce.number().int().min(1).max(maxPageSize, `The page size can be at most ${maxPageSize}.`).default(200),
  q: z.string().trim().max(100, 'Search with at most 100 characters.').optional(),
  kind: productKindSchema.optional(),
  family: z.string().trim().max(40).optional(),
});
export type DemandQuery = z.infer<typeof demandQuerySchema>;

const expectedVersion = z
  .number({ error: 'Send the version you read, or null for a cell that was empty.' })
  .int()
  .nonnegative()
  .nullable();

/**
 * One cell change. `version` is what the client read: the row's version, or null when it saw no
 * row. A quantity of 0 removes the firm order / forecast.
 */
export const demandChangeSchema = z.discriminatedUnion('kind', [
  z.strictObject({
    kind: z.literal('firm'),
    productId: z.number().int().positive('Choose a product.'),
    weekStart: isoDateSchema,
    orderRef: z.string().trim().min(1, 'Enter the customer order reference.').max(60, 'Use at most 60 characters.'),
    qty: quantitySchema,
    /** Must ship complete by its week. Left out: a new order is not must-ship, a stored one keeps its mark. */
    mustShip: z.boolean({ error: 'Must-ship is true or false.' }).optional(),
    version: expectedVersion,
  }),
  z.strictObject({
    kind: z.literal('forecast'),
    productId: z.number().int().positive('Choose a product.'),
    weekStart: isoDateSchema,
    qty: quantitySchema,
    version: expectedVersion,
  }),
]);
export type DemandChange = z.infer<typeof demandChangeSchema>;

/** Body of PUT /api/demand: every change is written in one transaction, or none is. */
export const demandBatchSchema = z
  .strictObject({
    changes: z.array(demandChangeSchema).min(1, 'Send at least one change.').max(5000, 'At most 5,000 changes per save; save a large paste in parts.'),
  })
  .superRefine((b, ctx) => {
    const seen = new Map<string, number>();
    b.changes.forEach((c, i) => {
      const key = `${c.kind}|${c.productId}|${c.weekStart}|${c.kind === 'firm' ? c.orderRef.toLowerCase() : ''}`;
      const first = seen.get(key);
      if (first !== undefined) {
        ctx.addIssue({ code: 'custom', path: ['changes', i], message: `The same cell is changed twice (also at changes.${first}).` });
      } else {
        seen.set(key, i);
      }
    });
  });
export type DemandBatch = z.infer<typeof demandBatchSchema>;

/** Answer of PUT /api/demand. */
export const demandBatchResultSchema = z.object({
  created: z.number().int(),
  updated: z.number().int(),
  deleted: z.number().int(),
  unchanged: z.number().int(),
});
export type DemandBatchResult = z.infer<typeof demandBatchResultSchema>;
