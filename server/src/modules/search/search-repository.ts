import { eq, sql } from 'drizzle-orm';
import { releaseEntries, species, speciesPhases } from '../../../../schema';
import type { Queryable } from '../releases/releases-repository';

export interface SearchDocument {
  key: string;
  name: string;
  synonyms: string[];
  formula: string;
  charge: number;
  casRn: string | null;
  inchiKey: string | null;
  /** `phase` or `phase,modification`, e.g. `l`, `cr,calcite`. */
  phases: string[];
}

export const searchRepository = {
  /** Every species a release holds a value for, with the phases it holds. */
  documents(db: Queryable, releaseId: number): Promise<SearchDocument[]> {
    return db
      .select({
        key: species.key,
        name: species.name,
        synonyms: species.synonyms,
        formula: species.formula,
        charge: species.charge,
        casRn: species.casRn,
        inchiKey: species.inchiKey,
        phases: sql<
          string[]
        >`array_agg(distinct ${speciesPhases.phase}::text || coalesce(',' || ${speciesPhases.modification}, ''))`,
      })
      .from(releaseEntries)
      .innerJoin(speciesPhases, eq(speciesPhases.id, releaseEntries.speciesPhaseId))
      .innerJoin(species, eq(species.id, speciesPhases.speciesId))
      .where(eq(releaseEntries.releaseId, releaseId))
      .groupBy(species.id);
  },
};
