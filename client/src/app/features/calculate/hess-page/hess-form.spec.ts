import { FUEL_GAS_CHECK } from './hess-example';
import { formKey, fromQueryParams, toQueryParams } from './hess-form';

describe('the Hess form in the URL', () => {
  it('round-trips every input, numbers exactly as typed', () => {
    const value = {
      ...FUEL_GAS_CHECK,
      steps: [{ equation: 'CO(g) + 1/2 O2(g) -> CO2(g)', deltaH: '\u2212283,0', uncertainty: '' }],
      unit: 'kcal/mol' as const,
      temperature: '500',
    };
    expect(fromQueryParams(toQueryParams(value))).toEqual(value);
  });

  it('holds no calculation without a target or steps', () => {
    expect(fromQueryParams({})).toBeNull();
    expect(fromQueryParams({ unit: 'kJ/mol' })).toBeNull();
  });

  it('falls back to kJ/mol for a unit it does not know', () => {
    expect(fromQueryParams({ target: 'H2(g) -> H2(g)', unit: 'eV' })?.unit).toBe('kJ/mol');
  });

  it('compares inputs as sent: surrounding spaces do not make a result stale', () => {
    const spaced = { ...FUEL_GAS_CHECK, target: ` ${FUEL_GAS_CHECK.target} ` };
    expect(formKey(spaced)).toBe(formKey(FUEL_GAS_CHECK));
    expect(formKey({ ...FUEL_GAS_CHECK, unit: 'J/mol' })).not.toBe(formKey(FUEL_GAS_CHECK));
  });
});
