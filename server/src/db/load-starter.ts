import path from 'node:path';
import { eq, inArray, sql } from 'drizzle-orm';
import {
  heatCapacityRanges,
  revisions,
  sources,
  species,
  speciesPhases,
  users,
  type StandardPressure,
} from '../../../schema';
import {
  readDataset,
  type Dataset,
  type DataPhase,
  type StandardPressurePa,
} from '../../../imports/registry-csv';
import { PROJECT_ROOT } from '../config/paths';
import { recordAudit } from '../modules/audit/audit-repository';
import { formatCitation } from '../modules/sources/citation';
import { createReleasesService, type ReleasesService } from '../modules/releases/releases-service';
import type { Database, Tx } from './client';

export const STARTER_DIR = path.join(PROJECT_ROOT, 'imports/starter');
export const STARTER_RELEASE = '2026.1';
/** The account that publishes data loaded by the system itself (never signs in). */
export const SYSTEM_ACCOUNT = { githubId: 0, login: 'thalpos-system', name: 'Thalpos (system)' };
/** Serialises concurrent loaders (two processes starting at once). */
const LOAD_LOCK = 0x7468616c; // "thal"

const PRESSURE: Record<StandardPressurePa, StandardPressure> = {
  100000: '1 bar',
  101325: '1 atm',
};

export interface StarterLoadResult {
  loaded: boolean;
  release: string;
  counts?: { sources: number; species: number; revisions: number };
}

const phaseKey = (key: string, phase: DataPhase, modification: string | null) =>
  `${key}|${phase}|${modification ?? ''}`;

/**
 * Loads the starter dataset and publishes it as release 2026.1 through the release service,
 * all in one transaction. Runs once: when the release exists, nothing is read or written.
 */
