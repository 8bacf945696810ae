import { z } from 'zod';
import { isReferenceState } from '../../server/src/thermo';
import { readCsv, type ParseResult, type TextInput } from './csv-table';
import {
  cell,
  checkModification,
  checkReferences,
  energyFields,
  rowError,
  validateCells,
} from './cells';
import type { CrossReferences, FormationRow } from './row-types';

const FILE = 'formation-enthalpies.csv';
export const FORMATION_COLUMNS = [
  'species',
  'phase',
  'modification',
  'value',
  'unit',
  'uncertainty',
  'uncertainty_basis',
  'method',
  'standard_pressure_pa',
  'source',
  'from_memory',
  'notes',
] as const;

const schema = z.object({
  species: cell.required,
  phase: cell.phase,
  modification: cell.modification,
  value: cell.decimal,
  unit: cell.unit,
  uncertainty: cell.positiveDecimal,
  uncertainty_basis: cell.basis,
  method: cell.method,
  standard_pressure_pa: cell.pressure,
  source: cell.required,
  from_memory: cell.fromMemory,
  notes: cell.optional,
});

/** Identity of a species-phase: key, phase and modification. */
export function speciesPhaseKey(
  species: string,
  phase: string,
  modification: string | null,
): string {
  return modification === null ? `${species}(${phase})` : `${species}(${phase},${modification})`;
}

/**
 * ΔfH°(298.15 K) rows. One row per species-phase (the value a release pins); an element in its
 * reference state must be exactly 0 by definition.
 */
export function parseFormationCsv(
  input: TextInput,
  refs: CrossReferences = {},
): ParseResult<FormationRow> {
  const { records, errors } = readCsv(input, FILE, FORMATION_COLUMNS);
  const rows: FormationRow[] = [];
  const lines = new Map<string, number>();
  for (const record of records) {
    const c = validateCells(schema, record, FILE, errors);
    if (c === null) continue;
    const before = errors.length;
    const report = (message: string, column: string): void => {
      rowError(errors, FILE, record.line, message, column);
    };
    checkModification(c.phase, c.modification, 'modification', report);
    checkReferences(refs, c.species, c.source, report);
    const energy = energyFields(c, report);
    const id = speciesPhaseKey(c.species, c.phase, c.modification);
    const earlier = lines.get(id);
    if (earlier !== undefined) report(`${id} already on line ${earlier}`, 'species');
    else lines.set(id, record.line);
    const species = refs.species?.get(c.species);
    if (
      species !== undefined &&
      isReferenceState(species.formula, c.phase, c.modification) &&
      energy.valueJPerMol !== '0'
    )
      report(`${id} is an element in its reference state: its ΔfH° is 0 by definition`, 'value');
    if (errors.length > before) continue;
    rows.push({
      line: record.line,
      species: c.species,
      phase: c.phase,
      modification: c.modification,
      ...energy,
      method: c.method,
      standardPressurePa: c.standard_pressure_pa,
      source: c.source,
      fromMemory: c.from_memory,
      notes: c.notes,
    });
  }
  return { rows, errors };
}
