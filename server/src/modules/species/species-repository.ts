import { and, asc, desc, eq, ilike, inArray, or, sql, type SQL } from 'drizzle-orm';
import {
  heatCapacityRanges,
  releaseEntries,
  releases,
  revisions,
  sources,
  species,
  speciesPhases,
  type RevisionStatus,
  type SpeciesRow,
  type StoredPhase,
} from '../../../../schema';
import type { Queryable } from '../releases/releases-repository';

export interface ReleaseSpeciesFilter {
  /** Hill formula with charge suffix, as stored. */
  formula?: string;
  phases?: readonly StoredPhase[];
  name?: string;
  sort: 'name' | 'formula' | 'deltaFH' | 'key';
  order: 'asc' | 'desc';
  limit: number;
  offset: number;
}

const likeEscaped = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

const SORT_COLUMNS = {
  name: species.name,
  formula: species.formula,
  deltaFH: revisions.value,
  key: species.key,
} as const;

export const speciesRepository = {
  /** One page of the ΔfH° values a release pins, filtered, with the total before paging. */
  async listInRelease(db: Queryable, releaseId: number, f: ReleaseSpeciesFilter) {
    const where: SQL[] = [
      eq(releaseEntries.releaseId, releaseId),
      eq(releaseEntries.quantity, 'formation_enthalpy'),
    ];
    if (f.formula !== undefined) where.push(eq(species.formula, f.formula));
    if (f.phases !== undefined) where.push(inArray(speciesPhases.phase, [...f.phases]));
    if (f.name !== undefined) {
      const pattern = likeEscaped(f.name);
      where.push(
        or(
          ilike(species.name, pattern),
          ilike(species.key, pattern),
          sql`exists (select 1 from unnest(${species.synonyms}) as syn where syn ilike ${pattern})`,
        )!,
      );
    }
    const direction = f.order === 'desc' ? desc : asc;
    return db
      .select({
        key: species.key,
        name: species.name,
        formula: species.formula,
        charge: species.charge,
        phase: speciesPhases.phase,
        modification: speciesPhases.modification,
        revisionId: revisions.id,
        value: revisions.value,
        uncertainty: revisions.uncertainty,
        uncertaintyBasis: revisions.uncertaintyBasis,
        method: revisions.method,
        standardPressure: revisions.standardPressure,
        fromMemory: revisions.fromMemory,
        sourceId: sources.id,
        citation: sources.citation,
        doi: sources.doi,
        total: sql<number>`(count(*) over ())::int`,
      })
      .from(releaseEntries)
      .innerJoin(revisions, eq(revisions.id, releaseEntries.revisionId))
      .innerJoin(speciesPhases, eq(speciesPhases.id, releaseEntries.speciesPhaseId))
      .innerJoin(species, eq(species.id, speciesPhases.speciesId))
      .innerJoin(sources, eq(sources.id, revisions.sourceId))
      .where(and(...where))
      .orderBy(
        direction(SORT_COLUMNS[f.sort]),
        asc(species.key),
        asc(speciesPhases.phase),
        asc(speciesPhases.modification),
      )
      .limit(f.limit)
      .offset(f.offset);
  },

  async findByKey(db: Queryable, key: string): Promise<SpeciesRow | undefined> {
    const [row] = await db.select().from(species).where(eq(species.key, key));
    return row;
  },

  phasesOf(db: Queryable, speciesId: number) {
    return db
      .select()
      .from(speciesPhases)
      .where(eq(speciesPhases.speciesId, speciesId))
      .orderBy(asc(speciesPhases.phase), asc(speciesPhases.modification));
  },

  /** Revisions of a species' phases in the given statuses, oldest first. */
  revisionsOf(db: Queryable, speciesId: number, statuses: readonly RevisionStatus[]) {
    return db
      .select({
        revision: revisions,
        phase: speciesPhases.phase,
        modification: speciesPhases.modification,
      })
      .from(revisions)
      .innerJoin(speciesPhases, eq(speciesPhases.id, revisions.speciesPhaseId))
      .where(and(eq(speciesPhases.speciesId, speciesId), inArray(revisions.status, [...statuses])))
      .orderBy(asc(revisions.createdAt), asc(revisions.id));
  },

  rangesOf(db: Queryable, revisionIds: number[]) {
    if (revisionIds.length === 0) return Promise.resolve([]);
    return db
      .select()
      .from(heatCapacityRanges)
      .where(inArray(heatCapacityRanges.revisionId, revisionIds))
      .orderBy(asc(heatCapacityRanges.revisionId), asc(heatCapacityRanges.seq));
  },

  /** Which revision each published release pins for the species' phases, oldest release first. */
  pinsOf(db: Queryable, speciesId: number) {
    return db
      .select({
        version: releases.version,
        publishedAt: releases.publishedAt,
        speciesPhaseId: releaseEntries.speciesPhaseId,
        quantity: releaseEntries.quantity,
        revisionId: releaseEntries.revisionId,
      })
      .from(releaseEntries)
      .innerJoin(releases, eq(releases.id, releaseEntries.releaseId))
      .innerJoin(speciesPhases, eq(speciesPhases.id, releaseEntries.speciesPhaseId))
      .where(and(eq(speciesPhases.speciesId, speciesId), eq(releases.status, 'published')))
      .orderBy(asc(releases.publishedAt), asc(releases.id));
  },

  sourcesByIds(db: Queryable, ids: number[]) {
    if (ids.length === 0) return Promise.resolve([]);
    return db.select().from(sources).where(inArray(sources.id, ids)).orderBy(asc(sources.id));
  },
};
