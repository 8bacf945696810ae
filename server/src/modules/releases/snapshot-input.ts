import type { HeatCapacityModel, ShomateRange } from '../../thermo';
import type { Tx } from '../../db/client';
import type { PinnedQuantity, PinnedRow, Queryable } from './releases-repository';
import { releasesRepository } from './releases-repository';
import type {
  SnapshotHeatCapacitySet,
  SnapshotInput,
  SnapshotSource,
  SnapshotSpecies,
  StandardPressure,
} from './release-snapshot';

interface RangeRow {
  revisionId: number;
  seq: number;
  tMin: string;
  tMax: string;
  coefficients: (string | null)[];
}

const num = (t: string | null | undefined): number => Number(t);

/** Rebuilds the engine's model from stored ranges (coefficients c1… as the source printed them). */
export function modelFromRanges(
  form: 'nasa7' | 'shomate',
  ranges: readonly RangeRow[],
): HeatCapacityModel {
  if (form === 'nasa7') {
    const [low, high] = ranges;
    if (!low || !high || ranges.length !== 2)
      throw new Error('a NASA 7-coefficient set needs two ranges');
    return {
      kind: 'nasa7',
      tLow: num(low.tMin),
      tMid: num(low.tMax),
      tHigh: num(high.tMax),
      low: low.coefficients.slice(0, 7).map(num),
      high: high.coefficients.slice(0, 7).map(num),
    };
  }
  return {
    kind: 'shomate',
    ranges: ranges.map((r): ShomateRange => {
      const [A, B, C, D, E, F, , H] = r.coefficients;
      return {
        tMin: num(r.tMin),
        tMax: num(r.tMax),
        A: num(A),
        B: num(B),
        C: num(C),
        D: num(D),
        E: num(E),
        // drizzle reads a NULL array element as the text 'NULL'.
        ...(F != null && F !== 'NULL' && H != null && H !== 'NULL' ? { F: num(F), H: num(H) } : {}),
      };
    }),
  };
}

interface SpeciesColumns {
  speciesKey: string;
  speciesName: string;
  speciesFormula: string;
  speciesCharge: number;
  speciesSynonyms: string[];
}

function speciesOfRows(rows: readonly SpeciesColumns[]): SnapshotSpecies[] {
  const byKey = new Map<string, SnapshotSpecies>();
  for (const r of rows) {
    if (byKey.has(r.speciesKey)) continue;
    byKey.set(r.speciesKey, {
      key: r.speciesKey,
      name: r.speciesName,
      formula: r.speciesFormula,
      charge: r.speciesCharge,
      synonyms: r.speciesSynonyms,
    });
  }
  return [...byKey.values()];
}

const sourceOf = (r: {
  sourceId: number;
  citation: string;
  doi: string | null;
}): SnapshotSource => ({
  id: String(r.sourceId),
  citation: r.citation,
  doi: r.doi,
});

const QUANTITIES = ['formation_enthalpy', 'heat_capacity', 'transition'] as const;

type ReadQuantity = (tx: Tx, quantity: PinnedQuantity) => Promise<PinnedRow[]>;

/**
 * The rows of every quantity and the heat-capacity ranges. Rows that never change are read on a
 * pool with the three queries at once on their own connections (a cold load waits for the
 * slowest, not the sum); inside a caller's transaction, or for rows that may change, they run
 * one after another in one transaction.
 */
async function readRows(db: Queryable, unchanging: boolean, read: ReadQuantity) {
  const onPool = '$client' in db && unchanging;
  const [formation, heat, transitions] = onPool
    ? await Promise.all(QUANTITIES.map((q) => db.transaction((tx) => read(tx, q))))
    : await db.transaction(async (tx) => {
        const rows = [];
        for (const q of QUANTITIES) rows.push(await read(tx, q));
        return rows;
      });
  const ranges = await releasesRepository.rangesOf(
    db,
    heat!.map((h) => h.revisionId),
  );
  return { formation: formation!, heat: heat!, transitions: transitions!, ranges };
}

/** The pinned rows of a release (a published one never changes). */
function readPinnedRows(db: Queryable, release: { id: number; publishedAt: Date | null }) {
  return readRows(db, release.publishedAt !== null, async (tx, quantity) => {
    await releasesRepository.preferKeyProbes(tx);
    // Species come with their rows, so no separate species query is needed.
    return releasesRepository.pinned(tx, release.id, quantity);
  });
}

/** The plain rows of one release from the database: what `buildSnapshot` indexes. */
export async function loadSnapshotInput(
  db: Queryable,
  release: { id: number; version: string; publishedAt: Date | null },
): Promise<SnapshotInput> {
  return inputOf(release.version, release.publishedAt, await readPinnedRows(db, release));
}

/**
 * The accepted revisions of every quantity (what the next release would pin, unpublished) as
 * the rows of a release labelled `version`: what `buildSnapshot` indexes.
 */
export async function loadAcceptedInput(db: Queryable, version: string): Promise<SnapshotInput> {
  return inputOf(
    version,
    null,
    await readRows(db, false, (tx, quantity) => releasesRepository.accepted(tx, quantity)),
  );
}

function inputOf(
  version: string,
  publishedAt: Date | null,
  { formation, heat, transitions, ranges }: Awaited<ReturnType<typeof readRows>>,
): SnapshotInput {
  const rangesByRevision = new Map<number, RangeRow[]>();
  for (const r of ranges) {
    const list = rangesByRevision.get(r.revisionId);
    if (list) list.push(r);
    else rangesByRevision.set(r.revisionId, [r]);
  }
  return {
    version,
    publishedAt: publishedAt?.toISOString() ?? null,
    species: speciesOfRows([...formation, ...heat, ...transitions]),
    formationValues: formation.map((f) => ({
      revisionId: String(f.revisionId),
      speciesKey: f.speciesKey,
      phase: f.phase,
      modification: f.modification,
      value: f.value!,
      uncertainty: f.uncertainty,
      uncertaintyBasis: f.uncertaintyBasis,
      method: f.method ?? 'unspecified',
      standardPressure: f.standardPressure as StandardPressure,
      source: sourceOf(f),
    })),
    heatCapacitySets: heat.map((h): SnapshotHeatCapacitySet => ({
      revisionId: String(h.revisionId),
      speciesKey: h.speciesKey,
      phase: h.phase,
      modification: h.modification,
      model: modelFromRanges(h.heatCapacityForm!, rangesByRevision.get(h.revisionId) ?? []),
      source: sourceOf(h),
    })),
    transitions: transitions.map((t) => ({
      revisionId: String(t.revisionId),
      speciesKey: t.speciesKey,
      fromPhase: t.phase,
      fromModification: t.modification,
      toPhase: t.toPhase!,
      toModification: t.toModification,
      temperature: t.temperature!,
      deltaH: t.value!,
      source: sourceOf(t),
    })),
  };
}
