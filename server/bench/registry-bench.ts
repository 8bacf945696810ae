/**
 * Registry at scale: builds the synthetic registry (synthetic-registry.ts) in a scratch
 * PostgreSQL cluster, then measures cold resolution of a release into its snapshot (target
 * ≤ 300 ms) and fuzzy search p95 (target ≤ 30 ms). Prints figures; asserts nothing.
 *   npm run bench:registry
 */
import { execSync } from 'node:child_process';
import { Client } from 'pg';
import { connectDatabase } from '../src/db/client';
import { runMigrations } from '../src/db/migrate';
import { buildSnapshot } from '../src/modules/releases/release-snapshot';
import { createReleasesService } from '../src/modules/releases/releases-service';
import { loadSnapshotInput } from '../src/modules/releases/snapshot-input';
import { SpeciesSearchIndex } from '../src/modules/search/search-index';
import { searchRepository } from '../src/modules/search/search-repository';
import { createScratchCluster } from '../../tests/support/pg-cluster';
import {
  generateRegistry,
  releaseVersion,
  SYNTHETIC,
  syntheticSpecies,
} from './synthetic-registry';

const COLD_RUNS = 5;
const SEARCHES = 1_000;

process.env.PG_BIN ??= execSync('ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1')
  .toString()
  .trim();

const ms = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e6;
const percentile = (xs: number[], p: number) =>
  [...xs].sort((a, b) => a - b)[Math.ceil((p / 100) * xs.length) - 1]!;
const print = (text: string) => process.stdout.write(`${text}\n`);
const line = (label: string, value: string, target = '') =>
  print(`${label.padEnd(44)} ${value.padStart(12)}  ${target}`);

/** Misspellings of the generator's names and formulas in another element order. */
function queries(n: number): string[] {
  const names = syntheticSpecies(SYNTHETIC.species).map((s) => s.name.split(' ')[0]!);
  const out: string[] = [];
  for (let i = 0; out.length < n; i += 97) {
    const name = names[i % names.length]!;
    const at = 1 + (i % (name.length - 2));
    const kind = i % 3;
    if (kind === 0)
      out.push(name.slice(0, at) + name.slice(at + 1)); // a dropped letter
    else if (kind === 1)
      out.push(name.slice(0, at) + name[at + 1] + name[at] + name.slice(at + 2)); // swapped
    else out.push(`O${1 + (i % 3)}C${2 + (i % 9)}H${4 + (i % 11)}`); // formula, other order
  }
  return out;
}

async function main(): Promise<void> {
  const cluster = await createScratchCluster();
  try {
    const admin = new Client({ connectionString: cluster.url });
    await admin.connect();
    await admin.query('create database thalpos_bench');
    await admin.end();
    const url = cluster.url.replace(/\/postgres$/, '/thalpos_bench');
    const { pool, db } = connectDatabase(url);
    await runMigrations(db);

    let start = process.hrtime.bigint();
    await generateRegistry(db);
    const rows = (
      await pool.query(`select (select count(*) from species_phases)::int as phases,
        (select count(*) from revisions)::int as revisions, (select count(*) from releases)::int as releases,
        (select count(*) from release_entries)::int as entries`)
    ).rows[0];
    print(
      `\nsynthetic registry: ${rows.phases} species-phases, ${rows.revisions} revisions, ` +
        `${rows.releases} releases, ${rows.entries} release entries (built in ${(ms(start) / 1000).toFixed(1)} s)\n`,
    );

    const version = releaseVersion(SYNTHETIC.releases);
    const cold: number[] = [];
    const load: number[] = [];
    const build: number[] = [];
    let entries = 0;
    for (let i = 0; i < COLD_RUNS; i++) {
      const releases = createReleasesService(db); // a new process's empty cache
      start = process.hrtime.bigint();
      const snapshot = await releases.getSnapshot(version);
      cold.push(ms(start));
      entries = snapshot.counts.speciesPhases;
      // The same two steps apart: rows from the database, then the engine's index over them.
      const row = await releases.resolve(version);
      start = process.hrtime.bigint();
      const input = await loadSnapshotInput(db, row);
      load.push(ms(start));
      start = process.hrtime.bigint();
      buildSnapshot(input);
      build.push(ms(start));
    }
    line(
      `cold snapshot of ${version} (${entries} species-phases), median`,
      `${percentile(cold, 50).toFixed(0)} ms`,
      '(target ≤ 300 ms)',
    );
    line('cold snapshot, slowest of ' + COLD_RUNS, `${Math.max(...cold).toFixed(0)} ms`);
    line('  of which: rows from the database, median', `${percentile(load, 50).toFixed(0)} ms`);
    line('  of which: building the index, median', `${percentile(build, 50).toFixed(0)} ms`);

    const releaseId = (await pool.query('select id from releases where version = $1', [version]))
      .rows[0].id;
    start = process.hrtime.bigint();
    const index = new SpeciesSearchIndex(await searchRepository.documents(db, releaseId));
    line(
      `search index build (${index.documents.length} species)`,
      `${ms(start).toFixed(0)} ms`,
      '(once per release)',
    );

    const qs = queries(SEARCHES);
    for (const q of qs.slice(0, 50)) index.search(q, 10); // warm-up
    const times: number[] = [];
    let found = 0;
    for (const q of qs) {
      start = process.hrtime.bigint();
      found += index.search(q, 10).results.length > 0 ? 1 : 0;
      times.push(ms(start));
    }
    line(`fuzzy search p50 (${SEARCHES} queries)`, `${percentile(times, 50).toFixed(2)} ms`);
    line('fuzzy search p95', `${percentile(times, 95).toFixed(2)} ms`, '(target ≤ 30 ms)');
    line('queries with at least one hit', `${found} / ${SEARCHES}`);
    await pool.end();
  } finally {
    cluster.destroy();
  }
}

main().catch((err: unknown) => {
  const e = err as { message?: string; cause?: { message?: string } };
  process.stderr.write(
    `registry benchmark failed: ${(e.cause?.message ?? e.message ?? String(err)).slice(0, 500)}\n`,
  );
  process.exit(1);
});
