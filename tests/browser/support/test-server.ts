import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { createServer } from 'node:net';
import { resolve } from 'node:path';
import mysql from 'mysql2/promise';
import { repoRoot, type BrowserEnv } from './browser-env';

/** A running Millrace (API + built planner) on a fresh database with the demo plant. */
export interface TestServer {
  url: string;
  dbName: string;
  /** Everything the server printed, for failure messages. */
  output(): string;
  stop(): Promise<void>;
}

async function freePort(): Promise<number> {
  return new Promise((ok, fail) => {
    const s = createServer();
    s.once('error', fail);
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => ok(port));
    });
  });
}

async function adminQuery(env: BrowserEnv, sql: string): Promise<void> {
  const conn = await mysql.createConnection({ host: env.db.host, port: env.db.port, user: env.db.user, password: env.db.password });
  try {
    await conn.query(sql);
  } finally {
    await conn.end();
  }
}

/** Runs a script of the API with the given environment and fails with its output when it fails. */
function runScript(script: string, childEnv: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((ok, fail) => {
    const child = spawn(process.execPath, ['--import', 'tsx', resolve(repoRoot, script)], { cwd: repoRoot, env: childEnv, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (out += d));
    child.on('error', fail);
    child.on('exit', (code) => (code === 0 ? ok() : fail(new Error(`${script} exited with ${code}:\n${out}`))));
  });
}

async function waitForHealth(url: string, child: ChildProcess, output: () => string, seconds = 60): Promise<void> {
  const until = Date.now() + seconds * 1000;
  while (Date.now() < until) {
    if (child.exitCode !== null) throw new Error(`The API exited with ${child.exitCode} before it was ready:\n${output()}`);
    try {
      const res = await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(1000) });
      if (res.status === 200) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`The API did not answer 200 on ${url}/api/health within ${seconds} s:\n${output()}`);
}

/**
 * Creates a database, runs the migrations and the demo-plant loader into it, and starts
 * apps/api/src/server.ts on a free port serving the built planner. `stop()` ends the server and
 * drops the database.
 */
export async function startTestServer(env: BrowserEnv): Promise<TestServer> {
  const dbName = `${env.db.baseName.slice(0, 30)}_ui${randomBytes(4).toString('hex')}`;
  await adminQuery(env, `CREATE DATABASE \`${dbName}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const childEnv: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'test',
    DB_HOST: env.db.host,
    DB_PORT: String(env.db.port),
    DB_NAME: dbName,
    DB_USER: env.db.user,
    DB_PASSWORD: env.db.password,
    HOST: '127.0.0.1',
    PORT: String(port),
    PUBLIC_URL: url,
    SMTP_HOST: env.smtp.host,
    SMTP_PORT: String(env.smtp.port),
    SMTP_SECURE: 'false',
    MAIL_CATCHER_URL: env.mailCatcherUrl,
    PLANNER_DIST: env.plannerDist,
  };
  let child: ChildProcess | null = null;
  let out = '';
  const dropDb = () => adminQuery(env, `DROP DATABASE IF EXISTS \`${dbName}\``);
  try {
    await runScript('apps/api/src/db/migrate.ts', childEnv);
    await runScript('apps/api/src/db/seed-demo.ts', childEnv);
    child = spawn(process.execPath, ['--import', 'tsx', resolve(repoRoot, 'apps/api/src/server.ts')], { cwd: repoRoot, env: childEnv, stdio: ['ignore', 'pipe', 'pipe'] });
    child.stdout!.on('data', (d) => (out += d));
    child.stderr!.on('data', (d) => (out += d));
    await waitForHealth(url, child, () => out);
  } catch (err) {
    if (child && child.exitCode === null) child.kill('SIGKILL');
    await dropDb();
    throw err;
  }
  const running = child;
  return {
    url,
    dbName,
    output: () => out,
    async stop() {
      if (running.exitCode === null) {
        const exited = new Promise<void>((r) => running.once('exit', () => r()));
        running.kill('SIGTERM');
        const timer = setTimeout(() => running.kill('SIGKILL'), 12_000);
        await exited;
        clearTimeout(timer);
      }
      await dropDb();
    },
  };
}
