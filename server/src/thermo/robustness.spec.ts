import fc from 'fast-check';
import {
  autoBalance,
  checkBalance,
  convertEnergy,
  deriveFormationEnthalpy,
  enthalpyIncrement,
  heatingValues,
  hillFormula,
  molarMass,
  parseEquation,
  parseFormula,
  parseTerm,
  reactionEnthalpy,
  reactionEnthalpyAtT,
  solveHess,
  ThermoError,
  type Equation,
} from './index';
import * as engine from './index';
import { equationText, formulaText, mutatedText, termText } from './testing/arbitraries';

/** Runs f; any failure must be a ThermoError. */
function onlyThermoErrors(f: () => unknown): void {
  try {
    f();
  } catch (err) {
    if (!(err instanceof ThermoError)) throw err;
    expect(typeof err.code).toBe('string');
    if (err.code === 'parse_error') expect(typeof err.details['position']).toBe('number');
  }
}

const anything = fc.oneof(
  fc.anything(),
  fc.double(),
  fc.string(),
  fc.constant(undefined),
  fc.constant(null),
);
const unicode = fc.string({ unit: 'binary', maxLength: 60 });

describe('every failure is a ThermoError', () => {
  it('parseFormula on random and mutated text', () => {
    fc.assert(
      fc.property(fc.oneof(unicode, mutatedText(formulaText)), (s) =>
        onlyThermoErrors(() => parseFormula(s)),
      ),
      { numRuns: 3000 },
    );
  });

  it('parseEquation on random and mutated text', () => {
    fc.assert(
      fc.property(fc.oneof(unicode, mutatedText(equationText)), (s) =>
        onlyThermoErrors(() => parseEquation(s)),
      ),
      { numRuns: 3000 },
    );
  });

  it('parse positions point inside the text (or at its end)', () => {
    fc.assert(
      fc.property(mutatedText(equationText), (s) => {
        try {
          parseEquation(s);
        } catch (err) {
          if (err instanceof ThermoError && err.code === 'parse_error') {
            const p = err.details['position'] as number;
            expect(p >= 0 && p <= s.length).toBe(true);
          }
        }
      }),
      { numRuns: 2000 },
    );
  });

  it('parseTerm, molarMass and hillFormula on junk', () => {
    fc.assert(
      fc.property(fc.oneof(mutatedText(termText), unicode), anything, (s, x) => {
        onlyThermoErrors(() => parseTerm(s));
        onlyThermoErrors(() => molarMass(s));
        onlyThermoErrors(() => molarMass(x as string));
        onlyThermoErrors(() => hillFormula(x as Record<string, number>, 0));
        onlyThermoErrors(() => parseEquation(x as string));
      }),
      { numRuns: 1000 },
    );
  });

  it('balance, ΔrH°, Hess and derivation on random equations and values', () => {
    const parsed = equationText.map((t) => {
      try {
        return parseEquation(t);
      } catch {
        return null;
      }
    });
    fc.assert(
      fc.property(parsed, parsed, anything, fc.double(), (eq, other, junk, number) => {
        fc.pre(eq !== null && other !== null);
        const e = eq as Equation;
        onlyThermoErrors(() => checkBalance(e));
        onlyThermoErrors(() => autoBalance(e));
        onlyThermoErrors(() => reactionEnthalpy(e, () => junk as never));
        onlyThermoErrors(() => reactionEnthalpy(e, () => ({ value: number, uncertainty: number })));
        onlyThermoErrors(() =>
          solveHess(e, [
            { equation: other as Equation, deltaH: number },
            { equation: e, deltaH: 1, uncertainty: junk as number },
          ]),
        );
        onlyThermoErrors(() => solveHess(e, junk as never));
        const first = e.reactants[0];
        onlyThermoErrors(() =>
          deriveFormationEnthalpy(e, number, junk as number, first?.id ?? 'H2O', () => ({
            value: 1,
          })),
        );
        onlyThermoErrors(() =>
          reactionEnthalpyAtT(e, number, () => ({ value: 1, thermal: junk as never })),
        );
      }),
      { numRuns: 500 },
    );
  });

  it('engine functions handed objects that are not equations', () => {
    fc.assert(
      fc.property(anything, anything, (a, b) => {
        const fake = { reactants: [a], products: [b] } as unknown as Equation;
        for (const eq of [a as Equation, fake]) {
          onlyThermoErrors(() => checkBalance(eq));
          onlyThermoErrors(() => autoBalance(eq));
          onlyThermoErrors(() => reactionEnthalpy(eq, () => ({ value: 1 })));
          onlyThermoErrors(() => solveHess(eq, [{ equation: eq, deltaH: 1 }]));
          onlyThermoErrors(() => reactionEnthalpyAtT(eq, 500, () => undefined));
        }
      }),
      { numRuns: 500 },
    );
  });

  it('heating values, heat capacities and units on junk', () => {
    fc.assert(
      fc.property(mutatedText(termText), anything, fc.double(), (s, junk, T) => {
        onlyThermoErrors(() => heatingValues(s, {}));
        onlyThermoErrors(() => heatingValues(s, junk as never));
        onlyThermoErrors(() => enthalpyIncrement(junk as never, T));
        onlyThermoErrors(() =>
          enthalpyIncrement(
            {
              kind: 'shomate',
              ranges: [{ tMin: 1, tMax: 2000, A: 1, B: 1, C: 1, D: 1, E: junk as number }],
            },
            T,
          ),
        );
        onlyThermoErrors(() => convertEnergy(T, junk as 'J/mol', 'kJ/mol'));
      }),
      { numRuns: 1000 },
    );
  });

  it('every exported function, called with junk arguments', () => {
    const functions = Object.entries(engine).filter(
      (entry): entry is [string, (...args: unknown[]) => unknown] =>
        typeof entry[1] === 'function' && entry[0] !== 'ThermoError',
    );
    expect(functions.length).toBeGreaterThan(30);
    const junk = fc.oneof(
      anything,
      fc.constantFrom('H2O(l)', 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)', 'Na+', 298.15),
    );
    fc.assert(
      fc.property(fc.array(junk, { maxLength: 6 }), (args) => {
        for (const [, f] of functions) onlyThermoErrors(() => f(...args));
      }),
      { numRuns: Number(process.env.FUZZ_RUNS ?? 300) },
    );
  });
});
