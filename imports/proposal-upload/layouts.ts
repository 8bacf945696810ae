import { parseFormationCsv, FORMATION_COLUMNS } from '../registry-csv/formation-csv';
import { parseHeatCapacityCsv, HEAT_CAPACITY_COLUMNS } from '../registry-csv/heat-capacity-csv';
import { parseSpeciesCsv, SPECIES_COLUMNS } from '../registry-csv/species-csv';
import { parseTransitionsCsv, TRANSITION_COLUMNS } from '../registry-csv/transitions-csv';

/**
 * The four row layouts of the registry's tabular format (imports/README.md) that an upload may
 * hold: a CSV upload is one of the dataset's files; an XML upload holds rows of any of them,
 * one element per row, attributes named as the CSV columns.
 */
export const LAYOUTS = {
  species: { file: 'species.csv', element: 'species', columns: SPECIES_COLUMNS },
  formation: {
    file: 'formation-enthalpies.csv',
    element: 'formation-enthalpy',
    columns: FORMATION_COLUMNS,
  },
  heat_capacity: {
    file: 'heat-capacity.csv',
    element: 'heat-capacity',
    columns: HEAT_CAPACITY_COLUMNS,
  },
  transition: { file: 'transitions.csv', element: 'transition', columns: TRANSITION_COLUMNS },
} as const;

export type Layout = keyof typeof LAYOUTS;
export const LAYOUT_NAMES = Object.keys(LAYOUTS) as Layout[];

/** The registry parser of each layout (species first: value rows may name species it adds). */
export const PARSERS = {
  species: parseSpeciesCsv,
  formation: parseFormationCsv,
  heat_capacity: parseHeatCapacityCsv,
  transition: parseTransitionsCsv,
} as const;

/** The layout whose columns a header shares most, or null when it shares fewer than half. */
export function layoutOfHeader(header: readonly string[]): Layout | null {
  let best: Layout | null = null;
  let bestScore = 0;
  for (const name of LAYOUT_NAMES) {
    const columns: readonly string[] = LAYOUTS[name].columns;
    const shared = header.filter((h) => columns.includes(h)).length;
    const score = shared / columns.length;
    if (score > bestScore) {
      best = name;
      bestScore = score;
    }
  }
  return bestScore >= 0.5 ? best : null;
}

export function describeLayouts(): string {
  return LAYOUT_NAMES.map((l) => `${LAYOUTS[l].file} (${LAYOUTS[l].columns.join(',')})`).join('; ');
}
