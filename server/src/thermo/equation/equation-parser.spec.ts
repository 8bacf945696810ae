import fc from 'fast-check';
import { ThermoError } from '../errors/thermo-error';
import { parseCached } from './cached-equation-parser';
import { isRegistryKey, parseEquation, parseEquationUncached, parseTerm } from './equation-parser';
import { printEquation } from './equation-printer';
import type { Term } from './equation-types';
import { equationText, mutatedText } from '../testing/arbitraries';

function failure(text: string): ThermoError {
  try {
    parseEquation(text);
  } catch (err) {
    if (err instanceof ThermoError) return err;
    throw err;
  }
  throw new Error(`expected "${text}" to fail`);
}

const coef = (t: Term): string => t.coefficient.toFraction();

describe('parseEquation', () => {
  it('reads terms, coefficients and phases', () => {
    const eq = parseEquation('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)');
    expect(eq.reactants.map((t) => [coef(t), t.id])).toEqual([
      ['1', 'CH4(g)'],
      ['2', 'O2(g)'],
    ]);
    expect(eq.products.map((t) => [coef(t), t.id])).toEqual([
      ['1', 'CO2(g)'],
      ['2', 'H2O(l)'],
    ]);
    expect(eq.products[1]).toMatchObject({
      phase: 'l',
      modification: null,
      species: { kind: 'formula', formula: 'H2O' },
    });
  });

  it('accepts the arrows ->, = and →', () => {
    const a = parseEquation('H2(g) + 1/2 O2(g) -> H2O(l)');
    expect(parseEquation('H2(g) + 1/2 O2(g) = H2O(l)')).toEqual(a);
    expect(parseEquation('H2(g) + 1/2 O2(g) → H2O(l)')).toEqual(a);
    expect(parseEquation('H2(g)+1/2O2(g)->H2O(l)')).toEqual(a);
  });

  it('keeps coefficients exact: integers, decimals and fractions', () => {
    const eq = parseEquation('0.5 N2(g) + 1.5 H2(g) -> NH3(g)');
    expect(eq.reactants.map(coef)).toEqual(['1/2', '3/2']);
    expect(parseEquation('1/3 O3(g) -> 1/2 O2(g)').reactants.map(coef)).toEqual(['1/3']);
    expect(
      parseEquation('12 C(cr,graphite) + 11 H2(g) + 11/2 O2(g) -> C12H22O11(cr)').reactants.map(
        coef,
      ),
    ).toEqual(['12', '11', '11/2']);
    expect(parseEquation('2H2(g) + O2(g) -> 2H2O(l)').reactants.map(coef)).toEqual(['2', '1']);
  });

  it('reads a modification name alone as its crystal, the same species-phase as (cr,name)', () => {
    const short = parseEquation('C(diamond) + TiO2(rutile) -> CaCO3(calcite)');
    expect(short.reactants[0]).toMatchObject({
      phase: 'cr',
      modification: 'diamond',
      id: 'C(diamond)',
    });
    expect(short.reactants[1]).toMatchObject({ phase: 'cr', modification: 'rutile' });
    const long = parseEquation('C(cr,diamond) -> C(cr)');
    expect(long.reactants[0]!.id).toBe(short.reactants[0]!.id);
    expect(long.products[0]!.id).toBe('C(cr)');
  });

  it.each([
    ['H2O(G) -> H2O(l)', 3, /phases are written in lower case: write \(g\), not \(G\)/],
    ['H2O(l) -> H2O(AQ)', 13, /lower case: write \(aq\)/],
    ['H2O(CR,ice) -> H2O(l)', 3, /lower case: write \(cr,ice\)/],
    ['H2O(l) -> H2O(S)', 13, /\(S\)' reads as an element group.*lower case, \(s\)/],
    ['Cu(Cr) -> Cu(cr)', 2, /lower case, \(cr\)/],
    ['H2O(gas) -> H2O(l)', 4, /unknown phase 'gas'.*did you mean \(g\)/],
    ['H2O(l) -> H2O(vapour)', 14, /did you mean \(g\)/],
    ['01 H2(g) -> H2(g)', 0, /coefficient is written without leading zeros/],
    ['H01(g) -> H(g)', 1, /count is written without leading zeros/],
  ])('refuses %p, saying what is wrong (position %p)', (text, position, message) => {
    let err: ThermoError | undefined;
    try {
      parseEquation(text);
    } catch (e) {
      err = e as ThermoError;
    }
    expect(err).toBeInstanceOf(ThermoError);
    expect(err!.code).toBe('parse_error');
    expect(err!.details['position']).toBe(position);
    expect(err!.message).toMatch(message);
    expect(err!.message).not.toMatch(/unknown element/);
  });

  it('names an unknown element symbol plainly', () => {
    let err: ThermoError | undefined;
    try {
      parseEquation('Xy(g) -> Xy(l)');
    } catch (e) {
      err = e as ThermoError;
    }
    expect(err).toMatchObject({ code: 'unknown_element', details: { symbol: 'Xy', position: 0 } });
    expect(err!.message).toBe('unknown element symbol Xy at character 1');
  });

  it('reads modification labels and trims them', () => {
    const eq = parseEquation('C(cr,diamond) -> C(cr, graphite)');
    expect(eq.reactants[0]).toMatchObject({
      phase: 'cr',
      modification: 'diamond',
      id: 'C(diamond)',
    });
    expect(eq.products[0]).toMatchObject({ modification: 'graphite', id: 'C(graphite)' });
    expect(parseEquation('CaCO3(cr,calcite) -> CaO(cr) + CO2(g)').reactants[0]?.modification).toBe(
      'calcite',
    );
    expect(parseEquation('SiO2(cr, alpha  quartz) -> SiO2(am)').reactants[0]?.modification).toBe(
      'alpha quartz',
    );
  });

  it('keeps phase s and flags it as a solid still to be resolved', () => {
    const eq = parseEquation('Fe(s) + S(s) -> FeS(s)');
    expect(eq.reactants.every((t) => t.phase === 's' && t.unresolvedSolid)).toBe(true);
    expect(parseEquation('Fe(cr) -> Fe(g)').reactants[0]?.unresolvedSolid).toBe(false);
  });

  it('allows terms without a phase', () => {
    const eq = parseEquation('H2 + Cl2 -> 2 HCl');
    expect(eq.products[0]).toMatchObject({ phase: null, id: 'HCl' });
  });

  it('reads registry keys in brackets as species without a formula', () => {
    const eq = parseEquation('[2-methylpropane](g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)');
    expect(eq.reactants[0]).toMatchObject({
      species: { kind: 'key', key: '2-methylpropane' },
      phase: 'g',
      id: '[2-methylpropane](g)',
    });
    expect(parseEquation('[(E)-but-2-ene](g) -> [(Z)-but-2-ene](g)').products[0]?.species).toEqual({
      kind: 'key',
      key: '(Z)-but-2-ene',
    });
  });

  it('reads a bracket that is a formula as a formula', () => {
    const eq = parseEquation('K4[Fe(CN)6](cr) -> 4 K+(aq) + [Fe(CN)6]^4-(aq)');
    expect(eq.products[1]?.species).toMatchObject({
      kind: 'formula',
      formula: '[Fe(CN)6]^4-',
      charge: -4,
    });
    expect(isRegistryKey('Fe(CN)6')).toBe(false);
    expect(isRegistryKey('ferrocene')).toBe(true);
    expect(isRegistryKey('two words')).toBe(false);
  });

  it('reads ions and hydrates', () => {
    const eq = parseEquation('CuSO4*5H2O(cr) -> Cu^2+(aq) + SO4^2-(aq) + 5 H2O(l)');
    expect(eq.reactants[0]?.id).toBe('CuSO4·5H2O(cr)');
    expect(eq.products.map((t) => t.species.kind === 'formula' && t.species.charge)).toEqual([
      2, -2, 0,
    ]);
    const salt = parseEquation('Na+(aq) + Cl-(aq) -> NaCl(cr)');
    expect(salt.reactants.map((t) => t.id)).toEqual(['Na+(aq)', 'Cl-(aq)']);
    expect(parseEquation('Na+ + Cl- -> NaCl').reactants.map((t) => t.id)).toEqual(['Na+', 'Cl-']);
    expect(parseEquation('H+(aq) + OH-(aq) -> H2O(l)').reactants[1]?.id).toBe('OH-(aq)');
  });

  it('reads a sign glued between two species as a separator, not a charge', () => {
    expect(parseEquation('H2+Cl2->2HCl').reactants.map((t) => t.id)).toEqual(['H2', 'Cl2']);
  });

  it('reads a sign glued to = or → as a charge', () => {
    expect(parseEquation('Cl2(g)->2Cl-').products[0]?.id).toBe('Cl-');
    expect(parseEquation('H+(aq)+OH-→H2O(l)').reactants.map((t) => t.id)).toEqual([
      'H+(aq)',
      'OH-',
    ]);
    expect(parseEquation('Na(g)=Na+').products[0]?.id).toBe('Na+');
  });

  it('merges a species-phase repeated on one side', () => {
    const eq = parseEquation('H2(g) + H2(g) + O2(g) -> H2O(l) + H2O(l)');
    expect(eq.reactants.map((t) => [coef(t), t.id])).toEqual([
      ['2', 'H2(g)'],
      ['1', 'O2(g)'],
    ]);
    expect(eq.products.map((t) => [coef(t), t.id])).toEqual([['2', 'H2O(l)']]);
  });

  it('cancels a species-phase on both sides to the net equation', () => {
    const eq = parseEquation('CH4(g) + 3 O2(g) -> CO2(g) + 2 H2O(l) + O2(g)');
    expect(printEquation(eq)).toBe('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)');
    const moved = parseEquation('Ar(g) + 2 H2O(l) -> 3 H2O(l)');
    expect(printEquation(moved)).toBe('Ar(g) -> H2O(l)');
  });

  it('keeps different phases and modifications apart', () => {
    const eq = parseEquation('H2O(l) -> H2O(g)');
    expect(eq.reactants[0]?.id).not.toBe(eq.products[0]?.id);
    expect(parseEquation('C(cr,graphite) -> C(cr,diamond)').products).toHaveLength(1);
  });

  it('fails when cancelling leaves one side empty', () => {
    const err = failure('H2O(l) -> H2O(l)');
    expect(err.code).toBe('invalid_input');
    expect(failure('2 O2(g) -> O2(g) + O2(g)').code).toBe('invalid_input');
  });

  it.each([
    ['CH4(g) + 2 O2(g) CO2(g)', 17, /expected '\+' or an arrow/],
    [
      'CH4(g) + 2 O2(g)',
      16,
      /expected an arrow \('->', '=' or '→'\) between reactants and products/,
    ],
    ['-> H2O(l)', 0, /expected a species before the arrow/],
    ['H2O(l) ->', 9, /expected a species after the arrow/],
    ['H2(g) + -> H2O(l)', 8, /expected a species after '\+'/],
    ['H2(g) -> H2O(l) -> H2O(g)', 16, /exactly one arrow/],
    ['H2(g) -> H2O(l) 2', 16, /expected '\+' or the end of the equation/],
    ['H2O(x) -> H2O(g)', 4, /unknown phase 'x'; use g, l, cr, s, am or aq/],
    ['H2O(l -> H2O(g)', 5, /expected '\)' to close the phase label/],
    ['C(cr,) -> C(g)', 5, /expected a modification label/],
    ['0 H2(g) -> H2(g)', 0, /greater than zero/],
    ['1/0 H2(g) -> H2(g)', 2, /zero denominator/],
    ['1. H2(g) -> H2(g)', 2, /digits after the decimal point/],
    ['2 -> H2(g)', 2, /expected a species after the coefficient 2/],
    ['Ca(OH2(cr) -> CaO(cr)', 6, /unclosed group/],
  ])('rejects %p at position %p', (text, position, message) => {
    const err = failure(text);
    expect(err.code).toBe('parse_error');
    expect(err.details['position']).toBe(position);
    expect(err.message).toMatch(message);
    // The message counts characters from 1, once; `position` is the 0-based index.
    expect(err.message).toMatch(new RegExp(`at character ${position + 1}$`));
    expect(err.message.match(/character|position/g)).toHaveLength(1);
  });

  it('reports unknown elements inside an equation at their position', () => {
    const err = failure('H2(g) + Xq(g) -> H2O(l)');
    expect(err.code).toBe('unknown_element');
    expect(err.details).toMatchObject({ position: 8, symbol: 'Xq' });
  });

  it('parses the same text the same way on repeated calls (caches are transparent)', () => {
    const text = 'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)';
    const first = parseEquation(text);
    expect(parseEquation(text)).toEqual(first);
    expect(parseEquation(`${text} `)).toEqual(first);
  });

  it('gives the same result or the same error with warm caches (property)', () => {
    const outcome = (text: string): unknown => {
      try {
        return parseEquation(text);
      } catch (err) {
        return err instanceof ThermoError
          ? { code: err.code, message: err.message, details: err.details }
          : err;
      }
    };
    fc.assert(
      fc.property(fc.oneof(equationText, mutatedText(equationText)), (text) => {
        // The first call may fill the token caches; the second may take the cached path.
        const cold = outcome(text);
        expect(outcome(text)).toEqual(cold);
      }),
      { numRuns: 1500 },
    );
  });

  it('takes the cached path only where it agrees with the full parser (property)', () => {
    fc.assert(
      fc.property(fc.oneof(equationText, mutatedText(equationText)), (text) => {
        let full: unknown;
        try {
          full = parseEquationUncached(text);
        } catch {
          full = null;
        }
        let cached: unknown;
        try {
          cached = parseCached(text);
        } catch (err) {
          // The cached path may meet an empty side only where the full parser does too.
          expect(full).toBeNull();
          expect(err).toBeInstanceOf(ThermoError);
          return;
        }
        if (cached !== null) expect(cached).toEqual(full);
      }),
      { numRuns: 2000 },
    );
  });

  it('rejects input that is not a string', () => {
    expect(() => parseEquation(undefined as unknown as string)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => parseEquation('H2 -> H2O'.repeat(5000))).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });
});

describe('parseTerm', () => {
  it('reads one term with an optional coefficient', () => {
    expect(parseTerm('H2O(l)')).toMatchObject({ id: 'H2O(l)' });
    expect(parseTerm(' 1/2 O2(g) ').coefficient.toFraction()).toBe('1/2');
    expect(() => parseTerm('H2O(l) + H2')).toThrow(
      expect.objectContaining({ code: 'parse_error', details: { position: 7 } }),
    );
    expect(() => parseTerm('')).toThrow(expect.objectContaining({ code: 'parse_error' }));
  });
});
