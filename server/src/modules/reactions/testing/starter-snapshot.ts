import path from 'node:path';
import { readDataset, type Dataset } from '../../../../../imports/registry-csv';
import { formatCitation } from '../../sources/citation';
import {
  buildSnapshot,
  type ReleaseSnapshot,
  type SnapshotInput,
  type SnapshotSource,
  type StandardPressure,
} from '../../releases/release-snapshot';

/**
 * The starter dataset read straight from its files as one release, for specs that need the
 * real data without a database. Revision ids are the file and line (the database gives real ones).
 */
export function datasetSnapshotInput(dataset: Dataset, version = '2026.1'): SnapshotInput {
  const sources = new Map<string, SnapshotSource>(
    dataset.sources.map((s) => [
      s.id,
      { id: s.id, citation: formatCitation(s), doi: typeof s.DOI === 'string' ? s.DOI : null },
    ]),
  );
  const source = (id: string) => sources.get(id)!;
  const pressure = (pa: number): StandardPressure => (pa === 101325 ? '1 atm' : '1 bar');
  return {
    version,
    publishedAt: null,
    species: dataset.species.map((s) => ({
      key: s.key,
      name: s.name,
      formula: s.hill,
      charge: s.charge,
      synonyms: s.synonyms,
    })),
    formationValues: dataset.formation.map((f) => ({
      revisionId: `formation:${f.line}`,
      speciesKey: f.species,
      phase: f.phase,
      modification: f.modification,
      value: f.valueJPerMol,
      uncertainty: f.uncertaintyJPerMol,
      uncertaintyBasis: f.uncertaintyBasis,
      method: f.method,
      standardPressure: pressure(f.standardPressurePa),
      source: source(f.source),
    })),
    heatCapacitySets: dataset.heatCapacity.map((h) => ({
      revisionId: `heat-capacity:${h.line}`,
      speciesKey: h.species,
      phase: h.phase,
      modification: h.modification,
      model: h.model,
      source: source(h.source),
    })),
    transitions: dataset.transitions.map((t) => ({
      revisionId: `transition:${t.line}`,
      speciesKey: t.species,
      fromPhase: t.fromPhase,
      fromModification: t.fromModification,
      toPhase: t.toPhase,
      toModification: t.toModification,
      temperature: t.temperatureK,
      deltaH: t.valueJPerMol,
      source: source(t.source),
    })),
  };
}

let starter: ReleaseSnapshot | undefined;

/** The starter dataset (imports/starter) as release 2026.1, built once per test file. */
export function starterSnapshot(): ReleaseSnapshot {
  starter ??= buildSnapshot(
    datasetSnapshotInput(readDataset(path.resolve(__dirname, '../../../../../imports/starter'))),
  );
  return starter;
}
