import type { DataSource } from 'typeorm';

/** Back-off between connection attempts while the database is not up yet (ms). */
export const defaultRetryDelaysMs = [500, 1_000, 2_000, 4_000, 8_000, 15_000];

export type ConnectOutcome = 'connected' | 'stopped';

/**
 * Initialises the data source, retrying with back-off (the last delay repeats) until it works
 * or `stopped()` says to give up. Requests answer 503 in the meantime (requireDatabase).
 */
export async function connectWithRetry(
  dataSource: DataSource,
  options: { stopped?: () => boolean; delaysMs?: number[]; log?: (line: string) => void } = {},
): Promise<ConnectOutcome> {
  const delays = options.delaysMs ?? defaultRetryDelaysMs;
  const log = options.log ?? ((line: string) => console.warn(line));
  for (let attempt = 0; !options.stopped?.(); attempt++) {
    try {
      await dataSource.initialize();
      return 'connected';
    } catch (err) {
      const delay = delays[Math.min(attempt, delays.length - 1)];
      log(`millrace api: database not reachable (${(err as Error).message}); retrying in ${delay} ms`);
      await new Promise((r) => setTimeout(r, delay));
    }
  }
  return 'stopped';
}
