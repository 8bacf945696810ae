import {
  assertBalanced,
  autoBalance,
  fromJoulesPerMole,
  parseEquation,
  printEquation,
  reactionEnthalpy,
  reactionEnthalpyAtT,
  STANDARD_TEMPERATURE,
  ThermoError,
  type Equation,
  type FormationValue,
  type PhaseTransition,
  type Term,
  type TemperatureValue,
  type TermContribution,
  type TermAtTemperature,
  type ThermalData,
} from '../../thermo';
import { AppError } from '../../lib/app-error';
import type { ReleaseSnapshot, SpeciesPhaseEntry } from '../releases/release-snapshot';
import { resolveEquation, type Resolution, type ResolvedTerm } from './reaction-resolver';
import type {
  ReactionEnthalpyAnswer,
  ReactionTermAnswer,
  ReactionUnitName,
} from './reactions-schemas';

/** The safety caution every calculation answer carries (PRODUCT.md, Safety). */
export const SAFETY_CAUTION =
  'Computed values are estimates from tabulated data; hazard assessment of real processes ' +
  'needs measured data (e.g. reaction calorimetry) and review under local codes and licensed ' +
  'engineering practice.';

const REFERENCE_NOTE = 'element in its reference state: ΔfH° = 0 by definition';

export interface ReactionRequestOn {
  readonly equation: string;
  readonly temperatureK: number;
  readonly unit: ReactionUnitName;
}

type Answer = Omit<ReactionEnthalpyAnswer, 'caution'>;

/**
 * ΔrH° of one equation against one release snapshot: parse, resolve, balance, then Hess's law
 * (and Kirchhoff's law away from 298.15 K) in the engine. Throws ThermoError or AppError.
 */
export function computeReaction(snap: ReleaseSnapshot, req: ReactionRequestOn): Answer {
  const resolution = resolveEquation(snap, parseEquation(req.equation));
  checkBalanced(resolution);
  return req.temperatureK === STANDARD_TEMPERATURE
    ? atStandard(snap, resolution, req)
    : atTemperature(snap, resolution, req);
}

function checkBalanced(r: Resolution): void {
  try {
    assertBalanced(r.balanceEquation);
  } catch (err) {
    if (!(err instanceof ThermoError && err.code === 'unbalanced')) throw err;
    const imbalance = Object.fromEntries(
      Object.entries(err.details['imbalance'] as Record<string, string>).map(([el, v]) => [
        el,
        fractionValue(v),
      ]),
    );
    throw new AppError(422, 'unbalanced', err.message, {
      imbalance,
      charge: fractionValue(String(err.details['charge'] ?? '0')),
      suggestion: suggestion(r.hasKeys ? r.balanceEquation : r.equation),
    });
  }
}

function fractionValue(text: string): number {
  const [n, d] = text.split('/');
  return d === undefined ? Number(n) : Number(n) / Number(d);
}

function suggestion(eq: Equation): string | null {
  try {
    return printEquation(autoBalance(eq));
  } catch (err) {
    if (err instanceof ThermoError) return null;
    throw err;
  }
}

/** The value the engine sees for a resolved term; provenance passes through in `resolved`. */
function formationOf(r: ResolvedTerm): FormationValue | undefined {
  const f = r.entry?.formation;
  if (!f) return undefined;
  return {
    value: f.joules,
    uncertainty: f.uncertaintyJoules,
    uncertaintyBasis: f.uncertaintyBasis,
  };
}

function atStandard(snap: ReleaseSnapshot, r: Resolution, req: ReactionRequestOn): Answer {
  const result = reactionEnthalpy(r.equation, (t) => formationOf(r.byTerm.get(t)!), {
    requireBalanced: false,
  });
  const out = converter(req.unit);
  return {
    release: snap.version,
    equation: printEquation(r.equation),
    temperatureK: req.temperatureK,
    unit: req.unit,
    deltaH: out(result.deltaH),
    uncertainty: result.uncertainty === null ? null : out(result.uncertainty),
    uncertaintyBasis: basisText(result.uncertainty, result.uncertaintyBasis),
    terms: result.terms.map((c) => termAnswer(c, r.byTerm.get(c.term)!, out)),
    assumptions: [...r.assumptions, ...pressureNotes(r)],
  };
}

