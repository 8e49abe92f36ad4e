import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { createDataSource, migrations } from '../src/db/data-source';
import { createEmptyDatabase } from './support/test-db';

let db: Awaited<ReturnType<typeof createEmptyDatabase>>;
let ds: DataSource;
beforeAll(async () => {
  db = await createEmptyDatabase();
  ds = createDataSource(db.config);
  await ds.initialize();
});
afterAll(async () => {
  if (ds?.isInitialized) await ds.destroy();
  await db?.drop();
});

async function columns(table: string): Promise<string[]> {
  const rows: Array<{ COLUMN_NAME: string }> = await ds.query(
    'SELECT COLUMN_NAME FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = ? ORDER BY ORDINAL_POSITION',
    [table],
  );
  return rows.map((r) => r.COLUMN_NAME);
}

describe('migrations', () => {
  it('when run on an empty database, then every listed migration runs once and the schema matches the entities', async () => {
    const tablesBefore = await ds.query('SHOW TABLES');
    expect(tablesBefore).toEqual([]);
    const ran = await ds.runMigrations({ transaction: 'each' });
    expect(ran.length).toBe((migrations as unknown[]).length);
    expect(await ds.showMigrations()).toBe(false);
    // Entities and tables agree: TypeORM would need no change to the schema.
    const pending = await ds.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((q) => q.query)).toEqual([]);
  });

  it('when run again, then nothing runs', async () => {
    expect(await ds.runMigrations({ transaction: 'each' })).toEqual([]);
  });

  it('when lucia reads sessions, then the tables have the columns @lucia-auth/adapter-mysql uses', async () => {
    expect(await columns('session')).toEqual(['id', 'user_id', 'expires_at']);
    expect(await columns('person')).toEqual(
      expect.arrayContaining(['id', 'email', 'name', 'role', 'password_hash', 'active', 'version', 'created_at', 'updated_at']),
    );
  });
});
