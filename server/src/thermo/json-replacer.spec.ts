import { parseEquation } from './equation-parser';
import { solveHess } from './hess';
import { thermoJsonReplacer } from './json-replacer';

describe('thermoJsonReplacer', () => {
  it('lets results with exact coefficients go through JSON', () => {
    const eq = parseEquation('H2(g) + 1/2 O2(g) -> H2O(l)');
    expect(() => JSON.stringify(eq)).toThrow(TypeError);
    const json = JSON.parse(JSON.stringify(eq, thermoJsonReplacer));
    expect(json.reactants[1].coefficient).toBe('1/2');
    expect(json.reactants[1].id).toBe('O2(g)');
  });

  it('serialises Hess multipliers as exact strings', () => {
    // CODATA Key Values (Cox, Wagman, Medvedev 1989), J/mol.
    const r = solveHess('2 H2O(l) -> 2 H2(g) + O2(g)', [
      { equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', deltaH: -285830 },
    ]);
    const json = JSON.parse(JSON.stringify(r, thermoJsonReplacer));
    expect(json.multipliers).toEqual(['-2']);
    expect(json.steps[0]).toMatchObject({
      multiplier: '-2',
      scale: '2',
      flipped: true,
      deltaH: 571660,
    });
  });
});
