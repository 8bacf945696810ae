import { combustionEquation, heatingValues } from './heating-values';
import { parseTerm } from '../equation/equation-parser';
import { printEquation } from '../equation/equation-printer';
import { checkBalance } from '../balance/balance';
import { molarMass } from '../formula/molar-mass';

const kJ = 1000;
// ΔfH°(298.15 K), kJ/mol.
const DATA = {
  'CO2(g)': -393.51 * kJ, // CODATA Key Values (Cox, Wagman, Medvedev 1989)
  'H2O(l)': -285.83 * kJ, // CODATA
  'H2O(g)': -241.826 * kJ, // CODATA
  'SO2(g)': -296.81 * kJ, // CODATA, from memory
  'C2H5OH(l)': -277.6 * kJ, // via Molecular Energetics (Martinho Simões & Minas da Piedade 2008)
  'H2S(g)': -20.6 * kJ, // CODATA, from memory (OpenStax App. G agrees)
  'NH3(g)': -45.94 * kJ, // CODATA
  'H2O2(l)': -187.78 * kJ, // OpenStax Chemistry 2e, App. G
};

describe('combustionEquation', () => {
  it.each([
    ['C2H5OH(l)', 'C2H5OH(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)'],
    ['NH3(g)', 'NH3(g) + 3/4 O2(g) -> 3/2 H2O(l) + 1/2 N2(g)'],
    ['H2S(g)', 'H2S(g) + 3/2 O2(g) -> H2O(l) + SO2(g)'],
    ['CH3NO2(l)', 'CH3NO2(l) + 3/4 O2(g) -> CO2(g) + 3/2 H2O(l) + 1/2 N2(g)'],
    ['H2O2(l)', 'H2O2(l) -> H2O(l) + 1/2 O2(g)'],
  ])('burns %s per mole of fuel', (fuel, expected) => {
    const eq = combustionEquation(parseTerm(fuel), 'l');
    expect(printEquation(eq)).toBe(expected);
    expect(checkBalance(eq).balanced).toBe(true);
  });

  it('refuses other elements, ions, keys and fully oxidised species', () => {
    expect(() => combustionEquation(parseTerm('CH3Cl(g)'), 'l')).toThrow(
      expect.objectContaining({
        code: 'invalid_input',
        details: expect.objectContaining({ elements: ['Cl'] }),
      }),
    );
    expect(() => combustionEquation(parseTerm('NH4+(aq)'), 'l')).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => combustionEquation(parseTerm('[2-methylpropane](g)'), 'l')).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => combustionEquation(parseTerm('CO2(g)'), 'l')).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => combustionEquation(parseTerm('N2(g)'), 'l')).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });
});

describe('heatingValues', () => {
  it('gives HHV with liquid water and LHV with vapour, per mol and per kg', () => {
    const hv = heatingValues('C2H5OH(l)', DATA);
    const hhv = -(2 * -393.51 + 3 * -285.83 - -277.6) * kJ;
    const lhv = -(2 * -393.51 + 3 * -241.826 - -277.6) * kJ;
    expect(hv.hhv.perMol).toBeCloseTo(hhv, 6);
    expect(hv.lhv.perMol).toBeCloseTo(lhv, 6);
    expect(hv.molarMass).toBeCloseTo(molarMass('C2H6O'), 12);
    expect(hv.hhv.perKg).toBeCloseTo((hhv * 1000) / hv.molarMass, 3);
    expect(hv.waterPerMol.toFraction()).toBe('3');
    expect(hv.hhv.combustion.terms.map((t) => t.term.id)).toEqual([
      'C2H5OH(l)',
      'O2(g)',
      'CO2(g)',
      'H2O(l)',
    ]);
  });

  it('differs between HHV and LHV by the vaporization of the water formed', () => {
    const hv = heatingValues('H2S(g)', DATA);
    expect(hv.hhv.perMol - hv.lhv.perMol).toBeCloseTo((285.83 - 241.826) * kJ, 6);
  });

  it('accepts a lookup function instead of a table', () => {
    const hv = heatingValues(parseTerm('NH3(g)'), (t) =>
      t.id in DATA ? { value: DATA[t.id as keyof typeof DATA] } : undefined,
    );
    expect(hv.lhv.perMol).toBeCloseTo(-(1.5 * -241.826 - -45.94) * kJ, 6);
  });

  it('names the missing values', () => {
    expect(() => heatingValues('C3H8(g)', DATA)).toThrow(
      expect.objectContaining({ code: 'missing_data', details: { missing: ['C3H8(g)'] } }),
    );
  });
});
