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
