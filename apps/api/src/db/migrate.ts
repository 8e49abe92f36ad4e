import { loadConfig } from '../config';
import { createDataSource } from './data-source';

/** Runs every pending migration, prints what ran, exits 0 (1 with a reason on failure). */
async function main(): Promise<void> {
  const config = loadConfig();
  const dataSource = createDataSource(config.db);
  await dataSource.initialize();
  try {
    const ran = await dataSource.runMigrations({ transaction: 'each' });
    if (ran.length === 0) console.log('migrate: database is up to date');
    for (const m of ran) console.log(`migrate: ran ${m.name}`);
  } finally {
    await dataSource.destroy();
  }
}

main().catch((err: unknown) => {
  console.error(`migrate: failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
