import { and, eq, inArray, sql, type SQL } from 'drizzle-orm';
import {
  releaseAcknowledgements,
  releaseExclusions,
  releases,
  type ReleaseRow,
  type RevisionKind,
  type StoredPhase,
  UNCERTAINTY_BASIS_VALUES,
} from '../../../../schema';
import type { Tx } from '../../db/client';
import type { Queryable } from './releases-repository';

export type ChangeKind = 'added' | 'changed' | 'retired';

/** The base release and the draft a change set is computed for. */
export interface DraftKey {
  id: number;
  baseReleaseId: number | null;
}

/** One side (old or new) of a change: the revision with its value and source. */
export type ChangeSideRow = {
  revisionId: number;
  kind: RevisionKind;
  value: string | null;
  uncertainty: string | null;
  uncertaintyBasis: (typeof UNCERTAINTY_BASIS_VALUES)[number] | null;
  method: string | null;
  temperature: string | null;
  heatCapacityForm: string | null;
  sourceId: number;
  citation: string;
  doi: string | null;
};

export type ChangeRow = {
  change: ChangeKind;
  /** The revision an editor includes or leaves out: the new one, or for a retirement the old. */
  changeId: number;
  included: boolean;
  speciesKey: string;
  speciesName: string;
  speciesFormula: string;
  phase: StoredPhase;
  modification: string | null;
  quantity: string;
  old: ChangeSideRow | null;
  new: ChangeSideRow | null;
};

export type StaleInputRow = {
  derivedId: number;
  speciesKey: string;
  speciesName: string;
  speciesFormula: string;
  phase: StoredPhase;
  modification: string | null;
  quantity: string;
  value: string | null;
  acknowledged: boolean;
  inputId: number;
  inputSpeciesKey: string;
  inputPhase: StoredPhase;
  inputModification: string | null;
  inputQuantity: string;
  /** What the draft pins for that input instead (null: the input is retired). */
  replacedById: number | null;
};

/**
 * The change set of a draft as common table expressions:
 *  - `prev`: the base release's entries;
 *  - `changes`: every key whose accepted revision differs from the base (added, changed,
 *    retired), with `included` unless the editor left it out;
 *  - `final`: what the draft would pin — the base's entries, with the included changes applied.
 */
function draftCtes(draft: DraftKey): SQL {
  return sql`
    with prev as (
      select species_phase_id, quantity, revision_id from release_entries
      where release_id = ${draft.baseReleaseId}
    ), acc as (
      select species_phase_id, quantity, id as revision_id from revisions where status = 'accepted'
    ), changes as (
      select coalesce(a.species_phase_id, p.species_phase_id) as species_phase_id,
             coalesce(a.quantity, p.quantity) as quantity,
             p.revision_id as old_id, a.revision_id as new_id,
             case when p.revision_id is null then 'added'
                  when a.revision_id is null then 'retired' else 'changed' end as change,
             coalesce(a.revision_id, p.revision_id) as change_id,
             not exists (select 1 from release_exclusions x where x.release_id = ${draft.id}
                         and x.revision_id = coalesce(a.revision_id, p.revision_id)) as included
      from acc a full join prev p
        on p.species_phase_id = a.species_phase_id and p.quantity = a.quantity
      where a.revision_id is distinct from p.revision_id
    ), final as (
      select p.species_phase_id, p.quantity, p.revision_id from prev p
      where not exists (select 1 from changes c where c.included
                        and c.species_phase_id = p.species_phase_id and c.quantity = p.quantity)
      union all
      select c.species_phase_id, c.quantity, c.new_id from changes c
      where c.included and c.new_id is not null
    )`;
}

const side = (alias: string) =>
  sql.raw(`
  case when ${alias}.id is null then null else json_build_object(
    'revisionId', ${alias}.id, 'kind', ${alias}.kind, 'value', ${alias}.value::text,
    'uncertainty', ${alias}.uncertainty::text, 'uncertaintyBasis', ${alias}.uncertainty_basis,
    'method', ${alias}.method, 'temperature', ${alias}.temperature::text,
    'heatCapacityForm', ${alias}.heat_capacity_form, 'sourceId', ${alias}_so.id,
    'citation', ${alias}_so.citation, 'doi', ${alias}_so.doi) end`);

