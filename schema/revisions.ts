import { sql } from 'drizzle-orm';
import {
  boolean,
  check,
  index,
  integer,
  jsonb,
  numeric,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uniqueIndex,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core';
import { phase, speciesPhases } from './species';
import { sources } from './sources';
import { users } from './users';

/** The three kinds of value a revision can hold. */
export const REVISION_KINDS = ['formation_enthalpy', 'heat_capacity', 'transition'] as const;
export type RevisionKind = (typeof REVISION_KINDS)[number];
export const revisionKind = pgEnum('revision_kind', REVISION_KINDS);

/**
 * proposed → accepted (awaits the next release) → superseded (a newer accepted revision
 * replaced it) or retired (withdrawn without replacement); rejected proposals end as rejected.
 * At most one revision per species-phase and quantity is accepted at a time.
 */
export const REVISION_STATUSES = [
  'proposed',
  'accepted',
  'superseded',
  'retired',
  'rejected',
] as const;
export type RevisionStatus = (typeof REVISION_STATUSES)[number];
export const revisionStatus = pgEnum('revision_status', REVISION_STATUSES);

export const UNCERTAINTY_BASIS_VALUES = ['standard', 'expanded_k2', 'as_stated'] as const;
export const uncertaintyBasis = pgEnum('uncertainty_basis', UNCERTAINTY_BASIS_VALUES);

export const STANDARD_PRESSURES = ['1 bar', '1 atm'] as const;
export type StandardPressure = (typeof STANDARD_PRESSURES)[number];
export const standardPressure = pgEnum('standard_pressure', STANDARD_PRESSURES);

export const HEAT_CAPACITY_FORMS = ['nasa7', 'shomate'] as const;
export type HeatCapacityForm = (typeof HEAT_CAPACITY_FORMS)[number];
export const heatCapacityForm = pgEnum('heat_capacity_form', HEAT_CAPACITY_FORMS);

/** What a derived ΔfH° was computed from (the inputs themselves are in revision_inputs). */
export interface DerivationRecord {
  /** The measured reaction, as the engine prints it. */
  equation: string;
  /** Measured ΔrH° in J/mol, exact decimal text. */
  deltaH: string;
  uncertainty: string | null;
  /** Release whose values the other terms came from (`accepted`: the accepted values then). */
  releaseVersion: string;
  /** Basis of the measured uncertainty (derivations recorded by proposals). */
  uncertaintyBasis?: 'standard' | 'expanded_k2' | 'as_stated' | null;
}

/**
 * One version of one value of one species-phase. Never edited in place: a new revision
 * supersedes the old. `quantity` is the pinning key a release entry uses: `formation_enthalpy`,
 * `heat_capacity`, or `transition:<to phase>[,<modification>]` (one per target phase).
 * Numbers are exact decimals in SI (J/mol, K).
 */
export const revisions = pgTable(
  'revisions',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    speciesPhaseId: integer()
      .notNull()
      .references(() => speciesPhases.id),
    kind: revisionKind().notNull(),
    quantity: text().notNull(),
    /** ΔfH°(298.15 K) or ΔtrsH, J/mol; null for heat-capacity sets. */
    value: numeric(),
    uncertainty: numeric(),
    uncertaintyBasis: uncertaintyBasis(),
    /** Transitions: the temperature (K) and the phase entered on heating. */
    temperature: numeric(),
    toPhase: phase(),
    toModification: text(),
    /** Heat-capacity sets: the form; the ranges are rows of heat_capacity_ranges. */
    heatCapacityForm: heatCapacityForm(),
    /** How the value was obtained (combustion_calorimetry, equilibrium, computed, derived…). */
    method: text(),
    standardPressure: standardPressure().notNull().default('1 bar'),
    sourceId: integer()
      .notNull()
      .references(() => sources.id),
    notes: text(),
    /** True when the value was transcribed from memory rather than read in the source. */
    fromMemory: boolean().notNull().default(false),
    status: revisionStatus().notNull(),
    supersedesId: integer().references((): AnyPgColumn => revisions.id),
    derivation: jsonb().$type<DerivationRecord>(),
    createdBy: integer().references(() => users.id),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    /** When the status last changed (accepted, superseded, retired…). */
    statusChangedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    // Target of the release entries' composite key: an entry cannot pin a revision of another
    // species-phase or quantity.
    unique('revisions_identity').on(t.id, t.speciesPhaseId, t.quantity),
    uniqueIndex('revisions_one_accepted_idx')
      .on(t.speciesPhaseId, t.quantity)
      .where(sql`${t.status} = 'accepted'`),
    index('revisions_species_phase_idx').on(t.speciesPhaseId, t.quantity, t.createdAt),
    index('revisions_status_idx').on(t.status),
    index('revisions_supersedes_idx').on(t.supersedesId),
    index('revisions_source_idx').on(t.sourceId),
    check(
      'revisions_kind_shape',
      sql`case ${t.kind}
        when 'formation_enthalpy' then ${t.quantity} = 'formation_enthalpy' and ${t.value} is not null
          and ${t.heatCapacityForm} is null and ${t.temperature} is null and ${t.toPhase} is null
        when 'heat_capacity' then ${t.quantity} = 'heat_capacity' and ${t.value} is null
          and ${t.heatCapacityForm} is not null and ${t.temperature} is null and ${t.toPhase} is null
        when 'transition' then ${t.value} is not null and ${t.temperature} > 0 and ${t.toPhase} is not null
          and ${t.heatCapacityForm} is null
          and ${t.quantity} = 'transition:' || ${t.toPhase} || coalesce(',' || ${t.toModification}, '')
      end`,
    ),
    check(
      'revisions_uncertainty_nonnegative',
      sql`${t.uncertainty} is null or ${t.uncertainty} >= 0`,
    ),
    check(
      'revisions_uncertainty_basis',
      sql`(${t.uncertainty} is null) = (${t.uncertaintyBasis} is null)`,
    ),
    check('revisions_not_self_superseding', sql`${t.supersedesId} is distinct from ${t.id}`),
  ],
);

/**
 * One temperature range of a heat-capacity set. NASA 7-coefficient sets have two ranges
 * (a1…a7 each); Shomate sets one or more (A…H, F G H optional); coefficients are c1… as the source printed them.
 */
export const heatCapacityRanges = pgTable(
  'heat_capacity_ranges',
  {
    revisionId: integer()
      .notNull()
      .references(() => revisions.id),
    seq: integer().notNull(),
    tMin: numeric().notNull(),
    tMax: numeric().notNull(),
    coefficients: numeric().array().notNull(),
  },
  (t) => [
    primaryKey({ columns: [t.revisionId, t.seq] }),
    check('heat_capacity_ranges_order', sql`${t.tMin} > 0 and ${t.tMin} < ${t.tMax}`),
    check('heat_capacity_ranges_coefficients', sql`cardinality(${t.coefficients}) between 5 and 8`),
  ],
);

/** Derived values remember the revisions they were computed from; superseding one makes them stale. */
export const revisionInputs = pgTable(
  'revision_inputs',
  {
    revisionId: integer()
      .notNull()
      .references(() => revisions.id),
    inputRevisionId: integer()
      .notNull()
      .references(() => revisions.id),
  },
  (t) => [
    primaryKey({ columns: [t.revisionId, t.inputRevisionId] }),
    index('revision_inputs_input_idx').on(t.inputRevisionId),
    check('revision_inputs_not_self', sql`${t.revisionId} <> ${t.inputRevisionId}`),
  ],
);

export type RevisionRow = typeof revisions.$inferSelect;
export type HeatCapacityRangeRow = typeof heatCapacityRanges.$inferSelect;
