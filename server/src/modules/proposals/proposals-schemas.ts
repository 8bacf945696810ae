import { z } from 'zod';
import {
  HEAT_CAPACITY_FORMS,
  REVISION_KINDS,
  REVISION_STATUSES,
  STANDARD_PRESSURES,
  STORED_PHASES,
  UNCERTAINTY_BASIS_VALUES,
} from '../../../../schema';
import { intText } from '../../middleware/validate';

/**
 * The contract of the proposals routes (issue 7): requests validated at the edge, answers
 * checked in tests/api/proposals*.test.ts. The client imports the inferred types only.
 *
 * Item kinds (`kind`):
 * - `add_value` / `supersede_value` — a new value of one species-phase. `quantity` chooses the
 *   shape: `formation_enthalpy` (the fixed fields of issue 7), `heat_capacity` (`form` nasa7 with
 *   exactly two ranges of 7 coefficients a1…a7, or shomate with one or more ranges of 5–8
 *   coefficients A…H), `transition` (`toPhase`, `toModification`, `temperature` in K, ΔtrsH as
 *   `value`). `supersede_value` replaces the accepted revision of the same species-phase and
 *   quantity; `supersedes` (a revision id) pins which one was meant — without it the revision
 *   accepted when the proposal is submitted is the target.
 * - `retire_value` — withdraws the accepted revision (`revisionId`, or the accepted one of
 *   `species`/`phase`/`quantity`) without replacement; `sourceId` says why.
 * - `add_species` — a new species (formula checked by the engine, key format, charge, CAS RN
 *   check digit, InChIKey shape) with its first phases; duplicates are warnings, not errors.
 * - `add_phase` — a new phase (and modification) of an existing species, or of one added by an
 *   earlier item of the same proposal.
 * - `derive_value` — ΔfH° derived from a measured reaction enthalpy (`equation`, `deltaH` in
 *   `unit`) and the other species' values in `release`; method is always `derived`.
 *
 * Species are named by registry key (`methane`); a phase is `g l cr s am aq`, optionally with a
 * modification after a comma (`cr,graphite`) or in `modification`. `s` means cr or am when the
 * species has exactly one of them. Energies arrive in kJ/mol, kcal/mol (thermochemical calorie,
 * 4.184 J) or J/mol and are stored exactly in J/mol. `sourceId` is a source's id (text or number).
 */

export const Phase = z.enum(STORED_PHASES);
const PhaseText = z
  .string()
  .trim()
  .regex(
    /^(g|l|cr|s|am|aq)(,[a-z0-9][a-z0-9 -]*)?$/,
    'a phase is g, l, cr, s, am or aq, optionally with a modification: cr,graphite',
  );
const Modification = z
  .string()
  .trim()
  .regex(/^[a-z0-9][a-z0-9 -]*$/, 'a modification is lower-case words: graphite, calcite')
  .max(60);
const SpeciesKey = z.string().trim().min(1).max(200);
export const EnergyUnit = z.enum(['kJ/mol', 'kcal/mol', 'J/mol']);
export const UncertaintyBasis = z.enum(UNCERTAINTY_BASIS_VALUES);
const Finite = z.number().finite();
const NonNegative = z.number().finite().min(0);
/** A source's id; the fixed contract sends it as text, numbers are accepted too. */
export const SourceIdField = z
  .union([
    z.string().regex(/^[1-9][0-9]{0,9}$/, 'a source id is a positive whole number'),
    z.number().int().positive(),
  ])
  .transform(String);
const RevisionId = z.number().int().positive().max(2_147_483_647);
const Method = z.string().trim().min(1).max(200);
const Notes = z.string().max(4000).optional();
const Pressure = z.enum(STANDARD_PRESSURES).default('1 bar');

const Target = { species: SpeciesKey, phase: PhaseText, modification: Modification.optional() };
const Measured = {
  value: Finite,
  unit: EnergyUnit,
  uncertainty: NonNegative.nullable().optional(),
  uncertaintyBasis: UncertaintyBasis.nullable().optional(),
  method: Method,
  standardPressure: Pressure,
  sourceId: SourceIdField,
  notes: Notes,
  fromMemory: z.boolean().default(false),
};

export const HeatCapacityRangeInput = z.object({
  tMin: z.number().finite().positive(),
  tMax: z.number().finite().positive(),
  coefficients: z.array(Finite.nullable()).min(5).max(8),
});

