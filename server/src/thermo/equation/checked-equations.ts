import { ThermoError } from '../errors/thermo-error';
import type { Equation, Term } from './equation-types';

/**
 * Equations the engine built itself, or has checked once, are instances of this class (still
 * plain data: two fields, compared and serialised like any object). Equations are immutable
 * values, so an instance needs no second look; this keeps the term-by-term validation of
 * hand-built objects off the hot path at the cost of one instanceof test.
 */
class NetEquation implements Equation {
  constructor(
    readonly reactants: readonly Term[],
    readonly products: readonly Term[],
  ) {}
}

export function markChecked(eq: Equation): Equation {
  return eq instanceof NetEquation ? eq : new NetEquation(eq.reactants, eq.products);
}

export function isChecked(eq: Equation): boolean {
  return eq instanceof NetEquation;
}

/** Shape check of a term handed in from outside the engine. */
export function isTerm(t: unknown): boolean {
  if (t === null || typeof t !== 'object') return false;
  const { id, coefficient, species, phase, modification } = t as Partial<Term>;
  if (typeof id !== 'string' || (phase !== null && typeof phase !== 'string')) return false;
  if (modification !== null && typeof modification !== 'string') return false;
  if (typeof coefficient?.n !== 'bigint' || typeof coefficient.d !== 'bigint') return false;
  if (coefficient.s !== 1n || coefficient.n <= 0n || coefficient.d <= 0n) return false;
  if (species === null || typeof species !== 'object') return false;
  if (species.kind === 'key') return typeof species.key === 'string';
  if (species.kind !== 'formula' || typeof species.formula !== 'string') return false;
  if (!Number.isSafeInteger(species.charge)) return false;
  const els = species.elements;
  if (els === null || typeof els !== 'object') return false;
  for (const symbol in els) {
    const n = els[symbol];
    if (typeof n !== 'number' || !Number.isFinite(n) || n <= 0) return false;
    // A non-integer count is only trusted with its exact value beside it.
    if (!Number.isSafeInteger(n) && typeof species.exact?.[symbol]?.n !== 'bigint') return false;
  }
  return true;
}

export function assertTerms(terms: unknown): asserts terms is readonly Term[] {
  if (!Array.isArray(terms) || !terms.every(isTerm)) {
    throw new ThermoError(
      'invalid_input',
      'expected a list of terms as produced by parseTerm or parseEquation',
    );
  }
}
