import fc from 'fast-check';
import { ThermoError } from '../errors/thermo-error';
import { parseEquation } from './equation-parser';
import { printEquation, printTerm } from './equation-printer';
import type { Equation } from './equation-types';
import { equationText } from '../testing/arbitraries';

/** Parses generated text, skipping the few draws that cancel to an empty side. */
function parsed(text: string): Equation | null {
  try {
    return parseEquation(text);
  } catch (err) {
    if (err instanceof ThermoError && err.code === 'invalid_input') return null;
    throw err;
  }
}

describe('printEquation', () => {
  it('prints the canonical form', () => {
    expect(printEquation(parseEquation('CH4(g)+2O2(g)=CO2(g)+2H2O(l)'))).toBe(
      'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
    );
    expect(printEquation(parseEquation('0.5 O2(g) + H2(g) → H2O(g)'))).toBe(
      '1/2 O2(g) + H2(g) -> H2O(g)',
    );
    expect(printEquation(parseEquation('CuSO4*5H2O(cr) -> CuSO4(cr) + 5H2O(g)'))).toBe(
      'CuSO4·5H2O(cr) -> CuSO4(cr) + 5 H2O(g)',
    );
    expect(printEquation(parseEquation('Na+ + Cl- -> NaCl'))).toBe('Na+ + Cl- -> NaCl');
    expect(printEquation(parseEquation('NH4^+(aq) -> NH3(aq) + H^+(aq)'))).toBe(
      'NH4+(aq) -> NH3(aq) + H+(aq)',
    );
    expect(printEquation(parseEquation('[2-methylpropane](g) -> [n-butane](g)'))).toBe(
      '[2-methylpropane](g) -> [n-butane](g)',
    );
  });

  it('prints one term with coefficient, species and phase', () => {
    const eq = parseEquation('3/2 O2(g) + C(cr, graphite) -> CO2(g) + 1/2 O2(g)');
    // Our canonical notation: the modification's name alone stands for the crystal.
    expect(eq.reactants.map(printTerm)).toEqual(['O2(g)', 'C(graphite)']);
  });

  it('round-trips: parseEquation(printEquation(e)) equals e (property)', () => {
    fc.assert(
      fc.property(equationText, (text) => {
        const e = parsed(text);
        fc.pre(e !== null);
        expect(parseEquation(printEquation(e as Equation))).toEqual(e);
      }),
      { numRuns: 2000 },
    );
  });

  it('is idempotent on its own output (property)', () => {
    fc.assert(
      fc.property(equationText, (text) => {
        const e = parsed(text);
        fc.pre(e !== null);
        const once = printEquation(e as Equation);
        expect(printEquation(parseEquation(once))).toBe(once);
      }),
      { numRuns: 500 },
    );
  });
});