const FormationValue = z.object({
  ...Target,
  quantity: z.literal('formation_enthalpy'),
  ...Measured,
});
const HeatCapacityValue = z.object({
  ...Target,
  quantity: z.literal('heat_capacity'),
  form: z.enum(HEAT_CAPACITY_FORMS),
  ranges: z.array(HeatCapacityRangeInput).min(1).max(8),
  method: Method.optional(),
  standardPressure: Pressure,
  sourceId: SourceIdField,
  notes: Notes,
  fromMemory: z.boolean().default(false),
});
const TransitionValue = z.object({
  ...Target,
  quantity: z.literal('transition'),
  toPhase: Phase,
  toModification: Modification.optional(),
  /** K. */
  temperature: z.number().finite().positive(),
  ...Measured,
});

const AddKind = { kind: z.literal('add_value') };
const SupersedeKind = {
  kind: z.literal('supersede_value'),
  /** The accepted revision meant; without it, the one accepted at submission. */
  supersedes: RevisionId.optional(),
};

export const AddValueItem = z.discriminatedUnion('quantity', [
  FormationValue.extend(AddKind).strict(),
  HeatCapacityValue.extend(AddKind).strict(),
  TransitionValue.extend(AddKind).strict(),
]);
export const SupersedeValueItem = z.discriminatedUnion('quantity', [
  FormationValue.extend(SupersedeKind).strict(),
  HeatCapacityValue.extend(SupersedeKind).strict(),
  TransitionValue.extend(SupersedeKind).strict(),
]);

export const RetireValueItem = z
  .object({
    kind: z.literal('retire_value'),
    /** The accepted revision to retire; or name it by species, phase and quantity. */
    revisionId: RevisionId.optional(),
    species: SpeciesKey.optional(),
    phase: PhaseText.optional(),
    modification: Modification.optional(),
    /** `formation_enthalpy`, `heat_capacity` or `transition:<to phase>[,<modification>]`. */
    quantity: z.string().max(80).optional(),
    sourceId: SourceIdField,
    notes: Notes,
  })
  .strict()
  .refine((i) => i.revisionId !== undefined || (i.species && i.phase && i.quantity), {
    message: 'name the revision to retire: revisionId, or species, phase and quantity',
  });

export const NewPhase = z.object({ phase: Phase, modification: Modification.optional() }).strict();

export const AddSpeciesItem = z
  .object({
    kind: z.literal('add_species'),
    /** Registry key: lower-case words joined by hyphens (`2-methylpropane`). */
    key: z.string().trim().min(1).max(120),
    name: z.string().trim().min(1).max(300),
    /** Any notation the engine reads (`CH4`, `SO4^2-`); stored in Hill order. */
    formula: z.string().trim().min(1).max(200),
    charge: z.number().int().min(-20).max(20).default(0),
    synonyms: z.array(z.string().trim().min(1).max(300)).max(50).default([]),
    casRn: z.string().trim().max(20).optional(),
    inchi: z.string().trim().max(4000).optional(),
    inchiKey: z.string().trim().max(40).optional(),
    smiles: z.string().trim().max(2000).optional(),
    notes: Notes,
    phases: z.array(NewPhase).max(10).default([]),
    sourceId: SourceIdField.optional(),
  })
  .strict();

export const AddPhaseItem = z
  .object({
    kind: z.literal('add_phase'),
    species: SpeciesKey,
    phase: Phase,
    modification: Modification.optional(),
    sourceId: SourceIdField.optional(),
    notes: Notes,
  })
  .strict();

export const DeriveValueItem = z
  .object({
    kind: z.literal('derive_value'),
    species: SpeciesKey,
    phase: PhaseText,
    modification: Modification.optional(),
    /** The measured reaction, containing the species (e.g. its combustion). */
    equation: z.string().trim().min(1).max(2000),
    deltaH: Finite,
    unit: EnergyUnit,
    uncertainty: NonNegative.nullable().optional(),
    uncertaintyBasis: UncertaintyBasis.nullable().optional(),
    /**
     * Whose values the other terms come from: a published release (`2026.1`, `latest`), or
     * `accepted` for the newest accepted values (released or waiting for the next release).
     */
    release: z.string().trim().min(1).max(64),
    sourceId: SourceIdField,
    method: z.literal('derived').default('derived'),
    standardPressure: Pressure,
    notes: Notes,
  })
  .strict();

/** One item of a proposal: the union of every kind above. */
export const ProposalItemInput = z.union([
  AddValueItem,
  SupersedeValueItem,
  RetireValueItem,
  AddSpeciesItem,
  AddPhaseItem,
  DeriveValueItem,
]);
export type ProposalItemInput = z.infer<typeof ProposalItemInput>;
export type ItemKind = ProposalItemInput['kind'];
export const ITEM_KINDS = [
  'add_species',
  'add_phase',
  'add_value',
  'supersede_value',
  'retire_value',
  'derive_value',
] as const;

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
