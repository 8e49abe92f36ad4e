import { z } from 'zod';

/**
 * GET /api/dev/mail and /api/dev/mail/:id (admin, development only): the messages the local mail
 * catcher caught, read through the API so the admin needs no other tool.
 */
export const caughtMailSummarySchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  /** The message's Date header as ISO time (falls back to when the catcher received it). */
  date: z.string(),
});
export type CaughtMailSummary = z.infer<typeof caughtMailSummarySchema>;

export const caughtMailSchema = caughtMailSummarySchema.extend({
  cc: z.array(z.string()),
  text: z.string(),
  /** The HTML part, or null for a plain-text message. Shown only in a sandboxed frame. */
  html: z.string().nullable(),
});
export type CaughtMail = z.infer<typeof caughtMailSchema>;

/** The catcher's ids are its own file names: letters, digits, dot, dash, underscore. */
export const caughtMailParamsSchema = z.strictObject({
  id: z.string().regex(/^[A-Za-z0-9._-]{1,200}$/, 'A caught message id is letters, digits, dots, dashes or underscores.'),
});
