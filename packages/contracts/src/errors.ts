import { z } from 'zod';

/** Machine-readable error codes used in every error response of the API. */
export const errorCodeSchema = z.enum([
  'validation_failed',
  'unauthenticated',
  'forbidden',
  'origin_mismatch',
  'invalid_credentials',
  'not_found',
  'conflict',
  'unprocessable',
  'rate_limited',
  'db_unavailable',
  'payload_too_large',
  'internal_error',
  /** The local mail catcher (development) did not answer (502). */
  'mail_catcher_unavailable',
]);
export type ErrorCode = z.infer<typeof errorCodeSchema>;

/** One bad field of a request: `path` is dotted (`rows.3.qty`). */
export const fieldErrorSchema = z.object({ path: z.string(), message: z.string() });
export type FieldError = z.infer<typeof fieldErrorSchema>;

/** One planning-data issue (422 answers). */
export const dataIssueSchema = z.object({ item: z.string(), message: z.string() });
export type DataIssue = z.infer<typeof dataIssueSchema>;

/** The single JSON shape of every error response. */
export const errorBodySchema = z.object({
  error: z.object({
    // Kept as a string so clients tolerate codes added later; known codes are in errorCodeSchema.
    code: z.string(),
    message: z.string(),
    fields: z.array(fieldErrorSchema).optional(),
    issues: z.array(dataIssueSchema).optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;
