/**
 * Release exports and diffs at scale, on the synthetic registry (synthetic-registry.ts) in a
 * scratch PostgreSQL cluster: rendering and storing the three exports of the newest synthetic
 * release (20,000 species-phases), which is what its publish transaction does, against
 * `psql COPY (the same query) TO STDOUT` in the same run (target ≤ 3× per format); then each
 * stored export served over HTTP, with the process's RSS growth meanwhile (target ≤ 50 MB: it
 * streams); and the diff of two synthetic releases (target ≤ 1 s), split into its query and
 * the JSON answer. Prints, asserts nothing.
 *   npm run bench:exports
 */
import { execSync, spawn } from 'node:child_process';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import { Client } from 'pg';
import { connectDatabase } from '../src/db/client';
import { runMigrations } from '../src/db/migrate';
import { errorHandler } from '../src/middleware/error-handler';
import { EXPORT_FORMATS } from '../src/modules/releases/release-export-writers';
import { renderExportsIn } from '../src/modules/releases/release-export-store';
import {
  exportQueryText,
  releaseExportsRepository,
} from '../src/modules/releases/release-exports-repository';
import { releasesRepository } from '../src/modules/releases/releases-repository';
import { createReleasesModule } from '../src/modules/releases/releases-router';
import { createScratchCluster } from '../../tests/support/pg-cluster';
import { generateRegistry, releaseVersion, SYNTHETIC } from './synthetic-registry';

const RUNS = 3;

process.env.PG_BIN ??= execSync('ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1')
  .toString()
  .trim();

const ms = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e6;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const print = (text: string) => process.stdout.write(`${text}\n`);
const line = (label: string, value: string, target = '') =>
  print(`${label.padEnd(44)} ${value.padStart(12)}  ${target}`);
const mb = (bytes: number) => `${(bytes / 2 ** 20).toFixed(1)} MB`;

/** Reads a URL to the end, keeping nothing; returns its size and the peak RSS seen meanwhile. */
function download(url: string): Promise<{ bytes: number; peakRss: number }> {
  return new Promise((resolve, reject) => {
    let peakRss = process.memoryUsage.rss();
    const sample = setInterval(() => {
      peakRss = Math.max(peakRss, process.memoryUsage.rss());
    }, 5);
    http
      .get(url, (res) => {
        let bytes = 0;
        res.on('data', (c: Buffer) => (bytes += c.length));
        res.on('end', () => {
          clearInterval(sample);
          peakRss = Math.max(peakRss, process.memoryUsage.rss());
          if (res.statusCode !== 200) reject(new Error(`${url} answered ${res.statusCode}`));
          else resolve({ bytes, peakRss });
        });
      })
      .on('error', (err) => {
        clearInterval(sample);
        reject(err);
      });
  });
}

