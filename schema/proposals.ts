import { sql } from 'drizzle-orm';
import {
  check,
  index,
  integer,
  jsonb,
  numeric,
  pgEnum,
  pgTable,
  text,
  timestamp,
  unique,
} from 'drizzle-orm/pg-core';
import { revisions, type DerivationRecord } from './revisions';
import { phase } from './species';
import { sources } from './sources';
import { users } from './users';

/** draft → submitted → changes_requested (→ submitted again) | approved | rejected; withdrawn by the author. */
export const PROPOSAL_STATUSES = [
  'draft',
  'submitted',
  'changes_requested',
  'approved',
  'rejected',
  'withdrawn',
] as const;
export type ProposalStatusValue = (typeof PROPOSAL_STATUSES)[number];
export const proposalStatus = pgEnum('proposal_status', PROPOSAL_STATUSES);

export const PROPOSAL_ITEM_KINDS = [
  'add_species',
  'add_phase',
  'add_value',
  'supersede_value',
  'retire_value',
  'derive_value',
] as const;
export type ProposalItemKind = (typeof PROPOSAL_ITEM_KINDS)[number];
export const proposalItemKind = pgEnum('proposal_item_kind', PROPOSAL_ITEM_KINDS);

export const PROPOSAL_DECISIONS = ['approve', 'reject', 'request_changes'] as const;
export const proposalDecision = pgEnum('proposal_decision', PROPOSAL_DECISIONS);

/** A curator's request to change the registry; reviewed by an editor who is not the author. */
export const proposals = pgTable(
  'proposals',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    authorId: integer()
      .notNull()
      .references(() => users.id),
    rationale: text().notNull(),
    status: proposalStatus().notNull().default('draft'),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    /** The latest submission (a revised proposal is submitted again). */
    submittedAt: timestamp({ withTimezone: true }),
    decidedBy: integer().references(() => users.id),
    decidedAt: timestamp({ withTimezone: true }),
  },
  (t) => [
    index('proposals_status_idx').on(t.status, t.updatedAt),
    index('proposals_author_idx').on(t.authorId),
    check('proposals_decided_fields', sql`(${t.decidedBy} is null) = (${t.decidedAt} is null)`),
    check(
      'proposals_final_decided',
      sql`${t.status} not in ('approved', 'rejected') or ${t.decidedAt} is not null`,
    ),
    check('proposals_not_own_decision', sql`${t.decidedBy} is distinct from ${t.authorId}`),
  ],
);

/** What a derive item computed when it was saved, besides the DerivationRecord it will store. */
export interface ItemDerivation extends DerivationRecord {
  /** ΔfH° in J/mol, exact decimal text, and its propagated uncertainty. */
  value: string;
  valueUncertainty: string | null;
  /** Basis of the propagated uncertainty (`as_stated` when the inputs' bases differ). */
  valueUncertaintyBasis: 'standard' | 'expanded_k2' | 'as_stated' | null;
  inputs: {
    species: string;
    phase: string;
    revisionId: number | null;
    value: number;
    uncertainty: number | null;
  }[];
}

/**
 * One change a proposal asks for. `input` keeps the item as the curator sent it (original unit);
 * the columns beside it are what the service resolved: the SI value, the species-phase it is
 * about, the revision it replaces (fixed at submission) and the revision approval created.
 */
export const proposalItems = pgTable(
  'proposal_items',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    proposalId: integer()
      .notNull()
      .references(() => proposals.id),
    seq: integer().notNull(),
    kind: proposalItemKind().notNull(),
    input: jsonb().$type<Record<string, unknown>>().notNull(),
    speciesKey: text(),
    phase: phase(),
    modification: text(),
    /** `formation_enthalpy`, `heat_capacity` or `transition:<to>[,<modification>]`. */
    quantity: text(),
    /** J/mol, exact (ΔfH° or ΔtrsH). */
    value: numeric(),
    uncertainty: numeric(),
    sourceId: integer().references(() => sources.id),
    targetRevisionId: integer().references(() => revisions.id),
    createdRevisionId: integer().references(() => revisions.id),
    derivation: jsonb().$type<ItemDerivation>(),
    inputRevisionIds: integer()
      .array()
      .notNull()
      .default(sql`'{}'::integer[]`),
  },
  (t) => [
    unique('proposal_items_seq').on(t.proposalId, t.seq),
    index('proposal_items_target_idx').on(t.targetRevisionId),
    index('proposal_items_species_idx').on(t.speciesKey),
  ],
);

/** The review thread; a decision's comment carries the decision. */
export const proposalComments = pgTable(
  'proposal_comments',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    proposalId: integer()
      .notNull()
      .references(() => proposals.id),
    authorId: integer()
      .notNull()
      .references(() => users.id),
    body: text().notNull(),
    decision: proposalDecision(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('proposal_comments_proposal_idx').on(t.proposalId, t.createdAt)],
);

export type ProposalRow = typeof proposals.$inferSelect;
export type ProposalItemRow = typeof proposalItems.$inferSelect;
export type ProposalCommentRow = typeof proposalComments.$inferSelect;
