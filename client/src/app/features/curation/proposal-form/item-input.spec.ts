import { activeFields, itemForm, readRanges } from './item-form';
import { fromItemInput, toItemInput } from './item-input';

describe('proposal items', () => {
  it('enables only the fields of the chosen kind and quantity', () => {
    const form = itemForm();
    expect(form.controls.value.enabled).toBe(true);
    expect(form.controls.formula.enabled).toBe(false);
    form.controls.kind.setValue('add_species');
    expect(form.controls.formula.enabled).toBe(true);
    expect(form.controls.value.enabled).toBe(false);
    form.controls.kind.setValue('add_value');
    form.controls.quantity.setValue('heat_capacity');
    expect(form.controls.ranges.enabled).toBe(true);
    expect(form.controls.value.enabled).toBe(false);
    expect(activeFields('derive_value', 'formation_enthalpy')).not.toContain('method');
  });

  it('sends a formation-enthalpy value in the unit typed, numbers read as typed', () => {
    const form = itemForm({
      kind: 'supersede_value',
      species: 'methane',
      phase: 'g',
      value: '\u221274,6',
      unit: 'kJ/mol',
      uncertainty: '0.3',
      method: 'combustion calorimetry',
      sourceId: '12',
    });
    expect(form.valid).toBe(true);
    expect(toItemInput(form.getRawValue())).toEqual({
      kind: 'supersede_value',
      species: 'methane',
      phase: 'g',
      modification: undefined,
      quantity: 'formation_enthalpy',
      value: -74.6,
      unit: 'kJ/mol',
      uncertainty: 0.3,
      uncertaintyBasis: 'standard',
      method: 'combustion calorimetry',
      standardPressure: '1 bar',
      sourceId: '12',
      notes: undefined,
      fromMemory: false,
    });
  });

  it('reads a stored item back into the form for revising', () => {
    const value = fromItemInput({
      kind: 'derive_value',
      species: 'propane',
      phase: 'g',
      equation: 'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)',
      deltaH: -2219.2,
      unit: 'kJ/mol',
      release: '2026.1',
      sourceId: '3',
    });
    const form = itemForm(value);
    expect(form.getRawValue()).toMatchObject({
      kind: 'derive_value',
      value: '-2219.2',
      equation: 'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)',
      release: '2026.1',
    });
    expect(form.valid).toBe(true);
  });

  it('reads heat-capacity ranges one a line and explains a bad line', () => {
    expect(readRanges('200 1000 1 2 3 4 5 6 7')).toEqual([
      { tMin: 200, tMax: 1000, coefficients: [1, 2, 3, 4, 5, 6, 7] },
    ]);
    expect(readRanges('1000 200 1 2 3 4 5')).toMatch(/Line 1: tMax must be above tMin/);
    expect(readRanges('200 1000 1 2')).toMatch(/5 to 8 coefficients/);
  });
});
