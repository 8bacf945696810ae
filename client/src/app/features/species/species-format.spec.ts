import {
  basisWords,
  kjFromJoules,
  kjFromJoulesText,
  kjUncertainty,
  molarMassText,
} from './species-format';

describe('species numbers on screen', () => {
  it.each([
    ['-285830', '−285.83'],
    ['-241826', '−241.826'],
    ['-74600', '−74.6'],
    ['-283000', '−283.0'],
    ['0', '0.0'],
    ['-0', '0.0'],
    ['52400', '52.4'],
    ['-1675700', '−1675.7'],
    ['217998.5', '217.9985'],
    ['-42', '−0.042'],
  ])('moves the point of %s J/mol to %s kJ/mol exactly', (joules, kj) => {
    expect(kjFromJoulesText(joules)).toBe(kj);
  });

  it('leaves text it cannot read as it is', () => {
    expect(kjFromJoulesText('n/a')).toBe('n/a');
  });

  it('shows uncertainties in kJ/mol to two significant digits and names their basis', () => {
    expect(kjUncertainty(420)).toBe('0.42');
    expect(kjUncertainty(40)).toBe('0.04');
    expect(kjUncertainty(null)).toBeNull();
    expect(basisWords('expanded_k2')).toBe('expanded uncertainty, k = 2');
    expect(basisWords(null)).toBe('no uncertainty recorded');
  });

  it('writes molar masses to three decimals', () => {
    expect(molarMassText(18.01528)).toBe('18.015 g/mol');
  });
});

describe('kjFromJoules', () => {
  it('writes kJ/mol with one to three decimals and a real minus sign', () => {
    expect(kjFromJoules(-285830)).toBe('−285.83');
    expect(kjFromJoules(-283000)).toBe('−283.0');
    expect(kjFromJoules(0)).toBe('0.0');
    expect(kjFromJoules(-0)).toBe('0.0');
  });
});
