import { z } from 'zod';
import { newPasswordSchema, passwordMinLength } from '@millrace/contracts';

/** The policy in words, shown under every new-password field (the API checks the list and the name). */
export const passwordPolicyHint = `At least ${passwordMinLength} characters. Not a commonly used password, and not your e-mail address or name.`;

/** A new password typed twice: the contract's rule, and both entries equal. */
export const newPasswordTwiceSchema = z
  .object({ password: newPasswordSchema, repeat: z.string() })
  .refine((v) => v.password === v.repeat, { path: ['repeat'], message: 'The two entries differ; type the same password twice.' });
