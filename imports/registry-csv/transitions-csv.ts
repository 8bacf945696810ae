import { z } from 'zod';
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
import { speciesPhaseKey } from './formation-csv';
import type { CrossReferences, TransitionRow } from './row-types';

const FILE = 'transitions.csv';
export const TRANSITION_COLUMNS = [
  'species',
  'from_phase',
  'from_modification',
  'to_phase',
  'to_modification',
  'temperature_k',
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
  from_phase: cell.phase,
  from_modification: cell.modification,
  to_phase: cell.phase,
  to_modification: cell.modification,
  temperature_k: cell.kelvin,
  ...valueCells,
});

/** Phase transitions in the heating direction: ΔtrsH of going from_phase → to_phase at T. */
export function parseTransitionsCsv(
  input: TextInput,
  refs: CrossReferences = {},
): ParseResult<TransitionRow> {
  const seenOn = firstLines();
  return readRows(input, FILE, TRANSITION_COLUMNS, schema, (c, line, report): TransitionRow => {
    checkModification(c.from_phase, c.from_modification, 'from_modification', report);
    checkModification(c.to_phase, c.to_modification, 'to_modification', report);
    checkReferences(refs, c.species, c.source, report);
    const from = speciesPhaseKey(c.species, c.from_phase, c.from_modification);
    const to = speciesPhaseKey(c.species, c.to_phase, c.to_modification);
    if (from === to) report('a transition needs two different phases', 'to_phase');
    const fields = valueFields(c, report);
    // On heating through an equilibrium transition ΔtrsH = T·ΔtrsS > 0.
    if (fields.valueJPerMol.startsWith('-') || fields.valueJPerMol === '0')
      report(
        'ΔtrsH in the heating direction is positive (fusion cr → l, vaporization l → g)',
        'value',
      );
    const id = `${from} → ${to}`;
    const earlier = seenOn(id, line);
    if (earlier !== undefined) report(`${id} already on line ${earlier}`, 'species');
    return {
      line,
      species: c.species,
      fromPhase: c.from_phase,
      fromModification: c.from_modification,
      toPhase: c.to_phase,
      toModification: c.to_modification,
      temperatureK: c.temperature_k,
      ...fields,
    };
  });
}
