import fc from 'fast-check';
import { ThermoError } from '../errors/thermo-error';
import { reverseEquation, scaleEquation } from '../equation/equation-builder';
import { parseEquation } from '../equation/equation-parser';
import type { Term } from '../equation/equation-types';
import { tableLookup, type FormationValue } from './formation-data';
import { frac } from '../rational/rational';
import { reactionEnthalpy } from './reaction-enthalpy';

const kJ = 1000;
// CODATA Key Values (Cox, Wagman, Medvedev 1989), kJ/mol with their ± — except CH4, which is
// from Chase, Thermochemical Tables, 4th ed. (1998), from memory, without an uncertainty.
const CODATA: Record<string, FormationValue> = {
  'CO2(g)': {
    value: -393.51 * kJ,
    uncertainty: 0.13 * kJ,
    uncertaintyBasis: 'expanded_k2',
    source: 'CODATA 1989',
  },
  'CO(g)': {
    value: -110.53 * kJ,
    uncertainty: 0.17 * kJ,
    uncertaintyBasis: 'expanded_k2',
    source: 'CODATA 1989',
  },
  'H2O(l)': {
    value: -285.83 * kJ,
    uncertainty: 0.04 * kJ,
    uncertaintyBasis: 'expanded_k2',
    source: 'CODATA 1989',
  },
  'H2O(g)': {
    value: -241.826 * kJ,
    uncertainty: 0.04 * kJ,
    uncertaintyBasis: 'expanded_k2',
    source: 'CODATA 1989',
  },
  'NH3(g)': {
    value: -45.94 * kJ,
    uncertainty: 0.35 * kJ,
    uncertaintyBasis: 'expanded_k2',
    source: 'CODATA 1989',
  },
  'CH4(g)': { value: -74.87 * kJ, source: 'Chase 1998' },
};
const lookup = tableLookup(CODATA);