/** `psql -c "COPY (…) TO STDOUT"` with its output read and dropped; returns the bytes. */
function psqlCopy(url: string, query: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const psql = spawn(path.join(process.env.PG_BIN!, 'psql'), [
      url,
      '-X',
      '-q',
      '-v',
      'ON_ERROR_STOP=1',
      '-c',
      `COPY (${query}) TO STDOUT WITH (FORMAT csv, HEADER)`,
    ]);
    let bytes = 0;
    let err = '';
    psql.stdout.on('data', (c: Buffer) => (bytes += c.length));
    psql.stderr.on('data', (c: Buffer) => (err += c.toString()));
    psql.on('error', reject);
    psql.on('close', (code) => (code === 0 ? resolve(bytes) : reject(new Error(err))));
  });
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
    const load = os
      .loadavg()
      .map((l) => l.toFixed(1))
      .join(' ');
    print(`\nsynthetic registry built in ${(ms(start) / 1000).toFixed(1)} s`);
    print(`${os.cpus().length} CPUs, load average ${load} (figures are of this machine, now)\n`);

    const releases = createReleasesModule({ db });
    const app = express();
    app.use('/api/v1', releases.router);
    app.use(errorHandler);
    const server = app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/v1`;

    const version = releaseVersion(SYNTHETIC.releases);
    const row = await releases.service.resolve(version);
    const query = exportQueryText(row.id);
    await psqlCopy(url, query); // warm the buffer cache for both sides
    const copy: number[] = [];
    let copyBytes = 0;
    for (let i = 0; i < RUNS; i++) {
      start = process.hrtime.bigint();
      copyBytes = await psqlCopy(url, query);
      copy.push(ms(start));
    }
    const copyMs = median(copy);
    line(
      `psql COPY of ${version}'s export rows, median`,
      `${copyMs.toFixed(0)} ms`,
      `(${mb(copyBytes)})`,
    );

    // The synthetic releases are inserted as published rows: render and store this one's
    // exports exactly as a publish does, in one transaction.
    global.gc?.();
    let rss = process.memoryUsage.rss();
    const sampler = setInterval(() => (rss = Math.max(rss, process.memoryUsage.rss())), 5);
    const rssBefore = process.memoryUsage.rss();
    start = process.hrtime.bigint();
    const stored = await db.transaction((tx) => renderExportsIn(tx, row));
    const renderMs = ms(start);
    clearInterval(sampler);
    line('render + store csv, json, xml (publish step)', `${renderMs.toFixed(0)} ms`);
    line(`  ÷ (3 × psql COPY)`, `${(renderMs / (3 * copyMs)).toFixed(2)}×`, '(target ≤ 3×)');
    line(`  RSS growth while rendering, largest`, mb(rss - rssBefore), '(held until stored)');
    print(`  stored: ${EXPORT_FORMATS.map((f) => `${f} ${mb(stored[f].bytes)}`).join(', ')}`);

    start = process.hrtime.bigint();
    await download(`${base}/releases/${version}`);
    line('manifest, first request (stored checksums)', `${ms(start).toFixed(0)} ms`);

    for (const format of EXPORT_FORMATS) {
      const times: number[] = [];
      const growth: number[] = [];
      let bytes = 0;
      for (let i = 0; i < RUNS; i++) {
        global.gc?.();
        const before = process.memoryUsage.rss();
        start = process.hrtime.bigint();
        const got = await download(`${base}/releases/${version}/export.${format}`);
        times.push(ms(start));
        growth.push(got.peakRss - before);
        bytes = got.bytes;
      }
      const t = median(times);
      line(`export.${format} served (${mb(bytes)}), median`, `${t.toFixed(0)} ms`);
      line(`  ÷ psql COPY`, `${(t / copyMs).toFixed(2)}×`, '(target ≤ 3×)');
      line(`  RSS growth during the export, largest`, mb(Math.max(...growth)), '(target ≤ 50 MB)');
    }

    const pairs: [string, string][] = [
      [releaseVersion(SYNTHETIC.releases - 1), releaseVersion(SYNTHETIC.releases)],
      [releaseVersion(1), releaseVersion(SYNTHETIC.releases)],
    ];
    for (const [a, b] of pairs) {
      const [ra, rb] = await Promise.all([a, b].map((v) => releases.service.resolve(v)));
      const query: number[] = [];
      const times: number[] = [];
      let rows = 0;
      for (let i = 0; i < RUNS; i++) {
        start = process.hrtime.bigint();
        await db.transaction(async (tx) => {
          await releasesRepository.preferKeyProbes(tx);
          await releaseExportsRepository.sortInMemory(tx);
          return releaseExportsRepository.diff(tx, ra!.id, rb!.id);
        });
        query.push(ms(start));
        start = process.hrtime.bigint();
        await download(`${base}/releases/${a}/diff/${b}`);
        times.push(ms(start));
        rows = (await releases.exportsService.diff(a, b)).rows.length;
      }
      line(
        `diff ${a} → ${b} (${rows} rows) over HTTP, median`,
        `${median(times).toFixed(0)} ms`,
        '(target ≤ 1 s)',
      );
      line(`  of which the query and its rows, median`, `${median(query).toFixed(0)} ms`);
    }
    await new Promise((r) => server.close(r));
    await pool.end();
  } finally {
    cluster.destroy();
  }
}

main().catch((err: unknown) => {
  const e = err as { message?: string; cause?: { message?: string } };
  process.stderr.write(
    `release export benchmark failed: ${(e.cause?.message ?? e.message ?? String(err)).slice(0, 500)}\n`,
  );
  process.exit(1);
});
