import { z } from 'zod';
import { REVISION_KINDS, REVISION_STATUSES, STANDARD_PRESSURES } from '../../../../schema';
import { intText } from '../../middleware/validate';
import { ImpactAnswer } from '../watchlists/watchlists-schemas';
import { ITEM_KINDS, Phase, ProposalItemInput, UncertaintyBasis } from './proposal-item-schemas';

/**
 * The contract of the proposals routes (issue 7): requests validated at the edge, answers
 * checked in tests/api/proposals*.test.ts. The client imports the inferred types only. The item
 * kinds and their fields are documented in proposal-item-schemas.ts (re-exported here).
 */
export * from './proposal-item-schemas';

const Rationale = z.string().trim().min(1, 'say why: a rationale is required').max(10_000);
const Items = z.array(ProposalItemInput).min(1, 'a proposal has at least one item').max(20_000);

// ---- POST /api/v1/proposals · PUT|PATCH /api/v1/proposals/:id · POST /api/v1/proposals/check ----

export const CreateProposalBody = z.object({ rationale: Rationale, items: Items }).strict();
export type CreateProposalBody = z.infer<typeof CreateProposalBody>;
/** PUT replaces rationale and items; PATCH may send either. */
export const ReviseProposalBody = z
  .object({ rationale: Rationale.optional(), items: Items.optional() })
  .strict()
  .refine((b) => b.rationale !== undefined || b.items !== undefined, {
    message: 'send a rationale, items or both',
  });
export const CheckItemsBody = z.object({ items: Items }).strict();

/** A problem with one item: `path` as in `items[2].casRn`; blocks saving. */
export const ItemIssue = z.object({
  index: z.number().int(),
  path: z.string(),
  code: z.string(),
  message: z.string(),
});
export type ItemIssue = z.infer<typeof ItemIssue>;
/** Something a reviewer should look at (a likely duplicate species); never blocks saving. */
export const ItemWarning = ItemIssue.extend({
  /** For duplicates: the existing species' key. */
  species: z.string().optional(),
});
export type ItemWarning = z.infer<typeof ItemWarning>;

export const CheckAnswer = z.object({
  ok: z.boolean(),
  issues: z.array(ItemIssue),
  warnings: z.array(ItemWarning),
});
export type CheckAnswer = z.infer<typeof CheckAnswer>;

export const ProposalStatus = z.enum([
  'draft',
  'submitted',
  'changes_requested',
  'approved',
  'rejected',
  'withdrawn',
]);
export type ProposalStatus = z.infer<typeof ProposalStatus>;

export const CreateAnswer = z.object({
  id: z.number().int(),
  status: z.literal('draft'),
  warnings: z.array(ItemWarning),
});
export type CreateAnswer = z.infer<typeof CreateAnswer>;

// ---- GET /api/v1/proposals (the review queue) ----

export const ProposalListQuery = z
  .object({
    /** One status or several, comma-separated (`submitted,changes_requested`). */
    status: z
      .string()
      .transform((s) => s.split(',').map((x) => x.trim()))
      .pipe(z.array(ProposalStatus).min(1))
      .optional(),
    /** `me` for the caller's own proposals, or a login. */
    author: z.string().trim().min(1).max(100).optional(),
    /** Proposals with an item about this species key. */
    species: z.string().trim().min(1).max(200).optional(),
    /** Only proposals with a stale derived item (`true`). */
    stale: z.enum(['true', 'false']).optional(),
    sort: z.enum(['updatedAt', 'createdAt', 'submittedAt', 'id', 'status']).default('updatedAt'),
    order: z.enum(['asc', 'desc']).default('desc'),
    offset: intText(0, 1_000_000).default(0),
    limit: intText(1, 200).default(50),
  })
  .strict();
export type ProposalListQuery = z.infer<typeof ProposalListQuery>;

export const UserRef = z.object({ id: z.number().int(), login: z.string(), name: z.string() });

