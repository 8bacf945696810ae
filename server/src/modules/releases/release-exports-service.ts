import type { Database } from '../../db/client';
import type { ExportFormat } from './release-export-writers';
import { EXPORT_SLICE, releaseExportStore, type ExportDigest } from './release-export-store';
import { releaseExportsRepository } from './release-exports-repository';
import { releasesRepository, type ReleaseListRow } from './releases-repository';
import type { ReleaseDiff } from './releases-schemas';
import type { ReleasesService } from './releases-service';

export type { ExportDigest } from './release-export-store';

/** Receives export bytes in order; may wait (backpressure) before the next part is read. */
export type ExportSink = (chunk: Buffer) => Promise<void> | void;

/**
 * Whole-release exports, as stored when the release was published (release-export-store.ts),
 * and diffs between two releases.
 */
export function createReleaseExportsService(db: Database, releases: ReleasesService) {
  // Stored checksums never change: each release's are read once per process.
  const digests = new Map<number, Promise<Record<ExportFormat, ExportDigest>>>();

  /**
   * The stored checksums of a release's exports. A release published before exports were stored
   * has them rendered and stored by the first request that asks, in any process (see README).
   */
  function digestsOf(release: ReleaseListRow): Promise<Record<ExportFormat, ExportDigest>> {
    let p = digests.get(release.id);
    if (!p) {
      p = (async () =>
        (await releaseExportStore.digests(db, release.id)) ??
        db.transaction((tx) => releaseExportStore.fillIn(tx, release)))();
      digests.set(release.id, p);
      // A failed read (database down) is not kept: the next request tries again.
      p.catch(() => digests.delete(release.id));
    }
    return p;
  }

  /** Streams the stored export of a published release to `sink`, slice by slice. */
  async function write(release: ReleaseListRow, format: ExportFormat, sink: ExportSink) {
    const { bytes } = (await digestsOf(release))[format];
    for (let from = 0; from < bytes; from += EXPORT_SLICE) {
      await sink(await releaseExportStore.slice(db, release.id, format, from));
    }
  }

  return {
    write,
    digestOf: async (release: ReleaseListRow, format: ExportFormat) =>
      (await digestsOf(release))[format],
    /** The digests of all three formats, for the manifest. */
    digests: digestsOf,

    /** Entries that differ between two published releases (`from` → `to`); 404 for either unknown. */
    async diff(from: string, to: string): Promise<ReleaseDiff> {
      const [a, b] = await Promise.all([releases.resolve(from), releases.resolve(to)]);
      const rows = await db.transaction(
        async (tx) => {
          // 20,000 entries probe 200,000 revisions by key faster than hashing them all.
          await releasesRepository.preferKeyProbes(tx);
          await releaseExportsRepository.sortInMemory(tx);
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
