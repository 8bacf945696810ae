import { ThermoError } from '../errors/thermo-error';
import type { Equation, Term } from '../equation/equation-types';
import type { FormationValue, UncertaintyBasis } from '../enthalpy/formation-data';
import {
  enthalpyChange,
  enthalpyIncrement,
  modelRange,
  type HeatCapacityModel,
} from './heat-capacity';
import { toEquation } from '../equation/equation-input';
import type { BalanceReport } from '../balance/balance';
import {
  balanceFor,
  combine,
  evaluateTerms,
  type BalanceOptions,
  type TermContribution,
} from '../enthalpy/reaction-enthalpy';
import { scaleNumber } from '../rational/rational';
import type { CombinedBasis } from '../enthalpy/uncertainty';
import { STANDARD_TEMPERATURE } from '../enthalpy/units';

/**
 * A phase transition met when moving away from 298.15 K: for a transition above 298.15 K,
 * `deltaH` is the enthalpy of heating through it (fusion, vaporization) and `model` the phase
 * above; for one below, `deltaH` is still the heating-direction enthalpy (subtracted on the way
 * down) and `model` the phase below.
 */
export interface PhaseTransition {
  readonly temperature: number;
  /** ΔtrsH in J/mol, heating direction. */
  readonly deltaH: number;
  /** The phase entered, for the breakdown (e.g. 'g'). */
  readonly phase?: string;
  readonly model: HeatCapacityModel;
}

export interface ThermalData {
  /** Heat-capacity model of the phase the term names (the phase at 298.15 K). */
  readonly model: HeatCapacityModel;
  readonly transitions?: readonly PhaseTransition[];
}

/** Lookup result for temperature-dependent work: ΔfH° (not needed for reference elements) and Cp data. */
export interface TemperatureValue {
  readonly value?: number;
  readonly uncertainty?: number | null;
  readonly uncertaintyBasis?: UncertaintyBasis | null;
  readonly thermal?: ThermalData;
  readonly [provenance: string]: unknown;
}

export type TemperatureLookup = (term: Term) => TemperatureValue | undefined;

export interface TermAtTemperature extends TermContribution {
  /** H°(T) − H°(298.15 K) of the species, J/mol, including crossed transitions. */
  readonly increment: number;
  readonly transitions: readonly { temperature: number; deltaH: number; phase: string | null }[];
}

export interface ReactionEnthalpyAtT {
  readonly temperature: number;
  /** ΔrH°(T), J/mol. */
  readonly deltaH: number;
  /** ΔrH°(298.15 K), J/mol. */
  readonly deltaH298: number;
  /** Uncertainty of the 298.15 K part only (heat-capacity data carry none here); J/mol. */
  readonly uncertainty: number | null;
  readonly uncertaintyBasis: CombinedBasis | null;
  readonly terms: readonly TermAtTemperature[];
  readonly balance: BalanceReport;
}

interface Segment {
  readonly increment: number;
  readonly crossed: { temperature: number; deltaH: number; phase: string | null }[];
}

function outOfRange(term: Term, err: ThermoError, model: HeatCapacityModel): ThermoError {
  const range = modelRange(model);
  return new ThermoError('out_of_range', `${term.id}: ${err.message}`, {
    ...err.details,
    species: term.id,
    range,
  });
}

