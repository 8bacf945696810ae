import { spawn } from 'node:child_process';
import path from 'node:path';
import { PROJECT_ROOT } from '../../server/src/config/paths';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

// The real entry point as its own process: it starts, serves, and on SIGTERM closes cleanly.
describe('server process', () => {
  let db: TestDatabase;
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(() => db.drop());

  it('applies migrations at start-up, serves, and exits 0 on SIGTERM', async () => {
    const child = spawn(path.join(PROJECT_ROOT, 'node_modules/.bin/tsx'), ['server/src/main.ts'], {
      cwd: PROJECT_ROOT,
      env: {
        ...process.env,
        PORT: '0',
        DATABASE_URL: db.url,
        MIGRATION_DATABASE_URL: db.ownerUrl,
        LOG_LEVEL: 'silent',
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    const exited = new Promise<number | null>((resolve) =>
      child.on('exit', (code) => resolve(code)),
    );
    let output = '';
    const url = await new Promise<string>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`no start-up line in: ${output}`)), 30_000);
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
    });
    const health = await fetch(`${url}/api/health`);
    expect(await health.json()).toEqual({ status: 'ok', db: 'ok' });

    child.kill('SIGTERM');
    await expect(exited).resolves.toBe(0);
  }, 60_000);
});
