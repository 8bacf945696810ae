import { ATOMIC_WEIGHTS } from './atomic-weights';
import { parseFormula } from './formula-parser';
import { molarMass } from './molar-mass';

describe('molarMass', () => {
  // CIAAW 2021 abridged standard atomic weights, as listed in check-values.md.
  it.each([
    ['H', 1.008],
    ['C', 12.011],
    ['N', 14.007],
    ['O', 15.999],
    ['F', 18.998],
    ['Na', 22.99],
    ['Al', 26.982],
    ['Si', 28.085],
    ['S', 32.06],
    ['Cl', 35.45],
    ['Ca', 40.078],
    ['Fe', 55.845],
  ])('uses the CIAAW 2021 abridged weight of %s', (symbol, weight) => {
    expect(ATOMIC_WEIGHTS.get(symbol)?.weight).toBe(weight);
    expect(ATOMIC_WEIGHTS.get(symbol)?.massNumber).toBe(false);
  });

  it('sums weights times counts', () => {
    expect(molarMass('H2O')).toBeCloseTo(2 * 1.008 + 15.999, 10);
    expect(molarMass('CH4')).toBeCloseTo(12.011 + 4 * 1.008, 10);
    expect(molarMass('CaCO3')).toBeCloseTo(40.078 + 12.011 + 3 * 15.999, 10);
    expect(molarMass(parseFormula('CuSO4·5H2O'))).toBeCloseTo(
      63.546 + 32.06 + 9 * 15.999 + 10 * 1.008,
      10,
    );
  });

  it('ignores the electron mass of a charge', () => {
    expect(molarMass('SO4^2-')).toBe(molarMass('SO4'));
  });

  it('covers all 118 elements, using a mass number where there is no standard atomic weight', () => {
    expect(ATOMIC_WEIGHTS.size).toBe(118);
    expect(ATOMIC_WEIGHTS.get('Tc')).toMatchObject({ z: 43, weight: 97, massNumber: true });
    expect(ATOMIC_WEIGHTS.get('Og')).toMatchObject({ z: 118, massNumber: true });
    expect(ATOMIC_WEIGHTS.get('U')).toMatchObject({ z: 92, weight: 238.03, massNumber: false });
    const weights = [...ATOMIC_WEIGHTS.values()].map((a) => a.weight);
    expect(weights.every((w) => w > 0)).toBe(true);
  });

  it('fails with a ThermoError on input that is not a formula', () => {
    expect(() => molarMass('Xx2')).toThrow(expect.objectContaining({ code: 'unknown_element' }));
    expect(() => molarMass(null as unknown as string)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });
});
