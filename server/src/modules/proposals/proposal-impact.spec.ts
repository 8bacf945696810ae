import { printEquation } from '../../thermo';
import { compare, formationEquation } from './proposal-impact';

describe('review impact', () => {
  it('writes the formation reaction from the elements in their reference states', () => {
    const eq = (formula: string, phase: string, modification: string | null = null) =>
      formationEquation({ key: 'x', formula, charge: 0, phase, modification });
    expect(printEquation(eq('CH4', 'g')!)).toBe('C(graphite) + 2 H2(g) -> CH4(g)');
    expect(printEquation(eq('H2O', 'l')!)).toBe('H2(g) + 1/2 O2(g) -> H2O(l)');
    expect(printEquation(eq('CaCO3', 'cr', 'calcite')!)).toBe(
      'C(graphite) + Ca(cr) + 3/2 O2(g) -> CaCO3(calcite)',
    );
    // Elements in their reference state and ions have none to show.
    expect(eq('O2', 'g')).toBeNull();
    expect(
      formationEquation({ key: 'x', formula: 'SO4', charge: -2, phase: 'aq', modification: null }),
    ).toBeNull();
  });

  it('compares in kJ/mol and in units of the root-sum-square uncertainty, flagged above 2', () => {
    const c = compare({ value: -74_600, uncertainty: 300 }, { value: -74_870, uncertainty: 400 });
    expect(c.differenceKJPerMol).toBeCloseTo(0.27, 12);
    expect(c.combinedUncertaintyKJPerMol).toBeCloseTo(0.5, 12);
    expect(c.differenceInUncertainties).toBeCloseTo(0.54, 12);
    expect(c.flagged).toBe(false);
    expect(
      compare({ value: -73_000, uncertainty: 300 }, { value: -74_870, uncertainty: 400 }).flagged,
    ).toBe(true);
    expect(compare({ value: 1, uncertainty: null }, { value: 0, uncertainty: 1 })).toMatchObject({
      combinedUncertaintyKJPerMol: null,
      differenceInUncertainties: null,
      flagged: false,
    });
  });
});
