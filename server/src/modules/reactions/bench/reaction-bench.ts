/**
 * Reaction-enthalpy benchmark (prints figures, asserts nothing; run by reaction-bench.sh, i.e.
 * `npm run bench:reactions`, which provides DATABASE_URL with the starter release):
 *  1. a batch of 10,000 reactions in process, on the starter release's snapshot;
 *  2. the same batch over HTTP, JSON both ways;
 *  3. GET /api/v1/reaction-enthalpy requests/s ÷ a bare JSON route's requests/s, both on one
 *     server process in this run (autocannon); and the same route answered 304 from its ETag,
 *     which shows what the application's middleware alone costs.
 * BENCH_SECONDS (default 5) sets each autocannon run's length.
 */
import { fork } from 'node:child_process';
import path from 'node:path';
import autocannon from 'autocannon';
import { createReactionsService } from '../reactions-service';
import { starterSnapshot } from '../testing/starter-snapshot';

const BATCH = 10_000;
const SECONDS = Number(process.env['BENCH_SECONDS'] ?? 5);
const CONNECTIONS = 10;
const RELEASE = '2026.1';

// Everyday duties of the Kestrel Process Works: combustion, reforming, calcination, synthesis.
const EQUATIONS: [string, number][] = [
  ['CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)', 298.15],
  ['C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(g)', 298.15],
  ['[butane](g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)', 298.15],
  ['CH4(g) + H2O(g) -> CO(g) + 3 H2(g)', 298.15],
  ['CO(g) + H2O(g) -> CO2(g) + H2(g)', 298.15],
  ['CaCO3(s) -> CaO(s) + CO2(g)', 298.15],
  ['N2(g) + 3 H2(g) -> 2 NH3(g)', 298.15],
  ['4 NH3(g) + 5 O2(g) -> 4 NO(g) + 6 H2O(g)', 298.15],
  ['C2H5OH(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)', 298.15],
  ['SO2(g) + 1/2 O2(g) -> SO3(g)', 298.15],
  ['CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)', 1000],
  ['N2(g) + 3 H2(g) -> 2 NH3(g)', 700],
];
const reactions = Array.from({ length: BATCH }, (_, i) => {
  const [equation, temperatureK] = EQUATIONS[i % EQUATIONS.length]!;
  return { id: i, equation, temperatureK };
});

const rate = (n: number, ms: number) => Math.round((n / ms) * 1000).toLocaleString('en-US');

function inProcess(): void {
  const snap = starterSnapshot();
  const service = createReactionsService(async () => snap);
  for (let i = 0; i < 3; i++) service.batch(snap, { unit: 'kJ/mol', reactions }); // warm-up
  const runs: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < 5; i++) {
    const start = performance.now();
    const cpuStart = process.cpuUsage();
    const answer = service.batch(snap, { unit: 'kJ/mol', reactions });
    const used = process.cpuUsage(cpuStart);
    runs.push(performance.now() - start);
    cpu.push((used.user + used.system) / 1000);
    if (answer.errors !== 0) throw new Error(`${answer.errors} reactions failed`);
  }
  const best = Math.min(...runs);
  console.log(
    `batch of ${BATCH} in process (best of 5):   ${best.toFixed(0)} ms  → ${rate(BATCH, best)} reactions/s  (target ≥ 50,000)`,
  );
  // On a shared machine the wall clock includes waiting for a core; CPU time does not.
  const bestCpu = Math.min(...cpu);
  console.log(
    `  the same in CPU time of this process:  ${bestCpu.toFixed(0)} ms  → ${rate(BATCH, bestCpu)} reactions/s`,
  );
}

async function overHttp(base: string): Promise<void> {
  const body = JSON.stringify({ release: RELEASE, reactions });
  const send = () =>
    fetch(`${base}/api/v1/reaction-enthalpy/batch`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body,
    }).then(async (r) => {
      if (r.status !== 200) throw new Error(`batch answered ${r.status}: ${await r.text()}`);
      return r.arrayBuffer();
    });
  for (let i = 0; i < 2; i++) await send();
  const runs: number[] = [];
  let bytes = 0;
  for (let i = 0; i < 5; i++) {
    const start = performance.now();
    bytes = (await send()).byteLength;
    runs.push(performance.now() - start);
  }
  const best = Math.min(...runs);
  console.log(
    `batch of ${BATCH} over HTTP (best of 5):    ${best.toFixed(0)} ms  → ${rate(BATCH, best)} reactions/s  (${(bytes / 1e6).toFixed(1)} MB answer)`,
  );
}

async function requestsPerSecond(url: string, headers?: Record<string, string>): Promise<number> {
  const result = await autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers });
  if (result.errors > 0 || (result.non2xx > 0 && !headers)) {
    throw new Error(`${url}: ${result.non2xx} non-2xx answers, ${result.errors} errors`);
  }
  return result.requests.average;
}

async function main(): Promise<void> {
  console.log('Thalpos reaction-enthalpy benchmark');
  inProcess();
  // In-process figures only: `npx tsx server/src/modules/reactions/bench/reaction-bench.ts`.
  if (!process.env['DATABASE_URL']) return;

  const server = fork(path.join(__dirname, 'reaction-bench-server.ts'), {
    execArgv: [
      '--import',
      'tsx',
      // BENCH_CPU_PROF=<dir>: a CPU profile of the server, to see where its time goes.
      ...(process.env['BENCH_CPU_PROF']
        ? ['--cpu-prof', `--cpu-prof-dir=${process.env['BENCH_CPU_PROF']}`]
        : []),
    ],
    stdio: 'inherit',
  });
  try {
    const port = await new Promise<number>((resolve, reject) => {
      server.once('message', (m: { port: number }) => resolve(m.port));
      server.once('exit', (code) => reject(new Error(`the server exited (${code})`)));
    });
    const base = `http://127.0.0.1:${port}`;
    await overHttp(base);

    const query = new URLSearchParams({ equation: EQUATIONS[0]![0], release: RELEASE });
    const reaction = `${base}/api/v1/reaction-enthalpy?${query}`;
    await requestsPerSecond(reaction); // warm-up: snapshot built, code optimised
    const bare = await requestsPerSecond(`${base}/bare`);
    const computed = await requestsPerSecond(reaction);
    // The same route answered 304 from its ETag: the application's middleware without the work.
    const etag = (await fetch(reaction)).headers.get('etag') ?? '';
    const unchanged = await requestsPerSecond(reaction, { 'if-none-match': etag });
    console.log(`bare JSON route:                         ${Math.round(bare)} requests/s`);
    console.log(`GET /api/v1/reaction-enthalpy:           ${Math.round(computed)} requests/s`);
    console.log(`same route, 304 Not Modified:           ${Math.round(unchanged)} requests/s`);
    console.log(
      `ratio (${CONNECTIONS} connections, ${SECONDS} s each):          ${(computed / bare).toFixed(2)}  (target ≥ 0.8)`,
    );
  } finally {
    const exited = new Promise((resolve) => server.once('exit', resolve));
    server.disconnect();
    await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 5000))]);
    if (server.exitCode === null) server.kill();
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
