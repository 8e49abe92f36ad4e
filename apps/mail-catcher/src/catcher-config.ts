import path from 'node:path';

/** Where the catcher listens and keeps its messages. Always loopback: it has no authentication. */
export interface CatcherConfig {
  smtpPort: number;
  httpPort: number;
  mailDir: string;
}

export const LOOPBACK = '127.0.0.1';

function readPort(env: NodeJS.ProcessEnv, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`${name} must be a port number from 0 to 65535, got "${raw}".`);
  }
  return port;
}

/**
 * MAIL_CATCHER_SMTP_PORT (2525), MAIL_CATCHER_HTTP_PORT (2580), MAIL_CATCHER_DIR
 * (<repo>/.millrace/mail, resolved against the current directory when relative).
 */
export function readCatcherConfig(env: NodeJS.ProcessEnv = process.env, cwd = process.cwd()): CatcherConfig {
  return {
    smtpPort: readPort(env, 'MAIL_CATCHER_SMTP_PORT', 2525),
    httpPort: readPort(env, 'MAIL_CATCHER_HTTP_PORT', 2580),
    mailDir: path.resolve(cwd, env.MAIL_CATCHER_DIR || '.millrace/mail'),
  };
}
