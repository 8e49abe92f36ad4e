import { z } from 'zod';
import { qtyPerSchema, scrapPctSchema } from './numbers';
import { versionSchema } from './paging';

/**
 * One bill-of-materials line of a parent product: exactly one of component product (a
 * sub-assembly or other product) or purchased material. Component use per parent unit is
 * qtyPer ÷ (1 − scrapPct/100) (Orlicky, MRP: gross requirements divided by (1 − scrap)).
 */
export const bomLineSchema = z.object({
  id: z.number().int(),
  position: z.number().int(),
  componentProductId: z.number().int().nullable(),
  componentProductCode: z.string().nullable(),
  componentProductName: z.string().nullable(),
  materialId: z.number().int().nullable(),
  materialCode: z.string().nullable(),
  materialName: z.string().nullable(),
  /** unit of the component (product or material) */
  unit: z.string(),
  qtyPer: z.number(),
  scrapPct: z.number(),
});
export type BomLine = z.infer<typeof bomLineSchema>;

const idOrNull = z.number().int('Choose from the list.').positive('Choose from the list.').nullable();

export const bomLineInputSchema = z
  .strictObject({
    componentProductId: idOrNull.default(null),
    materialId: idOrNull.default(null),
    qtyPer: qtyPerSchema,
    scrapPct: scrapPctSchema.default(0),
  })
  .superRefine((l, ctx) => {
    if ((l.componentProductId === null) === (l.materialId === null)) {
      ctx.addIssue({
        code: 'custom',
        path: ['componentProductId'],
        message: 'Choose either a component product or a material (exactly one).',
      });
    }
  });
export type BomLineInput = z.infer<typeof bomLineInputSchema>;

/** Body of PUT /api/products/:id/bom: the whole list replaces the old one, checked against the product's version. */
export const bomReplaceSchema = z.strictObject({
  version: versionSchema,
  lines: z.array(bomLineInputSchema).max(500, 'A bill of materials can have at most 500 lines.'),
});
export type BomReplace = z.infer<typeof bomReplaceSchema>;
