import { z } from 'zod';
import {
  RELEASE_VERSION_PATTERN,
  REVISION_KINDS,
  STORED_PHASES,
  UNCERTAINTY_BASIS_VALUES,
} from '../../../../schema';

/**
 * The contract of the release composer (editors and admins): drafts, their changes against the
 * previous release, stale derived values, and publishing. Kept beside `releases-schemas.ts`
 * (the public read side) so neither file grows past a screen of reading.
 */

const RevisionIds = z.array(z.number().int().positive().max(2_147_483_647)).max(20_000);
const Notes = z.string().max(20_000);

// ---- POST /api/v1/releases ----

export const CreateReleaseBody = z
  .object({
    version: z
      .string()
      .regex(RELEASE_VERSION_PATTERN, 'must look like 2026.2 (year, dot, number; e.g. 2026.2-rc1)'),
    notes: Notes.default(''),
  })
  .strict();
export type CreateReleaseInput = z.input<typeof CreateReleaseBody>;

// ---- PATCH /api/v1/releases/:version ----

export const UpdateDraftBody = z
  .object({
    notes: Notes.optional(),
    /** Changes to leave out, by the revision the change list names. */
    exclude: RevisionIds.optional(),
    /** Left-out changes to take back in. */
    include: RevisionIds.optional(),
    /** Re-base a stale draft onto the newest published release. */
    rebase: z.literal(true).optional(),
  })
  .strict()
  .refine((b) => Object.keys(b).length > 0, 'name at least one of notes, exclude, include, rebase');
export type UpdateDraftInput = z.infer<typeof UpdateDraftBody>;

// ---- POST /api/v1/releases/:version/acknowledgements ----

export const AcknowledgeBody = z.object({ revisionIds: RevisionIds.min(1) }).strict();
export type AcknowledgeInput = z.infer<typeof AcknowledgeBody>;

// ---- answers ----

const Person = z.object({ login: z.string(), name: z.string() });
const Phase = z.enum(STORED_PHASES);

export const DraftView = z.object({
  version: z.string(),
  status: z.literal('draft'),
  notes: z.string(),
  /** The release this draft changes: the newest published one when it was drafted. */
  base: z.string().nullable(),
  /** True when another release was published since: the draft must be re-based to publish. */
  stale: z.boolean(),
  latest: z.string().nullable(),
  createdAt: z.string(),
  createdBy: Person.nullable(),
});
export type DraftView = z.infer<typeof DraftView>;

/** `GET /api/v1/releases/drafts`. */
export const DraftList = z.object({ drafts: z.array(DraftView) });
export type DraftList = z.infer<typeof DraftList>;

/** One side of a change. Values J/mol (exact decimal in `valueText`), temperatures K. */
export const ChangeSide = z.object({
  revisionId: z.number().int(),
  kind: z.enum(REVISION_KINDS),
  value: z.number().nullable(),
  valueText: z.string().nullable(),
  uncertainty: z.number().nullable(),
  uncertaintyBasis: z.enum(UNCERTAINTY_BASIS_VALUES).nullable(),
  method: z.string().nullable(),
  temperature: z.number().nullable(),
  heatCapacityForm: z.string().nullable(),
  source: z.object({ id: z.number().int(), citation: z.string(), doi: z.string().nullable() }),
});
export type ChangeSide = z.infer<typeof ChangeSide>;

export const DraftChange = z.object({
  change: z.enum(['added', 'changed', 'retired']),
  /** What `exclude`/`include` name: the new revision, or for a retirement the retired one. */
  revisionId: z.number().int(),
  included: z.boolean(),
  species: z.object({ key: z.string(), name: z.string(), formula: z.string() }),
  phase: Phase,
  modification: z.string().nullable(),
  quantity: z.string(),
  old: ChangeSide.nullable(),
  new: ChangeSide.nullable(),
  /**
   * new − old in kJ/mol, and the same in units of the combined standard uncertainty
   * (root sum of squares of both); null where a side has no value or no uncertainty.
   */
  difference: z
    .object({
      kJPerMol: z.number(),
      combinedUncertainties: z.number().nullable(),
    })
    .nullable(),
});
export type DraftChange = z.infer<typeof DraftChange>;

export const DraftCounts = z.object({
  added: z.number().int(),
  changed: z.number().int(),
  retired: z.number().int(),
  included: z.number().int(),
  /** Stale derived values not yet acknowledged: publishing is refused while this is above 0. */
  staleUnacknowledged: z.number().int(),
});

/** `GET /api/v1/releases/:version/changes`, and the answer of `POST`/`PATCH` on a draft. */
export const DraftAnswer = z.object({
  release: DraftView,
  counts: DraftCounts,
  changes: z.array(DraftChange),
});
export type DraftAnswer = z.infer<typeof DraftAnswer>;

export const StaleDerived = z.object({
  revisionId: z.number().int(),
  species: z.object({ key: z.string(), name: z.string(), formula: z.string() }),
  phase: Phase,
  modification: z.string().nullable(),
  quantity: z.string(),
  value: z.number().nullable(),
  acknowledged: z.boolean(),
  /** The inputs this draft replaces (`replacedBy`: the revision pinned instead) or retires (null). */
  inputs: z.array(
    z.object({
      revisionId: z.number().int(),
      speciesKey: z.string(),
      phase: Phase,
      modification: z.string().nullable(),
      quantity: z.string(),
      replacedBy: z.number().int().nullable(),
    }),
  ),
});
export type StaleDerived = z.infer<typeof StaleDerived>;

/** `GET /api/v1/releases/:version/stale` and `POST …/acknowledgements`. */
export const StaleAnswer = z.object({ release: z.string(), stale: z.array(StaleDerived) });
export type StaleAnswer = z.infer<typeof StaleAnswer>;

export const PUBLISH_PHASES = [
  'idle',
  'waiting',
  'checking',
  'pinning',
  'freezing',
  'notifying',
  'done',
  'failed',
] as const;
export type PublishPhase = (typeof PUBLISH_PHASES)[number];

/** `GET /api/v1/releases/:version/publish-status`: the running (or last) publish job. */
export const PublishStatus = z.object({
  version: z.string(),
  phase: z.enum(PUBLISH_PHASES),
  percent: z.number().min(0).max(100),
  message: z.string(),
  error: z.object({ code: z.string(), message: z.string() }).nullable(),
  steps: z.array(z.object({ phase: z.enum(PUBLISH_PHASES), percent: z.number(), at: z.string() })),
});
export type PublishStatus = z.infer<typeof PublishStatus>;
