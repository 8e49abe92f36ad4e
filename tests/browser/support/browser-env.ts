import { existsSync } from 'node:fs';
import { resolve } from 'node:path';

/** The repository root (tests/browser/support → ../../..). */
export const repoRoot = resolve(import.meta.dirname, '../../..');

/** What the browser suites need from the environment; the README's test command sets every one. */
export interface BrowserEnv {
  db: { host: string; port: number; user: string; password: string; baseName: string };
  smtp: { host: string; port: number };
  mailCatcherUrl: string;
  plannerDist: string;
  chromiumPath: string;
}

export function readBrowserEnv(env: NodeJS.ProcessEnv = process.env): BrowserEnv {
  const missing = ['DB_USER', 'DB_NAME', 'SMTP_PORT', 'MAIL_CATCHER_URL', 'PLANNER_DIST'].filter((k) => !env[k]);
  if (missing.length > 0) {
    throw new Error(
      `The browser flows need ${missing.join(', ')} (and DB_HOST, DB_PORT, DB_PASSWORD, SMTP_HOST, CHROMIUM_PATH). ` +
        'The README test command (./docker-free-start.sh test) exports them; by hand, set them to a MariaDB you may create databases on, ' +
        'a running mail catcher and the built planner (npm run build -w apps/planner).',
    );
  }
  const plannerDist = resolve(env.PLANNER_DIST!);
  if (!existsSync(resolve(plannerDist, 'index.html'))) throw new Error(`PLANNER_DIST=${plannerDist} has no index.html; build the planner first.`);
  const chromiumPath = env.CHROMIUM_PATH || '/usr/bin/chromium';
  if (!existsSync(chromiumPath)) throw new Error(`No Chromium at ${chromiumPath}; install Debian's chromium or set CHROMIUM_PATH.`);
  return {
    db: { host: env.DB_HOST || '127.0.0.1', port: Number(env.DB_PORT || 3306), user: env.DB_USER!, password: env.DB_PASSWORD ?? '', baseName: env.DB_NAME! },
    smtp: { host: env.SMTP_HOST || '127.0.0.1', port: Number(env.SMTP_PORT) },
    mailCatcherUrl: env.MAIL_CATCHER_URL!.replace(/\/$/, ''),
    plannerDist,
    chromiumPath,
  };
}
