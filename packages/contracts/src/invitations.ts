import { z } from 'zod';
import { newPasswordSchema } from './people';
import { roleSchema } from './roles';

/** What a single-use e-mailed link is for. */
export const personTokenPurposeSchema = z.enum(['invitation', 'password_reset']);
export type PersonTokenPurpose = z.infer<typeof personTokenPurposeSchema>;

const email = z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address.' })).pipe(z.string().max(254));
/** The secret from the link: 43 base64url characters (32 random bytes). */
const token = z.string().regex(/^[A-Za-z0-9_-]{43}$/, 'This link is not valid; ask for a new one.');

/** Body of POST /api/invitations (admin): the person gets an e-mail with a link to set a password. */
export const invitationCreateSchema = z.strictObject({
  email,
  name: z.string().trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.'),
  role: roleSchema,
});
export type InvitationCreate = z.infer<typeof invitationCreateSchema>;

/** Answer of POST /api/invitations (the link itself only travels by e-mail). */
export const invitationSentSchema = z.object({ personId: z.number().int(), email: z.string(), expiresAt: z.string() });
export type InvitationSent = z.infer<typeof invitationSentSchema>;

/** GET /api/invitations/:token and /api/password-resets/:token — what an open link is for, before the person sets a password. */
export const personTokenParamsSchema = z.strictObject({ token });
export const personTokenInfoSchema = z.object({
  purpose: personTokenPurposeSchema,
  email: z.string(),
  name: z.string(),
  /** The role the person signs in with (shown on the welcome page). */
  role: roleSchema,
  expiresAt: z.string(),
});
export type PersonTokenInfo = z.infer<typeof personTokenInfoSchema>;

/** Body of POST /api/invitations/accept and POST /api/password-resets/confirm. */
export const setPasswordWithTokenSchema = z.strictObject({ token, password: newPasswordSchema });
export type SetPasswordWithToken = z.infer<typeof setPasswordWithTokenSchema>;

/** Body of POST /api/password-resets/request: always answered 202, whether or not the address is known. */
export const passwordResetRequestSchema = z.strictObject({ email });
export type PasswordResetRequest = z.infer<typeof passwordResetRequestSchema>;
