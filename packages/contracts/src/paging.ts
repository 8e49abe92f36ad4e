import { z } from 'zod';

/**
 * Server-side paging, sorting and text filter shared by every master-data list
 * (`?page=1&pageSize=50&sort=code&dir=asc&q=oak`). Each area adds its own `sort` enum and filters.
 */
export const maxPageSize = 5000;

export const sortDirectionSchema = z.enum(['asc', 'desc']);
export type SortDirection = z.infer<typeof sortDirectionSchema>;

/** Fields every list query accepts; spread into an area's strict query object. */
export const pageQueryShape = {
  page: z.coerce.number().int('The page must be a whole number.').min(1, 'Pages start at 1.').default(1),
  pageSize: z.coerce
    .number()
    .int('The page size must be a whole number.')
    .min(1, 'The page size must be at least 1.')
    .max(maxPageSize, `The page size can be at most ${maxPageSize}.`)
    .default(50),
  dir: sortDirectionSchema.default('asc'),
  q: z.string().trim().max(100, 'Search with at most 100 characters.').optional(),
};

/** A query-string boolean: only the words `true` and `false`. */
export const queryBooleanSchema = z.enum(['true', 'false']).transform((v) => v === 'true');

/** One page of a list. */
export function pageOf<T extends z.ZodTypeAny>(item: T) {
  return z.object({
    items: z.array(item),
    total: z.number().int(),
    page: z.number().int(),
    pageSize: z.number().int(),
  });
}
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** Path parameter `:id` of a master-data row. */
export const idParamsSchema = z.strictObject({
  id: z.coerce.number().int('The id must be a whole number.').positive('The id must be a positive whole number.'),
});
export type IdParams = z.infer<typeof idParamsSchema>;

/** Optional `?version=` on DELETE: when sent, the delete only happens if nobody changed the row since. */
export const deleteQuerySchema = z.strictObject({
  version: z.coerce.number().int().nonnegative().optional(),
});
export type DeleteQuery = z.infer<typeof deleteQuerySchema>;

/** The version an update or list save sends back (optimistic locking). */
export const versionSchema = z.number({ error: 'Send the version you read.' }).int().nonnegative();
