import { sql } from 'drizzle-orm';
import {
  check,
  index,
  integer,
  jsonb,
  pgTable,
  text,
  timestamp,
  unique,
} from 'drizzle-orm/pg-core';
import { users } from './users';

/** One reaction a watcher follows: the equation as typed, with an optional label and temperature. */
export interface WatchedReaction {
  equation: string;
  label?: string;
  /** K; 298.15 K when absent. */
  temperatureK?: number;
}

/** A user's named set of reactions, whose impact is reported between any two releases. */
export const watchlists = pgTable(
  'watchlists',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    ownerId: integer()
      .notNull()
      .references(() => users.id),
    name: text().notNull(),
    reactions: jsonb().$type<WatchedReaction[]>().notNull().default([]),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('watchlists_owner_name').on(t.ownerId, t.name),
    index('watchlists_owner_idx').on(t.ownerId),
    check('watchlists_name_length', sql`char_length(${t.name}) between 1 and 100`),
    check(
      'watchlists_reactions_array',
      sql`jsonb_typeof(${t.reactions}) = 'array' and jsonb_array_length(${t.reactions}) <= 1000`,
    ),
  ],
);

export type WatchlistRow = typeof watchlists.$inferSelect;
