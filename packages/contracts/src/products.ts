import { z } from 'zod';
import { codeSchema, nameSchema, unitSchema } from './codes';
import { moneySchema, quantitySchema } from './numbers';
import { pageOf, pageQueryShape, queryBooleanSchema, versionSchema } from './paging';
import { bomLineSchema } from './bom';
import { routingStepSchema } from './routings';

/** finished goods are sold; sub-assemblies are made to go into other products. */
export const productKindSchema = z.enum(['finished', 'subassembly']);
export type ProductKind = z.infer<typeof productKindSchema>;

const fields = {
  code: codeSchema,
  name: nameSchema,
  unit: unitSchema,
  kind: productKindSchema,
  /** selling price per unit */
  price: moneySchema,
  /** holding cost in % of the item's value per year (20–40 % is usual; a supply-chain glossary) */
  holdingCostRatePct: z.number().min(0, 'Cannot be negative.').max(200, 'At most 200 % a year.'),
  safetyStock: quantitySchema,
  /** made in multiples of this quantity (1 = any whole number) */
  batchMultiple: z.number().gt(0, 'The batch multiple must be more than 0.').max(1e6, 'At most 1,000,000.'),
  openingStock: quantitySchema,
  /** penalty per unit of a firm order shipped late, per week late */
  latePenalty: moneySchema,
  /** changeover family (products of one family follow each other without a full changeover) */
  family: z.string().trim().max(40, 'Use at most 40 characters.').nullable(),
  active: z.boolean(),
};

export const productSchema = z.object({
  id: z.number().int(),
  code: z.string(),
  name: z.string(),
  unit: z.string(),
  kind: productKindSchema,
  price: z.number(),
  holdingCostRatePct: z.number(),
  safetyStock: z.number(),
  batchMultiple: z.number(),
  openingStock: z.number(),
  latePenalty: z.number(),
  family: z.string().nullable(),
  active: z.boolean(),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Product = z.infer<typeof productSchema>;

/** A product with its bill of materials and routing (GET /api/products/:id). */
export const productDetailSchema = productSchema.extend({
  bom: z.array(bomLineSchema),
  routing: z.array(routingStepSchema),
});
export type ProductDetail = z.infer<typeof productDetailSchema>;

/** Body of POST /api/products. */
export const productCreateSchema = z.strictObject({
  ...fields,
  price: fields.price.default(0),
  holdingCostRatePct: fields.holdingCostRatePct.default(24),
  safetyStock: fields.safetyStock.default(0),
  batchMultiple: fields.batchMultiple.default(1),
  openingStock: fields.openingStock.default(0),
  latePenalty: fields.latePenalty.default(0),
  family: fields.family.default(null),
  active: fields.active.default(true),
});
export type ProductCreate = z.infer<typeof productCreateSchema>;

/** Body of PATCH /api/products/:id: any fields, with the version read. */
export const productUpdateSchema = z.strictObject({
  code: fields.code.optional(),
  name: fields.name.optional(),
  unit: fields.unit.optional(),
  kind: fields.kind.optional(),
  price: fields.price.optional(),
  holdingCostRatePct: fields.holdingCostRatePct.optional(),
  safetyStock: fields.safetyStock.optional(),
  batchMultiple: fields.batchMultiple.optional(),
  openingStock: fields.openingStock.optional(),
  latePenalty: fields.latePenalty.optional(),
  family: fields.family.optional(),
  active: fields.active.optional(),
  version: versionSchema,
});
export type ProductUpdate = z.infer<typeof productUpdateSchema>;

export const productSortSchema = z.enum(['code', 'name', 'kind', 'family', 'price', 'updatedAt']);
/** Query of GET /api/products. */
export const productListQuerySchema = z.strictObject({
  ...pageQueryShape,
  sort: productSortSchema.default('code'),
  kind: productKindSchema.optional(),
  family: z.string().trim().max(40).optional(),
  active: queryBooleanSchema.optional(),
});
export type ProductListQuery = z.infer<typeof productListQuerySchema>;

export const productPageSchema = pageOf(productSchema);
export type ProductPage = z.infer<typeof productPageSchema>;
