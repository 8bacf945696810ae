import { shown, ThermoError } from '../errors/thermo-error';
import { parseTerm } from '../equation/equation-parser';
import type { Equation, Term } from '../equation/equation-types';
import type { FormationLookup, UncertaintyBasis } from './formation-data';
import { toEquation } from '../equation/equation-input';
import {
  balanceFor,
  combine,
  evaluateTerms,
  referenceMatch,
  type BalanceOptions,
  type TermContribution,
} from './reaction-enthalpy';
import { scaleNumber } from '../rational/rational';
import { QuadratureSum, type CombinedBasis } from './uncertainty';

export interface DerivedFormation {
  /** The species-phase whose ΔfH° was derived. */
  readonly term: Term;
  /** ΔfH° in J/mol. */
  readonly value: number;
  /** √(u_r² + Σ(νᵢuᵢ)²) / |ν_x| in J/mol; null when the measurement or an input has none. */
  readonly uncertainty: number | null;
  readonly uncertaintyBasis: CombinedBasis | null;
  readonly measured: { readonly deltaH: number; readonly uncertainty: number | null };
  /** Every other term with the value used for it (provenance passes through). */
  readonly inputs: readonly TermContribution[];
}

export interface DeriveOptions extends BalanceOptions {
  /** Basis of the measured uncertainty; 'as_stated' when not given. */
  readonly measuredUncertaintyBasis?: UncertaintyBasis;
}

/**
 * ΔfH° of one species from a measured reaction enthalpy (e.g. a combustion enthalpy) and the
 * other species' values: ΔrH = Σνᵢ·ΔfHᵢ ⇒ ΔfH_x = (ΔrH − Σ_{i≠x} νᵢ·ΔfHᵢ) / ν_x, with the
 * uncertainties of the measurement and the inputs combined in quadrature (Molecular Energetics §2.6).
 */
export function deriveFormationEnthalpy(
  eq: Equation | string,
  measuredDeltaH: number,
  measuredUncertainty: number | null | undefined,
  unknownTerm: string | Term,
  lookup: FormationLookup,
  options: DeriveOptions = {},
): DerivedFormation {
  const equation = toEquation(eq);
  balanceFor(equation, options);
  if (typeof measuredDeltaH !== 'number' || !Number.isFinite(measuredDeltaH)) {
    throw new ThermoError('invalid_input', 'the measured ΔH must be a finite number of J/mol');
  }
  const mu = measuredUncertainty ?? null;
  if (mu !== null && (typeof mu !== 'number' || !Number.isFinite(mu) || mu < 0)) {
    throw new ThermoError('invalid_input', 'the measured uncertainty must be a finite number ≥ 0');
  }
  const wanted = typeof unknownTerm === 'string' ? parseTerm(unknownTerm).id : unknownTerm?.id;
  const all = [...equation.reactants, ...equation.products];
  const target = all.find((t) => t.id === wanted);
  if (target === undefined) {
    throw new ThermoError(
      'invalid_input',
      `${typeof wanted === 'string' ? wanted : shown(wanted)} is not a term of the equation`,
      {
        species: wanted,
        terms: all.map((t) => t.id),
      },
    );
  }
  if (referenceMatch(target).reference) {
    throw new ThermoError(
      'invalid_input',
      `${target.id} is an element in its reference state; its ΔfH° is zero by definition`,
      {
        species: target.id,
      },
    );
  }
  const isTarget = (t: Term): boolean => t === target;
  const others: Equation = {
    reactants: equation.reactants.filter((t) => !isTarget(t)),
    products: equation.products.filter((t) => !isTarget(t)),
  };
  const inputs = evaluateTerms(others, lookup);
  const nuX = equation.products.includes(target) ? target.coefficient : target.coefficient.neg();

  // The measured value's uncertainty joins the inputs' in the same quadrature sum.
  const u = new QuadratureSum();
  u.add(mu, mu === null ? null : (options.measuredUncertaintyBasis ?? 'as_stated'));
  const known = combine(inputs, u);
  const rest = measuredDeltaH - known.deltaH;
  const inv = nuX.inverse();
  const combined = known.uncertainty;
  return {
    term: target,
    value: scaleNumber(rest, inv),
    uncertainty: combined === null ? null : scaleNumber(combined, inv.abs()),
    uncertaintyBasis: known.uncertaintyBasis,
    measured: { deltaH: measuredDeltaH, uncertainty: mu },
    inputs,
  };
}
