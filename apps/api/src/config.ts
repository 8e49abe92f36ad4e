import { z } from 'zod';

/**
 * The API's configuration: one zod schema over the environment (see /work/team/API.md).
 * `loadConfig` fails fast with a readable list of every bad variable.
 */
const booleanFromEnv = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'], { message: 'Use true or false.' })
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

const port = z.coerce.number({ message: 'Use a port number.' }).int().min(1).max(65535);

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  DB_HOST: z.string().min(1).default('127.0.0.1'),
  DB_PORT: port.default(3306),
  DB_NAME: z.string().regex(/^[A-Za-z0-9_]{1,64}$/, 'Use letters, digits and _ only (at most 64).'),
  DB_USER: z.string().min(1, 'Set the database user.'),
  DB_PASSWORD: z.string().default(''),
  PORT: port.default(8080),
  HOST: z.string().min(1).default('127.0.0.1'),
  PUBLIC_URL: z.url({ message: 'Use an absolute http(s) URL.' }).default('http://127.0.0.1:8080'),
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: port.default(2525),
  SMTP_SECURE: booleanFromEnv.default(false),
  MAIL_FROM: z.string().min(3).default('Millrace <millrace@localhost>'),
  MAIL_CATCHER_URL: z.url().optional(),
  PLANNER_DIST: z.string().min(1).optional(),
  /** Chromium that renders shift-sheet PDFs (Debian's package by default) */
  CHROMIUM_PATH: z.string().min(1).default('/usr/bin/chromium'),
});

export interface DbConfig {
  host: string;
  port: number;
  name: string;
  user: string;
  password: string;
}

export interface Config {
  nodeEnv: 'development' | 'test' | 'production';
  db: DbConfig;
  http: { host: string; port: number; publicUrl: string };
  smtp: { host: string; port: number; secure: boolean; from: string };
  mailCatcherUrl?: string;
  plannerDist?: string;
  chromiumPath: string;
}

export class ConfigError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ConfigError';
  }
}

/** Parses the environment; throws ConfigError naming each bad variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  // Treat empty strings as "not set" so defaults apply (`FOO= node …`).
  const cleaned = Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined && v !== ''));
  const parsed = envSchema.safeParse(cleaned);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.') || '(env)'}: ${i.message}`);
    throw new ConfigError(`Millrace API: the environment is not usable:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  return {
    nodeEnv: e.NODE_ENV,
    db: { host: e.DB_HOST, port: e.DB_PORT, name: e.DB_NAME, user: e.DB_USER, password: e.DB_PASSWORD },
    http: { host: e.HOST, port: e.PORT, publicUrl: e.PUBLIC_URL.replace(/\/+$/, '') },
    smtp: { host: e.SMTP_HOST, port: e.SMTP_PORT, secure: e.SMTP_SECURE, from: e.MAIL_FROM },
    mailCatcherUrl: e.MAIL_CATCHER_URL,
    plannerDist: e.PLANNER_DIST,
    chromiumPath: e.CHROMIUM_PATH,
  };
}