function atTemperature(snap: ReleaseSnapshot, r: Resolution, req: ReactionRequestOn): Answer {
  const T = req.temperatureK;
  const missing: { species: string; needs: string }[] = [];
  const thermal = new Map<Term, ThermalData | undefined>();
  for (const [term, resolved] of r.byTerm) {
    thermal.set(term, thermalData(term, resolved.entry, T, missing));
  }
  if (missing.length > 0) {
    throw new AppError(
      422,
      'missing_data',
      `release ${snap.version} lacks data for ${T} K: ${missing.map((m) => `${m.species} (${m.needs})`).join(', ')}`,
      { missing: [...new Set(missing.map((m) => m.species))], needs: missing },
    );
  }
  const lookup = (t: Term): TemperatureValue | undefined => {
    const f = formationOf(r.byTerm.get(t)!);
    const th = thermal.get(t);
    return f === undefined && th === undefined ? undefined : { ...f, thermal: th };
  };
  const result = reactionEnthalpyAtT(r.equation, T, lookup, { requireBalanced: false });
  const out = converter(req.unit);
  return {
    release: snap.version,
    equation: printEquation(r.equation),
    temperatureK: T,
    unit: req.unit,
    deltaH: out(result.deltaH),
    deltaH298: out(result.deltaH298),
    uncertainty: result.uncertainty === null ? null : out(result.uncertainty),
    uncertaintyBasis: basisText(result.uncertainty, result.uncertaintyBasis),
    terms: result.terms.map((c) => temperatureTerm(c, r.byTerm.get(c.term)!, out)),
    assumptions: [
      ...r.assumptions,
      ...pressureNotes(r),
      `ΔrH°(${T} K) by Kirchhoff's law from the release's heat-capacity sets; the uncertainty covers the 298.15 K formation enthalpies only`,
    ],
  };
}

/**
 * Heat-capacity model of the term's phase and the transitions between 298.15 K and T, each
 * with the model of the phase it leads into; what is missing is added to `missing`.
 */
function thermalData(
  term: Term,
  entry: SpeciesPhaseEntry | null,
  T: number,
  missing: { species: string; needs: string }[],
): ThermalData | undefined {
  const model = entry?.heatCapacity?.model;
  if (!entry || !model) {
    missing.push({ species: term.id, needs: 'heat-capacity data' });
    return undefined;
  }
  const up = T > STANDARD_TEMPERATURE;
  const transitions: PhaseTransition[] = [];
  let at = entry;
  let from = STANDARD_TEMPERATURE;
  for (;;) {
    const next = up
      ? at.transitionsUp.find((tr) => tr.temperature > from)
      : at.transitionsDown.find((tr) => tr.temperature < from);
    if (!next || (up ? next.temperature >= T : next.temperature <= T)) break;
    const beyond = up ? next.to : next.from;
    if (!beyond.heatCapacity) {
      missing.push({
        species: term.id,
        needs: `heat-capacity data of phase ${beyond.phase}${beyond.modification ? `, ${beyond.modification}` : ''} beyond its transition at ${next.temperature} K`,
      });
      return undefined;
    }
    transitions.push({
      temperature: next.temperature,
      deltaH: next.deltaH,
      phase: up ? next.to.phase : next.from.phase,
      model: beyond.heatCapacity.model,
    });
    at = beyond;
    from = next.temperature;
  }
  return { model, transitions };
}

type Convert = (jPerMol: number) => number;

function converter(unit: ReactionUnitName): Convert {
  return unit === 'J/mol' ? (v) => v : (v) => fromJoulesPerMole(v, unit);
}

function basisText(uncertainty: number | null, basis: string | null): string {
  if (uncertainty === null) return 'unavailable';
  return basis ?? 'exact';
}

function pressureNotes(r: Resolution): string[] {
  const atm = [...r.byTerm.values()].filter(
    (t) => t.entry?.formation?.standardPressure === '1 atm',
  );
  return atm.length === 0
    ? []
    : [
        `ΔfH° of ${atm.map((t) => t.term.id).join(', ')} is on the older 1 atm standard pressure (the rest on 1 bar); the difference is negligible for enthalpies of condensed phases and ideal gases`,
      ];
}

function termAnswer(c: TermContribution, r: ResolvedTerm, out: Convert): ReactionTermAnswer {
  const f = r.entry?.formation ?? null;
  const reference = c.referenceState;
  return {
    species: r.species?.key ?? null,
    formula: r.species?.formula ?? (c.term.species.kind === 'formula' ? c.term.species.hill : ''),
    phase: c.term.phase as ReactionTermAnswer['phase'],
    modification: c.term.modification,
    coefficient: c.nu.valueOf(),
    deltaFH: out(c.formationEnthalpy),
    uncertainty: c.uncertainty === null ? null : out(c.uncertainty),
    uncertaintyBasis: reference ? null : c.uncertaintyBasis,
    revisionId: f?.revisionId ?? null,
    source: f ? { citation: f.source.citation, doi: f.source.doi } : null,
    referenceState: reference,
    note: reference ? REFERENCE_NOTE : null,
    standardPressure: f?.standardPressure ?? null,
  };
}

function temperatureTerm(c: TermAtTemperature, r: ResolvedTerm, out: Convert): ReactionTermAnswer {
  const cp = r.entry?.heatCapacity ?? null;
  const crossed = r.entry ? [...r.entry.transitionsUp, ...r.entry.transitionsDown] : [];
  return {
    ...termAnswer(c, r, out),
    enthalpyIncrement: out(c.increment),
    transitions: c.transitions.map((tr) => ({
      temperature: tr.temperature,
      deltaH: out(tr.deltaH),
      phase: tr.phase,
      revisionId: crossed.find((x) => x.temperature === tr.temperature)?.revisionId ?? null,
    })),
    heatCapacity: cp
      ? { revisionId: cp.revisionId, source: { citation: cp.source.citation, doi: cp.source.doi } }
      : null,
  };
}
