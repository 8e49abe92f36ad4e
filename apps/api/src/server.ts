import type { Server } from 'node:http';
import { createApp } from './app';
import { deleteExpiredSessions, sweepIntervalMs } from './auth/delete-expired-sessions';
import { ConfigError, loadConfig } from './config';
import { connectWithRetry } from './db/connect-with-retry';
import { createDataSource } from './db/data-source';
import { OutboxSender } from './mail/outbox-sender';
import { createSmtpMailer } from './mail/smtp-mailer';
import { SolverJobRunner } from './solver-jobs/solver-job-runner';
import { closeSheetPrinters } from './shift-sheets/sheet-printer';

function main(): void {
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    console.error(err instanceof ConfigError ? err.message : err);
    process.exit(1);
  }
  const dataSource = createDataSource(config.db);
  const mailer = createSmtpMailer(config.smtp);
  const app = createApp({ dataSource, config, mailer });
  // Background work of this process: solver jobs claimed from the job table, the e-mail outbox.
  const solverJobs = new SolverJobRunner(dataSource);
  const outbox = new OutboxSender(dataSource, mailer);
  let stopping = false;
  const server: Server = app.listen(config.http.port, config.http.host, () => {
    console.log(`millrace api: listening on http://${config.http.host}:${config.http.port} (public URL ${config.http.publicUrl})`);
  });
  server.on('error', (err) => {
    console.error(`millrace api: cannot listen on ${config.http.host}:${config.http.port}: ${err.message}`);
    process.exit(1);
  });
  void connectWithRetry(dataSource, { stopped: () => stopping }).then((outcome) => {
    if (outcome !== 'connected') return;
    console.log('millrace api: database connected');
    solverJobs.start();
    outbox.start();
  });
  const sweep = setInterval(() => {
    if (!dataSource.isInitialized) return;
    deleteExpiredSessions(dataSource).catch((err: Error) => console.warn(`millrace api: session sweep failed: ${err.message}`));
  }, sweepIntervalMs);
  sweep.unref();

  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`millrace api: ${signal} received, stopping`);
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close(async () => {
      await Promise.all([solverJobs.stop(), outbox.stop(), closeSheetPrinters()]).catch(() => undefined);
      if (dataSource.isInitialized) await dataSource.destroy().catch(() => undefined);
      process.exit(0);
    });
    server.closeIdleConnections();
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('unhandledRejection', (reason) => console.error('millrace api: unhandled rejection', reason));
}

main();
