import { sql } from 'drizzle-orm';
import { check, index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { users } from './users';

/**
 * Personal API tokens. The token itself is shown once at creation and never stored: only its
 * public prefix (`thp_` + the id part, shown in lists and recognisable when leaked) and a keyed
 * hash of the whole token (HMAC-SHA-256, hex) are kept. A revoked token keeps its row.
 */
export const apiTokens = pgTable(
  'api_tokens',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    userId: integer()
      .notNull()
      .references(() => users.id),
    name: text().notNull(),
    prefix: text().notNull().unique(),
    hash: text().notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    /** Updated at most once a minute, to spare writes on busy tokens. */
    lastUsedAt: timestamp({ withTimezone: true }),
    revokedAt: timestamp({ withTimezone: true }),
  },
  (t) => [
    index('api_tokens_user_idx').on(t.userId),
    check('api_tokens_prefix_format', sql`${t.prefix} ~ '^thp_[0-9a-f]{16}$'`),
    check('api_tokens_hash_format', sql`${t.hash} ~ '^[0-9a-f]{64}$'`),
    check('api_tokens_name_length', sql`char_length(${t.name}) between 1 and 100`),
  ],
);

export type ApiTokenRow = typeof apiTokens.$inferSelect;