/** H(T) − H(298.15) along the species' phases, adding ΔtrsH for every transition crossed. */
export function speciesIncrement(term: Term, thermal: ThermalData, T: number): Segment {
  if (
    thermal === null ||
    typeof thermal !== 'object' ||
    (thermal.transitions !== undefined && !Array.isArray(thermal.transitions))
  ) {
    throw new ThermoError(
      'invalid_input',
      `${term.id}: thermal data needs a model and an optional list of transitions`,
      { species: term.id },
    );
  }
  for (const tr of thermal.transitions ?? []) {
    if (
      tr === null ||
      typeof tr !== 'object' ||
      !Number.isFinite(tr.temperature) ||
      !Number.isFinite(tr.deltaH)
    ) {
      throw new ThermoError(
        'invalid_input',
        `${term.id}: a phase transition needs a finite temperature and ΔtrsH`,
        { species: term.id },
      );
    }
  }
  const up = T > STANDARD_TEMPERATURE;
  const transitions = [...(thermal.transitions ?? [])]
    .filter((tr) =>
      up
        ? tr.temperature > STANDARD_TEMPERATURE && tr.temperature < T
        : tr.temperature < STANDARD_TEMPERATURE && tr.temperature > T,
    )
    .sort((a, b) => (up ? a.temperature - b.temperature : b.temperature - a.temperature));
  let model = thermal.model;
  let from = STANDARD_TEMPERATURE;
  let increment = 0;
  const crossed: Segment['crossed'] = [];
  const run = (to: number): number => {
    try {
      return from === STANDARD_TEMPERATURE
        ? enthalpyIncrement(model, to)
        : enthalpyChange(model, from, to);
    } catch (err) {
      if (err instanceof ThermoError && err.code === 'out_of_range')
        throw outOfRange(term, err, model);
      throw err;
    }
  };
  for (const tr of transitions) {
    increment += run(tr.temperature) + (up ? tr.deltaH : -tr.deltaH);
    crossed.push({ temperature: tr.temperature, deltaH: tr.deltaH, phase: tr.phase ?? null });
    model = tr.model;
    from = tr.temperature;
  }
  increment += run(T);
  return { increment, crossed };
}

/**
 * Kirchhoff's law: ΔrH°(T) = ΔrH°(298.15 K) + Σν·[H°(T) − H°(298.15 K)], each species carried
 * through its phase transitions inside the interval.
 */
export function reactionEnthalpyAtT(
  eq: Equation | string,
  T: number,
  lookup: TemperatureLookup,
  options?: BalanceOptions,
): ReactionEnthalpyAtT {
  const equation = toEquation(eq);
  const balance = balanceFor(equation, options);
  if (typeof T !== 'number' || !Number.isFinite(T) || T <= 0) {
    throw new ThermoError('invalid_input', 'temperature must be a positive number of kelvin', {
      temperature: T,
    });
  }
  if (typeof lookup !== 'function')
    throw new ThermoError('invalid_input', 'lookup must be a function');
  const found = new Map<Term, TemperatureValue | undefined>();
  const ask = (term: Term): TemperatureValue | undefined => {
    if (!found.has(term)) found.set(term, lookup(term) ?? undefined);
    return found.get(term);
  };
  const missing: { species: string; needs: string }[] = [];
  let standard: TermContribution[] = [];
  try {
    standard = evaluateTerms(equation, (term) => {
      const v = ask(term);
      return v === undefined || v.value === undefined ? undefined : (v as FormationValue);
    });
  } catch (err) {
    if (!(err instanceof ThermoError && err.code === 'missing_data')) throw err;
    for (const id of err.details['missing'] as string[])
      missing.push({ species: id, needs: 'standard enthalpy of formation' });
  }
  const atStandard = T === STANDARD_TEMPERATURE;
  if (!atStandard) {
    // Reference elements have ΔfH° = 0 but still need heat-capacity data.
    for (const term of [...equation.reactants, ...equation.products]) {
      if (ask(term)?.thermal == null)
        missing.push({ species: term.id, needs: 'heat-capacity data' });
    }
  }
  if (missing.length > 0) {
    const names = [...new Set(missing.map((m) => m.species))];
    throw new ThermoError(
      'missing_data',
      `missing data for ${missing.map((m) => `${m.species} (${m.needs})`).join(', ')}`,
      {
        missing: names,
        needs: missing,
      },
    );
  }
  let products = 0;
  let reactants = 0;
  const terms: TermAtTemperature[] = standard.map((t) => {
    const segment = atStandard
      ? { increment: 0, crossed: [] }
      : speciesIncrement(t.term, (ask(t.term) as TemperatureValue).thermal as ThermalData, T);
    const scaled = scaleNumber(segment.increment, t.nu);
    if (t.side === 'product') products += scaled;
    else reactants -= scaled;
    return { ...t, increment: segment.increment, transitions: segment.crossed };
  });
  const base = combine(standard);
  return {
    temperature: T,
    deltaH: base.deltaH + (products - reactants),
    deltaH298: base.deltaH,
    uncertainty: base.uncertainty,
    uncertaintyBasis: base.uncertaintyBasis,
    terms,
    balance,
  };
}
