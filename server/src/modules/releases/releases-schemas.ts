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