export async function loadStarterDataset(
  db: Database,
  releasesService: Pick<ReleasesService, 'createDraftIn' | 'publishIn'>,
  options: { dir?: string; version?: string } = {},
): Promise<StarterLoadResult> {
  const version = options.version ?? STARTER_RELEASE;
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${LOAD_LOCK})`);
    const existing = await tx.execute(sql`select 1 from releases where version = ${version}`);
    if ((existing.rowCount ?? 0) > 0) return { loaded: false, release: version };

    const dataset = readDataset(options.dir ?? STARTER_DIR);
    const system = await systemAccount(tx);
    const counts = await insertDataset(tx, dataset, system.id);
    await recordAudit(tx, {
      actorId: system.id,
      action: 'registry.dataset_loaded',
      entityType: 'dataset',
      entityId: 'starter',
      after: counts,
    });
    await releasesService.createDraftIn(
      tx,
      system,
      version,
      'First release: the starter dataset transcribed from published compilations (see each value’s source).',
    );
    await releasesService.publishIn(tx, system, version);
    return { loaded: true, release: version, counts };
  });
}

async function systemAccount(tx: Tx) {
  await tx
    .insert(users)
    .values({ ...SYSTEM_ACCOUNT, role: 'editor' })
    .onConflictDoNothing({ target: users.githubId });
  const [row] = await tx.select().from(users).where(eq(users.githubId, SYSTEM_ACCOUNT.githubId));
  return row!;
}

async function insertDataset(tx: Tx, data: Dataset, createdBy: number) {
  // Sources: matched by key, or by DOI when a curator already entered the same work.
  const sourceIds = new Map<string, number>();
  for (const csl of data.sources) {
    const doi = typeof csl.DOI === 'string' ? csl.DOI.toLowerCase() : null;
    const [found] = await tx
      .select({ id: sources.id })
      .from(sources)
      .where(
        doi ? sql`${sources.key} = ${csl.id} or ${sources.doi} = ${doi}` : eq(sources.key, csl.id),
      );
    const id =
      found?.id ??
      (
        await tx
          .insert(sources)
          .values({ key: csl.id, csl, citation: formatCitation(csl), doi, createdBy })
          .returning({ id: sources.id })
      )[0]!.id;
    sourceIds.set(csl.id, id);
  }

  if (data.species.length > 0) {
    await tx
      .insert(species)
      .values(
        data.species.map((s) => ({
          key: s.key,
          name: s.name,
          synonyms: [...s.synonyms],
          formula: s.hill,
          charge: s.charge,
          casRn: s.casRn,
          inchi: s.inchi,
          inchiKey: s.inchiKey,
          smiles: s.smiles,
          notes: s.notes,
          createdBy,
        })),
      )
      .onConflictDoNothing({ target: species.key });
  }
  const speciesRows = await tx
    .select({ id: species.id, key: species.key })
    .from(species)
    .where(
      inArray(
        species.key,
        data.species.map((s) => s.key),
      ),
    );
  const speciesIds = new Map(speciesRows.map((s) => [s.key, s.id]));

  const wanted = new Map<
    string,
    { speciesId: number; phase: DataPhase; modification: string | null }
  >();
  const want = (key: string, phase: DataPhase, modification: string | null) =>
    wanted.set(phaseKey(key, phase, modification), {
      speciesId: speciesIds.get(key)!,
      phase,
      modification,
    });
  for (const f of data.formation) want(f.species, f.phase, f.modification);
  for (const h of data.heatCapacity) want(h.species, h.phase, h.modification);
  for (const t of data.transitions) want(t.species, t.fromPhase, t.fromModification);
  if (wanted.size > 0) {
    await tx
      .insert(speciesPhases)
      .values([...wanted.values()])
      .onConflictDoNothing();
  }
  const phaseRows = await tx
    .select({
      id: speciesPhases.id,
      speciesId: speciesPhases.speciesId,
      phase: speciesPhases.phase,
      modification: speciesPhases.modification,
    })
    .from(speciesPhases)
    .where(inArray(speciesPhases.speciesId, [...speciesIds.values()]));
  const keyOf = new Map(speciesRows.map((s) => [s.id, s.key]));
  const phaseIds = new Map(
    phaseRows.map((p) => [phaseKey(keyOf.get(p.speciesId)!, p.phase, p.modification), p.id]),
  );
  const phaseId = (key: string, phase: DataPhase, modification: string | null) =>
    phaseIds.get(phaseKey(key, phase, modification))!;

  const common = { status: 'accepted' as const, createdBy };
  const values: (typeof revisions.$inferInsert)[] = [
    ...data.formation.map((f) => ({
      ...common,
      speciesPhaseId: phaseId(f.species, f.phase, f.modification),
      kind: 'formation_enthalpy' as const,
      quantity: 'formation_enthalpy',
      value: f.valueJPerMol,
      uncertainty: f.uncertaintyJPerMol,
      uncertaintyBasis: f.uncertaintyBasis,
      method: f.method,
      standardPressure: PRESSURE[f.standardPressurePa],
      sourceId: sourceIds.get(f.source)!,
      notes: f.notes,
      fromMemory: f.fromMemory,
    })),
    ...data.transitions.map((t) => ({
      ...common,
      speciesPhaseId: phaseId(t.species, t.fromPhase, t.fromModification),
      kind: 'transition' as const,
      quantity: `transition:${t.toPhase}${t.toModification ? `,${t.toModification}` : ''}`,
      value: t.valueJPerMol,
      uncertainty: t.uncertaintyJPerMol,
      uncertaintyBasis: t.uncertaintyBasis,
      temperature: t.temperatureK,
      toPhase: t.toPhase,
      toModification: t.toModification,
      method: t.method,
      standardPressure: PRESSURE[t.standardPressurePa],
      sourceId: sourceIds.get(t.source)!,
      notes: t.notes,
      fromMemory: t.fromMemory,
    })),
  ];
  // ON CONFLICT: a value a curator already accepted for the same species-phase wins.
  const inserted =
    values.length > 0
      ? await tx
          .insert(revisions)
          .values(values)
          .onConflictDoNothing()
          .returning({ id: revisions.id })
      : [];

  let heatSets = 0;
  for (const h of data.heatCapacity) {
    const [rev] = await tx
      .insert(revisions)
      .values({
        ...common,
        speciesPhaseId: phaseId(h.species, h.phase, h.modification),
        kind: 'heat_capacity',
        quantity: 'heat_capacity',
        heatCapacityForm: h.kind,
        sourceId: sourceIds.get(h.source)!,
        notes: h.notes,
        fromMemory: h.fromMemory,
      })
      .onConflictDoNothing()
      .returning({ id: revisions.id });
    if (!rev) continue;
    heatSets++;
    await tx.insert(heatCapacityRanges).values(
      h.ranges.map((r, seq) => ({
        revisionId: rev.id,
        seq,
        tMin: r.tMinK,
        tMax: r.tMaxK,
        coefficients: [...r.coefficients] as string[],
      })),
    );
  }
  return {
    sources: sourceIds.size,
    species: speciesIds.size,
    revisions: inserted.length + heatSets,
  };
}

/** Start-up: load and publish the starter release unless it exists (`npm start`, test template). */
export function ensureStarterRelease(db: Database): Promise<StarterLoadResult> {
  return loadStarterDataset(db, createReleasesService(db));
}
