import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';

import { ChemText, chemText } from './chem-text';

describe('chemText', () => {
  it.each([
    ['H2O', 'H₂O'],
    ['SO4^2-', 'SO₄²⁻'],
    ['Fe^3+', 'Fe³⁺'],
    ['PO4^-3', 'PO₄³⁻'],
    ['NH4^+', 'NH₄⁺'],
    ['Na+', 'Na⁺'],
    ['OH-(aq)', 'OH⁻(aq)'],
    ['CuSO4·5H2O', 'CuSO₄·5H₂O'],
    ['CuSO4*5H2O(cr)', 'CuSO₄·5H₂O(cr)'],
    ['CaSO4·1/2H2O', 'CaSO₄·1/2H₂O'],
    ['Fe0.947O(cr)', 'Fe₀.₉₄₇O(cr)'],
    ['Ca(OH)2', 'Ca(OH)₂'],
    ['K4[Fe(CN)6]', 'K₄[Fe(CN)₆]'],
    ['[Fe(CN)6]^4-', '[Fe(CN)₆]⁴⁻'],
    ['C(cr,graphite)', 'C(cr,graphite)'],
    ['O4S^2-', 'O₄S²⁻'],
  ])('shows %s as %s', (plain, shown) => {
    expect(chemText(plain)).toBe(shown);
  });

  it('keeps coefficients, phases and arrows of an equation, and shows -> as one glyph', () => {
    expect(chemText('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)')).toBe(
      'CH₄(g) + 2 O₂(g) → CO₂(g) + 2 H₂O(l)',
    );
    expect(chemText('1/2 O2(g) + H2(g) = H2O(l)')).toBe('1/2 O₂(g) + H₂(g) = H₂O(l)');
    expect(chemText('0.5 O2(g)+CO(g)->CO2(g)')).toBe('0.5 O₂(g)+CO(g)→CO₂(g)');
    expect(chemText('2H2O(l) → 2 H2(g) + O2(g)')).toBe('2H₂O(l) → 2 H₂(g) + O₂(g)');
  });

  it('tells a separator from a charge the way the parser does', () => {
    expect(chemText('H2+O2')).toBe('H₂+O₂');
    expect(chemText('Na+(aq) + Cl-(aq) -> NaCl(cr)')).toBe('Na⁺(aq) + Cl⁻(aq) → NaCl(cr)');
    expect(chemText('H2O(l)->H2O(g)')).toBe('H₂O(l)→H₂O(g)');
  });

  it('leaves registry keys as written', () => {
    expect(chemText('[2-methylpropane](g) -> [butane](g)')).toBe(
      '[2-methylpropane](g) → [butane](g)',
    );
  });

  it('answers empty text for nothing', () => {
    expect(chemText(null)).toBe('');
    expect(chemText(undefined)).toBe('');
    expect(chemText('')).toBe('');
  });
});

@Component({
  imports: [ChemText],
  template: `<span>{{ formula | chemText }}</span>`,
})
class Host {
  formula = 'SO4^2-(aq)';
}

describe('ChemText pipe', () => {
  it('renders formulas in a template', () => {
    const fixture = TestBed.createComponent(Host);
    fixture.detectChanges();
    expect(fixture.nativeElement.textContent).toBe('SO₄²⁻(aq)');
  });
});