export const ProposalSummary = z.object({
  id: z.number().int(),
  status: ProposalStatus,
  rationale: z.string(),
  author: UserRef,
  decidedBy: UserRef.nullable(),
  /** ISO 8601. */
  createdAt: z.string(),
  updatedAt: z.string(),
  submittedAt: z.string().nullable(),
  decidedAt: z.string().nullable(),
  itemCount: z.number().int(),
  kinds: z.array(z.enum(ITEM_KINDS)),
  /** Species keys the items are about (first few). */
  species: z.array(z.string()),
  commentCount: z.number().int(),
  /** True when a derived item's inputs were superseded since it was computed. */
  stale: z.boolean(),
});
export type ProposalSummary = z.infer<typeof ProposalSummary>;

export const ProposalList = z.object({
  proposals: z.array(ProposalSummary),
  total: z.number().int(),
  offset: z.number().int(),
  limit: z.number().int(),
});
export type ProposalList = z.infer<typeof ProposalList>;

// ---- GET /api/v1/proposals/:id (detail for review) ----

export const SourceRef = z.object({
  id: z.number().int(),
  citation: z.string(),
  doi: z.string().nullable(),
});

/** A revision as the review shows it; energies in J/mol (exact text beside the number). */
export const RevisionRef = z.object({
  id: z.number().int(),
  kind: z.enum(REVISION_KINDS),
  quantity: z.string(),
  status: z.enum(REVISION_STATUSES),
  value: z.number().nullable(),
  valueText: z.string().nullable(),
  uncertainty: z.number().nullable(),
  uncertaintyBasis: UncertaintyBasis.nullable(),
  temperature: z.number().nullable(),
  method: z.string().nullable(),
  standardPressure: z.enum(STANDARD_PRESSURES),
  source: SourceRef,
  createdAt: z.string(),
  /** Published releases that pin it. */
  releases: z.array(z.string()),
  derived: z.boolean(),
});
export type RevisionRef = z.infer<typeof RevisionRef>;

/** A derived revision whose input was superseded: which input, and by what. */
export const StaleInput = z.object({
  inputRevisionId: z.number().int(),
  /** The accepted revision that replaced it (null when it was retired). */
  supersededBy: z.number().int().nullable(),
  species: z.string(),
  phase: z.string(),
});
export type StaleInput = z.infer<typeof StaleInput>;

export const DerivedRef = z.object({
  revisionId: z.number().int(),
  species: z.string(),
  phase: z.string(),
  status: z.enum(REVISION_STATUSES),
});

/** ΔrH° in kJ/mol of a reaction of the item's species, with today's and the proposed value. */
export const ReactionImpact = z.object({
  label: z.enum(['formation', 'combustion']),
  equation: z.string(),
  /** kJ/mol; null where the current data cannot compute it (e.g. a new species). */
  before: z.number().nullable(),
  after: z.number().nullable(),
  unit: z.literal('kJ/mol'),
});

export const Comparison = z.object({
  /** Proposed minus current, kJ/mol. */
  differenceKJPerMol: z.number(),
  /** √(u_new² + u_old²) in kJ/mol; null when either states no uncertainty. */
  combinedUncertaintyKJPerMol: z.number().nullable(),
  /** |difference| / combined uncertainty; null without one. */
  differenceInUncertainties: z.number().nullable(),
  /** True when the difference exceeds 2 combined uncertainties. */
  flagged: z.boolean(),
});

/** What a derive item computed: ΔfH° with propagated uncertainty and the input revisions. */
export const DerivationView = z.object({
  value: z.number(),
  uncertainty: z.number().nullable(),
  equation: z.string(),
  release: z.string(),
  inputs: z.array(
    z.object({
      species: z.string(),
      phase: z.string(),
      revisionId: z.number().int().nullable(),
      value: z.number(),
      uncertainty: z.number().nullable(),
    }),
  ),
});

