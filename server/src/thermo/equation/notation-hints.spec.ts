import { parseEquation } from './equation-parser';
import { notationHints } from './notation-hints';

describe('notationHints', () => {
  it('keeps the documented reading of Fe2+ and asks whether Fe^2+ was meant', () => {
    const eq = parseEquation('Fe2+(aq) -> Fe(cr)');
    expect(eq.reactants[0]!.species).toMatchObject({ elements: { Fe: 2 }, charge: 1 });
    expect(notationHints(eq)).toEqual(['did you mean Fe^2+? Fe2+ reads as Fe2 with charge +1']);
  });

  it('asks about a polyatomic ion whose last count swallowed the charge (SO42-)', () => {
    expect(notationHints('SO42-(aq) -> SO4^2-(aq)')).toEqual([
      'did you mean SO4^2-? SO42- reads as SO42 with charge −1',
    ]);
  });

  it('says nothing for readings that are usual as written', () => {
    expect(
      notationHints('HSO4-(aq) + NO3-(aq) + Fe^2+(aq) + Na+(aq) -> H+(aq) + Cl-(aq) + SO4^2-(aq)'),
    ).toEqual([]);
    expect(notationHints('[2-methylpropane](g) -> [n-butane](g)')).toEqual([]);
  });
});
