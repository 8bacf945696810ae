import {
  autoBalance,
  checkBalance,
  fractionText,
  fromJoulesPerMole,
  notationHints,
  parseEquation,
  phaseName,
  printEquation,
  solveHess,
  ThermoError,
  toJoulesPerMole,
  type EnergyUnit,
  type Equation,
  type Term,
} from '../../thermo';
import { AppError } from '../../lib/app-error';
import type { HessAnswer, HessInput, ParseAnswer } from './calculate-schemas';

/**
 * Where a value came from in the request: `field` is its path (`steps[2].equation`), `index` the
 * 0-based step index for programs, `label` how a person finds it on the form (steps from 1).
 */
interface Place {
  readonly field: string;
  readonly label: string;
  readonly index?: number;
}

const TARGET: Place = { field: 'target', label: 'target' };
const stepPlace = (i: number, part: 'equation' | 'deltaH' | 'uncertainty'): Place => ({
  field: `steps[${i}].${part}`,
  label: `step ${i + 1} ${part === 'deltaH' ? 'ΔH' : part}`,
  index: i,
});
const where = (p: Place) =>
  p.index === undefined ? { field: p.field } : { field: p.field, index: p.index };

/** Re-throws an engine error with the request field named, in the message and the details. */
function inField<T>(place: Place, run: () => T): T {
  try {
    return run();
  } catch (err) {
    if (err instanceof ThermoError)
      throw new ThermoError(err.code, `${place.label}: ${err.message}`, {
        ...err.details,
        ...where(place),
      });
    throw err;
  }
}

const parseField = (text: string, place: Place): Equation =>
  inField(place, () => parseEquation(text));

const speciesLabel = (t: Term) =>
  t.species.kind === 'key' ? `[${t.species.key}]` : t.species.formula;

/** One term as the parse route lists it; the coefficient is negative for reactants. */
const speciesEntry = (t: Term, sign: 1 | -1) => ({
  formula: speciesLabel(t),
  phase: t.phase,
  modification: t.modification,
  phaseName: phaseName(t.phase, t.modification),
  coefficient: fractionText(sign === 1 ? t.coefficient : t.coefficient.neg()),
});

/** What the equation editor shows while someone types: normal form, balance, a suggestion. */
export function describeEquation(text: string): ParseAnswer {
  const eq = parseField(text, { field: 'equation', label: 'equation' });
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
    hints: notationHints(eq),
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

/**
 * With no registry to resolve from, a term without a phase is ambiguous (H2O as liquid or gas
 * differs by 44 kJ/mol): every term of a Hess problem must name its phase.
 */
function requirePhases(eq: Equation, place: Place): void {
  const bare = [...eq.reactants, ...eq.products].find((t) => t.phase === null);
  if (bare === undefined) return;
  const term = speciesLabel(bare);
  throw new AppError(
    422,
    'missing_phase',
    `${place.label}: ${term} has no phase; write it as ${term}(g), ${term}(l), ${term}(cr) or ${term}(aq) — the phase changes ΔH`,
    { ...where(place), term },
  );
}

/** A request energy in J/mol, refusing values whose conversion overflows (naming the field). */
function joules(value: number, unit: EnergyUnit, place: Place): number {
  return inField(place, () => toJoulesPerMole(value, unit));
}

/** Hess combination in the caller's unit; the engine works in J/mol and the sum is linear. */
export function combineSteps(input: HessInput): HessAnswer {
  const { unit } = input;
  const target = parseField(input.target, TARGET);
  requirePhases(target, TARGET);
  const steps = input.steps.map((s, i) => {
    const equation = parseField(s.equation, stepPlace(i, 'equation'));
    requirePhases(equation, stepPlace(i, 'equation'));
    return {
      equation,
      deltaH: joules(s.deltaH, unit, stepPlace(i, 'deltaH')),
      uncertainty:
        s.uncertainty === undefined
          ? null
          : joules(s.uncertainty, unit, stepPlace(i, 'uncertainty')),
    };
  });
  const result = solveWithFields(target, steps, unit);
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
      equation: printEquation(steps[s.index]!.equation),
    })),
  };
}

/** The engine names a failing step by its 0-based `step`; the answer adds its field path. */
function solveWithFields(
  target: Equation,
  steps: Parameters<typeof solveHess>[1],
  unit: EnergyUnit,
): ReturnType<typeof solveHess> {
  try {
    return solveHess(target, steps, { unit });
  } catch (err) {
    if (!(err instanceof ThermoError)) throw err;
    const step = err.details['step'];
    const place =
      typeof step === 'number'
        ? where(stepPlace(step, 'equation'))
        : err.details['target']
          ? where(TARGET)
          : {};
    const unitDetail = err.code === 'not_unique' || err.code === 'out_of_range' ? { unit } : {};
    throw new ThermoError(err.code, err.message, { ...err.details, ...place, ...unitDetail });
  }
}
