import { sql } from 'drizzle-orm';
import { check, integer, jsonb, pgTable, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import { users } from './users';

/** A citation: CSL-JSON underneath, the formatted citation beside it; one row per DOI. */
export const sources = pgTable(
  'sources',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    /** Stable key from an import file (e.g. the starter dataset); null for sources entered by hand. */
    key: text().unique(),
    csl: jsonb().$type<Record<string, unknown>>().notNull(),
    citation: text().notNull(),
    /** Stored lowercase (DOIs are case-insensitive), without a resolver prefix. */
    doi: text(),
    createdBy: integer().references(() => users.id),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('sources_doi_idx')
      .on(t.doi)
      .where(sql`${t.doi} is not null`),
    check(
      'sources_doi_format',
      sql`${t.doi} is null or (${t.doi} ~ '^10\\.[0-9]{4,9}/\\S+$' and ${t.doi} = lower(${t.doi}))`,
    ),
  ],
);

export type SourceRow = typeof sources.$inferSelect;
