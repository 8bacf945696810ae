import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { PROJECT_ROOT } from '../../server/src/config/paths';

const manifest = JSON.parse(fs.readFileSync(path.join(PROJECT_ROOT, 'package.json'), 'utf8'));

/** The lowest version a `^x.y.z` or `~x.y.z` range (or an exact one) admits, as numbers. */
const lowest = (range: string) =>
  range
    .replace(/^[\^~]/, '')
    .split('.')
    .map(Number);
const atLeast = (a: number[], b: number[]) => {
  for (let i = 0; i < 3; i++) if (a[i] !== b[i]) return a[i] > b[i];
  return true;
};

describe('dependencies', () => {
  // The lowest version each range admits must include the security fixes.
  it.each([
    ['drizzle-orm', '0.45.2'],
    ['express', '5.0.0'],
  ])('%s cannot resolve below %s', (name, fixed) => {
    const range: string = manifest.dependencies[name];
    expect(range).toMatch(/^[\^~]?\d+\.\d+\.\d+$/);
    expect(atLeast(lowest(range), lowest(fixed))).toBe(true);
  });

  it('keeps the local sign-in stand-in out of the production dependencies', () => {
    expect(manifest.dependencies['oauth2-mock-server']).toBeUndefined();
    expect(manifest.devDependencies['oauth2-mock-server']).toBeDefined();
  });

  it('npm run audit says plainly when the advisory endpoint cannot be queried', () => {
    const res = spawnSync(process.execPath, ['scripts/audit.mjs'], {
      cwd: PROJECT_ROOT,
      encoding: 'utf8',
      timeout: 60_000,
      env: {
        ...process.env,
        npm_config_registry: 'http://127.0.0.1:9/',
        npm_config_fetch_retries: '0',
      },
    });
    expect(res.status).toBe(2);
    expect(res.stdout).toMatch(/^NOT CHECKED: the advisory endpoint of http:\/\/127\.0\.0\.1:9\//);
    expect(res.stdout).toContain('not a clean result');
  }, 90_000);
});