export const ProposalItemView = z.object({
  index: z.number().int(),
  kind: z.enum(ITEM_KINDS),
  /** The item as the curator sent it (original unit). */
  input: z.record(z.string(), z.unknown()),
  species: z.string().nullable(),
  phase: Phase.nullable(),
  modification: z.string().nullable(),
  quantity: z.string().nullable(),
  /** The stored SI value (J/mol) of a value item; null for other kinds. */
  value: z.number().nullable(),
  uncertainty: z.number().nullable(),
  source: SourceRef.nullable(),
  /** The accepted revision this item would replace or retire (now). */
  target: RevisionRef.nullable(),
  /** The target fixed at submission (a decision is refused as `stale` when it moved on). */
  targetRevisionId: z.number().int().nullable(),
  comparison: Comparison.nullable(),
  /** Every other value recorded for the species-phase and quantity, newest first. */
  otherValues: z.array(RevisionRef),
  /** Derived revisions that approving this item would make stale. */
  wouldStale: z.array(DerivedRef),
  reactions: z.array(ReactionImpact),
  derivation: DerivationView.nullable(),
  /** For derive items: inputs superseded since the value was computed. */
  staleInputs: z.array(StaleInput),
  /** The revision approval created. */
  createdRevisionId: z.number().int().nullable(),
});
export type ProposalItemView = z.infer<typeof ProposalItemView>;

export const CommentView = z.object({
  id: z.number().int(),
  author: UserRef,
  body: z.string(),
  /** Set when the comment came with a decision. */
  decision: z.enum(['approve', 'reject', 'request_changes']).nullable(),
  createdAt: z.string(),
});
export type CommentView = z.infer<typeof CommentView>;

export const ProposalDetail = ProposalSummary.extend({
  items: z.array(ProposalItemView),
  comments: z.array(CommentView),
  warnings: z.array(ItemWarning),
  /** What the caller may do now (the screens show only these buttons). */
  allowed: z.array(z.enum(['revise', 'submit', 'withdraw', 'comment', 'decide'])),
});
export type ProposalDetail = z.infer<typeof ProposalDetail>;

// ---- transitions ----

export const CommentBody = z.object({ body: z.string().trim().min(1).max(10_000) }).strict();
export const DecisionBody = z
  .object({
    decision: z.enum(['approve', 'reject', 'request_changes']),
    comment: z.string().trim().min(1, 'a decision needs a comment').max(10_000),
  })
  .strict();
export type Decision = z.infer<typeof DecisionBody>['decision'];

/** submit / withdraw / decision / PUT|PATCH: the proposal's new state. */
export const TransitionAnswer = z.object({
  id: z.number().int(),
  status: ProposalStatus,
  /** Revisions created by an approval. */
  createdRevisionIds: z.array(z.number().int()),
  warnings: z.array(ItemWarning),
});
export type TransitionAnswer = z.infer<typeof TransitionAnswer>;

export const CommentAnswer = z.object({ comment: CommentView });
export type CommentAnswer = z.infer<typeof CommentAnswer>;

// ---- POST /api/v1/revisions/:id/rederive ----

/** Re-derives a derived revision against the newest values (`accepted`): a new draft proposal. */
export const RederiveBody = z
  .object({
    release: z.string().trim().min(1).max(64).default('accepted'),
    rationale: z.string().trim().min(1).max(10_000).optional(),
  })
  .strict();
export const RederiveAnswer = CreateAnswer;
export type RederiveAnswer = CreateAnswer;

// ---- GET /api/v1/proposals/:id/watchlist-impact ----

/**
 * The caller's watchlists with the proposal's items applied: `from` is the accepted values
 * (`accepted`, heat capacities and transitions included, so a reaction saved at another
 * temperature is computed as the reaction API computes it), `to` the same with the proposal
 * overlaid (`proposal-<id>`). Every reaction is listed; those the proposal moves count in
 * `affected`.
 */
export const WatchlistImpactAnswer = z.object({
  proposalId: z.number().int(),
  status: ProposalStatus,
  watchlists: z.array(
    z.object({
      id: z.number().int(),
      name: z.string(),
      /** Reactions whose ΔrH changes, or that only one side can compute. */
      affected: z.number().int(),
      report: ImpactAnswer,
    }),
  ),
  caution: z.string(),
});
export type WatchlistImpactAnswer = z.infer<typeof WatchlistImpactAnswer>;
