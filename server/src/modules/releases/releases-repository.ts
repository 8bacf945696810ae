import { aliasedTable, asc, desc, eq, inArray, sql, type SQL, type SQLWrapper } from 'drizzle-orm';
import {
  heatCapacityRanges,
  releaseEntries,
  releases,
  revisions,
  sources,
  species,
  speciesPhases,
  users,
  type HeatCapacityForm,
  type ReleaseRow,
  type StandardPressure,
  type StoredPhase,
  UNCERTAINTY_BASIS_VALUES,
} from '../../../../schema';
import type { Database, Tx } from '../../db/client';

export type Queryable = Database | Tx;

const publisher = aliasedTable(users, 'publisher');

export interface ReleaseListRow extends ReleaseRow {
  publishedByLogin: string | null;
  publishedByName: string | null;
}

export interface ReleaseCounts {
  species: number;
  speciesPhases: number;
  formationEnthalpies: number;
  heatCapacitySets: number;
  transitions: number;
  sources: number;
}

const listColumns = {
  id: releases.id,
  version: releases.version,
  notes: releases.notes,
  status: releases.status,
  createdBy: releases.createdBy,
  createdAt: releases.createdAt,
  publishedBy: releases.publishedBy,
  publishedAt: releases.publishedAt,
  baseReleaseId: releases.baseReleaseId,
  publishedByLogin: publisher.login,
  publishedByName: publisher.name,
};

/** What a snapshot reads: ΔfH° values, heat-capacity sets, or every transition. */
export type PinnedQuantity = 'formation_enthalpy' | 'heat_capacity' | 'transition';

/** One pinned revision with its species-phase and source, as the snapshot loader reads it. */
export type PinnedRow = {
  revisionId: number;
  speciesKey: string;
  speciesName: string;
  speciesFormula: string;
  speciesCharge: number;
  speciesSynonyms: string[];
  phase: StoredPhase;
  modification: string | null;
  value: string | null;
  uncertainty: string | null;
  uncertaintyBasis: (typeof UNCERTAINTY_BASIS_VALUES)[number] | null;
  method: string | null;
  standardPressure: StandardPressure;
  temperature: string | null;
  toPhase: StoredPhase | null;
  toModification: string | null;
  heatCapacityForm: HeatCapacityForm | null;
  sourceId: number;
  citation: string;
  doi: string | null;
};

