import {
  autoBalance,
  checkBalance,
  fractionText,
  fromJoulesPerMole,
  parseEquation,
  printEquation,
  solveHess,
  ThermoError,
  toJoulesPerMole,
  type Equation,
  type Term,
} from '../../thermo';
import type { HessAnswer, HessInput, ParseAnswer } from './calculate-schemas';

/** Parses one equation, naming the request field in any error so the client can point at it. */
function parseField(text: string, field: string): Equation {
  try {
    return parseEquation(text);
  } catch (err) {
    if (err instanceof ThermoError)
      throw new ThermoError(err.code, err.message, { ...err.details, field });
    throw err;
  }
}

const speciesLabel = (t: Term) =>
  t.species.kind === 'key' ? `[${t.species.key}]` : t.species.formula;

/** One term as the parse route lists it; the coefficient is negative for reactants. */
const speciesEntry = (t: Term, sign: 1 | -1) => ({
  formula: speciesLabel(t),
  phase: t.phase,
  modification: t.modification,
  coefficient: fractionText(sign === 1 ? t.coefficient : t.coefficient.neg()),
});

/** What the equation editor shows while someone types: normal form, balance, a suggestion. */
export function describeEquation(text: string): ParseAnswer {
  const eq = parseField(text, 'equation');
  const report = checkBalance(eq);
  return {
    normalized: printEquation(eq),
    // null when a registry-key term hides its composition: the balance cannot be judged.
    balanced: report.balanced,
    imbalance: Object.fromEntries(
      Object.entries(report.imbalance).map(([el, f]) => [el, fractionText(f)]),
    ),
    charge: fractionText(report.charge),
    unknownComposition: [...report.unknownComposition],
    suggestion: report.balanced === false ? suggestBalance(eq) : null,
    species: [
      ...eq.reactants.map((t) => speciesEntry(t, -1)),
      ...eq.products.map((t) => speciesEntry(t, 1)),
    ],
  };
}

function suggestBalance(eq: Equation): string | null {
  try {
    return printEquation(autoBalance(eq));
  } catch (err) {
    if (err instanceof ThermoError) return null;
    throw err;
  }
}

/** Hess combination in the caller's unit; the engine works in J/mol and the sum is linear. */
export function combineSteps(input: HessInput): HessAnswer {
  const { unit } = input;
  const target = parseField(input.target, 'target');
  const steps = input.steps.map((s, i) => ({
    equation: parseField(s.equation, `steps[${i}].equation`),
    deltaH: toJoulesPerMole(s.deltaH, unit),
    uncertainty: s.uncertainty === undefined ? null : toJoulesPerMole(s.uncertainty, unit),
  }));
  const result = solveHess(target, steps);
  const out = (jPerMol: number) => fromJoulesPerMole(jPerMol, unit);
  return {
    target: printEquation(result.target),
    deltaH: out(result.deltaH),
    uncertainty: result.uncertainty === null ? null : out(result.uncertainty),
    unit,
    multipliers: result.multipliers.map(fractionText),
    unused: result.unused,
    alternativeSolutions: result.alternativeSolutions,
    steps: result.steps.map((s) => ({
      index: s.index,
      multiplier: fractionText(s.multiplier),
      flipped: s.flipped,
      scale: fractionText(s.scale),
      deltaH: out(s.deltaH),
      equation: printEquation(steps[s.index].equation),
    })),
  };
}
