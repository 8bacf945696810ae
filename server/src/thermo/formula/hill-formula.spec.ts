import { hillFormula, hillOrder } from './hill-formula';

describe('Hill order', () => {
  it('puts C then H first when carbon is present, the rest alphabetically', () => {
    expect(hillOrder(['O', 'H', 'C', 'Br', 'N'])).toEqual(['C', 'H', 'Br', 'N', 'O']);
    expect(hillFormula({ O: 1, H: 6, C: 2 })).toBe('C2H6O');
    expect(hillFormula({ Cl: 3, C: 1, H: 1 })).toBe('CHCl3');
    expect(hillFormula({ Fe: 1, H: 10, C: 10 })).toBe('C10H10Fe');
  });

  it('sorts everything alphabetically without carbon, H included', () => {
    expect(hillOrder(['O', 'H', 'S'])).toEqual(['H', 'O', 'S']);
    expect(hillFormula({ S: 1, O: 4, H: 2 })).toBe('H2O4S');
    expect(hillFormula({ Na: 1, Cl: 1 })).toBe('ClNa');
    expect(hillFormula({ H: 3, N: 1 })).toBe('H3N');
  });

  it('appends the charge the way the parser reads it back', () => {
    expect(hillFormula({ O: 4, S: 1 }, -2)).toBe('O4S^2-');
    expect(hillFormula({ Na: 1 }, 1)).toBe('Na+');
    expect(hillFormula({ H: 1, O: 1 }, -1)).toBe('HO-');
    expect(hillFormula({ Fe: 1 }, 3)).toBe('Fe^3+');
  });

  it('skips zero counts and rejects bad input', () => {
    expect(hillFormula({ C: 1, H: 0, O: 2 })).toBe('CO2');
    expect(() => hillFormula({ Qq: 1 })).toThrow(
      expect.objectContaining({ code: 'unknown_element' }),
    );
    // Non-integer counts (non-stoichiometric phases) print as decimals.
    expect(hillFormula({ Fe: 0.947, O: 1 })).toBe('Fe0.947O');
    expect(() => hillFormula({ H: -1.5 })).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => hillFormula({ H: 1 }, 0.5)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });
});
