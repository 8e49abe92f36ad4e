import { randomBytes } from 'node:crypto';
import mysql from 'mysql2/promise';
import type { DataSource } from 'typeorm';
import type { DbConfig } from '../../src/config';
import { createDataSource } from '../../src/db/data-source';

/**
 * A throw-away database per suite file: DB_* from the environment (the README's test command
 * sets them; by hand, point them at any MariaDB you may create databases on). The database
 * name is DB_NAME plus a random suffix, so suites and parallel runs never collide.
 */
export function testDbBaseConfig(env: NodeJS.ProcessEnv = process.env): DbConfig {
  const missing = ['DB_USER', 'DB_NAME'].filter((k) => !env[k]);
  if (missing.length > 0) {
    throw new Error(
      `API tests need a MariaDB: set ${missing.join(', ')} (and DB_HOST, DB_PORT, DB_PASSWORD). ` +
        'The README test command sets them for a throw-away instance.',
    );
  }
  return {
    host: env.DB_HOST || '127.0.0.1',
    port: Number(env.DB_PORT || 3306),
    name: env.DB_NAME!,
    user: env.DB_USER!,
    password: env.DB_PASSWORD ?? '',
  };
}

export interface TestDatabase {
  config: DbConfig;
  /** Initialised, fully migrated (never synchronised). */
  dataSource: DataSource;
  /** Destroys the data source and drops the database. */
  drop(): Promise<void>;
}

async function adminQuery(base: DbConfig, sql: string): Promise<void> {
  const conn = await mysql.createConnection({ host: base.host, port: base.port, user: base.user, password: base.password });
  try {
    await conn.query(sql);
  } finally {
    await conn.end();
  }
}

/** Creates an empty database (no tables at all). */
export async function createEmptyDatabase(base = testDbBaseConfig()): Promise<{ config: DbConfig; drop(): Promise<void> }> {
  const name = `${base.name.slice(0, 40)}_t${randomBytes(5).toString('hex')}`;
  await adminQuery(base, `CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  return { config: { ...base, name }, drop: () => adminQuery(base, `DROP DATABASE IF EXISTS \`${name}\``) };
}

/** Creates a database, runs every migration on it, and returns the connected data source. */
export async function createTestDatabase(base = testDbBaseConfig()): Promise<TestDatabase> {
  const empty = await createEmptyDatabase(base);
  const dataSource = createDataSource(empty.config);
  try {
    await dataSource.initialize();
    await dataSource.runMigrations({ transaction: 'each' });
  } catch (err) {
    if (dataSource.isInitialized) await dataSource.destroy();
    await empty.drop();
    throw err;
  }
  return {
    config: empty.config,
    dataSource,
    async drop() {
      if (dataSource.isInitialized) await dataSource.destroy();
      await empty.drop();
    },
  };
}
