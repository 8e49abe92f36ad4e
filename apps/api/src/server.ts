import type { Server } from 'node:http';
import type { DataSource } from 'typeorm';
import { createApp } from './app';
import { ConfigError, loadConfig } from './config';
import { createDataSource } from './db/data-source';

/** Back-off between connection attempts while the database is not up yet (ms). */
const retryDelaysMs = [500, 1_000, 2_000, 4_000, 8_000, 15_000];

/** Connects in the background, retrying for ever with back-off; requests get 503 meanwhile. */
async function connectWithRetry(dataSource: DataSource, stopped: () => boolean): Promise<void> {
  for (let attempt = 0; !stopped(); attempt++) {
    try {
      await dataSource.initialize();
      console.log('millrace api: database connected');
      return;
    } catch (err) {
      const delay = retryDelaysMs[Math.min(attempt, retryDelaysMs.length - 1)];
      console.warn(`millrace api: database not reachable (${(err as Error).message}); retrying in ${delay} ms`);
      await new Promise((r) => setTimeout(r, delay));
    }
  }
}

function main(): void {
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    console.error(err instanceof ConfigError ? err.message : err);
    process.exit(1);
  }
  const dataSource = createDataSource(config.db);
  const app = createApp({ dataSource, config });
  let stopping = false;
  const server: Server = app.listen(config.http.port, config.http.host, () => {
    console.log(`millrace api: listening on http://${config.http.host}:${config.http.port} (public URL ${config.http.publicUrl})`);
  });
  server.on('error', (err) => {
    console.error(`millrace api: cannot listen on ${config.http.host}:${config.http.port}: ${err.message}`);
    process.exit(1);
  });
  void connectWithRetry(dataSource, () => stopping);

  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`millrace api: ${signal} received, stopping`);
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close(async () => {
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
