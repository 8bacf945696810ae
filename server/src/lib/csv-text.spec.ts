import { guardCsvText, unguardCsvText } from './csv-text';

describe('guardCsvText', () => {
  it.each([
    ['=HYPERLINK("https://example.invalid")', `'=HYPERLINK("https://example.invalid")`],
    ['+1', `'+1`],
    ['-2+3', `'-2+3`],
    ['@SUM(A1)', `'@SUM(A1)`],
    ['\tcmd', `'\tcmd`],
    ['\rcmd', `'\rcmd`],
    ['\uFF1D1+1', `'\uFF1D1+1`],
    // An apostrophe already in front of a formula character: one more, so it reads back exactly.
    [`'=x`, `''=x`],
  ])('puts an apostrophe before %j', (text, cell) => {
    expect(guardCsvText(text)).toBe(cell);
    expect(unguardCsvText(cell)).toBe(text);
  });

  it.each(['Water', 'H2O', "'quoted'", ' =spaced', 'a=b', 'O4S^2-', '', 'ΔfH°'])(
    'keeps %j as it is',
    (text) => {
      expect(guardCsvText(text)).toBe(text);
      expect(unguardCsvText(text)).toBe(text);
    },
  );

  it('keeps null as null', () => {
    expect(guardCsvText(null)).toBeNull();
  });
});
