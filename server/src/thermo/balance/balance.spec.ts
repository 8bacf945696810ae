import { assertBalanced, checkBalance } from './balance';
import { ThermoError } from '../errors/thermo-error';
import { parseEquation } from '../equation/equation-parser';

const report = (text: string) => checkBalance(parseEquation(text));
const texts = (r: Record<string, { toFraction(): string }>): Record<string, string> =>
  Object.fromEntries(Object.entries(r).map(([k, v]) => [k, v.toFraction()]));

describe('checkBalance', () => {
  it('accepts a balanced equation', () => {
    const r = report('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)');
    expect(r).toMatchObject({ balanced: true, imbalance: {}, unknownComposition: [] });
    expect(r.charge.valueOf()).toBe(0);
  });

  it('reports products minus reactants per element, nonzero entries only', () => {
    const r = report('CH4(g) + O2(g) -> CO2(g) + 2 H2O(l)');
    expect(r.balanced).toBe(false);
    expect(texts(r.imbalance)).toEqual({ O: '2' });
    expect(texts(report('H2(g) + O2(g) -> H2O(l)').imbalance)).toEqual({ O: '-1' });
  });

  it('works exactly with fractional coefficients', () => {
    expect(report('H2(g) + 1/2 O2(g) -> H2O(l)').balanced).toBe(true);
    expect(report('1/3 O3(g) -> 1/2 O2(g)').balanced).toBe(true);
    expect(texts(report('H2(g) + 1/3 O2(g) -> H2O(l)').imbalance)).toEqual({ O: '1/3' });
    expect(report('0.1 C3H8(g) + 0.5 O2(g) -> 0.3 CO2(g) + 0.4 H2O(l)').balanced).toBe(true);
  });

  it('checks charge', () => {
    expect(report('Na+(aq) + Cl-(aq) -> NaCl(cr)').balanced).toBe(true);
    const r = report('Fe(cr) -> Fe^3+(aq)');
    expect(r.balanced).toBe(false);
    expect(r.imbalance).toEqual({});
    expect(r.charge.toFraction()).toBe('3');
  });

  it('stays exact beyond the integer fast path', () => {
    const big = '123456789012345 H2(g) + 123456789012345/2 O2(g) -> 123456789012345 H2O(l)';
    expect(report(big).balanced).toBe(true);
    const off = report('123456789012345 H2(g) + 61728394506172 O2(g) -> 123456789012345 H2O(l)');
    expect(texts(off.imbalance)).toEqual({ O: '1' });
    expect(report('1/99991 H2(g) + 1/199982 O2(g) -> 1/99991 H2O(l)').balanced).toBe(true);
  });

  it('cannot judge registry keys and says so', () => {
    const r = report('[2-methylpropane](g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)');
    expect(r.balanced).toBeNull();
    expect(r.unknownComposition).toEqual(['2-methylpropane']);
    expect(texts(r.imbalance)).toEqual({ C: '4', H: '10' });
  });

  it('balances hydrates through their water', () => {
    expect(report('CuSO4·5H2O(cr) -> CuSO4(cr) + 5 H2O(g)').balanced).toBe(true);
    expect(report('CuSO4*5H2O(cr) -> CuSO4(cr) + 4 H2O(g)').balanced).toBe(false);
  });
});

describe('assertBalanced', () => {
  it('passes a balanced equation and returns its report', () => {
    expect(assertBalanced('2 H2(g) + O2(g) -> 2 H2O(l)').balanced).toBe(true);
    expect(assertBalanced('[2-methylpropane](g) -> [n-butane](g)').balanced).toBeNull();
  });

  it('throws unbalanced with the imbalance as exact fractions', () => {
    try {
      assertBalanced('H2(g) + 1/3 O2(g) -> H2O(l)', { step: 2 });
      throw new Error('expected unbalanced');
    } catch (err) {
      expect(err).toBeInstanceOf(ThermoError);
      const e = err as ThermoError;
      expect(e.code).toBe('unbalanced');
      expect(e.details).toEqual({ step: 2, imbalance: { O: '1/3' }, charge: '0' });
      expect(e.message).toBe(
        // The `step` detail is a 0-based index; messages count steps from 1.
        'step 3: H2(g) + 1/3 O2(g) -> H2O(l) is not balanced (products minus reactants: O: 1/3)',
      );
    }
  });

  it('reports a charge imbalance', () => {
    expect(() => assertBalanced('Fe(cr) -> Fe^3+(aq)')).toThrow(
      expect.objectContaining({ code: 'unbalanced', details: { imbalance: {}, charge: '3' } }),
    );
  });
});

describe('balance with non-integer counts', () => {
  it('balances the gypsum dehydration to the hemihydrate exactly, either spelling', () => {
    for (const text of [
      'CaSO4·2H2O(cr) -> CaSO4·1/2H2O(cr) + 3/2 H2O(g)',
      'CaSO4·2H2O(cr) -> CaSO4·0.5H2O(cr) + 1.5 H2O(g)',
    ]) {
      expect(checkBalance(parseEquation(text)).balanced).toBe(true);
    }
    const off = checkBalance(parseEquation('CaSO4·2H2O(cr) -> CaSO4·1/2H2O(cr) + H2O(g)'));
    expect(off.balanced).toBe(false);
    expect(
      Object.fromEntries(Object.entries(off.imbalance).map(([k, v]) => [k, v.toFraction()])),
    ).toEqual({ H: '-1', O: '-1/2' });
  });

  it('balances wüstite formation with its exact iron count', () => {
    expect(checkBalance(parseEquation('0.947 Fe(cr) + 1/2 O2(g) -> Fe0.947O(cr)')).balanced).toBe(
      true,
    );
    const off = checkBalance(parseEquation('Fe(cr) + 1/2 O2(g) -> Fe0.947O(cr)'));
    expect(off.imbalance['Fe']!.toFraction()).toBe('-53/1000');
  });
});
