import { siPreview } from './si-preview';

describe('siPreview', () => {
  it('converts kJ/mol and kcal/mol (thermochemical calorie) to J/mol with a real minus', () => {
    expect(siPreview('-74.6', 'kJ/mol')).toBe('−74600 J/mol');
    expect(siPreview('-17.88', 'kcal/mol')).toBe('−74809.92 J/mol');
    expect(siPreview('1.1', 'kcal/mol')).toBe('4602.4 J/mol');
  });

  it('reads a typographic minus and a decimal comma as the number input does', () => {
    expect(siPreview('\u2212283,5', 'kJ/mol')).toBe('−283500 J/mol');
  });

  it('shows nothing for text that cannot be read', () => {
    expect(siPreview('', 'kJ/mol')).toBe('');
    expect(siPreview('1,234', 'kJ/mol')).toBe('');
    expect(siPreview('abc', 'kcal/mol')).toBe('');
  });
});
