import type Fraction from 'fraction.js';
import { isTerm } from './checked-equations';
import { ThermoError } from '../errors/thermo-error';
import { speciesPhaseId } from './equation-builder';
import { toEquation } from './equation-input';
import type { Equation, Term } from './equation-types';
import { fractionText } from '../rational/rational';

/** `2 H2O(l)`, `1/2 O2(g)`, `CO2(g)`: coefficient 1 is left out, fractions stay exact. */
export function printTerm(term: Term): string {
  if (!isTerm(term))
    throw new ThermoError(
      'invalid_input',
      'printTerm needs a term from parseTerm or parseEquation',
    );
  return termText(term);
}

function termText(term: Term): string {
  const id = speciesPhaseId(term.species, term.phase, term.modification);
  return isOne(term.coefficient) ? id : `${fractionText(term.coefficient)} ${id}`;
}

function isOne(f: Fraction): boolean {
  return f.n === 1n && f.d === 1n && f.s > 0n;
}

/**
 * Canonical text of an equation: terms joined by ` + `, arrow `->`. parseEquation reads it back
 * to the same structure.
 */
export function printEquation(input: Equation | string): string {
  const eq = toEquation(input);
  return `${eq.reactants.map(termText).join(' + ')} -> ${eq.products.map(termText).join(' + ')}`;
}
