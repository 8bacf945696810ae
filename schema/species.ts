import { sql } from 'drizzle-orm';
import {
  check,
  index,
  integer,
  pgEnum,
  pgTable,
  text,
  timestamp,
  unique,
  uniqueIndex,
} from 'drizzle-orm/pg-core';
import { users } from './users';

/** Phases a value can be recorded for; input `s` is resolved to one of these before storage. */
export const STORED_PHASES = ['g', 'l', 'cr', 'am', 'aq'] as const;
export type StoredPhase = (typeof STORED_PHASES)[number];
export const phase = pgEnum('phase', STORED_PHASES);

/** Registry keys: lowercase words (letters, digits, commas) joined by hyphens, e.g. `2-methylpropane`. */
export const SPECIES_KEY_PATTERN = '^[a-z0-9][a-z0-9,]*(-[a-z0-9,]+)*$';

export const species = pgTable(
  'species',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    key: text().notNull().unique(),
    name: text().notNull(),
    synonyms: text()
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    /** Hill order with charge suffix, as the engine prints it (e.g. `CH4`, `O4S^2-`). */
    formula: text().notNull(),
    charge: integer().notNull().default(0),
    casRn: text(),
    inchi: text(),
    inchiKey: text(),
    smiles: text(),
    notes: text(),
    createdBy: integer().references(() => users.id),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('species_key_format', sql`${t.key} ~ '^[a-z0-9][a-z0-9,]*(-[a-z0-9,]+)*$'`),
    check(
      'species_cas_format',
      sql`${t.casRn} is null or ${t.casRn} ~ '^[0-9]{2,7}-[0-9]{2}-[0-9]$'`,
    ),
    check(
      'species_inchikey_format',
      sql`${t.inchiKey} is null or ${t.inchiKey} ~ '^[A-Z]{14}-[A-Z]{10}-[A-Z]$'`,
    ),
    index('species_formula_idx').on(t.formula),
    uniqueIndex('species_cas_rn_idx').on(t.casRn),
    uniqueIndex('species_inchikey_idx').on(t.inchiKey),
  ],
);

/** One phase of one species (with a modification label for polymorphs: graphite, calcite…). */
export const speciesPhases = pgTable(
  'species_phases',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    speciesId: integer()
      .notNull()
      .references(() => species.id),
    phase: phase().notNull(),
    modification: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('species_phases_identity').on(t.speciesId, t.phase, t.modification).nullsNotDistinct(),
    check(
      'species_phases_modification_label',
      sql`${t.modification} is null or ${t.modification} ~ '^[a-z0-9][a-z0-9 -]*$'`,
    ),
  ],
);

export type SpeciesRow = typeof species.$inferSelect;
export type SpeciesPhaseRow = typeof speciesPhases.$inferSelect;
