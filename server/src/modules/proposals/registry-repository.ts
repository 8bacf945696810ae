import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import {
  heatCapacityRanges,
  releaseEntries,
  releases,
  revisionInputs,
  revisions,
  sources,
  species,
  speciesPhases,
  type RevisionStatus,
  type StoredPhase,
} from '../../../../schema';
import type { Database, Tx } from '../../db/client';

type Queryable = Database | Tx;

/** A revision with its species-phase, source and the published releases that pin it. */
export interface RevisionRefRow {
  id: number;
  kind: 'formation_enthalpy' | 'heat_capacity' | 'transition';
  quantity: string;
  status: RevisionStatus;
  value: string | null;
  uncertainty: string | null;
  uncertaintyBasis: 'standard' | 'expanded_k2' | 'as_stated' | null;
  temperature: string | null;
  method: string | null;
  standardPressure: '1 bar' | '1 atm';
  createdAt: Date;
  derived: boolean;
  speciesKey: string;
  phase: StoredPhase;
  modification: string | null;
  sourceId: number;
  citation: string;
  doi: string | null;
  releases: string[];
}

const refColumns = {
  id: revisions.id,
  kind: revisions.kind,
  quantity: revisions.quantity,
  status: revisions.status,
  value: revisions.value,
  uncertainty: revisions.uncertainty,
  uncertaintyBasis: revisions.uncertaintyBasis,
  temperature: revisions.temperature,
  method: revisions.method,
  standardPressure: revisions.standardPressure,
  createdAt: revisions.createdAt,
  derived: sql<boolean>`(${revisions.derivation} is not null)`,
  speciesKey: species.key,
  phase: speciesPhases.phase,
  modification: speciesPhases.modification,
  sourceId: sources.id,
  citation: sources.citation,
  doi: sources.doi,
  releases: sql<string[]>`coalesce((select array_agg(rel.version order by rel.published_at)
    from ${releaseEntries} e join ${releases} rel on rel.id = e.release_id
    where e.revision_id = ${revisions.id} and rel.status = 'published'), '{}')`,
};

const refQuery = (db: Queryable) =>
  db
    .select(refColumns)
    .from(revisions)
    .innerJoin(speciesPhases, eq(speciesPhases.id, revisions.speciesPhaseId))
    .innerJoin(species, eq(species.id, speciesPhases.speciesId))
    .innerJoin(sources, eq(sources.id, revisions.sourceId));

/** An input of a derived value that is no longer the accepted one, and what replaced it. */
export interface StaleInputRow extends Record<string, unknown> {
  revisionId: number | null;
  inputRevisionId: number;
  supersededBy: number | null;
  species: string;
  phase: string;
}

const staleInputSelect = sql`
  ir.id as "inputRevisionId",
  (select n.id from revisions n where n.supersedes_id = ir.id order by n.id desc limit 1) as "supersededBy",
  s.key as species, sp.phase || coalesce(',' || sp.modification, '') as phase
  from revisions ir
  join species_phases sp on sp.id = ir.species_phase_id
  join species s on s.id = sp.species_id`;

