import { ELEMENT_SYMBOLS } from './atomic-weights';
import { ThermoError } from '../errors/thermo-error';
import { exactCounts, parseFormula } from './formula-parser';

function failure(text: string): ThermoError {
  try {
    parseFormula(text);
  } catch (err) {
    if (err instanceof ThermoError) return err;
    throw err;
  }
  throw new Error(`expected ${text} to fail`);
}

describe('parseFormula', () => {
  it('reads simple formulas into element counts', () => {
    expect(parseFormula('H2O').elements).toEqual({ H: 2, O: 1 });
    expect(parseFormula('C2H5OH').elements).toEqual({ C: 2, H: 6, O: 1 });
    expect(parseFormula('NaCl').elements).toEqual({ Cl: 1, Na: 1 });
  });

  it('knows all 118 element symbols, and only those', () => {
    expect(ELEMENT_SYMBOLS).toHaveLength(118);
    for (const symbol of ELEMENT_SYMBOLS)
      expect(parseFormula(`${symbol}2`).elements).toEqual({ [symbol]: 2 });
    expect(ELEMENT_SYMBOLS.slice(-4)).toEqual(['Mc', 'Lv', 'Ts', 'Og']);
  });

  it('multiplies nested round and square brackets', () => {
    expect(parseFormula('Ca3(PO4)2').elements).toEqual({ Ca: 3, O: 8, P: 2 });
    expect(parseFormula('K4[Fe(CN)6]').elements).toEqual({ C: 6, Fe: 1, K: 4, N: 6 });
    expect(parseFormula('[Co(NH3)6]Cl3').elements).toEqual({ Cl: 3, Co: 1, H: 18, N: 6 });
    expect(parseFormula('((CH3)3C)2O').elements).toEqual({ C: 8, H: 18, O: 1 });
  });

  it('reads fractional hydrates and decimal subscripts exactly', () => {
    // Calcium sulfate hemihydrate, written with a fraction or a decimal: one canonical form.
    const half = parseFormula('CaSO4·1/2H2O');
    const decimal = parseFormula('CaSO4·0.5H2O');
    expect(half.formula).toBe('CaSO4·1/2H2O');
    expect(decimal.formula).toBe(half.formula);
    expect(half.elements).toEqual({ Ca: 1, H: 1, O: 4.5, S: 1 });
    expect(half.exact!['O']!.toFraction()).toBe('9/2');
    expect(half.hill).toBe('CaHO4.5S');
    // Wüstite, iron-deficient iron(II) oxide.
    const wustite = parseFormula('Fe0.947O');
    expect(wustite.formula).toBe('Fe0.947O');
    expect(wustite.exact!['Fe']!.toFraction()).toBe('947/1000');
    expect(exactCounts(wustite)['O']!.toFraction()).toBe('1');
    // A third: exact, where a float would not be.
    const third = parseFormula('X2O·1/3H2O'.replace('X', 'Na'));
    expect(third.exact!['H']!.toFraction()).toBe('2/3');
    expect(third.hill).toBe('H2/3Na2O4/3');
    // Whole counts carry no exact map: the integer fast path stays as it was.
    expect(parseFormula('CuSO4·5H2O').exact).toBeUndefined();
  });

  it('reads hydrates with · or * and a multiplier on the hydrate part', () => {
    const dot = parseFormula('CuSO4·5H2O');
    const star = parseFormula('CuSO4*5H2O');
    expect(dot.elements).toEqual({ Cu: 1, H: 10, O: 9, S: 1 });
    expect(star).toEqual(dot);
    expect(dot.formula).toBe('CuSO4·5H2O');
    expect(parseFormula('CaSO4·2H2O').elements).toEqual({ Ca: 1, H: 4, O: 6, S: 1 });
    expect(parseFormula('Na2CO3·H2O·NaHCO3').elements).toEqual({ C: 2, H: 3, Na: 3, O: 7 });
  });

  it('reads charges written ^2-, ^3+, + and -', () => {
    expect(parseFormula('SO4^2-')).toMatchObject({ charge: -2, elements: { O: 4, S: 1 } });
    expect(parseFormula('Fe^3+')).toMatchObject({ charge: 3, elements: { Fe: 1 } });
    expect(parseFormula('Na+')).toMatchObject({ charge: 1 });
    expect(parseFormula('OH-')).toMatchObject({ charge: -1, elements: { H: 1, O: 1 } });
    expect(parseFormula('[Fe(CN)6]^4-').charge).toBe(-4);
    expect(parseFormula('NH4^+').charge).toBe(1);
    expect(parseFormula('PO4^-3').charge).toBe(-3);
  });

  it('gives a canonical written form that keeps structure but normalises spelling', () => {
    expect(parseFormula('C1H4').formula).toBe('CH4');
    expect(parseFormula('NH4^+').formula).toBe('NH4+');
    expect(parseFormula('PO4^-3').formula).toBe('PO4^3-');
    expect(parseFormula('C2H5OH').formula).not.toBe(parseFormula('CH3OCH3').formula);
    expect(parseFormula('C2H5OH').hill).toBe(parseFormula('CH3OCH3').hill);
  });

  it('gives the Hill formula', () => {
    expect(parseFormula('C2H5OH').hill).toBe('C2H6O');
    expect(parseFormula('CuSO4·5H2O').hill).toBe('CuH10O9S');
    expect(parseFormula('SO4^2-').hill).toBe('O4S^2-');
  });

  it('ignores surrounding whitespace but keeps positions on the given text', () => {
    expect(parseFormula('  H2O ').elements).toEqual({ H: 2, O: 1 });
    expect(failure('  H2Xq').details['position']).toBe(4);
  });

  it('reports unknown element symbols with their position', () => {
    const err = failure('H2Xy3');
    expect(err.code).toBe('unknown_element');
    expect(err.details).toEqual({ position: 2, symbol: 'Xy' });
    expect(failure('Cx').details['symbol']).toBe('Cx');
    expect(failure('A').code).toBe('unknown_element');
  });

  it.each([
    ['', 0, /empty formula/],
    ['2H2O', 0, /leading number is a coefficient/],
    ['Ca(OH2', 6, /unclosed group/],
    ['Ca(OH]2', 5, /mismatched '\]'/],
    ['CaOH)2', 4, /no group to close/],
    ['Ca()2', 2, /empty group/],
    ['H0', 1, /greater than zero/],
    ['H01', 1, /without leading zeros/],
    ['CuSO4.5H2O', 4, /ambiguous.*CuSO4·5H2O/],
    ['CaSO4·0H2O', 6, /greater than zero/],
    ['CaSO4·1/0H2O', 6, /zero denominator/],
    ['H2O(l)', 3, /phase label belongs to an equation term/],
    ['SO4^2', 3, /expected a charge/],
    ['CuSO4·', 6, /expected a formula after the hydrate dot/],
    ['H2O+H', 3, /unexpected '\+'/],
    ['H1234567', 1, /count too large/],
  ])('rejects %p at position %p', (text, position, message) => {
    const err = failure(text);
    expect(err.code).toBe('parse_error');
    expect(err.details['position']).toBe(position);
    expect(err.message).toMatch(message);
    expect(err.message).toContain(`at character ${position + 1}`);
  });

  it('rejects non-strings as invalid input', () => {
    expect(() => parseFormula(42 as unknown as string)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });

  it('returns frozen results that later calls share', () => {
    const a = parseFormula('CH4');
    expect(Object.isFrozen(a) && Object.isFrozen(a.elements)).toBe(true);
    expect(parseFormula('CH4')).toBe(a);
  });
});
