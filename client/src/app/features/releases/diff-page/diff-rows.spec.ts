import type { ReleaseDiffRow } from '@contracts/releases/releases-schemas';
import { diffSortValue, diffViewRow, matchesDiffFilter, quantityText } from './diff-rows';

function diffRow(overrides: Partial<ReleaseDiffRow> = {}): ReleaseDiffRow {
  return {
    change: 'changed',
    speciesKey: 'water',
    speciesName: 'Water',
    formula: 'H2O',
    phase: 'l',
    modification: null,
    quantity: 'formation_enthalpy',
    oldRevisionId: 1,
    newRevisionId: 2,
    oldValue: '-285830',
    newValue: '-285705',
    oldUncertainty: '40',
    newUncertainty: '30',
    oldUncertaintyBasis: 'standard',
    newUncertaintyBasis: 'standard',
    differenceKjPerMol: '0.125',
    combinedUncertaintyKjPerMol: '0.05',
    differenceInUncertainties: '2.5',
    oldSourceCitation: 'Kestrel starter compilation (demo)',
    newSourceCitation: 'Kestrel recheck (demo)',
    oldSourceDoi: null,
    newSourceDoi: null,
    ...overrides,
  };
}

describe('diff rows', () => {
  it('names quantities in trade words', () => {
    expect(quantityText('formation_enthalpy')).toBe('ΔfH°');
    expect(quantityText('heat_capacity')).toBe('heat capacity');
    expect(quantityText('transition:l')).toBe('transition to liquid');
    expect(quantityText('transition:cr,beta')).toBe('transition to crystal, beta');
  });

  it('shows values in kJ/mol with real minus signs and a signed change', () => {
    const row = diffViewRow(diffRow());
    expect(row.oldKj).toBe('−285.83');
    expect(row.newKj).toBe('−285.705');
    expect(row.differenceKj).toBe('+0.125');
    expect(diffViewRow(diffRow({ differenceKjPerMol: '-1.5' })).differenceKj).toBe('−1.5');
    expect(diffViewRow(diffRow({ change: 'added', oldValue: null })).oldKj).toBeNull();
  });

  it('sorts numbers as numbers and the change in uncertainties by its size', () => {
    const a = diffViewRow(diffRow({ differenceKjPerMol: '-10', differenceInUncertainties: '-3' }));
    const b = diffViewRow(diffRow({ differenceKjPerMol: '2', differenceInUncertainties: '1' }));
    expect(diffSortValue(a, 'difference')).toBeLessThan(diffSortValue(b, 'difference') as number);
    expect(diffSortValue(a, 'sigmas')).toBeGreaterThan(diffSortValue(b, 'sigmas') as number);
    const heat = diffViewRow(
      diffRow({ differenceKjPerMol: null, differenceInUncertainties: null }),
    );
    expect(diffSortValue(heat, 'difference')).toBe(Number.NEGATIVE_INFINITY);
  });

  it('filters by text over names, formulas and sources, and by kind of change', () => {
    const row = diffViewRow(diffRow());
    expect(matchesDiffFilter(row, { text: 'WAT', change: '' })).toBe(true);
    expect(matchesDiffFilter(row, { text: 'recheck', change: '' })).toBe(true);
    expect(matchesDiffFilter(row, { text: 'h2o', change: 'changed' })).toBe(true);
    expect(matchesDiffFilter(row, { text: '', change: 'added' })).toBe(false);
    expect(matchesDiffFilter(row, { text: 'methane', change: '' })).toBe(false);
  });
});
