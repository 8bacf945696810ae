import { decimalText, toStoredJoules } from './values-si';

describe('values in SI', () => {
  it.each([
    [-74.87, '-74.87'],
    [1e-7, '0.0000001'],
    [-2.5e-8, '-0.000000025'],
    [1e21, '1000000000000000000000'],
    [1.5e22, '15000000000000000000000'],
    [0, '0'],
  ])('writes %p as the plain decimal %s', (n, text) => {
    expect(decimalText(n)).toBe(text);
  });

  it('converts exactly: kJ by 1000, kcal by 4184 (thermochemical calorie)', () => {
    expect(toStoredJoules(-74.87, 'kJ/mol')).toEqual({ joules: -74870, text: '-74870' });
    expect(toStoredJoules(-17.88, 'kcal/mol').text).toBe('-74809.92');
    expect(toStoredJoules(0.1, 'kcal/mol').text).toBe('418.4');
    expect(toStoredJoules(12.5, 'J/mol').text).toBe('12.5');
  });

  it('refuses a value beyond the float range through the engine', () => {
    expect(() => toStoredJoules(1e306, 'kcal/mol')).toThrow(/too large/);
  });
});
