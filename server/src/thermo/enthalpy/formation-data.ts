import { shown, ThermoError } from '../errors/thermo-error';
import { parseTerm } from '../equation/equation-parser';
import type { Term } from '../equation/equation-types';

export type UncertaintyBasis = 'standard' | 'expanded_k2' | 'as_stated';
export const UNCERTAINTY_BASES: readonly UncertaintyBasis[] = [
  'standard',
  'expanded_k2',
  'as_stated',
];

/**
 * A standard enthalpy of formation as the data layer hands it to the engine. Any further
 * fields (source, revision, method…) pass through untouched into the per-term breakdown.
 */
export interface FormationValue {
  /** ΔfH°(298.15 K) in J/mol. */
  readonly value: number;
  /** Uncertainty in J/mol; null/absent when the source gives none. */
  readonly uncertainty?: number | null;
  readonly uncertaintyBasis?: UncertaintyBasis | null;
  readonly [provenance: string]: unknown;
}

/**
 * Finds the value for one term (species, phase, modification), or undefined when the data has
 * none. The engine never calls it for elements in their reference state. An exception thrown by
 * the lookup itself propagates unchanged: it is the data layer's failure, not the engine's.
 */
export type FormationLookup = (term: Term) => FormationValue | undefined;

/** Checks a value from a lookup; the engine never computes with a malformed number. */
export function checkFormationValue(v: FormationValue, species: string): FormationValue {
  if (
    v === null ||
    typeof v !== 'object' ||
    typeof v.value !== 'number' ||
    !Number.isFinite(v.value)
  ) {
    throw new ThermoError(
      'invalid_input',
      `the value for ${species} is not a finite number of J/mol`,
      { species },
    );
  }
  const u = v.uncertainty;
  if (u !== undefined && u !== null && (typeof u !== 'number' || !Number.isFinite(u) || u < 0)) {
    throw new ThermoError(
      'invalid_input',
      `the uncertainty for ${species} must be a finite number ≥ 0`,
      { species },
    );
  }
  const b = v.uncertaintyBasis;
  if (b !== undefined && b !== null && !UNCERTAINTY_BASES.includes(b)) {
    throw new ThermoError('invalid_input', `unknown uncertainty basis ${shown(b)} for ${species}`, {
      species,
    });
  }
  return v;
}

/**
 * A lookup over a plain table keyed by term text (`'H2O(l)'`, `'C(cr,graphite)'`), values in
 * J/mol as a number or a FormationValue. Keys are parsed, so any spelling of a species-phase
 * finds its entry.
 */
export function tableLookup<T extends FormationValue>(
  table: Readonly<Record<string, number | T>>,
): (term: Term) => T | FormationValue | undefined {
  if (table === null || typeof table !== 'object') {
    throw new ThermoError('invalid_input', 'expected a table of term text → value in J/mol');
  }
  const byId = new Map<string, T | FormationValue>();
  for (const [key, v] of Object.entries(table)) {
    const id = parseTerm(key).id;
    byId.set(id, typeof v === 'number' ? { value: v } : v);
  }
  return (term) => byId.get(term.id);
}
