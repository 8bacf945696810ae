import type { HeatCapacityModel, UncertaintyBasis } from '../../server/src/thermo';
import type { EnergyUnitText } from './decimal-text';

/** Phases a stored value may have (`s` of the equation syntax is resolved before storage). */
export type DataPhase = 'g' | 'l' | 'cr' | 'am' | 'aq';
export const DATA_PHASES: readonly DataPhase[] = ['g', 'l', 'cr', 'am', 'aq'];

/** How a value was obtained; `evaluated` = a compilation's recommended value. */
export type Method =
  | 'combustion_calorimetry'
  | 'reaction_calorimetry'
  | 'solution_calorimetry'
  | 'equilibrium'
  | 'spectroscopic'
  | 'computed'
  | 'estimated'
  | 'derived'
  | 'evaluated';
export const METHODS: readonly Method[] = [
  'combustion_calorimetry',
  'reaction_calorimetry',
  'solution_calorimetry',
  'equilibrium',
  'spectroscopic',
  'computed',
  'estimated',
  'derived',
  'evaluated',
];

/** p° of the source: 1 bar (IUPAC since 1982) or 1 atm (older tables). */
export type StandardPressurePa = 100000 | 101325;

/** The subset of CSL-JSON the registry reads; other CSL fields pass through untouched. */
export interface CslItem {
  readonly id: string;
  readonly type: string;
  readonly title: string;
  readonly author?: readonly { family?: string; given?: string; literal?: string }[];
  readonly issued?: { 'date-parts'?: readonly (readonly (number | string)[])[] };
  readonly publisher?: string;
  readonly 'container-title'?: string;
  readonly volume?: string;
  readonly page?: string;
  readonly DOI?: string;
  readonly note?: string;
  readonly [field: string]: unknown;
}

export interface SpeciesRow {
  readonly line: number;
  readonly key: string;
  readonly name: string;
  /** As written in the file (the engine's input syntax). */
  readonly formula: string;
  /** Hill-order formula from the engine, e.g. "CH4O", "O4S^2-". */
  readonly hill: string;
  readonly elements: Readonly<Record<string, number>>;
  readonly charge: number;
  readonly synonyms: readonly string[];
  readonly casRn: string | null;
  readonly inchi: string | null;
  readonly inchiKey: string | null;
  readonly smiles: string | null;
  readonly notes: string | null;
}

/** Fields every value row shares: where it came from and how far to trust it. */
interface Provenance {
  readonly line: number;
  readonly method: Method;
  readonly standardPressurePa: StandardPressurePa;
  /** An id in sources.json. */
  readonly source: string;
  /** True when transcribed from memory rather than read in the source. */
  readonly fromMemory: boolean;
  readonly notes: string | null;
}

/** An energy as printed by its source, and the same exactly in J/mol (decimal text). */
export interface EnergyFields {
  readonly value: string;
  readonly unit: EnergyUnitText;
  readonly valueJPerMol: string;
  readonly uncertainty: string | null;
  readonly uncertaintyJPerMol: string | null;
  readonly uncertaintyBasis: UncertaintyBasis | null;
}

export interface FormationRow extends Provenance, EnergyFields {
  readonly species: string;
  readonly phase: DataPhase;
  readonly modification: string | null;
}

export interface TransitionRow extends Provenance, EnergyFields {
  readonly species: string;
  readonly fromPhase: DataPhase;
  readonly fromModification: string | null;
  readonly toPhase: DataPhase;
  readonly toModification: string | null;
  /** Decimal text as printed, e.g. "373.15". */
  readonly temperatureK: string;
}

/** One temperature range as printed: bounds and coefficients c1…c8 in order (null where empty). */
export interface CoefficientRange {
  readonly line: number;
  readonly tMinK: string;
  readonly tMaxK: string;
  readonly coefficients: readonly (string | null)[];
}

/** A heat-capacity set: the rows of one species-phase, and the engine's model built from them. */
export interface HeatCapacitySet {
  readonly line: number;
  readonly species: string;
  readonly phase: DataPhase;
  readonly modification: string | null;
  readonly kind: 'nasa7' | 'shomate';
  readonly ranges: readonly CoefficientRange[];
  readonly model: HeatCapacityModel;
  readonly source: string;
  readonly fromMemory: boolean;
  readonly notes: string | null;
}

export interface Dataset {
  readonly sources: CslItem[];
  readonly species: SpeciesRow[];
  readonly formation: FormationRow[];
  readonly heatCapacity: HeatCapacitySet[];
  readonly transitions: TransitionRow[];
}

/** What a per-file parser may check against: the dataset's species and source ids. */
export interface CrossReferences {
  readonly species?: ReadonlyMap<string, SpeciesRow>;
  readonly sources?: ReadonlySet<string>;
}
