// Applies migrations and the starter release (and the demo data, unless DEMO_DATA=0) to DATABASE_URL, then exits.
import { loadConfig } from '../config/env';
import { connectDatabase } from './client';
import { ensureStarterRelease } from './load-starter';
import { runMigrations } from './migrate';
import { seedDemoData } from './seed-demo';

async function main(): Promise<void> {
  const config = loadConfig();
  const { pool, db } = connectDatabase(config.migrationDatabaseUrl);
  try {
    await runMigrations(db);
    await ensureStarterRelease(db);
    if (config.demoData) await seedDemoData(db);
  } finally {
    await pool.end();
  }
}

main().catch((err: unknown) => {
  process.stderr.write(`migration failed: ${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});
