import { sql } from 'drizzle-orm';
import {
  type AnyPgColumn,
  check,
  foreignKey,
  index,
  integer,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
} from 'drizzle-orm/pg-core';
import { revisions } from './revisions';
import { speciesPhases } from './species';
import { users } from './users';

export const RELEASE_STATUSES = ['draft', 'published'] as const;
export type ReleaseStatus = (typeof RELEASE_STATUSES)[number];
export const releaseStatus = pgEnum('release_status', RELEASE_STATUSES);

/** Version labels such as `2026.1`; `latest` is reserved for "the newest published release". */
export const RELEASE_VERSION_PATTERN = /^[0-9]{4}\.[0-9]{1,3}(-[a-z0-9]+)?$/;

/** A named snapshot of the registry; once published, database triggers keep it unchanged. */
export const releases = pgTable(
  'releases',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    version: text().notNull().unique(),
    notes: text().notNull().default(''),
    status: releaseStatus().notNull().default('draft'),
    createdBy: integer().references(() => users.id),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    publishedBy: integer().references(() => users.id),
    publishedAt: timestamp({ withTimezone: true }),
    /**
     * The newest published release when this one was drafted (null for the first): its changes
     * are computed against it, and it may only publish while that is still the newest.
     */
    baseReleaseId: integer().references((): AnyPgColumn => releases.id),
  },
  (t) => [
    check('releases_version_format', sql`${t.version} ~ '^[0-9]{4}\\.[0-9]{1,3}(-[a-z0-9]+)?$'`),
    check(
      'releases_published_fields',
      sql`(${t.status} = 'published') = (${t.publishedAt} is not null and ${t.publishedBy} is not null)`,
    ),
    index('releases_published_idx')
      .on(t.publishedAt)
      .where(sql`${t.status} = 'published'`),
  ],
);

/** Pins exactly one revision per species-phase and quantity in a release. */
export const releaseEntries = pgTable(
  'release_entries',
  {
    releaseId: integer()
      .notNull()
      .references(() => releases.id),
    speciesPhaseId: integer()
      .notNull()
      .references(() => speciesPhases.id),
    quantity: text().notNull(),
    revisionId: integer().notNull(),
  },
  (t) => [
    primaryKey({ columns: [t.releaseId, t.speciesPhaseId, t.quantity] }),
    foreignKey({
      name: 'release_entries_revision_fk',
      columns: [t.revisionId, t.speciesPhaseId, t.quantity],
      foreignColumns: [revisions.id, revisions.speciesPhaseId, revisions.quantity],
    }),
    index('release_entries_revision_idx').on(t.revisionId),
    index('release_entries_species_phase_idx').on(t.speciesPhaseId),
  ],
);

/** Changes an editor left out of a draft (by the revision that makes the change). */
export const releaseExclusions = pgTable(
  'release_exclusions',
  {
    releaseId: integer()
      .notNull()
      .references(() => releases.id),
    revisionId: integer()
      .notNull()
      .references(() => revisions.id),
    excludedBy: integer().references(() => users.id),
    excludedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.releaseId, t.revisionId] })],
);

/** Derived values an editor knowingly publishes stale in a draft (their inputs changed). */
export const releaseAcknowledgements = pgTable(
  'release_acknowledgements',
  {
    releaseId: integer()
      .notNull()
      .references(() => releases.id),
    revisionId: integer()
      .notNull()
      .references(() => revisions.id),
    acknowledgedBy: integer().references(() => users.id),
    acknowledgedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.releaseId, t.revisionId] })],
);

export type ReleaseRow = typeof releases.$inferSelect;
export type ReleaseEntryRow = typeof releaseEntries.$inferSelect;
