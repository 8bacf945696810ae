import { sql } from 'drizzle-orm';
import type { Tx } from '../../db/client';
import type { Queryable } from './releases-repository';

/** Order of the sections in every export format. */
export const EXPORT_SECTIONS = ['formation_enthalpy', 'heat_capacity', 'transition'] as const;
export type ExportSection = (typeof EXPORT_SECTIONS)[number];

/**
 * One row of an export as the database hands it over: every number is exact decimal text
 * without trailing zeros (`trim_scale`), so the bytes never depend on how a value was typed in.
 * A heat-capacity set is one row per temperature range (`rangeIndex`: its stored position, from 1).
 */
export interface ExportRow {
  section: ExportSection;
  speciesKey: string;
  speciesName: string;
  formula: string;
  phase: string;
  modification: string | null;
  quantity: string;
  value: string | null;
  uncertainty: string | null;
  uncertaintyBasis: string | null;
  method: string | null;
  standardPressure: string;
  temperature: string | null;
  toPhase: string | null;
  toModification: string | null;
  heatCapacityForm: string | null;
  rangeIndex: number | null;
  tMin: string | null;
  tMax: string | null;
  coefficients: (string | null)[] | null;
  revisionId: number;
  sourceCitation: string;
  sourceDoi: string | null;
}

/**
 * The rows of one release in their one order: section, then species key, phase, modification,
 * quantity and range, compared byte by byte (`collate "C"`) so no server locale changes it.
 * Plain SQL text, because the export cursor and the benchmark's `COPY` run the very same query.
 */
export function exportQueryText(releaseId: number): string {
  if (!Number.isSafeInteger(releaseId)) throw new Error('release id must be an integer');
  return `select
      case when e.quantity = 'formation_enthalpy' then 'formation_enthalpy'
           when e.quantity = 'heat_capacity' then 'heat_capacity' else 'transition' end as "section",
      s.key as "speciesKey", s.name as "speciesName", s.formula, sp.phase::text as phase,
      sp.modification, e.quantity,
      trim_scale(r.value)::text as value, trim_scale(r.uncertainty)::text as uncertainty,
      r.uncertainty_basis::text as "uncertaintyBasis", r.method,
      r.standard_pressure::text as "standardPressure",
      trim_scale(r.temperature)::text as temperature, r.to_phase::text as "toPhase",
      r.to_modification as "toModification", r.heat_capacity_form::text as "heatCapacityForm",
      hr.seq + 1 as "rangeIndex",
      trim_scale(hr.t_min)::text as "tMin", trim_scale(hr.t_max)::text as "tMax",
      case when hr.revision_id is not null then array(
        select trim_scale(c)::text from unnest(hr.coefficients) with ordinality u(c, i) order by i
      ) end as coefficients,
      r.id as "revisionId", so.citation as "sourceCitation", so.doi as "sourceDoi"
    from release_entries e
    join revisions r on r.id = e.revision_id
    join species_phases sp on sp.id = e.species_phase_id
    join species s on s.id = sp.species_id
    join sources so on so.id = r.source_id
    left join heat_capacity_ranges hr on hr.revision_id = r.id and e.quantity = 'heat_capacity'
    where e.release_id = ${releaseId}
    order by case when e.quantity = 'formation_enthalpy' then 0
                  when e.quantity = 'heat_capacity' then 1 else 2 end,
             s.key collate "C", sp.phase, sp.modification collate "C" nulls first,
             e.quantity collate "C", hr.seq`;
}

/** Rows fetched per round trip: large enough to be quick, small enough to stay streamed. */
const FETCH_SIZE = 2_000;

/** One row of a diff between two releases: see `ReleaseDiffRow` in releases-schemas.ts. */
export interface DiffRow {
  change: 'added' | 'removed' | 'changed';
  speciesKey: string;
  speciesName: string;
  formula: string;
  phase: string;
  modification: string | null;
  quantity: string;
  oldRevisionId: number | null;
  newRevisionId: number | null;
  oldValue: string | null;
  newValue: string | null;
  oldUncertainty: string | null;
  newUncertainty: string | null;
  oldUncertaintyBasis: string | null;
  newUncertaintyBasis: string | null;
  differenceKjPerMol: string | null;
  combinedUncertaintyKjPerMol: string | null;
  differenceInUncertainties: string | null;
  oldSourceCitation: string | null;
  newSourceCitation: string | null;
  oldSourceDoi: string | null;
  newSourceDoi: string | null;
}

