import {
  hillFormula,
  parseFormula,
  type HeatCapacityModel,
  type UncertaintyBasis,
} from '../../thermo';

/**
 * The one bridge from registry rows to the engine: the plain rows of one release
 * (`SnapshotInput`, what the repository loads) and their in-memory index (`ReleaseSnapshot`,
 * what every read of a published release computes on). A published release never changes, so a
 * snapshot is built once and shared.
 */

/** Phases stored in the registry (`s` exists only in input syntax). */
export type SnapshotPhase = 'g' | 'l' | 'cr' | 'am' | 'aq';

export interface SnapshotSource {
  readonly id: string;
  /** Formatted citation. */
  readonly citation: string;
  readonly doi: string | null;
}

export interface SnapshotSpecies {
  /** Stable registry key, e.g. `2-methylpropane`. */
  readonly key: string;
  readonly name: string;
  /** Hill-order formula (a charge may be written, e.g. `O4S^2-`, or given in `charge` only). */
  readonly formula: string;
  readonly charge: number;
  readonly synonyms: readonly string[];
}

interface SpeciesPhaseRef {
  readonly speciesKey: string;
  readonly phase: SnapshotPhase;
  /** Modification label (graphite, calcite, quartz…); null when the phase has none. */
  readonly modification: string | null;
}

export type StandardPressure = '1 bar' | '1 atm';

/** One pinned ΔfH°(298.15 K) revision. Numbers as exact decimal text (database `numeric`). */
export interface SnapshotFormationValue extends SpeciesPhaseRef {
  readonly revisionId: string;
  /** J/mol, exact decimal text. */
  readonly value: string;
  /** J/mol, exact decimal text; null when the source gives none. */
  readonly uncertainty: string | null;
  readonly uncertaintyBasis: UncertaintyBasis | null;
  /** combustion calorimetry, equilibrium, computed, estimated, derived… */
  readonly method: string;
  readonly standardPressure: StandardPressure;
  readonly source: SnapshotSource;
}

/** One pinned heat-capacity set (the engine's own model shape). */
export interface SnapshotHeatCapacitySet extends SpeciesPhaseRef {
  readonly revisionId: string;
  readonly model: HeatCapacityModel;
  readonly source: SnapshotSource;
}

/** One pinned phase transition, in the heating direction (from → to). */
export interface SnapshotTransition {
  readonly revisionId: string;
  readonly speciesKey: string;
  readonly fromPhase: SnapshotPhase;
  readonly fromModification: string | null;
  readonly toPhase: SnapshotPhase;
  readonly toModification: string | null;
  /** K, exact decimal text. */
  readonly temperature: string;
  /** ΔtrsH in J/mol (heating direction), exact decimal text. */
  readonly deltaH: string;
  readonly source: SnapshotSource;
}

/** The plain rows of one release, as loaded from the database (or a data file in tests). */
export interface SnapshotInput {
  readonly version: string;
  readonly publishedAt: string | null;
  readonly species: readonly SnapshotSpecies[];
  readonly formationValues: readonly SnapshotFormationValue[];
  readonly heatCapacitySets: readonly SnapshotHeatCapacitySet[];
  readonly transitions: readonly SnapshotTransition[];
}

/** A transition as the engine uses it (numbers parsed). */
export interface SnapshotTransitionEntry {
  readonly revisionId: string;
  readonly temperature: number;
  readonly deltaH: number;
  readonly from: SpeciesPhaseEntry;
  readonly to: SpeciesPhaseEntry;
  readonly source: SnapshotSource;
}

/** Everything a release pins for one species in one phase (and modification). */
export interface SpeciesPhaseEntry {
  readonly species: SnapshotSpecies;
  readonly phase: SnapshotPhase;
  readonly modification: string | null;
  /** ΔfH° in J/mol as a number for the engine, beside the pinned row. */
  readonly formation:
    | (SnapshotFormationValue & {
        readonly joules: number;
        readonly uncertaintyJoules: number | null;
      })
    | null;
  readonly heatCapacity: SnapshotHeatCapacitySet | null;
  /** Transitions leaving this phase on heating, by temperature. */
  readonly transitionsUp: SnapshotTransitionEntry[];
  /** Transitions entering this phase on heating (left on cooling), by temperature. */
  readonly transitionsDown: SnapshotTransitionEntry[];
}

export interface ReleaseSnapshot {
  readonly version: string;
  readonly publishedAt: string | null;
  /** Species by registry key. */
  readonly species: ReadonlyMap<string, SnapshotSpecies>;
  /** Species sharing one composition (isomers), by Hill formula with charge (`C4H10`, `O4S^2-`). */
  readonly speciesByFormula: ReadonlyMap<string, readonly SnapshotSpecies[]>;
  /** Every species-phase of a species, by key. */
  readonly phasesByKey: ReadonlyMap<string, readonly SpeciesPhaseEntry[]>;
  /** One species-phase by `key|phase|modification` (modification empty when none). */
  readonly entries: ReadonlyMap<string, SpeciesPhaseEntry>;
  /** Counts for manifests and logs. */
  readonly counts: {
    readonly species: number;
    readonly speciesPhases: number;
    readonly formationValues: number;
    readonly heatCapacitySets: number;
    readonly transitions: number;
  };
}

