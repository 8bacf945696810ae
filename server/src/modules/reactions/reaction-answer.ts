import * as thermo from '../../thermo';
import type {
  Equation,
  FormationValue,
  PhaseTransition,
  Term,
  TemperatureValue,
  TermAtTemperature,
  TermContribution,
  ThermalData,
} from '../../thermo';
import { AppError } from '../../lib/app-error';
import type { ReleaseSnapshot, SpeciesPhaseEntry } from '../releases/release-snapshot';
import { resolveEquation, type Resolution, type ResolvedTerm } from './reaction-resolver';
import type {
  ReactionEnthalpyAnswer,
  ReactionTermAnswer,
  ReactionUnitName,
} from './reactions-schemas';

// Hot path: engine functions bound once (development module loaders put a getter on every
// imported binding, which costs more than a small reaction's arithmetic).
const { assertBalanced, autoBalance, buildEquation, fromJoulesPerMole, parseEquation } = thermo;
const { printEquation, reactionEnthalpy, reactionEnthalpyAtT, STANDARD_TEMPERATURE } = thermo;
const { ThermoError } = thermo;

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
  /** Fuzzy suggestions for unknown species (default true). */
  readonly suggest?: boolean;
}

type Answer = Omit<ReactionEnthalpyAnswer, 'caution'>;
type StaticTerm = Omit<ReactionTermAnswer, 'coefficient' | 'deltaFH' | 'uncertainty'>;

/**
 * What an equation text means in one release, independent of temperature and unit: resolved,
 * balance-checked, printed, with each term's provenance. A published release never changes, so
 * plans are kept per snapshot (bounded); a temperature sweep or a repeated batch reuses them.
 */
interface Plan {
  readonly resolution: Resolution;
  readonly equation: Equation;
  readonly printed: string;
  readonly assumptions: readonly string[];
  readonly values: ReadonlyMap<Term, FormationValue>;
  readonly lookup: (t: Term) => FormationValue | undefined;
  readonly statics: ReadonlyMap<Term, StaticTerm>;
}

const PLAN_LIMIT = 5000;
const plans = new WeakMap<ReleaseSnapshot, Map<string, Plan>>();

function planFor(snap: ReleaseSnapshot, text: string, suggest: boolean): Plan {
  let cache = plans.get(snap);
  if (!cache) plans.set(snap, (cache = new Map()));
  let plan = cache.get(text);
  if (!plan) {
    plan = makePlan(snap, text, suggest);
    if (cache.size >= PLAN_LIMIT) cache.clear();
    cache.set(text, plan);
  }
  return plan;
}

function makePlan(snap: ReleaseSnapshot, text: string, suggest: boolean): Plan {
  const resolution = resolveEquation(snap, parseEquation(text), suggest);
  checkBalanced(resolution);
  const values = new Map<Term, FormationValue>();
  const statics = new Map<Term, StaticTerm>();
  for (const [term, r] of resolution.byTerm) {
    const f = r.entry?.formation;
    if (f) {
      values.set(term, {
        value: f.joules,
        uncertainty: f.uncertaintyJoules,
        uncertaintyBasis: f.uncertaintyBasis,
      });
    }
    statics.set(term, staticTerm(term, r));
  }
  // The engine's own (checked) form, so it does not re-check the terms on every request.
  const built = buildEquation(resolution.equation.reactants, resolution.equation.products);
  const same = [...built.reactants, ...built.products].every((t) => resolution.byTerm.has(t));
  return {
    resolution,
    equation: same ? built : resolution.equation,
    printed: printEquation(resolution.equation),
    assumptions: Object.freeze([
      ...resolution.assumptions,
      ...pressureNotes(resolution),
      ...uncertaintyNotes(resolution),
    ]),
    values,
    lookup: (t) => values.get(t),
    statics,
  };
}

/**
 * ΔrH° of one equation against one release snapshot: parse, resolve, balance, then Hess's law
 * (and Kirchhoff's law away from 298.15 K) in the engine. Throws ThermoError or AppError.
 */
