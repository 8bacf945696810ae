import * as checkedEquations from './checked-equations';
import { ThermoError } from '../errors/thermo-error';
import * as parser from './equation-parser';
import type { Equation } from './equation-types';

// Hot path: imported functions bound once (development module loaders put a getter on every
// imported binding, which costs more than the work here).
const { isChecked, isTerm, markChecked } = checkedEquations;
const { parseEquation } = parser;

/** Accepts equation text or a parsed equation; a hand-built object is checked term by term. */
export function toEquation(eq: Equation | string): Equation {
  if (typeof eq === 'string') return parseEquation(eq);
  if (eq !== null && typeof eq === 'object' && isChecked(eq)) return eq;
  if (
    eq === null ||
    typeof eq !== 'object' ||
    !Array.isArray(eq.reactants) ||
    !Array.isArray(eq.products) ||
    !eq.reactants.every(isTerm) ||
    !eq.products.every(isTerm)
  ) {
    throw new ThermoError(
      'invalid_input',
      'expected an equation: text, or the result of parseEquation',
    );
  }
  return markChecked(eq);
}