export const releaseExportsRepository = {
  /**
   * Reads the export rows through a server-side cursor inside the caller's (read-only)
   * transaction and hands them on batch by batch; `onBatch` may wait (the client's backpressure).
   */
  async eachBatch(
    tx: Tx,
    releaseId: number,
    onBatch: (rows: ExportRow[]) => Promise<void> | void,
  ): Promise<void> {
    await tx.execute(
      sql.raw(`declare export_rows no scroll cursor for ${exportQueryText(releaseId)}`),
    );
    for (;;) {
      const { rows } = await tx.execute<Record<string, unknown>>(
        sql.raw(`fetch ${FETCH_SIZE} from export_rows`),
      );
      if (rows.length === 0) break;
      await onBatch(rows as unknown as ExportRow[]);
      if (rows.length < FETCH_SIZE) break;
    }
    await tx.execute(sql.raw('close export_rows'));
  },

  /**
   * For a diff of two large releases: its final sort of 20,000 wide rows (citations) needs about
   * 7 MB and would spill to disk under the default 4 MB. Transaction-local.
   */
  async sortInMemory(tx: Tx): Promise<void> {
    await tx.execute(sql`set local work_mem = '32MB'`);
  },

  /**
   * What changed from release `fromId` to `toId`, in one query: the two releases' entries
   * joined on species-phase and quantity, kept where the pinned revision differs. Differences
   * are exact (numeric); the combined uncertainty is the root sum of squares of both stated
   * uncertainties, and the difference in its units is rounded to two decimals.
   */
  async diff(db: Queryable, fromId: number, toId: number): Promise<DiffRow[]> {
    const result = await db.execute<Record<string, unknown>>(sql`
      with a as (select species_phase_id, quantity, revision_id from release_entries
                 where release_id = ${fromId}),
           b as (select species_phase_id, quantity, revision_id from release_entries
                 where release_id = ${toId}),
           d as (
             select coalesce(a.species_phase_id, b.species_phase_id) as species_phase_id,
                    coalesce(a.quantity, b.quantity) as quantity,
                    a.revision_id as old_id, b.revision_id as new_id
             from a full join b using (species_phase_id, quantity)
             where a.revision_id is distinct from b.revision_id),
           v as (
             select d.*, ra.value as va, rb.value as vb,
                    sqrt(ra.uncertainty ^ 2 + rb.uncertainty ^ 2) as u,
                    ra.uncertainty as ua, rb.uncertainty as ub,
                    ra.uncertainty_basis as basis_a, rb.uncertainty_basis as basis_b,
                    sa.citation as cite_a, sb.citation as cite_b, sa.doi as doi_a, sb.doi as doi_b
             from d
             left join revisions ra on ra.id = d.old_id
             left join revisions rb on rb.id = d.new_id
             left join sources sa on sa.id = ra.source_id
             left join sources sb on sb.id = rb.source_id)
      select case when v.old_id is null then 'added' when v.new_id is null then 'removed'
                  else 'changed' end as "change",
             s.key as "speciesKey", s.name as "speciesName", s.formula,
             sp.phase::text as phase, sp.modification, v.quantity,
             v.old_id as "oldRevisionId", v.new_id as "newRevisionId",
             trim_scale(v.va)::text as "oldValue", trim_scale(v.vb)::text as "newValue",
             trim_scale(v.ua)::text as "oldUncertainty", trim_scale(v.ub)::text as "newUncertainty",
             v.basis_a::text as "oldUncertaintyBasis", v.basis_b::text as "newUncertaintyBasis",
             trim_scale((v.vb - v.va) / 1000)::text as "differenceKjPerMol",
             trim_scale(round(v.u / 1000, 3))::text as "combinedUncertaintyKjPerMol",
             case when v.u > 0 then trim_scale(round((v.vb - v.va) / v.u, 2))::text
                  end as "differenceInUncertainties",
             v.cite_a as "oldSourceCitation", v.cite_b as "newSourceCitation",
             v.doi_a as "oldSourceDoi", v.doi_b as "newSourceDoi"
      from v
      join species_phases sp on sp.id = v.species_phase_id
      join species s on s.id = sp.species_id
      order by s.key collate "C", sp.phase, sp.modification collate "C" nulls first,
               v.quantity collate "C"`);
    return result.rows as unknown as DiffRow[];
  },
};