export function computeReaction(snap: ReleaseSnapshot, req: ReactionRequestOn): Answer {
  const plan = planFor(snap, req.equation, req.suggest ?? true);
  return req.temperatureK === STANDARD_TEMPERATURE
    ? atStandard(snap, plan, req)
    : atTemperature(snap, plan, req);
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

function atStandard(snap: ReleaseSnapshot, plan: Plan, req: ReactionRequestOn): Answer {
  const result = reactionEnthalpy(plan.equation, plan.lookup, { requireBalanced: false });
  const out = converter(req.unit);
  const terms: ReactionTermAnswer[] = [];
  for (const c of result.terms) terms.push(termAnswer(c, plan.statics.get(c.term)!, out));
  return {
    release: snap.version,
    equation: plan.printed,
    temperatureK: req.temperatureK,
    unit: req.unit,
    deltaH: out(result.deltaH),
    uncertainty: result.uncertainty === null ? null : out(result.uncertainty),
    uncertaintyBasis: basisText(result.uncertainty, result.uncertaintyBasis),
    terms,
    assumptions: plan.assumptions as string[],
  };
}

interface Thermal {
  readonly data: ThermalData;
  /** Revision of each transition crossed, by temperature. */
  readonly revisions: ReadonlyMap<number, string>;
  readonly heatCapacity: NonNullable<ReactionTermAnswer['heatCapacity']>;
}

function atTemperature(snap: ReleaseSnapshot, plan: Plan, req: ReactionRequestOn): Answer {
  const T = req.temperatureK;
  const missing: { species: string; needs: string }[] = [];
  const thermal = new Map<Term, Thermal>();
  for (const [term, resolved] of plan.resolution.byTerm) {
    const th = thermalData(term, resolved.entry, T, missing);
    if (th) thermal.set(term, th);
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
    const f = plan.values.get(t);
    const th = thermal.get(t)!.data;
    return f === undefined ? { thermal: th } : { ...f, thermal: th };
  };
  const result = reactionEnthalpyAtT(plan.equation, T, lookup, { requireBalanced: false });
  const out = converter(req.unit);
  return {
    release: snap.version,
    equation: plan.printed,
    temperatureK: T,
    unit: req.unit,
    deltaH: out(result.deltaH),
    deltaH298: out(result.deltaH298),
    uncertainty: result.uncertainty === null ? null : out(result.uncertainty),
    uncertaintyBasis: basisText(result.uncertainty, result.uncertaintyBasis),
    terms: result.terms.map((c) =>
      temperatureTerm(c, plan.statics.get(c.term)!, thermal.get(c.term)!, out),
    ),
    assumptions: [
      ...plan.assumptions,
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
): Thermal | undefined {
  const model = entry?.heatCapacity?.model;
  if (!entry || !model) {
    missing.push({ species: term.id, needs: 'heat-capacity data' });
    return undefined;
  }
  const up = T > STANDARD_TEMPERATURE;
  const transitions: PhaseTransition[] = [];
  const revisions = new Map<number, string>();
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
    revisions.set(next.temperature, next.revisionId);
    at = beyond;
    from = next.temperature;
  }
  const set = entry.heatCapacity!;
  return {
    data: { model, transitions },
    revisions,
    heatCapacity: {
      revisionId: set.revisionId,
      source: { citation: set.source.citation, doi: set.source.doi },
    },
  };
}

type Convert = (jPerMol: number) => number;

const SAME: Convert = (v) => v;
const CONVERTERS: Record<ReactionUnitName, Convert> = {
  'J/mol': SAME,
  'kJ/mol': (v) => fromJoulesPerMole(v, 'kJ/mol'),
  'kcal/mol': (v) => fromJoulesPerMole(v, 'kcal/mol'),
};

function converter(unit: ReactionUnitName): Convert {
  return CONVERTERS[unit];
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

/** Why the answer's uncertainty is null: the terms whose value states none. */
function uncertaintyNotes(r: Resolution): string[] {
  const without = [...r.byTerm.values()].filter(
    (t) => !t.referenceState && t.entry?.formation?.uncertaintyJoules === null,
  );
  return without.length === 0
    ? []
    : [
        `no combined uncertainty: the release states none for ΔfH° of ${without.map((t) => t.term.id).join(', ')}`,
      ];
}

/** Everything of a term's answer that does not depend on temperature or unit. */
function staticTerm(term: Term, r: ResolvedTerm): StaticTerm {
  const f = r.entry?.formation ?? null;
  return {
    species: r.species?.key ?? null,
    formula: r.species?.formula ?? (term.species.kind === 'formula' ? term.species.hill : ''),
    phase: term.phase as ReactionTermAnswer['phase'],
    modification: term.modification,
    uncertaintyBasis: null,
    revisionId: f?.revisionId ?? null,
    source: f ? { citation: f.source.citation, doi: f.source.doi } : null,
    referenceState: r.referenceState,
    note: r.referenceState ? REFERENCE_NOTE : null,
    standardPressure: f?.standardPressure ?? null,
  };
}

function termAnswer(c: TermContribution, s: StaticTerm, out: Convert): ReactionTermAnswer {
  return {
    species: s.species,
    formula: s.formula,
    phase: s.phase,
    modification: s.modification,
    coefficient: c.nu.valueOf(),
    deltaFH: out(c.formationEnthalpy),
    uncertainty: c.uncertainty === null ? null : out(c.uncertainty),
    uncertaintyBasis: c.referenceState ? null : c.uncertaintyBasis,
    revisionId: s.revisionId,
    source: s.source,
    referenceState: c.referenceState,
    note: s.note,
    standardPressure: s.standardPressure,
  };
}

function temperatureTerm(
  c: TermAtTemperature,
  s: StaticTerm,
  th: Thermal,
  out: Convert,
): ReactionTermAnswer {
  // Written out rather than spread from termAnswer: this runs for every term of every item.
  return {
    species: s.species,
    formula: s.formula,
    phase: s.phase,
    modification: s.modification,
    coefficient: c.nu.valueOf(),
    deltaFH: out(c.formationEnthalpy),
    uncertainty: c.uncertainty === null ? null : out(c.uncertainty),
    uncertaintyBasis: c.referenceState ? null : c.uncertaintyBasis,
    revisionId: s.revisionId,
    source: s.source,
    referenceState: c.referenceState,
    note: s.note,
    standardPressure: s.standardPressure,
    enthalpyIncrement: out(c.increment),
    transitions:
      c.transitions.length === 0
        ? []
        : c.transitions.map((tr) => ({
            temperature: tr.temperature,
            deltaH: out(tr.deltaH),
            phase: tr.phase,
            revisionId: th.revisions.get(tr.temperature) ?? null,
          })),
    heatCapacity: th.heatCapacity,
  };
}
