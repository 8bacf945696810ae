import { ATOMIC_WEIGHTS } from './atomic-weights';
import { ThermoError } from '../errors/thermo-error';
import { parseFormula, type ParsedFormula } from './formula-parser';

/**
 * Molar mass in g/mol from the atomic-weight table (CIAAW 2021 abridged). The electron mass of
 * an ion's charge is ignored (5.5e-4 g/mol per charge), as handbooks do.
 */
export function molarMass(formula: string | ParsedFormula): number {
  const parsed = typeof formula === 'string' ? parseFormula(formula) : formula;
  if (parsed === null || typeof parsed !== 'object' || typeof parsed.elements !== 'object') {
    throw new ThermoError('invalid_input', 'molarMass needs a formula string or a parsed formula');
  }
  let total = 0;
  for (const symbol in parsed.elements) {
    const entry = ATOMIC_WEIGHTS.get(symbol);
    if (entry === undefined) {
      throw new ThermoError('unknown_element', `unknown element symbol '${symbol}'`, { symbol });
    }
    total += entry.weight * (parsed.elements[symbol] as number);
  }
  return total;
}
