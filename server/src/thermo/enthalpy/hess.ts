import type Fraction from 'fraction.js';
import { ThermoError } from '../errors/thermo-error';
import { equationFromStoichiometry, stoichiometry } from '../equation/equation-builder';
import type { Equation, Term } from '../equation/equation-types';
import { printEquation } from '../equation/equation-printer';
import { solveLinear } from '../rational/rational-matrix';
import { fractionText, isZero, scaleNumber, sign, ZERO } from '../rational/rational';
import { toEquation } from '../equation/equation-input';
import { balanceFor, type BalanceOptions } from './reaction-enthalpy';
import { QuadratureSum } from './uncertainty';
import { fromJoulesPerMole, type EnergyUnit } from './units';

export interface HessStep {
  readonly equation: Equation | string;
  /** ΔH of the step as written, J/mol. */
  readonly deltaH: number;
  /** Uncertainty of ΔH in J/mol, if known. */
  readonly uncertainty?: number | null;
}

export interface HessStepUse {
  readonly index: number;
  /** mᵢ in Σ mᵢ·stepᵢ = target. */
  readonly multiplier: Fraction;
  /** The step is used reversed (m < 0). */
  readonly flipped: boolean;
  /** |m|. */
  readonly scale: Fraction;
  /** mᵢ·ΔHᵢ, J/mol. */
  readonly deltaH: number;
}

export interface HessResult {
  readonly target: Equation;
  readonly deltaH: number;
  /** √Σ(mᵢuᵢ)² over used steps (root sum of squares, independent steps); null if one has none. */
  readonly uncertainty: number | null;
  readonly multipliers: Fraction[];
  readonly steps: HessStepUse[];
  /** Indices of steps with m = 0. */
  readonly unused: number[];
  /**
   * Other multiplier sets reach the target too; they all give the same ΔH (otherwise the call
   * fails with `not_unique`). The one returned sets the free multipliers to zero, so it uses the
   * earliest-listed independent steps.
   */
  readonly alternativeSolutions: boolean;
}

export interface HessOptions extends BalanceOptions {
  /**
   * How far (J/mol) a closed cycle of steps may miss zero and still count as consistent.
   * Default: floating-point noise only (1e-9 relative to the cycle's terms).
   */
  readonly cycleTolerance?: number;
  /** Unit of the energies in error messages and details (default J/mol); results stay J/mol. */
  readonly unit?: EnergyUnit;
}

interface PreparedStep {
  readonly equation: Equation;
  readonly deltaH: number;
  readonly uncertainty: number | null;
}

function prepare(steps: readonly HessStep[]): PreparedStep[] {
  if (!Array.isArray(steps) || steps.length === 0) {
    throw new ThermoError('no_combination', 'no steps to combine');
  }
  return steps.map((s, index) => {
    if (s === null || typeof s !== 'object')
      throw new ThermoError('invalid_input', `step ${index + 1} is not an object`, { step: index });
    let equation: Equation;
    try {
      equation = toEquation(s.equation);
    } catch (err) {
      if (err instanceof ThermoError) {
        throw new ThermoError(err.code, `step ${index + 1}: ${err.message}`, {
          ...err.details,
          step: index,
        });
      }
      throw err;
    }
    if (typeof s.deltaH !== 'number' || !Number.isFinite(s.deltaH)) {
      throw new ThermoError(
        'invalid_input',
        `step ${index + 1}: ΔH must be a finite number of J/mol`,
        {
          step: index,
        },
      );
    }
    const u = s.uncertainty;
    if (u !== undefined && u !== null && (typeof u !== 'number' || !Number.isFinite(u) || u < 0)) {
      throw new ThermoError(
        'invalid_input',
        `step ${index + 1}: uncertainty must be a finite number ≥ 0`,
        { step: index },
      );
    }
    return { equation, deltaH: s.deltaH, uncertainty: u ?? null };
  });
}

/** Σ mᵢ·ΔHᵢ in index order; negating every m negates the sum exactly. */
function weightedSum(values: readonly number[], m: readonly Fraction[]): number {
  let total = 0;
  for (let i = 0; i < values.length; i++)
    total += scaleNumber(values[i] as number, m[i] as Fraction);
  return total;
}

/**
 * Hess's law over user-given steps: finds exact multipliers with Σ mᵢ·stepᵢ = target, column by
 * species-phase (H2O(l) and H2O(g) are different columns), and ΔH = Σ mᵢ·ΔHᵢ.
 */
