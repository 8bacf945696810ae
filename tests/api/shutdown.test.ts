import { execFileSync, spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { Client } from 'pg';
import { PROJECT_ROOT } from '../../server/src/config/paths';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

/** Runs the real entry point until it prints its address; the caller stops it. */
async function startServer(env: Record<string, string>) {
  const child = spawn(path.join(PROJECT_ROOT, 'node_modules/.bin/tsx'), ['server/src/main.ts'], {
    cwd: PROJECT_ROOT,
    env: { ...process.env, PORT: '0', LOG_LEVEL: 'silent', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  let output = '';
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`no start-up line in: ${output}`)), 60_000);
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      const m = /running at (http:\/\/\S+)/.exec(output);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    };
    child.stdout.on('data', onData);
    child.stderr.on('data', onData);
    child.on('exit', () => reject(new Error(`exited early: ${output}`)));
  });
  return { url, exited, stop: () => child.kill('SIGTERM') };
}

// The real entry point as its own process: it starts, serves, and on SIGTERM closes cleanly.
describe('server process', () => {
  let db: TestDatabase;
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(() => db.drop());

  it('applies migrations at start-up, serves, and exits 0 on SIGTERM', async () => {
    const server = await startServer({ DATABASE_URL: db.url, MIGRATION_DATABASE_URL: db.ownerUrl });
    const health = await fetch(`${server.url}/api/health`);
    expect(await health.json()).toEqual({ status: 'ok', db: 'ok' });
    server.stop();
    await expect(server.exited).resolves.toBe(0);
  }, 60_000);

  it('starts on an empty database: migrations as the owner, everything else as the app role', async () => {
    // A database as `npm start` prepares it: empty, with the app role granted by the script.
    const name = `thalpos_empty_${randomBytes(4).toString('hex')}`;
    const admin = new Client({ connectionString: process.env.TEST_ADMIN_DATABASE_URL });
    await admin.connect();
    try {
      await admin.query(`create database "${name}"`);
      const port = new URL(process.env.TEST_ADMIN_DATABASE_URL!).port;
      execFileSync('bash', ['-c', 'source scripts/lib.sh && grant_app_role "$1"', '_', name], {
        cwd: PROJECT_ROOT,
        env: { ...process.env, CLUSTER_PORT: port },
        stdio: 'pipe',
      });
      const at = (base: string) => {
        const u = new URL(base);
        u.pathname = `/${name}`;
        return u.toString();
      };
      const server = await startServer({
        DATABASE_URL: at(process.env.TEST_APP_DATABASE_URL!),
        MIGRATION_DATABASE_URL: at(process.env.TEST_ADMIN_DATABASE_URL!),
        DEMO_DATA: '1',
      });
      expect((await fetch(`${server.url}/api/health`)).status).toBe(200);
      server.stop();
      await expect(server.exited).resolves.toBe(0);

      const check = new Client({ connectionString: at(process.env.TEST_ADMIN_DATABASE_URL!) });
      await check.connect();
      try {
        // Every table belongs to the owner, and the demo accounts arrived with their audit rows.
        const owners = await check.query(
          `select distinct tableowner from pg_tables where schemaname = 'public'`,
        );
        expect(owners.rows).toEqual([{ tableowner: 'postgres' }]);
        const seeded = await check.query(
          `select count(*)::int as n from audit_log where action = 'user.seeded'`,
        );
        expect(seeded.rows[0].n).toBe(5);
      } finally {
        await check.end();
      }
    } finally {
      await admin.query(`drop database if exists "${name}" with (force)`);
      await admin.end();
    }
  }, 120_000);
});
