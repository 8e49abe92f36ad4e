import type { Express } from 'express';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import type { Role } from '@millrace/contracts';
import { createApp } from '../../src/app';
import type { Mailer } from '../../src/app-context';
import { loadConfig, type Config } from '../../src/config';
import { createTestDatabase } from './test-db';
import { seedPeople, testPassword, testPeople } from './seed-people';

export type TestAgent = ReturnType<typeof request.agent>;

export interface TestContext {
  app: Express;
  dataSource: DataSource;
  config: Config;
  /** The Origin every state-changing request must carry (PUBLIC_URL). */
  origin: string;
  /** A new supertest agent (keeps cookies, sends Origin) signed in as the test person of `role`. */
  agentFor(role: Role): Promise<TestAgent>;
  /** A new agent with no session (sends Origin). */
  anonymous(): TestAgent;
  close(): Promise<void>;
}

export interface TestContextOptions {
  /** Runs after the migrations and the four test people (see seed-people.ts). */
  seed?: (dataSource: DataSource) => Promise<void>;
  mailer?: Mailer;
  /** Overrides of the parsed configuration (e.g. smtp). The db part is always the test DB. */
  config?: Partial<Omit<Config, 'db'>>;
}

/**
 * The real app on a fresh, migrated MariaDB database with one person per role.
 * Call in beforeAll, and `close()` in afterAll.
 */
export async function createTestContext(options: TestContextOptions = {}): Promise<TestContext> {
  const db = await createTestDatabase();
  try {
    await seedPeople(db.dataSource);
    if (options.seed) await options.seed(db.dataSource);
  } catch (err) {
    await db.drop();
    throw err;
  }
  const base = loadConfig({ ...process.env, NODE_ENV: 'test', DB_NAME: db.config.name, DB_USER: db.config.user });
  const config: Config = { ...base, plannerDist: undefined, ...options.config, db: db.config };
  const app = createApp({ dataSource: db.dataSource, config, mailer: options.mailer });
  const origin = config.http.publicUrl;
  const anonymous = () => request.agent(app).set('Origin', origin);
  return {
    app,
    dataSource: db.dataSource,
    config,
    origin,
    anonymous,
    async agentFor(role) {
      const agent = anonymous();
      const res = await agent.post('/api/auth/sign-in').send({ email: testPeople[role].email, password: testPassword });
      if (res.status !== 200) throw new Error(`test sign-in as ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
      return agent;
    },
    close: () => db.drop(),
  };
}
