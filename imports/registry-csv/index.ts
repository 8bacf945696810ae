/**
 * Reader of the registry's own tabular format (imports/README.md): a dataset folder with
 * sources.json and four CSV files. Rows are validated with zod and the thermochemistry engine;
 * energies become exact decimal text in J/mol. Bad data gives row errors, never a throw, except
 * from readDataset, which refuses a dataset with any error.
 */
export { readDataset, parseDataset, DatasetError, DATASET_FILES } from './dataset';
export { parseSourcesJson } from './sources-json';
export { parseSpeciesCsv, casCheckDigitValid, SPECIES_KEY } from './species-csv';
export { parseFormationCsv, speciesPhaseKey } from './formation-csv';
export { parseHeatCapacityCsv } from './heat-capacity-csv';
export { parseTransitionsCsv } from './transitions-csv';
export { toJoulesPerMoleText, canonicalDecimal, type EnergyUnitText } from './decimal-text';
export type { RowError, ParseResult, TextInput } from './csv-table';
export * from './row-types';
