import { createHash } from 'node:crypto';
import type { Database } from '../../db/client';
import {
  createExportWriter,
  EXPORT_FORMATS,
  type ExportFormat,
  type ExportHeader,
} from './release-export-writers';
import { releaseExportsRepository } from './release-exports-repository';
import { releasesRepository, type ReleaseListRow } from './releases-repository';
import type { ReleaseDiff } from './releases-schemas';
import type { ReleasesService } from './releases-service';

export interface ExportDigest {
  sha256: string;
  bytes: number;
}

/** Receives export text in order; may wait (backpressure) before the next part is produced. */
export type ExportSink = (chunk: string) => Promise<void> | void;

const header = (r: ReleaseListRow): ExportHeader => ({
  version: r.version,
  publishedAt: r.publishedAt!.toISOString(),
  notes: r.notes,
});

/** Whole-release exports (streamed from a database cursor) and diffs between two releases. */
export function createReleaseExportsService(db: Database, releases: ReleasesService) {
  // A published release's export never changes: each digest is computed once per process.
  const digests = new Map<string, Promise<ExportDigest>>();

  /** Writes the whole export of a published release to `sink`, batch by batch. */
  async function write(release: ReleaseListRow, format: ExportFormat, sink: ExportSink) {
    const writer = createExportWriter(format, header(release));
    await sink(writer.begin());
    // One snapshot of the data for the whole cursor; nothing here writes.
    await db.transaction(
      (tx) =>
        releaseExportsRepository.eachBatch(tx, release.id, async (rows) => {
          const text = writer.rows(rows);
          if (text) await sink(text);
        }),
      { isolationLevel: 'repeatable read', accessMode: 'read only' },
    );
    await sink(writer.end());
  }

  function digestOf(release: ReleaseListRow, format: ExportFormat): Promise<ExportDigest> {
    const key = `${release.id}:${format}`;
    let p = digests.get(key);
    if (!p) {
      p = (async () => {
        const hash = createHash('sha256');
        let bytes = 0;
        await write(release, format, (chunk) => {
          hash.update(chunk, 'utf8');
          bytes += Buffer.byteLength(chunk, 'utf8');
        });
        return { sha256: hash.digest('hex'), bytes };
      })();
      digests.set(key, p);
      // A failed pass (database down) is not kept: the next request tries again.
      p.catch(() => digests.delete(key));
    }
    return p;
  }

  return {
    write,
    digestOf,

    /** The digests of all three formats, for the manifest. */
    async digests(release: ReleaseListRow): Promise<Record<ExportFormat, ExportDigest>> {
      const [csv, json, xml] = await Promise.all(EXPORT_FORMATS.map((f) => digestOf(release, f)));
      return { csv: csv!, json: json!, xml: xml! };
    },

    /** Entries that differ between two published releases (`from` → `to`); 404 for either unknown. */
    async diff(from: string, to: string): Promise<ReleaseDiff> {
      const [a, b] = await Promise.all([releases.resolve(from), releases.resolve(to)]);
      const rows = await db.transaction(
        async (tx) => {
          // 20,000 entries probe 200,000 revisions by key faster than hashing them all.
          await releasesRepository.preferKeyProbes(tx);
          return releaseExportsRepository.diff(tx, a.id, b.id);
        },
        { accessMode: 'read only' },
      );
      const summary = { added: 0, removed: 0, changed: 0 };
      for (const r of rows) summary[r.change]++;
      return { from: a.version, to: b.version, summary, rows };
    },
  };
}

export type ReleaseExportsService = ReturnType<typeof createReleaseExportsService>;
