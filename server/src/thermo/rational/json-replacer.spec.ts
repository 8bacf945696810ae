import { thermoJsonReplacer } from './json-replacer';
import { frac } from './rational';

describe('thermoJsonReplacer', () => {
  it('writes fractions as exact text in lowest terms, sign first', () => {
    const value = { half: frac(1, 2), minusTwo: frac(-4, 2), big: frac(13n, 2n), n: 1.5 };
    expect(() => JSON.stringify({ x: 1n })).toThrow(TypeError);
    expect(JSON.parse(JSON.stringify(value, thermoJsonReplacer))).toEqual({
      half: '1/2',
      minusTwo: '-2',
      big: '13/2',
      n: 1.5,
    });
  });

  it('writes nested fractions and bigints', () => {
    const json = JSON.parse(JSON.stringify({ m: [frac(-1, 3)], b: 12n }, thermoJsonReplacer));
    expect(json).toEqual({ m: ['-1/3'], b: '12' });
  });
});
