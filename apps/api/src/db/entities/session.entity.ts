import { EntitySchema } from 'typeorm';

/** A lucia session. Table `session` with the columns @lucia-auth/adapter-mysql expects. */
export interface SessionRow {
  id: string;
  userId: number;
  expiresAt: Date;
  person?: unknown;
}

export const SessionEntity = new EntitySchema<SessionRow>({
  name: 'Session',
  tableName: 'session',
  columns: {
    id: { type: 'varchar', length: 255, primary: true },
    userId: { name: 'user_id', type: 'int' },
    expiresAt: { name: 'expires_at', type: 'datetime' },
  },
  relations: {
    person: {
      type: 'many-to-one',
      target: 'Person',
      joinColumn: { name: 'user_id', foreignKeyConstraintName: 'fk_session_person' },
      onDelete: 'CASCADE',
      onUpdate: 'RESTRICT',
    },
  },
  indices: [{ name: 'ix_session_user', columns: ['userId'] }],
});
