import { z } from 'zod';
import { roleSchema } from './roles';

/** Shortest password the policy accepts (common practice, no source; issue 6 asks for 12). */
export const passwordMinLength = 12;
/** Longest password accepted (bounds the hashing work per request). */
export const passwordMaxLength = 256;

/** Shape-level password rule; the API also rejects passwords on a common-password list. */
export const newPasswordSchema = z
  .string()
  .min(passwordMinLength, `Use at least ${passwordMinLength} characters.`)
  .max(passwordMaxLength, `Use at most ${passwordMaxLength} characters.`);

/** Most work centers one person can be assigned to (far above any plant Millrace is made for). */
export const maxWorkCentersPerPerson = 500;

/**
 * Ids of the work centers a person is assigned to, each once. Any role may hold assignments
 * (they survive a change of role), but only floor leads use them: a floor lead with
 * assignments sees the shift sheets of those work centers only and the release e-mail names
 * them; a floor lead with none sees every work center. Deleting a work center removes it from
 * everyone's assignments.
 */
export const workCenterIdsSchema = z
  .array(z.number().int().positive('A work center id is a positive whole number.'))
  .max(maxWorkCentersPerPerson, `Assign at most ${maxWorkCentersPerPerson} work centers.`)
  .superRefine((ids, ctx) => {
    ids.forEach((id, i) => {
      if (ids.indexOf(id) !== i) ctx.addIssue({ code: 'custom', path: [i], message: `Work center id ${id} is listed twice.` });
    });
  });

/** A person as the API shows it (never the password hash). */
export const personSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  active: z.boolean(),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
  /** assigned work centers (see workCenterIdsSchema); GET, POST and PATCH /api/people always send it */
  workCenterIds: z.array(z.number().int()).optional(),
});
export type Person = z.infer<typeof personSchema>;

/** Body of POST /api/people (admin only). Invitations by e-mail come later. */
export const personCreateSchema = z.strictObject({
  email: z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address.' })).pipe(z.string().max(254)),
  name: z.string().trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.'),
  role: roleSchema,
  password: newPasswordSchema.optional(),
});
export type PersonCreate = z.infer<typeof personCreateSchema>;

/**
 * Body of PATCH /api/people/:id: change role, active, name and/or the assigned work centers
 * (the whole list, replacing the old one; [] clears it), sending the version read.
 */
export const personUpdateSchema = z
  .strictObject({
    role: roleSchema.optional(),
    active: z.boolean().optional(),
    name: z.string().trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.').optional(),
    workCenterIds: workCenterIdsSchema.optional(),
    version: z.number().int().nonnegative(),
  })
  .refine((v) => v.role !== undefined || v.active !== undefined || v.name !== undefined || v.workCenterIds !== undefined, {
    message: 'Send at least one of role, active, name or workCenterIds.',
    path: ['role'],
  });
export type PersonUpdate = z.infer<typeof personUpdateSchema>;

/** Path parameter `:id` of a person. */
export const personIdParamsSchema = z.strictObject({
  id: z.coerce.number().int().positive('The id must be a positive whole number.'),
});

/** Body of PUT /api/me/password (self-service change). */
export const passwordChangeSchema = z.strictObject({
  currentPassword: z.string().min(1, 'Enter your current password.').max(passwordMaxLength),
  newPassword: newPasswordSchema,
});
export type PasswordChange = z.infer<typeof passwordChangeSchema>;
