import type { DataSource } from 'typeorm';

export type DatabaseState = 'up' | 'down';

/** Longest a health probe waits for the database (ms). */
const probeTimeoutMs = 3_000;

/** Asks the database a trivial question; 'down' on any failure or after the probe timeout. */
export async function checkDatabase(dataSource: DataSource): Promise<DatabaseState> {
  if (!dataSource.isInitialized) return 'down';
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<DatabaseState>((resolve) => {
    timer = setTimeout(() => resolve('down'), probeTimeoutMs);
  });
  const probe = dataSource.query('SELECT 1 AS ok').then(
    () => 'up' as const,
    () => 'down' as const,
  );
  try {
    return await Promise.race([probe, timeout]);
  } finally {
    clearTimeout(timer);
  }
}
