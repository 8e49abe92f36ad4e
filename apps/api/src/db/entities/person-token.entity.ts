import { EntitySchema } from 'typeorm';
import type { PersonTokenPurpose } from '@millrace/contracts';

/**
 * A single-use link sent by e-mail (invitation, password reset). Table `person_token`. Only the
 * SHA-256 of the secret is stored; the secret itself exists only in the e-mail.
 */
export interface PersonTokenRow {
  id: number;
  personId: number;
  purpose: PersonTokenPurpose;
  tokenHash: string;
  expiresAt: Date;
  usedAt: Date | null;
  createdBy: number | null;
  createdAt: Date;
}

export const PersonTokenEntity = new EntitySchema<PersonTokenRow>({
  name: 'PersonToken',
  tableName: 'person_token',
  columns: {
    id: { type: 'bigint', primary: true, generated: 'increment' },
    personId: { name: 'person_id', type: 'int' },
    purpose: { type: 'varchar', length: 20 },
    tokenHash: { name: 'token_hash', type: 'char', length: 64, unique: true },
    expiresAt: { name: 'expires_at', type: 'datetime', precision: 3 },
    usedAt: { name: 'used_at', type: 'datetime', precision: 3, nullable: true },
    createdBy: { name: 'created_by', type: 'int', nullable: true },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
  },
});
