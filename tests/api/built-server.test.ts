import { execFileSync, spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PROJECT_ROOT } from '../../server/src/config/paths';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

// The production bundle (scripts/build-server.mjs) leaves the local sign-in stand-in out, and
// the built server loads it only when FAKE_SIGN_IN asks for it.
describe('built server', () => {
  let db: TestDatabase;
  let outdir: string;
  let scratch: string;
  beforeAll(async () => {
    db = await createTestDatabase();
    // Inside the project, so the bundle finds node_modules and the migrations as in production.
    outdir = path.join(PROJECT_ROOT, 'dist', `test-build-${randomBytes(4).toString('hex')}`);
    execFileSync(process.execPath, ['scripts/build-server.mjs', outdir], { cwd: PROJECT_ROOT });
    scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'thalpos-built-'));
    // Records every CommonJS module the process loaded, when it exits.
    fs.writeFileSync(
      path.join(scratch, 'record-modules.cjs'),
      `process.on('exit', () => require('fs').writeFileSync(process.env.LOADED_MODULES_FILE, JSON.stringify(Object.keys(require.cache))));`,
    );
  }, 60_000);
  afterAll(async () => {
    fs.rmSync(outdir, { recursive: true, force: true });
    fs.rmSync(scratch, { recursive: true, force: true });
    await db.drop();
  });

  /**
   * Starts dist/…/main.js in production mode, checks it serves, stops it; returns the modules it
   * loaded and what it printed.
   */
  async function runBuilt(
    extraEnv: Record<string, string>,
  ): Promise<{ loaded: string[]; output: string }> {
    const loadedFile = path.join(scratch, `loaded-${randomBytes(4).toString('hex')}.json`);
    const env: NodeJS.ProcessEnv = {
      PATH: process.env.PATH,
      NODE_ENV: 'production',
      PORT: '0',
      FAKE_GITHUB_PORT: '0',
      DATABASE_URL: db.url,
      MIGRATION_DATABASE_URL: db.ownerUrl,
      SESSION_SECRET: 'a-long-enough-secret-for-this-test',
      TOKEN_HASH_KEY: 'a-token-hash-key-for-this-test-0123456789',
      LOG_LEVEL: 'warn',
      LOADED_MODULES_FILE: loadedFile,
      ...extraEnv,
    };
    const child = spawn(
      process.execPath,
      ['--require', path.join(scratch, 'record-modules.cjs'), path.join(outdir, 'main.js')],
      { cwd: PROJECT_ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] },
    );
    const exited = new Promise<number | null>((resolve) => child.on('exit', (c) => resolve(c)));
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
      child.on('exit', () => reject(new Error(`exited early: ${output}`)));
    });
    expect((await fetch(`${url}/api/health`)).status).toBe(200);
    child.kill('SIGTERM');
    expect(await exited).toBe(0);
    const loaded = JSON.parse(fs.readFileSync(loadedFile, 'utf8')) as string[];
    return { loaded, output };
  }

  const fakeModules = (loaded: string[]) =>
    loaded.filter((m) => /github-fake|oauth2-mock-server/.test(m));

  it('bundles no fake sign-in code into main.js', () => {
    const main = fs.readFileSync(path.join(outdir, 'main.js'), 'utf8');
    expect(main).not.toContain('oauth2-mock-server');
    expect(main).not.toContain('Local sign-in provider');
    expect(fs.readFileSync(path.join(outdir, 'github-fake.js'), 'utf8')).toContain(
      'oauth2-mock-server',
    );
  });

  it('loads no fake code without FAKE_SIGN_IN, and warns that TRUST_PROXY is not set', async () => {
    const { loaded, output } = await runBuilt({
      GITHUB_CLIENT_ID: 'id',
      GITHUB_CLIENT_SECRET: 'secret',
    });
    expect(loaded.some((m) => m.endsWith('main.js'))).toBe(true);
    expect(fakeModules(loaded)).toEqual([]);
    expect(output).toContain('TRUST_PROXY is not set: cookies are not Secure');
  }, 60_000);

  it('loads the stand-in when FAKE_SIGN_IN=1 asks for a demo server', async () => {
    const { loaded, output } = await runBuilt({ FAKE_SIGN_IN: '1', TRUST_PROXY: '1' });
    expect(fakeModules(loaded)).toEqual([path.join(outdir, 'github-fake.js')]);
    expect(output).not.toContain('TRUST_PROXY is not set');
  }, 60_000);
});
