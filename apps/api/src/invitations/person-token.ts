import { createHash, randomBytes } from 'node:crypto';
import type { PersonTokenPurpose } from '@millrace/contracts';

/** How long a link stays valid (common practice, no source): days for an invitation, an hour for a reset. */
export const tokenLifetimeMs: Record<PersonTokenPurpose, number> = {
  invitation: 72 * 3_600_000,
  password_reset: 3_600_000,
};

/** A new secret for a link: 32 random bytes, base64url (43 characters). */
export function newTokenSecret(): string {
  return randomBytes(32).toString('base64url');
}

/** What is stored: the SHA-256 of the secret (the secret itself is only in the e-mail). */
export function hashToken(secret: string): string {
  return createHash('sha256').update(secret).digest('hex');
}