export function entryId(key: string, phase: string, modification: string | null): string {
  return `${key}|${phase}|${modification ?? ''}`;
}

/** The composition key a species is indexed by: Hill formula with its charge. */
export function formulaKey(species: Pick<SnapshotSpecies, 'formula' | 'charge'>): string {
  const parsed = parseFormula(species.formula);
  return hillFormula(parsed.elements, parsed.charge !== 0 ? parsed.charge : species.charge);
}

function toNumber(text: string, what: string): number {
  const n = Number(text);
  if (text.trim() === '' || !Number.isFinite(n)) {
    throw new Error(`snapshot: ${what} is not a finite decimal (${JSON.stringify(text)})`);
  }
  return n;
}

/** Indexes the rows of one release for the engine's lookups. Throws on inconsistent rows. */
export function buildSnapshot(input: SnapshotInput): ReleaseSnapshot {
  const species = new Map<string, SnapshotSpecies>();
  const speciesByFormula = new Map<string, SnapshotSpecies[]>();
  for (const s of input.species) {
    if (species.has(s.key)) throw new Error(`snapshot: species ${s.key} appears twice`);
    species.set(s.key, s);
    const fk = formulaKey(s);
    const list = speciesByFormula.get(fk);
    if (list) list.push(s);
    else speciesByFormula.set(fk, [s]);
  }

  type Building = { -readonly [K in keyof SpeciesPhaseEntry]: SpeciesPhaseEntry[K] };
  const entries = new Map<string, Building>();
  const phasesByKey = new Map<string, SpeciesPhaseEntry[]>();
  const entryFor = (ref: SpeciesPhaseRef): Building => {
    const id = entryId(ref.speciesKey, ref.phase, ref.modification);
    let e = entries.get(id);
    if (!e) {
      const s = species.get(ref.speciesKey);
      if (!s) throw new Error(`snapshot: unknown species ${ref.speciesKey}`);
      e = {
        species: s,
        phase: ref.phase,
        modification: ref.modification,
        formation: null,
        heatCapacity: null,
        transitionsUp: [],
        transitionsDown: [],
      };
      entries.set(id, e);
      const list = phasesByKey.get(s.key);
      if (list) list.push(e);
      else phasesByKey.set(s.key, [e]);
    }
    return e;
  };

  for (const f of input.formationValues) {
    const e = entryFor(f);
    if (e.formation)
      throw new Error(
        `snapshot: two ΔfH° values for ${entryId(f.speciesKey, f.phase, f.modification)}`,
      );
    e.formation = {
      ...f,
      joules: toNumber(f.value, `ΔfH° of ${f.speciesKey}`),
      uncertaintyJoules:
        f.uncertainty === null ? null : toNumber(f.uncertainty, `uncertainty of ${f.speciesKey}`),
    };
  }
  for (const h of input.heatCapacitySets) {
    const e = entryFor(h);
    if (e.heatCapacity)
      throw new Error(
        `snapshot: two heat-capacity sets for ${entryId(h.speciesKey, h.phase, h.modification)}`,
      );
    e.heatCapacity = h;
  }
  for (const t of input.transitions) {
    const from = entryFor({
      speciesKey: t.speciesKey,
      phase: t.fromPhase,
      modification: t.fromModification,
    });
    const to = entryFor({
      speciesKey: t.speciesKey,
      phase: t.toPhase,
      modification: t.toModification,
    });
    const entry: SnapshotTransitionEntry = {
      revisionId: t.revisionId,
      temperature: toNumber(t.temperature, `transition temperature of ${t.speciesKey}`),
      deltaH: toNumber(t.deltaH, `ΔtrsH of ${t.speciesKey}`),
      from,
      to,
      source: t.source,
    };
    from.transitionsUp.push(entry);
    to.transitionsDown.push(entry);
  }
  for (const e of entries.values()) {
    e.transitionsUp.sort((a, b) => a.temperature - b.temperature);
    e.transitionsDown.sort((a, b) => b.temperature - a.temperature);
  }

  return {
    version: input.version,
    publishedAt: input.publishedAt,
    species,
    speciesByFormula,
    phasesByKey,
    entries,
    counts: {
      species: species.size,
      speciesPhases: entries.size,
      formationValues: input.formationValues.length,
      heatCapacitySets: input.heatCapacitySets.length,
      transitions: input.transitions.length,
    },
  };
}

/**
 * The species-phases of one species matching a phase and modification; a null phase or
 * modification matches any. Used to fill in what an equation left unwritten.
 */
export function candidatesOf(
  snapshot: ReleaseSnapshot,
  key: string,
  phase: SnapshotPhase | null,
  modification: string | null,
): SpeciesPhaseEntry[] {
  return (snapshot.phasesByKey.get(key) ?? []).filter(
    (e) =>
      (phase === null || e.phase === phase) &&
      (modification === null || e.modification === modification),
  );
}
