import { sql } from 'drizzle-orm';
import { bigint, check, index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { sources } from './sources';
import { users } from './users';

/**
 * A document (PDF) attached to a source. The bytes live in the file store (S3 API) under `key`;
 * the row keeps what is needed to list it, check it and decide who may read it.
 */
export const sourceDocuments = pgTable(
  'source_documents',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    sourceId: integer()
      .notNull()
      .references(() => sources.id),
    /** Object key in the file store; never derived from the uploaded file name. */
    key: text().notNull().unique(),
    /** Lowercase hex SHA-256 of the stored bytes. */
    sha256: text().notNull(),
    size: bigint({ mode: 'number' }).notNull(),
    /** The name the uploader's file had, for display and the download's file name only. */
    fileName: text().notNull(),
    uploadedBy: integer()
      .notNull()
      .references(() => users.id),
    uploadedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('source_documents_source_idx').on(t.sourceId),
    check('source_documents_sha256_format', sql`${t.sha256} ~ '^[0-9a-f]{64}$'`),
    check('source_documents_size_positive', sql`${t.size} > 0`),
  ],
);

export type SourceDocumentRow = typeof sourceDocuments.$inferSelect;
