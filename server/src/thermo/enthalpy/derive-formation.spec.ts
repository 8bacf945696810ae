import { deriveFormationEnthalpy } from './derive-formation';
import { parseTerm } from '../equation/equation-parser';
import { tableLookup } from './formation-data';

const kJ = 1000;
// CODATA Key Values (Cox, Wagman, Medvedev 1989), kJ/mol, ± as published
// (twice the standard deviation).
const lookup = tableLookup({
  'CO2(g)': { value: -393.51 * kJ, uncertainty: 0.13 * kJ, uncertaintyBasis: 'expanded_k2' },
  'H2O(l)': { value: -285.83 * kJ, uncertainty: 0.04 * kJ, uncertaintyBasis: 'expanded_k2' },
  'CO(g)': { value: -110.53 * kJ, uncertainty: 0.17 * kJ, uncertaintyBasis: 'expanded_k2' },
});

describe('deriveFormationEnthalpy', () => {
  it('recovers a reactant value from a measured reaction enthalpy', () => {
    // ΔrH of CO + ½O2 → CO2 from the same CODATA values: −393.51 − (−110.53) = −282.98 kJ/mol.
    const d = deriveFormationEnthalpy(
      'CO(g) + 1/2 O2(g) -> CO2(g)',
      -282.98 * kJ,
      0.2 * kJ,
      'CO(g)',
      lookup,
      {
        measuredUncertaintyBasis: 'expanded_k2',
      },
    );
    expect(d.value).toBeCloseTo(-110.53 * kJ, 6);
    expect(d.uncertainty).toBeCloseTo(Math.sqrt(0.2 ** 2 + 0.13 ** 2) * kJ, 9);
    expect(d.uncertaintyBasis).toBe('expanded_k2');
    expect(d.term.id).toBe('CO(g)');
    expect(d.inputs.map((t) => t.term.id)).toEqual(['O2(g)', 'CO2(g)']);
    expect(d.measured).toEqual({ deltaH: -282.98 * kJ, uncertainty: 0.2 * kJ });
  });

  it('divides by the coefficient of the unknown, on either side', () => {
    // 2 CO(g) + O2(g) → 2 CO2(g): twice the reaction above.
    const d = deriveFormationEnthalpy(
      '2 CO(g) + O2(g) -> 2 CO2(g)',
      -565.96 * kJ,
      0.4 * kJ,
      parseTerm('CO(g)'),
      lookup,
    );
    expect(d.value).toBeCloseTo(-110.53 * kJ, 6);
    expect(d.uncertainty).toBeCloseTo((Math.sqrt(0.4 ** 2 + (2 * 0.13) ** 2) * kJ) / 2, 9);
    const product = deriveFormationEnthalpy(
      '2 CO(g) + O2(g) -> 2 CO2(g)',
      -565.96 * kJ,
      null,
      'CO2(g)',
      lookup,
    );
    expect(product.value).toBeCloseTo(-393.51 * kJ, 6);
    expect(product.uncertainty).toBeNull();
  });

  it('matches the unknown by species-phase', () => {
    expect(() =>
      deriveFormationEnthalpy('H2(g) + 1/2 O2(g) -> H2O(l)', -285.83 * kJ, null, 'H2O(g)', lookup),
    ).toThrow(
      expect.objectContaining({
        code: 'invalid_input',
        details: expect.objectContaining({ species: 'H2O(g)' }),
      }),
    );
  });

  it('refuses an element in its reference state as the unknown', () => {
    expect(() =>
      deriveFormationEnthalpy('H2(g) + 1/2 O2(g) -> H2O(l)', -285.83 * kJ, null, 'O2(g)', lookup),
    ).toThrow(expect.objectContaining({ code: 'invalid_input' }));
  });

  it('names the other species that lack values', () => {
    expect(() =>
      deriveFormationEnthalpy(
        'C2H6(g) + 7/2 O2(g) -> 2 CO2(g) + 3 H2O(g)',
        -1.4e6,
        null,
        'C2H6(g)',
        lookup,
      ),
    ).toThrow(expect.objectContaining({ code: 'missing_data', details: { missing: ['H2O(g)'] } }));
  });

  it('refuses an unbalanced equation', () => {
    expect(() =>
      deriveFormationEnthalpy('CO(g) + O2(g) -> CO2(g)', -282.98 * kJ, null, 'CO(g)', lookup),
    ).toThrow(expect.objectContaining({ code: 'unbalanced' }));
  });

  it('rejects a measurement that is not a finite number', () => {
    expect(() =>
      deriveFormationEnthalpy('CO(g) + 1/2 O2(g) -> CO2(g)', Number.NaN, null, 'CO(g)', lookup),
    ).toThrow(expect.objectContaining({ code: 'invalid_input' }));
    expect(() =>
      deriveFormationEnthalpy('CO(g) + 1/2 O2(g) -> CO2(g)', -1, -1, 'CO(g)', lookup),
    ).toThrow(expect.objectContaining({ code: 'invalid_input' }));
  });
});
