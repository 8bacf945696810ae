import { asHillFormula, SpeciesSearchIndex } from './search-index';
import type { SearchDocument } from './search-repository';

const doc = (key: string, name: string, formula: string, extra: Partial<SearchDocument> = {}) => ({
  key,
  name,
  synonyms: [],
  formula,
  charge: 0,
  casRn: null,
  inchiKey: null,
  phases: ['g'],
  ...extra,
});

const WATER = doc('water', 'Water', 'H2O', { synonyms: ['oxidane'], casRn: '7732-18-5' });
const METHANE = doc('methane', 'Methane', 'CH4');

/** Filler names built from syllables, enough to switch on the bigram filter (> 2,000). */
function filler(n: number): SearchDocument[] {
  const parts = ['kes', 'trel', 'ox', 'yl', 'prop', 'but', 'zo', 'cy', 'hex', 'am'];
  return Array.from({ length: n }, (_, i) => {
    const name = `${parts[i % 10]}${parts[Math.floor(i / 10) % 10]}${parts[Math.floor(i / 100) % 10]}`;
    return doc(`${name}-${i}`, `${name} ${i}`, `C${(i % 9) + 2}H${(i % 7) + 4}`);
  });
}

describe('SpeciesSearchIndex', () => {
  it.each([
    ['a small registry (every document scanned)', 0],
    ['a large registry (bigram candidates)', 3000],
  ])('finds misspelt names and formulas in any order in %s', (_what, extra) => {
    const index = new SpeciesSearchIndex([...filler(extra), WATER, METHANE]);
    for (const q of ['watr', 'wtaer', 'oxidan', 'metahne']) {
      expect(index.search(q, 5).results[0]?.key).toBe(q.startsWith('met') ? 'methane' : 'water');
    }
    expect(index.search('OH2', 5).results[0]).toMatchObject({ key: 'water', match: 'formula' });
    expect(index.search('7732-18-5', 5).results[0]).toMatchObject({ key: 'water', match: 'cas' });
  });

  it('reads only text that parses as a formula as one', () => {
    expect(asHillFormula('OH2')).toBe('H2O');
    expect(asHillFormula('water')).toBeNull();
    expect(asHillFormula('H2 O')).toBeNull();
    expect(asHillFormula('Xy2')).toBeNull();
  });
});
