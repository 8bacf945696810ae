import { ApiError } from '../../../core/api-error';
import { failure, fieldName, fixed, resultCsv, reversed } from './hess-outcome';

describe('Hess outcome words and numbers', () => {
  it('uses a real minus sign and never shows -0', () => {
    expect(fixed(-283, 1)).toBe('\u2212283.0');
    expect(fixed(-0.001, 2)).toBe('0.00');
    expect(fixed(206.1, 1)).toBe('206.1');
  });

  it('reverses an equation as the combination uses it', () => {
    expect(reversed('CO(g) + 1/2 O2(g) -> CO2(g)')).toBe('CO2(g) -> CO(g) + 1/2 O2(g)');
  });

  it('names request fields in the form words, 1-based', () => {
    expect(fieldName('steps[0].deltaH')).toBe('Step 1 ΔH');
    expect(fieldName('steps[2].equation')).toBe('Step 3 equation');
    expect(fieldName('target')).toBe('Target equation');
    expect(fieldName(undefined)).toBeNull();
  });

  it('does not repeat a step the server message already names', () => {
    const error = new ApiError(422, 'unbalanced', 'step 3 is not balanced', {
      field: 'steps[2].equation',
    });
    expect(failure(error).message).toBe('step 3 is not balanced');
    const target = new ApiError(400, 'parse_error', "target: expected '->'", { field: 'target' });
    expect(failure(target).message).toBe("target: expected '->'");
  });

  it('quotes CSV cells that hold commas', () => {
    const csv = resultCsv({
      target: 'A(g) -> B(g)',
      unit: 'kJ/mol',
      temperature: '298.15',
      total: '\u22121.0',
      uncertainty: null,
      uncertaintyNote: '',
      direction: 'exothermic',
      used: [
        {
          number: 1,
          usedAs: 'C(cr,graphite) -> C(cr,diamond)',
          reversed: false,
          factor: '1',
          multiplier: 1,
          given: '\u22121.0',
          contribution: '\u22121.0',
        },
      ],
      unused: [],
      alternatives: false,
    });
    expect(csv.split('\n')[1]).toBe('1,"C(cr,graphite) -> C(cr,diamond)",1,-1.0,-1.0');
  });
});
