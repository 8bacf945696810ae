import { sql } from 'drizzle-orm';
import { check, customType, integer, pgTable, primaryKey, text } from 'drizzle-orm/pg-core';
import { releases } from './releases';

const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => 'bytea' });

/**
 * The export files of a published release, rendered once in its publish transaction and frozen
 * by a trigger: every request streams these bytes, so an export never follows later edits of a
 * species name or a source's citation.
 */
export const releaseExports = pgTable(
  'release_exports',
  {
    releaseId: integer()
      .notNull()
      .references(() => releases.id),
    format: text().notNull(),
    sha256: text().notNull(),
    bytes: integer().notNull(),
    content: bytea().notNull(),
  },
  (t) => [
    primaryKey({ columns: [t.releaseId, t.format] }),
    check('release_exports_format', sql`${t.format} in ('csv', 'json', 'xml')`),
    check('release_exports_sha256', sql`${t.sha256} ~ '^[0-9a-f]{64}$'`),
    check('release_exports_bytes', sql`${t.bytes} = octet_length(${t.content})`),
  ],
);

export type ReleaseExportRow = typeof releaseExports.$inferSelect;
