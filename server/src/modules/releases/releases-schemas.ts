import { z } from 'zod';
import type { ReleaseCounts, ReleaseListRow } from './releases-repository';

/** A version label (`2026.1`) or `latest`; anything else is simply an unknown release (404). */
export const ReleaseParams = z.object({ version: z.string().min(1).max(64) });

export const ReleaseSummary = z.object({
  version: z.string(),
  status: z.literal('published'),
  notes: z.string(),
  publishedAt: z.string(),
  publishedBy: z.object({ login: z.string(), name: z.string() }).nullable(),
});
export type ReleaseSummary = z.infer<typeof ReleaseSummary>;

export const ReleaseList = z.object({ releases: z.array(ReleaseSummary) });
export type ReleaseList = z.infer<typeof ReleaseList>;

export const ReleaseManifest = ReleaseSummary.extend({
  counts: z.object({
    species: z.number().int(),
    speciesPhases: z.number().int(),
    formationEnthalpies: z.number().int(),
    heatCapacitySets: z.number().int(),
    transitions: z.number().int(),
    sources: z.number().int(),
  }),
});
export type ReleaseManifest = z.infer<typeof ReleaseManifest>;

export function toReleaseSummary(r: ReleaseListRow): ReleaseSummary {
  return {
    version: r.version,
    status: 'published',
    notes: r.notes,
    publishedAt: r.publishedAt!.toISOString(),
    publishedBy: r.publishedByLogin
      ? { login: r.publishedByLogin, name: r.publishedByName! }
      : null,
  };
}

export function toReleaseManifest(r: ReleaseListRow, counts: ReleaseCounts): ReleaseManifest {
  return { ...toReleaseSummary(r), counts };
}

// ---- Exports (README: "Release exports") ----

export const ExportFormat = z.enum(['csv', 'json', 'xml']);

/** `/releases/:version/export.:format` */
export const ExportParams = ReleaseParams.extend({ format: ExportFormat });

export const ExportChecksum = z.object({
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  bytes: z.number().int(),
  url: z.string(),
});
export type ExportChecksum = z.infer<typeof ExportChecksum>;

/** The manifest with its exports' checksums. */
export const ReleaseManifestWithExports = ReleaseManifest.extend({
  exports: z.object({ csv: ExportChecksum, json: ExportChecksum, xml: ExportChecksum }),
});
export type ReleaseManifestWithExports = z.infer<typeof ReleaseManifestWithExports>;

/** Exact decimal text: no exponent, no trailing zeros after the point. */
const Decimal = z.string().regex(/^-?(0|[1-9][0-9]*)(\.[0-9]*[1-9])?$/);
const Phase = z.enum(['g', 'l', 'cr', 'am', 'aq']);
const SpeciesFields = {
  speciesKey: z.string(),
  speciesName: z.string(),
  formula: z.string(),
  phase: Phase,
  modification: z.string().nullable(),
};
const ValueFields = {
  value: Decimal.describe('J/mol'),
  uncertainty: Decimal.nullable().describe('J/mol'),
  uncertaintyBasis: z.enum(['standard', 'expanded_k2', 'as_stated']).nullable(),
};
const ProvenanceFields = {
  method: z.string().nullable(),
  standardPressure: z.enum(['1 bar', '1 atm']),
  revisionId: z.number().int().positive(),
  source: z.object({ citation: z.string(), doi: z.string().nullable() }).strict(),
};

/** The JSON export, published as a JSON Schema at /api/v1/schemas/release-export.json. */
export const ReleaseExport = z
  .object({
    format: z.literal('thalpos-release-export'),
    formatVersion: z.literal(1),
    release: z.object({ version: z.string(), publishedAt: z.string(), notes: z.string() }).strict(),
    formationEnthalpies: z.array(
      z.object({ ...SpeciesFields, ...ValueFields, ...ProvenanceFields }).strict(),
    ),
    heatCapacitySets: z.array(
      z
        .object({
          ...SpeciesFields,
          form: z.enum(['nasa7', 'shomate']),
          ranges: z.array(
            z
              .object({
                tMin: Decimal.describe('K'),
                tMax: Decimal.describe('K'),
                coefficients: z.array(Decimal.nullable()).min(5).max(8),
              })
              .strict(),
          ),
          ...ProvenanceFields,
        })
        .strict(),
    ),
    transitions: z.array(
      z
        .object({
          ...SpeciesFields,
          toPhase: Phase,
          toModification: z.string().nullable(),
          temperature: Decimal.describe('K'),
          ...ValueFields,
          ...ProvenanceFields,
        })
        .strict(),
    ),
  })
  .strict()
  .describe('Thalpos release export (JSON); values in J/mol and K as exact decimal text');
export type ReleaseExport = z.infer<typeof ReleaseExport>;

// ---- Diffs ----

/** `/releases/:a/diff/:b` — `:b` may end in `.csv` or `.json`; `?format=csv` does the same. */
export const DiffParams = z.object({
  a: z.string().min(1).max(64),
  b: z.string().min(1).max(72),
});
export const DiffQuery = z.object({ format: z.enum(['json', 'csv']).optional() });

/**
 * One changed entry from release `from` to release `to`. Values J/mol, the difference in
 * kJ/mol (new − old, exact) and in units of the combined uncertainty (root sum of squares of
 * both stated uncertainties); all as decimal text. Heat-capacity sets carry no value.
 */
export const ReleaseDiffRow = z.object({
  change: z.enum(['added', 'removed', 'changed']),
  speciesKey: z.string(),
  speciesName: z.string(),
  formula: z.string(),
  phase: z.string(),
  modification: z.string().nullable(),
  quantity: z.string(),
  oldRevisionId: z.number().int().nullable(),
  newRevisionId: z.number().int().nullable(),
  oldValue: z.string().nullable(),
  newValue: z.string().nullable(),
  oldUncertainty: z.string().nullable(),
  newUncertainty: z.string().nullable(),
  oldUncertaintyBasis: z.string().nullable(),
  newUncertaintyBasis: z.string().nullable(),
  differenceKjPerMol: z.string().nullable(),
  combinedUncertaintyKjPerMol: z.string().nullable(),
  differenceInUncertainties: z.string().nullable(),
  oldSourceCitation: z.string().nullable(),
  newSourceCitation: z.string().nullable(),
  oldSourceDoi: z.string().nullable(),
  newSourceDoi: z.string().nullable(),
});
export type ReleaseDiffRow = z.infer<typeof ReleaseDiffRow>;

export const ReleaseDiff = z.object({
  from: z.string(),
  to: z.string(),
  summary: z.object({
    added: z.number().int(),
    removed: z.number().int(),
    changed: z.number().int(),
  }),
  rows: z.array(ReleaseDiffRow),
});
export type ReleaseDiff = z.infer<typeof ReleaseDiff>;