export const draftRepository = {
  listDrafts(db: Queryable): Promise<ReleaseRow[]> {
    return db.select().from(releases).where(eq(releases.status, 'draft')).orderBy(releases.id);
  },

  async findById(db: Queryable, id: number): Promise<ReleaseRow | undefined> {
    const [row] = await db.select().from(releases).where(eq(releases.id, id));
    return row;
  },

  /** Every change of the draft against its base, in species key order. */
  async changes(db: Queryable, draft: DraftKey): Promise<ChangeRow[]> {
    const result = await db.execute<ChangeRow>(sql`${draftCtes(draft)}
      select c.change, c.change_id as "changeId", c.included, s.key as "speciesKey",
             s.name as "speciesName", s.formula as "speciesFormula", sp.phase, sp.modification,
             c.quantity, ${side('o')} as old, ${side('n')} as new
      from changes c
      join species_phases sp on sp.id = c.species_phase_id
      join species s on s.id = sp.species_id
      left join revisions o on o.id = c.old_id
      left join sources o_so on o_so.id = o.source_id
      left join revisions n on n.id = c.new_id
      left join sources n_so on n_so.id = n.source_id
      order by s.key, sp.phase, sp.modification nulls first, c.quantity`);
    return result.rows;
  },

  /**
   * Derived values the draft would pin although one of their inputs is replaced or retired by a
   * change included in this draft: one row per such input.
   */
  async staleInputs(db: Queryable, draft: DraftKey): Promise<StaleInputRow[]> {
    const result = await db.execute<StaleInputRow>(sql`${draftCtes(draft)}
      select d.id as "derivedId", s.key as "speciesKey", s.name as "speciesName",
             s.formula as "speciesFormula", sp.phase, sp.modification, d.quantity,
             d.value::text as value,
             exists (select 1 from release_acknowledgements a
                     where a.release_id = ${draft.id} and a.revision_id = d.id) as acknowledged,
             ir.id as "inputId", isp_s.key as "inputSpeciesKey", isp.phase as "inputPhase",
             isp.modification as "inputModification", ir.quantity as "inputQuantity",
             fi.revision_id as "replacedById"
      from final f
      join revision_inputs ri on ri.revision_id = f.revision_id
      join revisions d on d.id = f.revision_id
      join species_phases sp on sp.id = d.species_phase_id
      join species s on s.id = sp.species_id
      join revisions ir on ir.id = ri.input_revision_id
      join species_phases isp on isp.id = ir.species_phase_id
      join species isp_s on isp_s.id = isp.species_id
      join changes c on c.included and c.species_phase_id = ir.species_phase_id
                    and c.quantity = ir.quantity
      left join final fi on fi.species_phase_id = ir.species_phase_id
                        and fi.quantity = ir.quantity
      where fi.revision_id is distinct from ir.id
      order by s.key, d.id, ir.id`);
    return result.rows;
  },

  /** Pins the draft's final set; returns how many entries and how many included changes. */
  async pinDraft(tx: Tx, draft: DraftKey): Promise<{ entries: number; changes: number }> {
    const counted = await tx.execute<{ changes: number }>(sql`${draftCtes(draft)}
      select count(*) filter (where included)::int as changes from changes`);
    const changes = counted.rows[0]?.changes ?? 0;
    if (changes === 0) return { entries: 0, changes };
    const inserted = await tx.execute(sql`${draftCtes(draft)}
      insert into release_entries (release_id, species_phase_id, quantity, revision_id)
      select ${draft.id}, species_phase_id, quantity, revision_id from final`);
    return { entries: inserted.rowCount ?? 0, changes };
  },

  async setNotes(tx: Tx, id: number, notes: string): Promise<void> {
    await tx.update(releases).set({ notes }).where(eq(releases.id, id));
  },

  async setBase(tx: Tx, id: number, baseReleaseId: number | null): Promise<void> {
    await tx.update(releases).set({ baseReleaseId }).where(eq(releases.id, id));
  },

  async exclude(tx: Tx, releaseId: number, revisionIds: number[], userId: number) {
    if (revisionIds.length === 0) return;
    await tx
      .insert(releaseExclusions)
      .values(revisionIds.map((revisionId) => ({ releaseId, revisionId, excludedBy: userId })))
      .onConflictDoNothing();
  },

  async include(tx: Tx, releaseId: number, revisionIds: number[]) {
    if (revisionIds.length === 0) return;
    await tx
      .delete(releaseExclusions)
      .where(
        and(
          eq(releaseExclusions.releaseId, releaseId),
          inArray(releaseExclusions.revisionId, revisionIds),
        ),
      );
  },

  async acknowledge(tx: Tx, releaseId: number, revisionIds: number[], userId: number) {
    if (revisionIds.length === 0) return;
    await tx
      .insert(releaseAcknowledgements)
      .values(revisionIds.map((revisionId) => ({ releaseId, revisionId, acknowledgedBy: userId })))
      .onConflictDoNothing();
  },

  /** Serialises every publish in the database: one release becomes the newest at a time. */
  async lockPublishing(tx: Tx): Promise<void> {
    await tx.execute(sql`select pg_advisory_xact_lock(${PUBLISH_LOCK})`);
  },
};

const PUBLISH_LOCK = 0x7075626c; // "publ"
