import { energyText, energyWithSpread, uncertaintyWords } from './reaction-result';

describe('numbers on the result card', () => {
  it('keeps one precision for the whole card, trailing zeros included, with a real minus', () => {
    expect(energyText(18, 'kJ/mol')).toBe('18.00');
    expect(energyText(-283, 'kJ/mol')).toBe('\u2212283.00');
    expect(energyText(-802286.4, 'J/mol')).toBe('\u2212802286');
    expect(energyText(-0.001, 'kcal/mol')).toBe('0.00');
    expect(energyWithSpread(-802.29, 'kJ/mol', 0.4236)).toBe('\u2212802.29 ± 0.42 kJ/mol');
    expect(energyWithSpread(12.5, 'kJ/mol', null)).toBe('12.50 kJ/mol');
  });

  it('states how the ± was combined, or names the terms that have none', () => {
    const base = {
      release: '2026.1',
      equation: '',
      temperatureK: 298.15,
      unit: 'kJ/mol' as const,
      deltaH: 0,
      assumptions: [],
      caution: '',
    };
    const term = {
      species: 'methane',
      formula: 'CH4',
      phase: 'g' as const,
      modification: null,
      coefficient: -1,
      deltaFH: -74.87,
      uncertainty: null,
      uncertaintyBasis: null,
      revisionId: '36',
      source: null,
      referenceState: false,
      note: null,
      standardPressure: '1 bar',
    };
    expect(
      uncertaintyWords({ ...base, uncertainty: 0.4, uncertaintyBasis: 'standard', terms: [] }),
    ).toBe(
      '± from standard uncertainties, combined as the root sum of squares of independent terms.',
    );
    expect(
      uncertaintyWords({
        ...base,
        uncertainty: null,
        uncertaintyBasis: 'unavailable',
        terms: [term, { ...term, formula: 'O2', referenceState: true }],
      }),
    ).toBe('Uncertainty not combined: no uncertainty recorded for CH4.');
  });
});
