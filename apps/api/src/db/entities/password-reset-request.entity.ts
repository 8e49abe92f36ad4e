import { EntitySchema } from 'typeorm';
import type { AttemptRow } from '../../auth/attempt-rate-limit';

/** One request for a password-reset link, kept for its rate limit (shared by every API process through MariaDB). */
export const PasswordResetRequestEntity = new EntitySchema<AttemptRow>({
  name: 'PasswordResetRequest',
  tableName: 'password_reset_request',
  columns: {
    id: { type: 'bigint', primary: true, generated: 'increment' },
    email: { type: 'varchar', length: 254 },
    ip: { type: 'varchar', length: 64 },
    attemptedAt: { name: 'requested_at', type: 'datetime', precision: 3 },
  },
  indices: [
    { name: 'ix_password_reset_request_key', columns: ['email', 'ip', 'attemptedAt'] },
    { name: 'ix_password_reset_request_ip', columns: ['ip', 'attemptedAt'] },
  ],
});
