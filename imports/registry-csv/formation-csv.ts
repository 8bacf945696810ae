import { z } from 'zod';
import { isReferenceState } from '../../server/src/thermo';
import type { ParseResult, TextInput } from './csv-table';
import {
  cell,
  checkModification,
  checkReferences,
  firstLines,
  readRows,
  valueCells,
  valueFields,
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
  ...valueCells,
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
  const seenOn = firstLines();
  return readRows(input, FILE, FORMATION_COLUMNS, schema, (c, line, report): FormationRow => {
    checkModification(c.phase, c.modification, 'modification', report);
    checkReferences(refs, c.species, c.source, report);
    const fields = valueFields(c, report);
    const id = speciesPhaseKey(c.species, c.phase, c.modification);
    const earlier = seenOn(id, line);
    if (earlier !== undefined) report(`${id} already on line ${earlier}`, 'species');
    const species = refs.species?.get(c.species);
    if (
      species !== undefined &&
      isReferenceState(species.formula, c.phase, c.modification) &&
      fields.valueJPerMol !== '0'
    )
      report(`${id} is an element in its reference state: its ΔfH° is 0 by definition`, 'value');
    return { line, species: c.species, phase: c.phase, modification: c.modification, ...fields };
  });
}