describe('reactionEnthalpy', () => {
  it('sums ν·ΔfH° of products minus reactants', () => {
    const r = reactionEnthalpy('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)', lookup);
    expect(r.deltaH).toBeCloseTo((-393.51 + 2 * -285.83 - -74.87) * kJ, 6);
    expect(r.terms.map((t) => [t.term.id, t.contribution])).toEqual([
      ['CH4(g)', 74.87 * kJ],
      ['O2(g)', 0],
      ['CO2(g)', -393.51 * kJ],
      ['H2O(l)', 2 * -285.83 * kJ],
    ]);
    expect(r.terms[0]?.nu.toFraction()).toBe('-1');
  });

  it('gives elements in their reference state zero without asking the lookup', () => {
    const asked: string[] = [];
    const spy = (t: Term): FormationValue | undefined => {
      asked.push(t.id);
      return lookup(t);
    };
    const r = reactionEnthalpy('C(cr,graphite) + O2(g) -> CO2(g)', spy);
    expect(asked).toEqual(['CO2(g)']);
    expect(r.deltaH).toBe(-393.51 * kJ);
    expect(r.terms[0]).toMatchObject({
      referenceState: true,
      assumedReferenceState: false,
      formationEnthalpy: 0,
      data: null,
    });
  });

  it('flags a reference state read from an unwritten phase', () => {
    const r = reactionEnthalpy('H2 + 1/2 O2 -> H2O(l)', lookup);
    expect(r.terms.slice(0, 2).map((t) => t.assumedReferenceState)).toEqual([true, true]);
    expect(r.deltaH).toBe(-285.83 * kJ);
  });

  it('looks up a non-reference form of an element', () => {
    expect(() => reactionEnthalpy('C(cr,graphite) -> C(cr,diamond)', lookup)).toThrow(
      expect.objectContaining({ code: 'missing_data', details: { missing: ['C(diamond)'] } }),
    );
  });

  it('combines uncertainties in quadrature, weighted by the coefficients', () => {
    const r = reactionEnthalpy('CO(g) + 1/2 O2(g) -> CO2(g)', lookup);
    expect(r.uncertainty).toBeCloseTo(Math.sqrt(0.13 ** 2 + 0.17 ** 2) * kJ, 9);
    expect(r.uncertaintyBasis).toBe('expanded_k2');
    const ammonia = reactionEnthalpy('N2(g) + 3 H2(g) -> 2 NH3(g)', lookup);
    expect(ammonia.uncertainty).toBeCloseTo(2 * 0.35 * kJ, 9);
  });

  it('has no combined uncertainty when one input has none', () => {
    const r = reactionEnthalpy('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)', lookup);
    expect(r.uncertainty).toBeNull();
    expect(r.uncertaintyBasis).toBeNull();
  });

  it('reports a mixed basis, and as_stated when none is given', () => {
    const mixed = tableLookup({
      'CO(g)': { value: -110.53 * kJ, uncertainty: 0.17 * kJ, uncertaintyBasis: 'standard' },
      'CO2(g)': { value: -393.51 * kJ, uncertainty: 0.13 * kJ, uncertaintyBasis: 'expanded_k2' },
    });
    expect(reactionEnthalpy('CO(g) + 1/2 O2(g) -> CO2(g)', mixed).uncertaintyBasis).toBe('mixed');
    const unstated = tableLookup({
      'CO(g)': { value: -110.53 * kJ, uncertainty: 0.17 * kJ },
      'CO2(g)': { value: -393.51 * kJ, uncertainty: 0.13 * kJ },
    });
    expect(reactionEnthalpy('CO(g) + 1/2 O2(g) -> CO2(g)', unstated).uncertaintyBasis).toBe(
      'as_stated',
    );
  });

  it('passes the lookup result through for provenance', () => {
    const r = reactionEnthalpy('CO(g) + 1/2 O2(g) -> CO2(g)', lookup);
    expect(r.terms[2]?.data).toMatchObject({ source: 'CODATA 1989' });
  });

  it('names every species without a value', () => {
    try {
      reactionEnthalpy('C2H6(g) + 7/2 O2(g) -> 2 CO2(g) + 3 H2O(l)', () => undefined);
      throw new Error('expected missing_data');
    } catch (err) {
      expect(err).toBeInstanceOf(ThermoError);
      expect((err as ThermoError).code).toBe('missing_data');
      expect((err as ThermoError).details['missing']).toEqual(['C2H6(g)', 'CO2(g)', 'H2O(l)']);
      expect((err as ThermoError).message).toContain('C2H6(g), CO2(g), H2O(l)');
    }
  });

  it.each([
    [{ value: Number.NaN }],
    [{ value: '12' as unknown as number }],
    [{ value: 1, uncertainty: -1 }],
    [{ value: 1, uncertainty: 1, uncertaintyBasis: 'sigma' as 'standard' }],
  ])('rejects a malformed value %p as invalid input', (bad) => {
    expect(() => reactionEnthalpy('CO(g) + 1/2 O2(g) -> CO2(g)', () => bad)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });

  it('refuses an unbalanced equation, giving the imbalance', () => {
    expect(() => reactionEnthalpy('CH4(g) + O2(g) -> CO2(g) + 2 H2O(l)', lookup)).toThrow(
      expect.objectContaining({
        code: 'unbalanced',
        details: { imbalance: { O: '2' }, charge: '0' },
      }),
    );
    const lenient = reactionEnthalpy('CH4(g) + O2(g) -> CO2(g) + 2 H2O(l)', lookup, {
      requireBalanced: false,
    });
    expect(lenient.balance.balanced).toBe(false);
  });

  it('returns the balance report, null-balanced when a registry key hides a composition', () => {
    expect(reactionEnthalpy('CO(g) + 1/2 O2(g) -> CO2(g)', lookup).balance.balanced).toBe(true);
    const keyed = reactionEnthalpy(
      '[2-methylpropane](g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)',
      (t) => (t.species.kind === 'key' ? { value: -134.99 * kJ /* fictional value */ } : lookup(t)),
    );
    expect(keyed.balance).toMatchObject({
      balanced: null,
      unknownComposition: ['2-methylpropane'],
    });
  });

  it('rejects a lookup that is not a function', () => {
    expect(() => reactionEnthalpy('CO(g) + 1/2 O2(g) -> CO2(g)', null as never)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });

  describe('properties', () => {
    const equations = [
      'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
      'CO(g) + H2O(g) -> CO2(g) + H2(g)',
      'N2(g) + 3 H2(g) -> 2 NH3(g)',
      'CH4(g) + H2O(g) -> CO(g) + 3 H2(g)',
      '4 NH3(g) + 3 O2(g) -> 2 N2(g) + 6 H2O(l)',
    ];
    // Random whole-number J/mol values keep every product exact, so equality can be exact.
    const values = fc.record({
      'CH4(g)': fc.integer({ min: -1e6, max: 1e6 }),
      'CO2(g)': fc.integer({ min: -1e6, max: 1e6 }),
      'H2O(l)': fc.integer({ min: -1e6, max: 1e6 }),
      'H2O(g)': fc.integer({ min: -1e6, max: 1e6 }),
      'CO(g)': fc.integer({ min: -1e6, max: 1e6 }),
      'NH3(g)': fc.integer({ min: -1e6, max: 1e6 }),
    });

    it('flipping a reaction negates ΔH exactly', () => {
      fc.assert(
        fc.property(
          fc.constantFrom(...equations),
          values,
          fc.double({ min: -1e6, max: 1e6, noNaN: true }),
          (text, table, noise) => {
            const look = tableLookup({ ...table, 'CO(g)': table['CO(g)'] + noise / 7 });
            const eq = parseEquation(text);
            // === rather than toBe: a zero ΔH is +0 both ways, and -(+0) is -0.
            expect(
              reactionEnthalpy(reverseEquation(eq), look).deltaH ===
                -reactionEnthalpy(eq, look).deltaH,
            ).toBe(true);
          },
        ),
      );
    });

    it('scaling by k multiplies ΔH by k (exactly for whole numbers, to 1e-12 otherwise)', () => {
      fc.assert(
        fc.property(
          fc.constantFrom(...equations),
          values,
          fc.integer({ min: 1, max: 50 }),
          (text, table, k) => {
            const look = tableLookup(table);
            const eq = parseEquation(text);
            expect(reactionEnthalpy(scaleEquation(eq, frac(k)), look).deltaH).toBe(
              k * reactionEnthalpy(eq, look).deltaH,
            );
          },
        ),
      );
      fc.assert(
        fc.property(
          fc.constantFrom(...equations),
          values,
          fc.integer({ min: 1, max: 50 }),
          fc.integer({ min: 1, max: 9 }),
          (text, table, n, d) => {
            const look = tableLookup(table);
            const eq = parseEquation(text);
            const scaled = reactionEnthalpy(scaleEquation(eq, frac(n, d)), look);
            const expected = (n / d) * reactionEnthalpy(eq, look).deltaH;
            // Rounding is relative to the size of the terms, not of their (possibly cancelling) sum.
            const size = scaled.terms.reduce((acc, t) => acc + Math.abs(t.contribution), 1);
            expect(Math.abs(scaled.deltaH - expected)).toBeLessThanOrEqual(1e-14 * size);
          },
        ),
      );
    });
  });
});
