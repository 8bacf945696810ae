import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { RowError } from './csv-table';
import { parseFormationCsv } from './formation-csv';
import { parseHeatCapacityCsv } from './heat-capacity-csv';
import type { CrossReferences, Dataset } from './row-types';
import { parseSourcesJson } from './sources-json';
import { parseSpeciesCsv } from './species-csv';
import { parseTransitionsCsv } from './transitions-csv';

export const DATASET_FILES = {
  sources: 'sources.json',
  species: 'species.csv',
  formation: 'formation-enthalpies.csv',
  heatCapacity: 'heat-capacity.csv',
  transitions: 'transitions.csv',
} as const;

/** Thrown by readDataset: every row error of every file, so one run shows all of them. */
export class DatasetError extends Error {
  constructor(
    readonly dir: string,
    readonly errors: readonly RowError[],
  ) {
    super(
      `${errors.length} problem(s) in the dataset ${dir}:\n` +
        errors
          .map((e) => `  ${e.file}:${e.line}${e.column ? ` [${e.column}]` : ''} ${e.message}`)
          .join('\n'),
    );
    this.name = 'DatasetError';
  }
}

/** Every file parsed and cross-checked (species keys, source ids); row errors collected. */
export function parseDataset(files: Record<keyof typeof DATASET_FILES, string | Uint8Array>): {
  dataset: Dataset;
  errors: RowError[];
} {
  const sources = parseSourcesJson(files.sources);
  const species = parseSpeciesCsv(files.species);
  const refs: CrossReferences = {
    species: new Map(species.rows.map((s) => [s.key, s])),
    sources: new Set(sources.rows.map((s) => s.id)),
  };
  const formation = parseFormationCsv(files.formation, refs);
  const heatCapacity = parseHeatCapacityCsv(files.heatCapacity, refs);
  const transitions = parseTransitionsCsv(files.transitions, refs);
  return {
    dataset: {
      sources: sources.rows,
      species: species.rows,
      formation: formation.rows,
      heatCapacity: heatCapacity.rows,
      transitions: transitions.rows,
    },
    errors: [
      ...sources.errors,
      ...species.errors,
      ...formation.errors,
      ...heatCapacity.errors,
      ...transitions.errors,
    ],
  };
}

/** Reads the five files of a dataset folder; throws a DatasetError listing every row error. */
export function readDataset(dir: string): Dataset {
  const errors: RowError[] = [];
  const read = (name: string): Uint8Array => {
    try {
      return readFileSync(join(dir, name));
    } catch (err) {
      errors.push({ file: name, line: 0, message: `cannot read: ${(err as Error).message}` });
      return new Uint8Array();
    }
  };
  const files = {
    sources: read(DATASET_FILES.sources),
    species: read(DATASET_FILES.species),
    formation: read(DATASET_FILES.formation),
    heatCapacity: read(DATASET_FILES.heatCapacity),
    transitions: read(DATASET_FILES.transitions),
  };
  if (errors.length > 0) throw new DatasetError(dir, errors);
  const result = parseDataset(files);
  if (result.errors.length > 0) throw new DatasetError(dir, result.errors);
  return result.dataset;
}
