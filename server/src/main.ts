// Starts Thalpos: migrations, demo data, the fake GitHub when needed, then the HTTP server.
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { loadConfig } from './config/env';
import { connectDatabase } from './db/client';
import { runMigrations } from './db/migrate';
import { seedDemoData } from './db/seed-demo';
import { startFakeGithub, type FakeGithub } from './fakes/github-fake';
import { createLogger } from './lib/logger';

async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger(config.logLevel);
  const database = connectDatabase(config.databaseUrl, logger);
  await runMigrations(database.db);
  if (config.demoData) await seedDemoData(database.db);

  let fake: FakeGithub | null = null;
  if (!config.github && !config.fakeGithubUrl) {
    fake = await startFakeGithub(config.fakeGithubPort, config.host);
    logger.info({ url: fake.url }, 'local fake GitHub sign-in provider started');
  }

  const app = createApp({ config, database, logger, fakeGithubUrl: fake?.url });
  const server = app.listen(config.port, config.host, () => {
    const { port } = server.address() as AddressInfo;
    process.stdout.write(`\nThalpos is running at http://${config.host}:${port}\n\n`);
  });

  let stopping = false;
  const shutdown = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'shutting down');
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close(async () => {
      await fake?.stop();
      await database.pool.end();
      process.exit(0);
    });
    server.closeIdleConnections();
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}

main().catch((err: unknown) => {
  process.stderr.write(
    `Thalpos failed to start: ${err instanceof Error ? err.message : String(err)}\n`,
  );
  process.exit(1);
});
