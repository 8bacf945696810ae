import type Fraction from 'fraction.js';

/** Phases of the input syntax; `s` is a solid whose polymorph is still to be resolved. */
export type Phase = 'g' | 'l' | 'cr' | 's' | 'am' | 'aq';
export const PHASES: readonly Phase[] = ['g', 'l', 'cr', 's', 'am', 'aq'];

const PHASE_NAMES: Record<Phase, string> = {
  g: 'gas',
  l: 'liquid',
  cr: 'crystal',
  s: 'solid',
  am: 'amorphous',
  aq: 'aqueous',
};

/** The phase spelled out for people: "gas", "crystal, diamond", "aqueous"; null when unwritten. */
export function phaseName(phase: Phase | null, modification: string | null = null): string | null {
  // Own keys only: a phase read from outside must not reach Object.prototype's members.
  if (typeof phase !== 'string' || !Object.hasOwn(PHASE_NAMES, phase)) return null;
  const name = PHASE_NAMES[phase];
  return typeof modification === 'string' ? `${name}, ${modification}` : name;
}

/** A species identified by its formula (composition known). */
export interface FormulaSpecies {
  readonly kind: 'formula';
  /** Canonical written formula, e.g. "CuSO4·5H2O", "SO4^2-". */
  readonly formula: string;
  readonly elements: Readonly<Record<string, number>>;
  readonly charge: number;
  /** Hill-order display formula. */
  readonly hill: string;
  /** Exact counts, present only when some count is not whole (`Fe0.947O`, `CaSO4·1/2H2O`). */
  readonly exact?: Readonly<Record<string, Fraction>>;
}

/** A species a formula cannot identify (isomers), named by its registry key; composition unknown. */
export interface KeySpecies {
  readonly kind: 'key';
  readonly key: string;
}

export type Species = FormulaSpecies | KeySpecies;

export interface Term {
  /** Exact positive rational. */
  readonly coefficient: Fraction;
  readonly species: Species;
  readonly phase: Phase | null;
  /** Modification label such as "graphite", "calcite", "rhombic"; null when not written. */
  readonly modification: string | null;
  /**
   * Species-phase identity: canonical formula or `[key]`, then `(phase[,modification])`.
   * Terms with equal ids are the same species in the same phase.
   */
  readonly id: string;
  /** True for phase `s`: a solid to be resolved against data (cr, am, or a named modification). */
  readonly unresolvedSolid: boolean;
}

/** A net equation: no species-phase appears twice, coefficients are positive. */
export interface Equation {
  readonly reactants: readonly Term[];
  readonly products: readonly Term[];
}

export type Side = 'reactant' | 'product';
