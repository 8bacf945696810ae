import { and, eq, inArray, or, sql, type SQL } from 'drizzle-orm';
import { revisions, sources, species, speciesPhases, type StoredPhase } from '../../../../schema';
import type { Database, Tx } from '../../db/client';
import type { ProposalItemInput } from './proposal-item-schemas';
import { chunks } from './proposals-repository';

type Queryable = Database | Tx;

interface SpeciesData {
  id: number;
  key: string;
  name: string;
  formula: string;
  charge: number;
  casRn: string | null;
  inchiKey: string | null;
}

/** What checking a set of items needs from the registry, loaded in a few queries. */
export interface CheckData {
  species: Map<string, SpeciesData>;
  phases: Map<string, { id: number; phase: StoredPhase; modification: string | null }[]>;
  /** Accepted revision by `speciesPhaseId|quantity`. */
  accepted: Map<string, { id: number }>;
  revisionsById: Map<
    number,
    {
      id: number;
      status: string;
      speciesKey: string;
      phase: StoredPhase;
      modification: string | null;
      quantity: string;
    }
  >;
  sources: Set<number>;
  duplicates(
    item: Extract<ProposalItemInput, { kind: 'add_species' }>,
    hill: string | null,
  ): { field: string; key: string; message: string }[];
}

/**
 * Loads what checking a set of items needs from the registry in a few batched queries: the
 * species and phases they name, the accepted value of each phase, the sources they cite, the
 * revisions they retire, and species that look like the new ones (for duplicate warnings).
 */
export async function loadCheckData(
  db: Queryable,
  items: readonly ProposalItemInput[],
): Promise<CheckData> {
  const keys = new Set<string>();
  const sourceIds = new Set<number>();
  const revisionIds = new Set<number>();
  const cas: string[] = [];
  const inchiKeys: string[] = [];
  for (const i of items) {
    if ('species' in i && i.species) keys.add(i.species);
    if ('sourceId' in i && i.sourceId) sourceIds.add(Number(i.sourceId));
    if (i.kind === 'retire_value' && i.revisionId) revisionIds.add(i.revisionId);
    if (i.kind === 'add_species') {
      keys.add(i.key);
      if (i.casRn) cas.push(i.casRn);
      if (i.inchiKey) inchiKeys.push(i.inchiKey);
    }
  }
  const byIds = [...revisionIds];
  const revRows = byIds.length
    ? await db
        .select({
          id: revisions.id,
          status: revisions.status,
          speciesKey: species.key,
          phase: speciesPhases.phase,
          modification: speciesPhases.modification,
          quantity: revisions.quantity,
        })
        .from(revisions)
        .innerJoin(speciesPhases, eq(speciesPhases.id, revisions.speciesPhaseId))
        .innerJoin(species, eq(species.id, speciesPhases.speciesId))
        .where(inArray(revisions.id, byIds))
    : [];
  for (const r of revRows) keys.add(r.speciesKey);
  const speciesRows: SpeciesData[] = [];
  for (const part of chunks([...keys])) {
    speciesRows.push(
      ...(await db
        .select({
          id: species.id,
          key: species.key,
          name: species.name,
          formula: species.formula,
          charge: species.charge,
          casRn: species.casRn,
          inchiKey: species.inchiKey,
        })
        .from(species)
        .where(inArray(species.key, part))),
    );
  }
  const phases = new Map<
    string,
    { id: number; phase: StoredPhase; modification: string | null }[]
  >();
  const accepted = new Map<string, { id: number }>();
  for (const part of chunks(speciesRows.map((s) => s.id))) {
    const rows = await db
      .select({
        id: speciesPhases.id,
        speciesId: speciesPhases.speciesId,
        phase: speciesPhases.phase,
        modification: speciesPhases.modification,
      })
      .from(speciesPhases)
      .where(inArray(speciesPhases.speciesId, part));
    const keyOf = new Map(speciesRows.map((s) => [s.id, s.key]));
    for (const p of rows) {
      const k = keyOf.get(p.speciesId)!;
      const list = phases.get(k) ?? [];
      list.push({ id: p.id, phase: p.phase, modification: p.modification });
      phases.set(k, list);
    }
    for (const ids of chunks(rows.map((p) => p.id))) {
      const acc = await db
        .select({ id: revisions.id, sp: revisions.speciesPhaseId, quantity: revisions.quantity })
        .from(revisions)
        .where(and(inArray(revisions.speciesPhaseId, ids), eq(revisions.status, 'accepted')));
      for (const a of acc) accepted.set(`${a.sp}|${a.quantity}`, { id: a.id });
    }
  }
  const srcRows = sourceIds.size
    ? await db
        .select({ id: sources.id })
        .from(sources)
        .where(
          inArray(
            sources.id,
            [...sourceIds].filter((n) => n <= 2_147_483_647),
          ),
        )
    : [];
  const similar = await similarSpecies(db, items, cas, inchiKeys);
  return {
    species: new Map(speciesRows.map((s) => [s.key, s])),
    phases,
    accepted,
    revisionsById: new Map(revRows.map((r) => [r.id, r])),
    sources: new Set(srcRows.map((s) => s.id)),
    duplicates(item, hill) {
      const out: { field: string; key: string; message: string }[] = [];
      for (const s of similar) {
        if (item.casRn && s.casRn === item.casRn)
          out.push({
            field: 'casRn',
            key: s.key,
            message: `${s.name} [${s.key}] already has CAS RN ${item.casRn}`,
          });
        else if (item.inchiKey && s.inchiKey === item.inchiKey)
          out.push({
            field: 'inchiKey',
            key: s.key,
            message: `${s.name} [${s.key}] already has InChIKey ${item.inchiKey}`,
          });
        else if (hill && s.formula === hill && s.name.toLowerCase() === item.name.toLowerCase())
          out.push({
            field: 'name',
            key: s.key,
            message: `${s.name} [${s.key}] has the same formula ${hill} and name: likely the same species`,
          });
      }
      return out;
    },
  };
}

async function similarSpecies(
  db: Queryable,
  items: readonly ProposalItemInput[],
  cas: string[],
  inchiKeys: string[],
) {
  const adds = items.filter((i) => i.kind === 'add_species');
  if (adds.length === 0) return [];
  const names = adds.map((i) => i.name.toLowerCase());
  const conditions: SQL[] = [inArray(sql`lower(${species.name})`, names)];
  if (cas.length) conditions.push(inArray(species.casRn, cas));
  if (inchiKeys.length) conditions.push(inArray(species.inchiKey, inchiKeys));
  return db
    .select({
      key: species.key,
      name: species.name,
      formula: species.formula,
      casRn: species.casRn,
      inchiKey: species.inchiKey,
    })
    .from(species)
    .where(or(...conditions));
}
