import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

/**
 * A throwaway PostgreSQL cluster for tests that stop and restart the database server itself,
 * so they never disturb the cluster the other suites share.
 */
export interface ScratchCluster {
  url: string;
  stop(): void;
  start(): void;
  destroy(): void;
}

const isRoot = process.getuid?.() === 0;

function run(bin: string, args: string[]): void {
  const pgBin = process.env.PG_BIN;
  if (!pgBin) throw new Error('PG_BIN is not set: run the tests through `npm test`');
  const cmd = path.join(pgBin, bin);
  if (isRoot) execFileSync('runuser', ['-u', 'postgres', '--', cmd, ...args], { stdio: 'pipe' });
  else execFileSync(cmd, args, { stdio: 'pipe' });
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

export async function createScratchCluster(): Promise<ScratchCluster> {
  const base = fs.mkdtempSync(path.join(os.tmpdir(), 'thalpos-pg-'));
  const dir = path.join(base, 'data');
  fs.mkdirSync(dir, { mode: 0o700 });
  if (isRoot) execFileSync('chown', ['-R', 'postgres', base]);
  const port = await freePort();
  run('initdb', ['-D', dir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8']);
  const start = () =>
    run('pg_ctl', [
      '-D',
      dir,
      '-w',
      '-l',
      path.join(dir, 'log'),
      '-o',
      `-c listen_addresses=127.0.0.1 -p ${port} -k ${dir} -c fsync=off`,
      'start',
    ]);
  const stop = () => run('pg_ctl', ['-D', dir, '-m', 'immediate', '-w', 'stop']);
  start();
  return {
    url: `postgres://postgres@127.0.0.1:${port}/postgres`,
    start,
    stop,
    destroy() {
      try {
        stop();
      } catch {
        /* already stopped */
      }
      fs.rmSync(base, { recursive: true, force: true });
    },
  };
}
