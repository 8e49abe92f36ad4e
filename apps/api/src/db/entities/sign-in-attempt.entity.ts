import { EntitySchema } from 'typeorm';
import type { AttemptRow } from '../../auth/attempt-rate-limit';

/** One failed sign-in, kept for the rate limit (shared by every API process through MariaDB). */
export type SignInAttemptRow = AttemptRow;

export const SignInAttemptEntity = new EntitySchema<SignInAttemptRow>({
  name: 'SignInAttempt',
  tableName: 'sign_in_attempt',
  columns: {
    id: { type: 'bigint', primary: true, generated: 'increment' },
    email: { type: 'varchar', length: 254 },
    ip: { type: 'varchar', length: 64 },
    attemptedAt: { name: 'attempted_at', type: 'datetime', precision: 3 },
  },
  indices: [{ name: 'ix_sign_in_attempt_key', columns: ['email', 'ip', 'attemptedAt'] }],
});
