import { z } from 'zod';
import { hoursSchema } from './numbers';
import { versionSchema } from './paging';

/** One routing step (operation) of a product on a work center. */
export const routingStepSchema = z.object({
  id: z.number().int(),
  sequence: z.number().int(),
  workCenterId: z.number().int(),
  workCenterCode: z.string(),
  workCenterName: z.string(),
  /** standard run hours per unit */
  hoursPerUnit: z.number(),
  /** setup hours per run */
  setupHours: z.number(),
});
export type RoutingStep = z.infer<typeof routingStepSchema>;

export const routingStepInputSchema = z.strictObject({
  sequence: z.number().int('The sequence must be a whole number.').min(1, 'Sequences start at 1.').max(9999, 'At most 9999.'),
  workCenterId: z.number().int('Choose a work center.').positive('Choose a work center.'),
  hoursPerUnit: hoursSchema,
  setupHours: hoursSchema.default(0),
});
export type RoutingStepInput = z.infer<typeof routingStepInputSchema>;

/** Body of PUT /api/products/:id/routing: the whole list replaces the old one, checked against the product's version. */
export const routingReplaceSchema = z
  .strictObject({
    version: versionSchema,
    steps: z.array(routingStepInputSchema).max(100, 'A routing can have at most 100 steps.'),
  })
  .superRefine((r, ctx) => {
    const seen = new Set<number>();
    r.steps.forEach((s, i) => {
      if (seen.has(s.sequence)) {
        ctx.addIssue({ code: 'custom', path: ['steps', i, 'sequence'], message: `Sequence ${s.sequence} is used twice.` });
      }
      seen.add(s.sequence);
    });
  });
export type RoutingReplace = z.infer<typeof routingReplaceSchema>;
