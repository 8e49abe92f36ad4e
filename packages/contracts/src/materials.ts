import { z } from 'zod';
import { codeSchema, nameSchema, unitSchema } from './codes';
import { isoDateSchema } from './dates';
import { moneySchema, quantitySchema } from './numbers';
import { pageOf, pageQueryShape, versionSchema } from './paging';

/**
 * Lot-sizing rules (Orlicky, MRP ch. 8): lot-for-lot orders the net requirement; fixed order
 * quantity orders max(Q, NR); minimum order quantity orders at least Q; period order quantity
 * covers the next `lotSize` periods.
 */
export const lotRuleSchema = z.enum(['lot_for_lot', 'fixed_order_quantity', 'minimum_order_quantity', 'period_order_quantity']);
export type LotRule = z.infer<typeof lotRuleSchema>;

const fields = {
  code: codeSchema,
  name: nameSchema,
  unit: unitSchema,
  unitCost: moneySchema,
  onHand: quantitySchema,
  leadTimeWeeks: z.number().int('Lead time is in whole weeks.').min(0, 'Cannot be negative.').max(104, 'At most 104 weeks.'),
  /** most that can be received per week; null = no cap */
  weeklySupplyCap: quantitySchema.nullable(),
  lotRule: lotRuleSchema,
  /** order quantity (fixed/minimum order quantity) or periods covered (period order quantity); null for lot-for-lot */
  lotSize: quantitySchema.nullable(),
};

function checkLot(m: { lotRule?: LotRule; lotSize?: number | null }, ctx: z.RefinementCtx) {
  if (m.lotRule === undefined) return;
  if (m.lotRule === 'lot_for_lot' && m.lotSize !== null && m.lotSize !== undefined) {
    ctx.addIssue({ code: 'custom', path: ['lotSize'], message: 'Lot-for-lot has no lot size; leave it empty.' });
  }
  if (m.lotRule !== 'lot_for_lot' && (m.lotSize === null || m.lotSize === undefined || m.lotSize <= 0)) {
    ctx.addIssue({ code: 'custom', path: ['lotSize'], message: 'This lot rule needs a lot size above 0.' });
  }
  if (m.lotRule === 'period_order_quantity' && typeof m.lotSize === 'number' && !Number.isInteger(m.lotSize)) {
    ctx.addIssue({ code: 'custom', path: ['lotSize'], message: 'Period order quantity counts whole weeks.' });
  }
}

export const scheduledReceiptSchema = z.object({
  id: z.number().int(),
  weekStart: z.string(),
  qty: z.number(),
  reference: z.string().nullable(),
});
export type ScheduledReceipt = z.infer<typeof scheduledReceiptSchema>;

export const materialSchema = z.object({
  id: z.number().int(),
  code: z.string(),
  name: z.string(),
  unit: z.string(),
  unitCost: z.number(),
  onHand: z.number(),
  leadTimeWeeks: z.number().int(),
  weeklySupplyCap: z.number().nullable(),
  lotRule: lotRuleSchema,
  lotSize: z.number().nullable(),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Material = z.infer<typeof materialSchema>;

/** A material with its scheduled receipts (GET /api/materials/:id). */
export const materialDetailSchema = materialSchema.extend({ receipts: z.array(scheduledReceiptSchema) });
export type MaterialDetail = z.infer<typeof materialDetailSchema>;

/** Body of POST /api/materials. */
export const materialCreateSchema = z
  .strictObject({
    ...fields,
    unitCost: fields.unitCost.default(0),
    onHand: fields.onHand.default(0),
    leadTimeWeeks: fields.leadTimeWeeks.default(0),
    weeklySupplyCap: fields.weeklySupplyCap.default(null),
    lotRule: fields.lotRule.default('lot_for_lot'),
    lotSize: fields.lotSize.default(null),
  })
  .superRefine(checkLot);
export type MaterialCreate = z.infer<typeof materialCreateSchema>;

/** Body of PATCH /api/materials/:id (lot rule and lot size are checked together with the stored values). */
export const materialUpdateSchema = z
  .strictObject({
    code: fields.code.optional(),
    name: fields.name.optional(),
    unit: fields.unit.optional(),
    unitCost: fields.unitCost.optional(),
    onHand: fields.onHand.optional(),
    leadTimeWeeks: fields.leadTimeWeeks.optional(),
    weeklySupplyCap: fields.weeklySupplyCap.optional(),
    lotRule: fields.lotRule.optional(),
    lotSize: fields.lotSize.optional(),
    version: versionSchema,
  })
  .superRefine(checkLot);
export type MaterialUpdate = z.infer<typeof materialUpdateSchema>;

export const scheduledReceiptInputSchema = z.strictObject({
  weekStart: isoDateSchema,
  qty: quantitySchema.refine((q) => q > 0, 'A receipt quantity must be more than 0.'),
  reference: z.string().trim().max(60, 'Use at most 60 characters.').nullable().default(null),
});
export type ScheduledReceiptInput = z.infer<typeof scheduledReceiptInputSchema>;

/** Body of PUT /api/materials/:id/receipts: the whole list replaces the old one. */
export const receiptsReplaceSchema = z.strictObject({
  version: versionSchema,
  receipts: z.array(scheduledReceiptInputSchema).max(1000, 'At most 1000 receipts.'),
});
export type ReceiptsReplace = z.infer<typeof receiptsReplaceSchema>;

export const materialSortSchema = z.enum(['code', 'name', 'unitCost', 'onHand', 'leadTimeWeeks', 'updatedAt']);
export const materialListQuerySchema = z.strictObject({
  ...pageQueryShape,
  sort: materialSortSchema.default('code'),
  lotRule: lotRuleSchema.optional(),
});
export type MaterialListQuery = z.infer<typeof materialListQuerySchema>;

export const materialPageSchema = pageOf(materialSchema);
export type MaterialPage = z.infer<typeof materialPageSchema>;
