import fc from 'fast-check';
import { autoBalance } from './auto-balance';
import { checkBalance } from './balance';
import { ThermoError } from '../errors/thermo-error';
import { buildEquation, makeTerm } from '../equation/equation-builder';
import { parseEquation, parseTerm } from '../equation/equation-parser';
import { printEquation } from '../equation/equation-printer';
import { frac } from '../rational/rational';

function balanceError(text: string): ThermoError {
  try {
    autoBalance(parseEquation(text));
  } catch (err) {
    if (err instanceof ThermoError) return err;
    throw err;
  }
  throw new Error(`expected ${text} not to balance`);
}

describe('autoBalance', () => {
  it.each([
    ['CH4(g) + O2(g) -> CO2(g) + H2O(l)', 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)'],
    ['C3H8(g) + O2(g) -> CO2(g) + H2O(g)', 'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(g)'],
    ['C8H18(l) + O2(g) -> CO2(g) + H2O(l)', '2 C8H18(l) + 25 O2(g) -> 16 CO2(g) + 18 H2O(l)'],
    ['Al(cr) + O2(g) -> Al2O3(cr,corundum)', '4 Al(cr) + 3 O2(g) -> 2 Al2O3(corundum)'],
    ['Fe(cr) + O2(g) -> Fe0.947O(cr)', '947 Fe(cr) + 500 O2(g) -> 1000 Fe0.947O(cr)'],
    [
      'CaSO4·2H2O(cr) -> CaSO4·1/2H2O(cr) + H2O(g)',
      '2 CaSO4·2H2O(cr) -> 2 CaSO4·1/2H2O(cr) + 3 H2O(g)',
    ],
    ['1/2 N2(g) + 7 H2(g) -> NH3(g)', 'N2(g) + 3 H2(g) -> 2 NH3(g)'],
    [
      'Fe^3+(aq) + Cu(cr) -> Fe^2+(aq) + Cu^2+(aq)',
      '2 Fe^3+(aq) + Cu(cr) -> 2 Fe^2+(aq) + Cu^2+(aq)',
    ],
    [
      'MnO4-(aq) + Fe^2+(aq) + H+(aq) -> Mn^2+(aq) + Fe^3+(aq) + H2O(l)',
      'MnO4-(aq) + 5 Fe^2+(aq) + 8 H+(aq) -> Mn^2+(aq) + 5 Fe^3+(aq) + 4 H2O(l)',
    ],
  ])('balances %s', (input, expected) => {
    const balanced = autoBalance(parseEquation(input));
    expect(printEquation(balanced)).toBe(expected);
    expect(checkBalance(balanced).balanced).toBe(true);
  });

  it('fails with unbalanced when no combination exists', () => {
    const err = balanceError('H2(g) -> O2(g)');
    expect(err.code).toBe('unbalanced');
    expect(err.details['reason']).toBe('no_solution');
  });

  it('names species that would have to change side', () => {
    const err = balanceError('H2O(l) + H2(g) -> O2(g)');
    expect(err.code).toBe('unbalanced');
    expect(err.details).toMatchObject({ reason: 'wrong_side', species: ['H2(g)'] });
    expect(err.message).toContain('H2(g)');
  });

  it('names species that cannot take part', () => {
    const err = balanceError('H2(g) + O2(g) + Ar(g) -> H2O(l)');
    expect(err.details).toMatchObject({ reason: 'species_not_involved', species: ['Ar(g)'] });
  });

  it('refuses to choose among several independent reactions', () => {
    const err = balanceError('C(cr,graphite) + O2(g) -> CO(g) + CO2(g)');
    expect(err.code).toBe('not_unique');
    expect(err.details['dimension']).toBe(2);
    expect((err.details['reactions'] as string[]).length).toBe(2);
    expect(balanceError('H2(g) + O2(g) -> H2O(l) + H2O(g)').code).toBe('not_unique');
  });

  it('refuses registry keys, whose composition is unknown', () => {
    const err = balanceError('[2-methylpropane](g) + O2(g) -> CO2(g) + H2O(l)');
    expect(err.code).toBe('invalid_input');
    expect(err.details['unknownComposition']).toEqual(['[2-methylpropane](g)']);
  });

  it('produces equations that balance exactly (property)', () => {
    const pool = [
      'CH4(g)',
      'C2H6(g)',
      'C3H8(g)',
      'C2H5OH(l)',
      'C6H12O6(cr)',
      'NH3(g)',
      'H2S(g)',
      'CO(g)',
      'C8H18(l)',
      'CH3NO2(l)',
      'C2H2(g)',
    ].map(parseTerm);
    const products = ['CO2(g)', 'H2O(l)', 'N2(g)', 'SO2(g)'].map(parseTerm);
    const o2 = parseTerm('O2(g)');
    fc.assert(
      fc.property(fc.subarray(pool, { minLength: 1, maxLength: 3 }), (fuels) => {
        const present = new Set(
          fuels.flatMap((t) =>
            t.species.kind === 'formula' ? Object.keys(t.species.elements) : [],
          ),
        );
        const needed = products.filter(
          (p) =>
            p.species.kind === 'formula' &&
            Object.keys(p.species.elements).some((e) => e !== 'O' && present.has(e)),
        );
        const eq = buildEquation(
          [...fuels, o2].map((t) => makeTerm(frac(1), t)),
          needed.map((t) => makeTerm(frac(1), t)),
        );
        try {
          const balanced = autoBalance(eq);
          expect(checkBalance(balanced).balanced).toBe(true);
          const all = [...balanced.reactants, ...balanced.products];
          expect(all.every((t) => t.coefficient.d === 1n && t.coefficient.s > 0n)).toBe(true);
        } catch (err) {
          // One fuel always balances; several burn independently: more than one reaction.
          if (fuels.length === 1) throw err;
          expect(err).toBeInstanceOf(ThermoError);
          expect((err as ThermoError).code).toBe('not_unique');
        }
      }),
      { numRuns: 300 },
    );
  });

  it('gives the smallest integers (property: coefficients share no common factor)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 20 }), (k, n) => {
        const fuel = parseTerm(`C${n}H${2 * n + 2}(g)`);
        const eq = buildEquation(
          [makeTerm(frac(k), fuel), makeTerm(frac(1), parseTerm('O2(g)'))],
          [makeTerm(frac(1), parseTerm('CO2(g)')), makeTerm(frac(k + 1), parseTerm('H2O(g)'))],
        );
        const b = autoBalance(eq);
        const coefficients = [...b.reactants, ...b.products].map((t) => t.coefficient.n);
        const gcd = (a: bigint, c: bigint): bigint => (c === 0n ? a : gcd(c, a % c));
        expect(coefficients.reduce(gcd)).toBe(1n);
      }),
    );
  });
});