export const releasesRepository = {
  async findByVersion(db: Queryable, version: string): Promise<ReleaseListRow | undefined> {
    const [row] = await db
      .select(listColumns)
      .from(releases)
      .leftJoin(publisher, eq(publisher.id, releases.publishedBy))
      .where(eq(releases.version, version));
    return row;
  },

  /** The newest published release: last published, ties broken by id. */
  async findLatestPublished(db: Queryable): Promise<ReleaseListRow | undefined> {
    const [row] = await db
      .select(listColumns)
      .from(releases)
      .leftJoin(publisher, eq(publisher.id, releases.publishedBy))
      .where(eq(releases.status, 'published'))
      .orderBy(desc(releases.publishedAt), desc(releases.id))
      .limit(1);
    return row;
  },

  listPublished(db: Queryable): Promise<ReleaseListRow[]> {
    return db
      .select(listColumns)
      .from(releases)
      .leftJoin(publisher, eq(publisher.id, releases.publishedBy))
      .where(eq(releases.status, 'published'))
      .orderBy(desc(releases.publishedAt), desc(releases.id));
  },

  async counts(db: Queryable, releaseId: number): Promise<ReleaseCounts> {
    const [row] = await db
      .select({
        species: sql<number>`count(distinct ${speciesPhases.speciesId})::int`,
        speciesPhases: sql<number>`count(distinct ${releaseEntries.speciesPhaseId})::int`,
        formationEnthalpies: sql<number>`(count(*) filter (where ${releaseEntries.quantity} = 'formation_enthalpy'))::int`,
        heatCapacitySets: sql<number>`(count(*) filter (where ${releaseEntries.quantity} = 'heat_capacity'))::int`,
        transitions: sql<number>`(count(*) filter (where ${releaseEntries.quantity} like 'transition:%'))::int`,
        sources: sql<number>`count(distinct ${revisions.sourceId})::int`,
      })
      .from(releaseEntries)
      .innerJoin(speciesPhases, eq(speciesPhases.id, releaseEntries.speciesPhaseId))
      .innerJoin(revisions, eq(revisions.id, releaseEntries.revisionId))
      .where(eq(releaseEntries.releaseId, releaseId));
    return row!;
  },

  async insertDraft(
    tx: Tx,
    draft: { version: string; notes: string; createdBy: number; baseReleaseId: number | null },
  ): Promise<ReleaseRow> {
    const [row] = await tx.insert(releases).values(draft).returning();
    return row!;
  },

  async lockByVersion(tx: Tx, version: string): Promise<ReleaseRow | undefined> {
    const [row] = await tx
      .select()
      .from(releases)
      .where(eq(releases.version, version))
      .for('update');
    return row;
  },

  /**
   * The time is read when the row is written, not when the transaction began (`now()`): publishes
   * serialise on a lock, so this orders releases by when they really became the newest.
   */
  async markPublished(tx: Tx, releaseId: number, userId: number): Promise<ReleaseRow> {
    const [row] = await tx
      .update(releases)
      .set({ status: 'published', publishedBy: userId, publishedAt: sql`clock_timestamp()` })
      .where(eq(releases.id, releaseId))
      .returning();
    return row!;
  },

  /**
   * For the snapshot load: the planner would hash-join every revision (200,000 at scale) where
   * probing the pinned ones (20,000) by primary key is several times faster. Transaction-local.
   */
  async preferKeyProbes(tx: Tx): Promise<void> {
    await tx.execute(sql`set local enable_hashjoin = off`);
  },

  /**
   * Pinned revisions of one quantity (or of every transition) with species-phase and source.
   * Plain SQL: at 20,000 rows the driver's objects are used as they come, without a mapping pass.
   */
  pinned(db: Queryable, releaseId: number, quantity: PinnedQuantity): Promise<PinnedRow[]> {
    return valueRows(
      db,
      sql`${releaseEntries}
      join ${revisions} r on r.id = ${releaseEntries.revisionId}
      join ${speciesPhases} sp on sp.id = ${releaseEntries.speciesPhaseId}`,
      sql`${releaseEntries.releaseId} = ${releaseId} and ${quantityIs(releaseEntries.quantity, quantity)}`,
    );
  },

  /** The accepted revisions of one quantity (what the next release would pin), as `pinned`. */
  accepted(db: Queryable, quantity: PinnedQuantity): Promise<PinnedRow[]> {
    return valueRows(
      db,
      sql`${revisions} r join ${speciesPhases} sp on sp.id = r.species_phase_id`,
      sql`r.status = 'accepted' and ${quantityIs(sql.raw('r.quantity'), quantity)}`,
    );
  },

  /** Heat-capacity ranges of the given revisions, in order. */
  rangesOf(db: Queryable, revisionIds: number[]) {
    if (revisionIds.length === 0) return Promise.resolve([]);
    return db
      .select()
      .from(heatCapacityRanges)
      .where(inArray(heatCapacityRanges.revisionId, revisionIds))
      .orderBy(asc(heatCapacityRanges.revisionId), asc(heatCapacityRanges.seq));
  },
};

/** One quantity's rows, or every transition (`transition:<to phase>…`). */
const quantityIs = (column: SQLWrapper, quantity: PinnedQuantity): SQL =>
  quantity === 'transition' ? sql`${column} like 'transition:%'` : sql`${column} = ${quantity}`;

/** Revisions `r` of species-phases `sp` (joined in `from`) with their species and source. */
async function valueRows(db: Queryable, from: SQL, where: SQL): Promise<PinnedRow[]> {
  const result = await db.execute<PinnedRow>(sql`
    select r.id as "revisionId", s.key as "speciesKey", s.name as "speciesName",
           s.formula as "speciesFormula", s.charge as "speciesCharge",
           s.synonyms as "speciesSynonyms", sp.phase, sp.modification, r.value, r.uncertainty,
           r.uncertainty_basis as "uncertaintyBasis", r.method,
           r.standard_pressure as "standardPressure", r.temperature, r.to_phase as "toPhase",
           r.to_modification as "toModification", r.heat_capacity_form as "heatCapacityForm",
           so.id as "sourceId", so.citation, so.doi
    from ${from}
    join ${species} s on s.id = sp.species_id
    join ${sources} so on so.id = r.source_id
    where ${where}`);
  return result.rows;
}
