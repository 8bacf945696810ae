/**
 * Kirchhoff's law with NASA 7-coefficient heat capacities (GRI-Mech 3.0, Smith et al. 1999).
 * Values and sources: check-values.md (the project's list of published reference values).
 */
import { reactionEnthalpyAtT, type Term, type TemperatureValue } from '../../server/src/thermo';
import {
  GRI_C2H2_FROM_MEMORY,
  GRI_CH4,
  GRI_CO2,
  GRI_H2,
  GRI_H2O,
  GRI_O2,
} from '../../server/src/thermo/testing/gri-mech-species';

const kJ = 1000;

const DATA: Record<string, TemperatureValue> = {
  // ΔfH°: C2H2 228.2 ± 0.7 (via Molecular Energetics); CH4 −74.87 (Chase 1998, from memory);
  // H2O(g), CO2 CODATA Key Values (Cox, Wagman, Medvedev 1989).
  'C2H2(g)': { value: 228.2 * kJ, uncertainty: 0.7 * kJ, thermal: { model: GRI_C2H2_FROM_MEMORY } },
  'CH4(g)': { value: -74.87 * kJ, thermal: { model: GRI_CH4 } },
  'H2O(g)': { value: -241.826 * kJ, uncertainty: 0.04 * kJ, thermal: { model: GRI_H2O } },
  'CO2(g)': { value: -393.51 * kJ, uncertainty: 0.13 * kJ, thermal: { model: GRI_CO2 } },
  'H2(g)': { thermal: { model: GRI_H2 } },
  'O2(g)': { thermal: { model: GRI_O2 } },
};
const lookup = (t: Term): TemperatureValue | undefined => DATA[t.id];

// Martinho Simões & Minas da Piedade, Molecular Energetics (OUP 2008), as listed in check-values.md.
describe("Kirchhoff's law: 2 CH4(g) → C2H2(g) + 3 H2(g) (Molecular Energetics)", () => {
  const equation = '2 CH4(g) -> C2H2(g) + 3 H2(g)';

  it('is 377.0 ± 1.1 kJ/mol at 298 K', () => {
    const r = reactionEnthalpyAtT(equation, 298.15, lookup);
    // Tolerance 1.1 kJ/mol, the book's stated uncertainty; it covers twice the 0.47 kJ/mol
    // spread of published ΔfH°(CH4) (the book's CH4 value is not in our reference file).
    expect(Math.abs(r.deltaH / kJ - 377.0)).toBeLessThanOrEqual(1.1);
  });

  it('is 407.1 kJ/mol at 1500 K', () => {
    const r = reactionEnthalpyAtT(equation, 1500, lookup);
    // Tolerance 4.5 kJ/mol (1.1 %). The GRI CH4 polynomial lies 1.871 kJ/mol above the tabulated
    // H(1500) − H(298.15) the book uses (check-values.md), worth 2 × 1.871 = 3.74 kJ/mol here; the
    // C2H2 polynomial is from memory (consistency-checked, see gri-mech-species.ts); and ΔrH°(298)
    // differs by up to 1.1 as above.
    expect(Math.abs(r.deltaH / kJ - 407.1)).toBeLessThanOrEqual(4.5);
    // The increase itself: 407.1 − 377.0 = 30.1 in the book; the CH4 deviation explains the gap.
    const increase = (r.deltaH - r.deltaH298) / kJ;
    expect(Math.abs(increase + 2 * 1.871 - 30.1)).toBeLessThanOrEqual(0.5);
  });
});

describe("Kirchhoff's law against tabulated increments (Chase 1998 via check-values.md)", () => {
  // ΔrH(T) = ΔrH°(298.15) + Σν·[H(T) − H(298.15)] with the table's increments:
  // arithmetic on named values.
  const TABLE: Record<string, Record<number, number>> = {
    'H2(g)': { 1000: 20.68, 1500: 36.29 },
    'O2(g)': { 1000: 22.703, 1500: 40.599 },
    'H2O(g)': { 1000: 26.0, 1500: 48.151 },
    'CO2(g)': { 1000: 33.397, 1500: 61.705 },
  };

  it.each([1000, 1500])('H2(g) + ½ O2(g) → H2O(g) at %p K', (T) => {
    const r = reactionEnthalpyAtT('H2(g) + 1/2 O2(g) -> H2O(g)', T, lookup);
    const expected =
      -241.826 + (TABLE['H2O(g)']![T]! - TABLE['H2(g)']![T]! - 0.5 * TABLE['O2(g)']![T]!);
    // Tolerance 0.1 kJ/mol: each polynomial follows the table to ≤ 0.062 kJ/mol (check-values.md).
    expect(Math.abs(r.deltaH / kJ - expected)).toBeLessThanOrEqual(0.1);
    expect(r.uncertainty).toBeCloseTo(0.04 * kJ, 9);
  });

  it('CH4(g) + 2 O2(g) → CO2(g) + 2 H2O(g) at 1000 K', () => {
    const r = reactionEnthalpyAtT('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)', 1000, lookup);
    const ch4Table = 38.179; // Chase 1998, from memory
    const expected = -393.51 + 2 * -241.826 + 74.87 + (33.397 + 2 * 26.0 - ch4Table - 2 * 22.703);
    // Tolerance 0.6 kJ/mol: the CH4 polynomial is 0.472 above the table at 1000 K;
    // the rest ≤ 0.013 each.
    expect(Math.abs(r.deltaH / kJ - expected)).toBeLessThanOrEqual(0.6);
  });
});
