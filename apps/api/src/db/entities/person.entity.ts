import { EntitySchema } from 'typeorm';
import type { Role } from '@millrace/contracts';

/** A person who signs in. Table `person` (also the lucia user table). */
export interface PersonRow {
  id: number;
  email: string;
  name: string;
  role: Role;
  /** argon2id PHC string; null until the person has set a password (invitations). */
  passwordHash: string | null;
  active: boolean;
  version: number;
  createdAt: Date;
  updatedAt: Date;
}

export const PersonEntity = new EntitySchema<PersonRow>({
  name: 'Person',
  tableName: 'person',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    email: { type: 'varchar', length: 254 },
    name: { type: 'varchar', length: 120 },
    role: { type: 'varchar', length: 20 },
    passwordHash: { name: 'password_hash', type: 'varchar', length: 255, nullable: true },
    active: { type: 'boolean', width: 1, default: true },
    version: { type: 'int', default: 1 },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
    updatedAt: { name: 'updated_at', type: 'datetime', precision: 3 },
  },
  indices: [{ name: 'uq_person_email', columns: ['email'], unique: true }],
});
