import { z } from 'zod';
import { roleSchema } from './roles';

/** Body of POST /api/auth/sign-in. */
export const signInSchema = z.strictObject({
  email: z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address.' })),
  password: z.string().min(1, 'Enter your password.').max(1024, 'Password is too long.'),
});
export type SignIn = z.infer<typeof signInSchema>;

/** Answer of GET /api/me and of a successful sign-in. */
export const meSchema = z.object({
  email: z.string(),
  name: z.string(),
  role: roleSchema,
});
export type Me = z.infer<typeof meSchema>;

/**
 * Answer of GET /api/session (open): whether this browser has a session, and whose. Unlike
 * GET /api/me (401 without a session), it always answers 200, so the planner can ask before
 * anyone has signed in without an error answer.
 */
export const sessionStateSchema = z.discriminatedUnion('signedIn', [
  z.object({ signedIn: z.literal(false) }),
  z.object({ signedIn: z.literal(true), person: meSchema }),
]);
export type SessionState = z.infer<typeof sessionStateSchema>;
