import { ATOMIC_WEIGHTS } from '../formula/atomic-weights';
import { isReferenceState, matchReferenceState, referenceStates } from './reference-states';

describe('reference states at 298.15 K, 1 bar', () => {
  it('covers every element up to Bi, and Th, U, Pu', () => {
    for (const { symbol, z } of ATOMIC_WEIGHTS.values()) {
      if (z <= 83 || ['Th', 'U', 'Pu'].includes(symbol))
        expect(referenceStates[symbol]).toBeDefined();
    }
    expect(referenceStates['At']).toBeUndefined();
    expect(referenceStates['Og']).toBeUndefined();
  });

  it.each([
    ['C', 'C', 'cr', 'graphite'],
    ['H', 'H2', 'g', null],
    ['O', 'O2', 'g', null],
    ['N', 'N2', 'g', null],
    ['F', 'F2', 'g', null],
    ['Cl', 'Cl2', 'g', null],
    ['Br', 'Br2', 'l', null],
    ['Hg', 'Hg', 'l', null],
    ['I', 'I2', 'cr', null],
    ['S', 'S', 'cr', 'rhombic'],
    ['P', 'P', 'cr', 'white'],
    ['Ar', 'Ar', 'g', null],
    ['Ga', 'Ga', 'cr', null],
    ['Cs', 'Cs', 'cr', null],
    ['Rb', 'Rb', 'cr', null],
    ['Fe', 'Fe', 'cr', null],
    ['U', 'U', 'cr', null],
  ])('%s is %s(%s) %s', (symbol, formula, phase, modification) => {
    expect(referenceStates[symbol]).toMatchObject({ formula, phase, modification });
    expect(isReferenceState(formula, phase as 'g', modification)).toBe(true);
  });

  it('requires the reference atomicity for gases', () => {
    expect(isReferenceState('O2', 'g')).toBe(true);
    expect(isReferenceState('O', 'g')).toBe(false);
    expect(isReferenceState('O3', 'g')).toBe(false);
    expect(isReferenceState('He', 'g')).toBe(true);
    expect(isReferenceState('He2', 'g')).toBe(false);
  });

  it('accepts any count for a condensed element', () => {
    expect(isReferenceState('S8', 'cr', 'rhombic')).toBe(true);
    expect(isReferenceState('P4', 'cr', 'white')).toBe(true);
  });

  it('rejects other phases, polymorphs, ions and compounds', () => {
    expect(isReferenceState('C', 'cr', 'diamond')).toBe(false);
    expect(isReferenceState('P', 'cr', 'red')).toBe(false);
    expect(isReferenceState('Br2', 'g')).toBe(false);
    expect(isReferenceState('H2O', 'l')).toBe(false);
    expect(isReferenceState('Na+', 'aq')).toBe(false);
    expect(isReferenceState('Fe', 'cr', 'gamma')).toBe(false);
    expect(isReferenceState('C', 'am')).toBe(false);
  });

  it('reads an unwritten phase or modification, or phase s, as the reference one and says so', () => {
    expect(matchReferenceState('C', 'cr')).toEqual({ reference: true, assumed: true });
    expect(matchReferenceState('C', 's')).toEqual({ reference: true, assumed: true });
    expect(matchReferenceState('O2', null)).toEqual({ reference: true, assumed: true });
    expect(matchReferenceState('C', 'cr', 'graphite')).toEqual({ reference: true, assumed: false });
    expect(matchReferenceState('S', 'cr', 'Orthorhombic')).toEqual({
      reference: true,
      assumed: false,
    });
    expect(matchReferenceState('Fe', 'cr')).toEqual({ reference: true, assumed: false });
  });
});

describe('matchReferenceState with junk arguments', () => {
  // A fuzzed call found this: a number as the modification threw a TypeError, not a coded error.
  it('refuses a modification or phase that is not text with invalid_input', () => {
    expect(() => matchReferenceState('U', null, 0 as unknown as string)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => matchReferenceState('U', 1 as unknown as 'g')).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });
});