export const registryRepository = {
  async revisionRef(db: Queryable, id: number): Promise<RevisionRefRow | undefined> {
    const [row] = await refQuery(db).where(eq(revisions.id, id));
    return row;
  },

  /** Every revision of one species-phase and quantity, newest first. */
  revisionsOf(
    db: Queryable,
    key: string,
    phase: StoredPhase,
    modification: string | null,
    quantity: string,
  ): Promise<RevisionRefRow[]> {
    return refQuery(db)
      .where(
        and(
          eq(species.key, key),
          eq(speciesPhases.phase, phase),
          modification === null
            ? sql`${speciesPhases.modification} is null`
            : eq(speciesPhases.modification, modification),
          eq(revisions.quantity, quantity),
        ),
      )
      .orderBy(desc(revisions.createdAt), desc(revisions.id));
  },

  /** Accepted derived revisions that used any of `inputIds`: approving a change to them stales these. */
  dependents(db: Queryable, inputIds: number[]) {
    if (inputIds.length === 0) return Promise.resolve([]);
    return db
      .selectDistinct({
        revisionId: revisions.id,
        species: species.key,
        phase: sql<string>`${speciesPhases.phase} || coalesce(',' || ${speciesPhases.modification}, '')`,
        status: revisions.status,
        inputRevisionId: revisionInputs.inputRevisionId,
      })
      .from(revisionInputs)
      .innerJoin(revisions, eq(revisions.id, revisionInputs.revisionId))
      .innerJoin(speciesPhases, eq(speciesPhases.id, revisions.speciesPhaseId))
      .innerJoin(species, eq(species.id, speciesPhases.speciesId))
      .where(
        and(inArray(revisionInputs.inputRevisionId, inputIds), eq(revisions.status, 'accepted')),
      );
  },

  /** For derived revisions: their inputs that were superseded or retired since. */
  async staleInputsOfRevisions(db: Queryable, ids: number[]): Promise<StaleInputRow[]> {
    if (ids.length === 0) return [];
    const { rows } = await db.execute<StaleInputRow>(sql`
      select ri.revision_id as "revisionId", ${staleInputSelect}
      join revision_inputs ri on ri.input_revision_id = ir.id
      where ri.revision_id in (${sql.join(
        ids.map((i) => sql`${i}`),
        sql`, `,
      )})
        and ir.status in ('superseded', 'retired')
      order by ri.revision_id, ir.id`);
    return rows;
  },

  /** For a derive item's inputs: those no longer accepted, and what replaced them. */
  async staleOfInputs(db: Queryable, inputIds: number[]): Promise<StaleInputRow[]> {
    if (inputIds.length === 0) return [];
    const { rows } = await db.execute<StaleInputRow>(sql`
      select null::int as "revisionId", ${staleInputSelect}
      where ir.id in (${sql.join(
        inputIds.map((i) => sql`${i}`),
        sql`, `,
      )})
        and ir.status in ('superseded', 'retired')
      order by ir.id`);
    return rows;
  },

  /** Locks revisions in id order (one lock order for every approval: no deadlocks). */
  lockRevisions(tx: Tx, ids: number[]) {
    if (ids.length === 0) return Promise.resolve([]);
    return tx
      .select({ id: revisions.id, status: revisions.status })
      .from(revisions)
      .where(inArray(revisions.id, ids))
      .orderBy(asc(revisions.id))
      .for('update');
  },

  async supersederOf(db: Queryable, id: number): Promise<number | null> {
    const [row] = await db
      .select({ id: revisions.id })
      .from(revisions)
      .where(eq(revisions.supersedesId, id))
      .orderBy(desc(revisions.id))
      .limit(1);
    return row?.id ?? null;
  },

  async acceptedFor(db: Queryable, speciesPhaseId: number, quantity: string) {
    const [row] = await db
      .select({ id: revisions.id })
      .from(revisions)
      .where(
        and(
          eq(revisions.speciesPhaseId, speciesPhaseId),
          eq(revisions.quantity, quantity),
          eq(revisions.status, 'accepted'),
        ),
      );
    return row?.id ?? null;
  },

  /** The accepted revision of a species-phase and quantity, without creating the phase. */
  async acceptedOf(
    db: Queryable,
    speciesId: number,
    phase: StoredPhase,
    modification: string | null,
    quantity: string,
  ): Promise<number | null> {
    const { rows } = await db.execute<{ id: number }>(sql`
      select r.id from revisions r join species_phases sp on sp.id = r.species_phase_id
      where sp.species_id = ${speciesId} and sp.phase = ${phase}
        and sp.modification is not distinct from ${modification}
        and r.quantity = ${quantity} and r.status = 'accepted'`);
    return rows[0]?.id ?? null;
  },

  async speciesIdByKey(db: Queryable, key: string): Promise<number | null> {
    const [row] = await db.select({ id: species.id }).from(species).where(eq(species.key, key));
    return row?.id ?? null;
  },

  async insertSpecies(tx: Tx, values: typeof species.$inferInsert): Promise<number> {
    const [row] = await tx.insert(species).values(values).returning({ id: species.id });
    return row!.id;
  },

  /** The species-phase's id, created when missing. */
  async ensurePhase(
    tx: Tx,
    speciesId: number,
    phase: StoredPhase,
    modification: string | null,
  ): Promise<{ id: number; created: boolean }> {
    const [made] = await tx
      .insert(speciesPhases)
      .values({ speciesId, phase, modification })
      .onConflictDoNothing()
      .returning({ id: speciesPhases.id });
    if (made) return { id: made.id, created: true };
    const [row] = await tx
      .select({ id: speciesPhases.id })
      .from(speciesPhases)
      .where(
        and(
          eq(speciesPhases.speciesId, speciesId),
          eq(speciesPhases.phase, phase),
          modification === null
            ? sql`${speciesPhases.modification} is null`
            : eq(speciesPhases.modification, modification),
        ),
      );
    return { id: row!.id, created: false };
  },

  async insertRevision(tx: Tx, values: typeof revisions.$inferInsert): Promise<number> {
    const [row] = await tx.insert(revisions).values(values).returning({ id: revisions.id });
    return row!.id;
  },

  async insertRanges(tx: Tx, rows: (typeof heatCapacityRanges.$inferInsert)[]): Promise<void> {
    if (rows.length) await tx.insert(heatCapacityRanges).values(rows);
  },

  async insertInputs(tx: Tx, revisionId: number, inputIds: number[]): Promise<void> {
    const unique = [...new Set(inputIds)].filter((i) => i !== revisionId);
    if (unique.length)
      await tx
        .insert(revisionInputs)
        .values(unique.map((inputRevisionId) => ({ revisionId, inputRevisionId })));
  },

  /** Status columns stay writable on pinned revisions (migration 0002); value columns never change. */
  async setStatus(tx: Tx, id: number, status: RevisionStatus): Promise<void> {
    await tx
      .update(revisions)
      .set({ status, statusChangedAt: sql`now()` })
      .where(eq(revisions.id, id));
  },

  /** The revision a derived value came from, for a re-derivation. */
  async derivedRevision(db: Queryable, id: number) {
    const [row] = await db
      .select({
        id: revisions.id,
        status: revisions.status,
        derivation: revisions.derivation,
        uncertaintyBasis: revisions.uncertaintyBasis,
        sourceId: revisions.sourceId,
        standardPressure: revisions.standardPressure,
        speciesKey: species.key,
        phase: speciesPhases.phase,
        modification: speciesPhases.modification,
      })
      .from(revisions)
      .innerJoin(speciesPhases, eq(speciesPhases.id, revisions.speciesPhaseId))
      .innerJoin(species, eq(species.id, speciesPhases.speciesId))
      .where(eq(revisions.id, id));
    return row;
  },
};
