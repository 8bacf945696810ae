import { createHash } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import { releaseExports } from '../../../../schema';
import type { Tx } from '../../db/client';
import {
  createExportWriter,
  EXPORT_FORMATS,
  type ExportFormat,
  type ExportHeader,
} from './release-export-writers';
import { releaseExportsRepository } from './release-exports-repository';
import type { Queryable } from './releases-repository';

export interface ExportDigest {
  sha256: string;
  bytes: number;
}

/** What the export header needs of a published release row. */
export interface PublishedRelease {
  id: number;
  version: string;
  notes: string;
  publishedAt: Date | null;
}

const header = (r: PublishedRelease): ExportHeader => ({
  version: r.version,
  publishedAt: r.publishedAt!.toISOString(),
  notes: r.notes,
});

/** Bytes read per query when an export is streamed: the content is stored uncompressed. */
export const EXPORT_SLICE = 1 << 20;

// Releases published before exports were stored are filled once, serialised on this lock.
const FILL_LOCK = 0x7468_6578; // "thex"

/**
 * Renders the three exports of a published release in one cursor pass over its rows (inside the
 * caller's transaction, so it sees a publish that is not yet committed) and stores them.
 */
export async function renderExportsIn(
  tx: Tx,
  release: PublishedRelease,
): Promise<Record<ExportFormat, ExportDigest>> {
  const parts = EXPORT_FORMATS.map((format) => ({
    format,
    writer: createExportWriter(format, header(release)),
    chunks: [] as Buffer[],
  }));
  const add = (p: (typeof parts)[number], text: string) => {
    if (text) p.chunks.push(Buffer.from(text, 'utf8'));
  };
  for (const p of parts) add(p, p.writer.begin());
  await releaseExportsRepository.eachBatch(tx, release.id, (rows) => {
    for (const p of parts) add(p, p.writer.rows(rows));
  });
  const digests = {} as Record<ExportFormat, ExportDigest>;
  for (const p of parts) {
    add(p, p.writer.end());
    const content = Buffer.concat(p.chunks);
    p.chunks = [];
    const digest = {
      sha256: createHash('sha256').update(content).digest('hex'),
      bytes: content.length,
    };
    await tx
      .insert(releaseExports)
      .values({ releaseId: release.id, format: p.format, ...digest, content });
    digests[p.format] = digest;
  }
  return digests;
}

export const releaseExportStore = {
  async digests(db: Queryable, releaseId: number) {
    const rows = await db
      .select({
        format: releaseExports.format,
        sha256: releaseExports.sha256,
        bytes: releaseExports.bytes,
      })
      .from(releaseExports)
      .where(eq(releaseExports.releaseId, releaseId));
    if (rows.length !== EXPORT_FORMATS.length) return null;
    return Object.fromEntries(
      rows.map((r) => [r.format, { sha256: r.sha256, bytes: r.bytes }]),
    ) as Record<ExportFormat, ExportDigest>;
  },

  /**
   * Stores the exports of a release published before they were kept, once: the first caller
   * renders under an advisory lock, the others wait and then read what it stored.
   */
  async fillIn(tx: Tx, release: PublishedRelease) {
    await tx.execute(sql`select pg_advisory_xact_lock(${FILL_LOCK}, ${release.id})`);
    return (await this.digests(tx, release.id)) ?? renderExportsIn(tx, release);
  },

  /** One slice of a stored export, `from` counted from 0. */
  async slice(db: Queryable, releaseId: number, format: ExportFormat, from: number) {
    const [row] = await db
      .select({
        part: sql<Buffer>`substring(${releaseExports.content} from ${from + 1} for ${EXPORT_SLICE})`,
      })
      .from(releaseExports)
      .where(and(eq(releaseExports.releaseId, releaseId), eq(releaseExports.format, format)));
    return row?.part ?? Buffer.alloc(0);
  },
};
