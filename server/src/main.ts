// Starts Thalpos: migrations, demo data, the fake GitHub and fake SMTP server when needed, the
// outbox worker, then the HTTP server.
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { loadConfig, type AppConfig } from './config/env';
import { connectDatabase } from './db/client';
import { ensureStarterRelease } from './db/load-starter';
import { runMigrations } from './db/migrate';
import { ensureDemoRelease } from './db/demo-release';
import { seedDemoData } from './db/seed-demo';
import type { FakeGithub } from './fakes/github-fake';
import { createLogger } from './lib/logger';
import { startMail } from './modules/mail/mail-startup';
import { startLocalSourceServices } from './modules/sources/sources-startup';

async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger(config.logLevel);
  logSecuritySettings(config, logger);
  // Migrations need the schema owner; the app itself connects as a role that owns nothing.
  const owner = connectDatabase(config.migrationDatabaseUrl, logger);
  try {
    await runMigrations(owner.db);
  } finally {
    await owner.pool.end();
  }
  const database = connectDatabase(config.databaseUrl, logger);
  const starter = await ensureStarterRelease(database.db);
  if (starter.loaded) logger.info(starter, 'starter dataset loaded and published');
  if (config.demoData) {
    await seedDemoData(database.db);
    // Not in the test template, where 2026.1 stays the newest release and tests publish their own.
    const demo = await ensureDemoRelease(database.db);
    if (demo.published) logger.info(demo, 'demo release published');
  }

  let fake: FakeGithub | null = null;
  if (!config.github && !config.fakeGithubUrl) {
    // Development code, loaded only when asked for: the production bundle does not contain it.
    const { startFakeGithub } = await import('./fakes/github-fake');
    fake = await startFakeGithub({
      port: config.fakeGithubPort,
      callbackUrls: ownCallbackUrls(config),
    });
    logger.info({ url: fake.url }, 'local fake GitHub sign-in provider started (loopback only)');
  }

  const mail = await startMail({ config, db: database.db, logger });

  const local = await startLocalSourceServices(config, logger);

  const app = createApp({ config: local.config, database, logger, fakeGithubUrl: fake?.url });
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
      await mail.stop();
      await fake?.stop();
      await local.stop();
      await database.pool.end();
      process.exit(0);
    });
    server.closeIdleConnections();
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}

/**
 * The callback URLs this server can be reached at, the only ones the local stand-in accepts
 * (on a random port, PORT=0, any loopback origin with the callback path).
 */
function ownCallbackUrls(config: AppConfig): string[] | undefined {
  if (config.port === 0) return undefined;
  const hosts = ['127.0.0.1', 'localhost', '[::1]'].includes(config.host)
    ? ['127.0.0.1', 'localhost']
    : [config.host];
  return hosts.map((h) => `http://${h}:${config.port}/auth/github/callback`);
}

/** Says plainly at start-up what the proxy setting implies, so a TLS deployment cannot miss it. */
function logSecuritySettings(config: AppConfig, logger: ReturnType<typeof createLogger>): void {
  if (config.trustProxy) {
    logger.info('TRUST_PROXY=1: client address and https from the proxy; Secure cookies, HSTS');
  } else if (config.env === 'production') {
    logger.warn(
      'TRUST_PROXY is not set: cookies are not Secure, no HSTS, and behind a proxy every caller ' +
        'shares one rate-limit bucket. Set TRUST_PROXY=1 when a TLS proxy serves this site.',
    );
  }
}

main().catch((err: unknown) => {
  process.stderr.write(
    `Thalpos failed to start: ${err instanceof Error ? err.message : String(err)}\n`,
  );
  process.exit(1);
});
