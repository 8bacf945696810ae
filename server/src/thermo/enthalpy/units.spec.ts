import {
  convertEnergy,
  fromJoulesPerMole,
  molarToSpecific,
  specificToMolar,
  THERMOCHEMICAL_CALORIE,
  toJoulesPerMole,
} from './units';

describe('energy units', () => {
  it('uses the thermochemical calorie, 4.184 J exactly', () => {
    expect(THERMOCHEMICAL_CALORIE).toBe(4.184);
    expect(toJoulesPerMole(1, 'kcal/mol')).toBe(4184);
    expect(convertEnergy(4184, 'J/mol', 'kcal/mol')).toBe(1);
  });

  it('converts between J/mol, kJ/mol and kcal/mol', () => {
    // ΔfH° of CO2(g) and H2O(l), CODATA Key Values (Cox, Wagman, Medvedev 1989).
    expect(toJoulesPerMole(-393.51, 'kJ/mol')).toBeCloseTo(-393510, 9);
    expect(fromJoulesPerMole(-285830, 'kJ/mol')).toBeCloseTo(-285.83, 12);
    // A round illustrative number in kcal/mol, not a measurement.
    expect(convertEnergy(-94, 'kcal/mol', 'kJ/mol')).toBeCloseTo(-94 * 4.184, 12);
    expect(convertEnergy(12.5, 'kcal/mol', 'kcal/mol')).toBe(12.5);
  });

  it('converts molar values to per-mass ones through the molar mass', () => {
    // 1 J/mol of a 2 g/mol substance is 0.5 J/g = 500 J/kg.
    expect(molarToSpecific(1, 2, 'J/kg')).toBe(500);
    // Illustrative round numbers: 890 kJ/mol of a 16 g/mol substance is 55.625 MJ/kg.
    expect(molarToSpecific(890e3, 16, 'MJ/kg')).toBeCloseTo(55.625, 12);
    expect(molarToSpecific(285.83e3, 'H2O')).toBeCloseTo(285.83e3 / (2 * 1.008 + 15.999), 9);
    expect(specificToMolar(molarToSpecific(123456, 'CO2', 'MJ/kg'), 'MJ/kg', 'CO2')).toBeCloseTo(
      123456,
      6,
    );
  });

  it('rejects unknown units and non-finite values', () => {
    expect(() => toJoulesPerMole(1, 'cal' as 'J/mol')).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => convertEnergy(Number.NaN, 'J/mol', 'kJ/mol')).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => molarToSpecific(1, 0)).toThrow(expect.objectContaining({ code: 'invalid_input' }));
    expect(() => molarToSpecific(1, 'Qq')).toThrow(
      expect.objectContaining({ code: 'unknown_element' }),
    );
    expect(() => molarToSpecific(1, 2, 'GJ/kg' as 'MJ/kg')).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });
});
