import { exactValue, factorText } from './exact-number';

describe('exact numbers', () => {
  it('reads the API text form and plain numbers', () => {
    expect(exactValue('-1/2')).toBe(-0.5);
    expect(exactValue('13/2')).toBe(6.5);
    expect(exactValue(3)).toBe(3);
  });

  it('writes multipliers as people do', () => {
    expect(factorText('-1/2')).toBe('½');
    expect(factorText('2')).toBe('2');
    expect(factorText('3/7')).toBe('3/7');
    expect(factorText('3/2')).toBe('1 ½');
    expect(factorText(0.5)).toBe('½');
    expect(factorText(3 / 7)).toBe('3/7');
  });
});