export function solveHess(
  target: Equation | string,
  steps: readonly HessStep[],
  options: HessOptions = {},
): HessResult {
  const goal = toEquation(target);
  const prepared = prepare(steps);
  // Each step and the target must balance on their own: an unbalanced step is almost always a typo.
  balanceFor(goal, options, { target: true });
  prepared.forEach((s, index) => balanceFor(s.equation, options, { step: index }));
  const columns = new Map<string, Term>();
  const vectors = [goal, ...prepared.map((s) => s.equation)].map((eq) => {
    const st = stoichiometry(eq);
    for (const [id, { term }] of st) if (!columns.has(id)) columns.set(id, term);
    return st;
  });
  const ids = [...columns.keys()];
  const [goalVector, ...stepVectors] = vectors;
  const a = ids.map((id) => stepVectors.map((v) => v.get(id)?.nu ?? ZERO));
  const b = ids.map((id) => goalVector?.get(id)?.nu ?? ZERO);
  const solution = solveLinear(a, b, prepared.length);

  if (!solution.consistent) throw unreachable(ids, goal, stepVectors, solution.certificate);

  const deltaHs = prepared.map((s) => s.deltaH);
  const tolerance = options.cycleTolerance ?? 0;
  for (const cycle of solution.nullSpace) {
    const cycleDeltaH = weightedSum(deltaHs, cycle);
    const scale = cycle.reduce(
      (acc, m, i) => acc + Math.abs(scaleNumber(deltaHs[i] as number, m)),
      0,
    );
    if (!Number.isFinite(cycleDeltaH)) throw overflow('ΔH', options.unit);
    if (Math.abs(cycleDeltaH) > Math.max(tolerance, 1e-9 * scale))
      throw inconsistent(cycle, cycleDeltaH, prepared, columns, options.unit ?? 'J/mol');
  }

  const multipliers = solution.particular;
  const uses: HessStepUse[] = multipliers.map((m, index) => ({
    index,
    multiplier: m,
    flipped: sign(m) < 0,
    scale: m.abs(),
    deltaH: scaleNumber(deltaHs[index] as number, m),
  }));
  const combined = new QuadratureSum();
  multipliers.forEach((m, i) => {
    const u = (prepared[i] as PreparedStep).uncertainty;
    if (!isZero(m)) combined.add(u === null ? null : scaleNumber(u, m), null);
  });
  const deltaH = weightedSum(deltaHs, multipliers);
  if (!Number.isFinite(deltaH) || uses.some((u) => !Number.isFinite(u.deltaH)))
    throw overflow('ΔH', options.unit);
  const uncertainty = combined.uncertainty;
  if (uncertainty !== null && !Number.isFinite(uncertainty))
    throw overflow('the uncertainty', options.unit);
  return {
    target: goal,
    deltaH,
    uncertainty,
    multipliers,
    steps: uses,
    unused: uses.filter((u) => isZero(u.multiplier)).map((u) => u.index),
    alternativeSolutions: solution.nullSpace.length > 0,
  };
}

function overflow(what: string, unit: EnergyUnit = 'J/mol'): ThermoError {
  return new ThermoError(
    'out_of_range',
    `${what} of the combination is too large to compute: beyond ±${fromJoulesPerMole(Number.MAX_VALUE, unit).toPrecision(3)} ${unit}`,
    { unit },
  );
}

/** An energy for a message: 12 significant digits hide float noise such as 1.0000000000002. */
const energyText = (value: number): string => String(Number(value.toPrecision(12)));

function unreachable(
  ids: readonly string[],
  goal: Equation,
  stepVectors: readonly Map<string, unknown>[],
  certificate: readonly Fraction[],
): ThermoError {
  const inTarget = new Set([...goal.reactants, ...goal.products].map((t) => t.id));
  const unmatched = ids.filter((id) => inTarget.has(id) && stepVectors.every((v) => !v.has(id)));
  // The certificate's non-zero rows are the species whose balance the steps cannot satisfy together.
  const conflicting = ids.filter((_, i) => !isZero(certificate[i] as Fraction));
  const message =
    unmatched.length > 0
      ? `the target cannot be reached: no step contains ${unmatched.join(', ')}`
      : `the target cannot be reached: no combination of the steps matches ${conflicting.join(', ')} at the same time`;
  return new ThermoError('no_combination', message, { unmatched, conflicting });
}

function inconsistent(
  cycle: readonly Fraction[],
  cycleDeltaH: number,
  steps: readonly PreparedStep[],
  columns: ReadonlyMap<string, Term>,
  unit: EnergyUnit,
): ThermoError {
  const used = cycle.map((m, index) => ({ index, m })).filter(({ m }) => !isZero(m));
  const combination = used
    .map(({ index, m }, k) => {
      const s = sign(m) < 0 ? (k === 0 ? '−' : ' − ') : k === 0 ? '' : ' + ';
      return `${s}${fractionText(m.abs())}×(step ${index + 1})`;
    })
    .join('');
  // The same net reaction reached by the positive and by the negative part of the cycle.
  const positive = used.filter(({ m }) => sign(m) > 0);
  const net = new Map<string, { term: Term; nu: Fraction }>();
  for (const { index, m } of positive) {
    for (const [id, { nu }] of stoichiometry((steps[index] as PreparedStep).equation)) {
      const prev = net.get(id)?.nu ?? ZERO;
      net.set(id, { term: columns.get(id) as Term, nu: prev.add(nu.mul(m)) });
    }
  }
  let reaction = '(no net change)';
  try {
    reaction = printEquation(equationFromStoichiometry(net.values()));
  } catch {
    // A positive part that cancels to nothing leaves the placeholder.
  }
  const viaPositive = positive.reduce(
    (acc, { index, m }) => acc + scaleNumber((steps[index] as PreparedStep).deltaH, m),
    0,
  );
  const viaNegative = viaPositive - cycleDeltaH;
  const [cycleValue, one, other] = [cycleDeltaH, viaPositive, viaNegative].map((v) =>
    fromJoulesPerMole(v, unit),
  ) as [number, number, number];
  return new ThermoError(
    'not_unique',
    `the steps are thermodynamically inconsistent: ${combination} is a closed cycle with ΔH = ${energyText(cycleValue)} ${unit} instead of 0, ` +
      `so ${reaction} gets ΔH = ${energyText(one)} ${unit} one way and ${energyText(other)} ${unit} the other, and the multipliers are not unique`,
    {
      combination,
      multipliers: cycle.map(fractionText),
      cycleDeltaH: cycleValue,
      reaction,
      deltaHs: [one, other],
      unit,
    },
  );
}
