/**
 * Deriving a formation enthalpy from a combustion enthalpy: the ferrocene example of
 * Martinho Simões & Minas da Piedade, Molecular Energetics (OUP 2008), §2.6 —
 * ΔfH°(Fe(C5H5)2, cr) = 154.9 ± 4.5 kJ/mol from ΔcH° = −5891.5 ± 4.2 kJ/mol.
 *
 * Inputs: CO2(g) −393.51 ± 0.13 and H2O(l) −285.830 ± 0.040 kJ/mol, CODATA Key Values (Cox,
 * Wagman, Medvedev 1989). The iron-bearing product and its value are not in our reference file.
 * With the CODATA values the published result requires the iron term to contribute −372.35 kJ
 * per mole of ferrocene. ⅓ Fe3O4 with ΔfH°(Fe3O4, cr) = −1118.4 kJ/mol (NBS tables, Wagman et al.
 * 1982, from memory) gives −372.8, within 0.45 kJ/mol; ½ Fe2O3 (−824.2, same source, from
 * memory) would give 115 kJ/mol and cannot be what the example used. We therefore burn to ⅓ Fe3O4.
 * NBS82 gives no uncertainty for the oxide; it is entered as exact here, so the propagated
 * figure covers the measurement and the CODATA terms only.
 */
import { checkBalance, deriveFormationEnthalpy, tableLookup } from '../../server/src/thermo';

const kJ = 1000;

const lookup = tableLookup({
  'CO2(g)': { value: -393.51 * kJ, uncertainty: 0.13 * kJ, uncertaintyBasis: 'expanded_k2' }, // CODATA 1989
  'H2O(l)': { value: -285.83 * kJ, uncertainty: 0.04 * kJ, uncertaintyBasis: 'expanded_k2' }, // CODATA 1989
  'Fe3O4(cr)': { value: -1118.4 * kJ, uncertainty: 0, uncertaintyBasis: 'expanded_k2' }, // NBS82, from memory
});

describe('ferrocene ΔfH° from its combustion enthalpy (Molecular Energetics §2.6)', () => {
  const combustion = 'Fe(C5H5)2(cr) + 79/6 O2(g) -> 10 CO2(g) + 5 H2O(l) + 1/3 Fe3O4(cr)';
  const derived = deriveFormationEnthalpy(
    combustion,
    -5891.5 * kJ,
    4.2 * kJ,
    'Fe(C5H5)2(cr)',
    lookup,
    {
      measuredUncertaintyBasis: 'expanded_k2',
    },
  );

  it('uses a balanced combustion equation', () => {
    expect(checkBalance(combustion).balanced).toBe(true);
  });

  it('gives 154.9 kJ/mol', () => {
    // Tolerance 0.5 kJ/mol: the 0.45 kJ/mol by which the oxide value we could cite differs from
    // the one the example implies (see above); a ninth of the stated ± 4.5.
    expect(Math.abs(derived.value / kJ - 154.9)).toBeLessThanOrEqual(0.5);
    expect(derived.value / kJ).toBeCloseTo(5891.5 + 10 * -393.51 + 5 * -285.83 + -1118.4 / 3, 6);
  });

  it('propagates ± 4.5 kJ/mol: √(4.2² + (10·0.13)² + (5·0.040)²)', () => {
    expect(derived.uncertainty! / kJ).toBeCloseTo(
      Math.sqrt(4.2 ** 2 + (10 * 0.13) ** 2 + (5 * 0.04) ** 2),
      9,
    );
    // Tolerance 0.15 kJ/mol against the published 4.5: the oxide's own ± (not available to us)
    // adds the rest in the book.
    expect(Math.abs(derived.uncertainty! / kJ - 4.5)).toBeLessThanOrEqual(0.15);
    expect(derived.uncertaintyBasis).toBe('expanded_k2');
  });

  it('lists the inputs it used', () => {
    expect(derived.inputs.map((t) => [t.term.id, t.formationEnthalpy / kJ])).toEqual([
      ['O2(g)', 0],
      ['CO2(g)', -393.51],
      ['H2O(l)', -285.83],
      ['Fe3O4(cr)', -1118.4],
    ]);
  });
});
