import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PROJECT_ROOT } from '../../server/src/config/paths';

// The set-up scripts wait while another apt run holds Debian's package lock.
describe('apt_get in scripts/lib.sh', () => {
  let bin: string;
  beforeEach(() => {
    bin = fs.mkdtempSync(path.join(os.tmpdir(), 'thalpos-apt-'));
  });
  afterEach(() => fs.rmSync(bin, { recursive: true, force: true }));

  /** A stand-in apt-get that reports a held lock `busy` times, then succeeds; counts its calls. */
  function fakeAptGet(busy: number, failure = 'E: Could not get lock /var/lib/dpkg/lock-frontend') {
    fs.writeFileSync(
      path.join(bin, 'apt-get'),
      `#!/bin/bash
n=$(cat "${bin}/calls" 2>/dev/null || echo 0); n=$((n + 1)); echo $n > "${bin}/calls"
if [ $n -le ${busy} ]; then echo "${failure}" >&2; exit 100; fi
echo "ran: $*"
`,
      { mode: 0o755 },
    );
  }

  const run = (limit = 30) =>
    spawnSync('bash', ['-c', 'source scripts/lib.sh && apt_get update -qq'], {
      cwd: PROJECT_ROOT,
      encoding: 'utf8',
      env: {
        ...process.env,
        PATH: `${bin}:${process.env.PATH}`,
        APT_LOCK_WAIT: String(limit),
        APT_LOCK_POLL: '0.1',
      },
    });
  const calls = () => Number(fs.readFileSync(path.join(bin, 'calls'), 'utf8'));

  it('waits while the lock is held, then runs', () => {
    fakeAptGet(3);
    const res = run();
    expect(res.status).toBe(0);
    expect(res.stdout).toContain('ran: -o DPkg::Lock::Timeout=30 update -qq');
    expect(res.stdout).toContain('another apt run holds the package lock');
    expect(calls()).toBe(4);
  });

  it('fails at once for any other error', () => {
    fakeAptGet(5, 'E: Unable to locate package nothing-such');
    const res = run();
    expect(res.status).not.toBe(0);
    expect(res.stderr).toContain('Unable to locate package');
    expect(calls()).toBe(1);
  });
});
