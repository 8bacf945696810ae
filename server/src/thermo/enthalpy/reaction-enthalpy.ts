import type Fraction from 'fraction.js';
import { ThermoError } from '../errors/thermo-error';
import * as balanceModule from '../balance/balance';
import type { BalanceReport } from '../balance/balance';
import * as input from '../equation/equation-input';
import type { Equation, Side, Term } from '../equation/equation-types';
import * as formationData from './formation-data';
import type { FormationLookup, FormationValue, UncertaintyBasis } from './formation-data';
import * as referenceStates from './reference-states';
import type { ReferenceMatch } from './reference-states';
import * as rational from '../rational/rational';
import * as uncertainty from './uncertainty';
import type { CombinedBasis } from './uncertainty';

// Hot path: imported functions bound once (development module loaders put a getter on every
// imported binding, which costs more than the work here).
const { assertBalanced, checkBalance } = balanceModule;
const { toEquation } = input;
const { checkFormationValue } = formationData;
const { matchReferenceState } = referenceStates;
const { scaleNumber } = rational;
const { QuadratureSum } = uncertainty;

export interface TermContribution {
  readonly side: Side;
  readonly term: Term;
  /** Signed stoichiometric number: positive for products, negative for reactants. */
  readonly nu: Fraction;
  /** ΔfH° in J/mol (0 for an element in its reference state). */
  readonly formationEnthalpy: number;
  /** Uncertainty of ΔfH° in J/mol (0 for a reference element, null when the data has none). */
  readonly uncertainty: number | null;
  readonly uncertaintyBasis: UncertaintyBasis | null;
  /** ν·ΔfH° in J/mol. */
  readonly contribution: number;
  readonly referenceState: boolean;
  /** The reference state was matched on an unwritten phase or modification. */
  readonly assumedReferenceState: boolean;
  /** What the lookup returned (provenance passes through); null for reference elements. */
  readonly data: FormationValue | null;
}

export interface ReactionEnthalpy {
  /** ΔrH° = Σν·ΔfH°(products) − Σν·ΔfH°(reactants), J/mol. */
  readonly deltaH: number;
  /** √Σ(νᵢuᵢ)² in J/mol; null when some non-reference term lacks an uncertainty. */
  readonly uncertainty: number | null;
  readonly uncertaintyBasis: CombinedBasis | null;
  readonly terms: readonly TermContribution[];
  /** Element and charge balance (balanced: null when registry keys hide a composition). */
  readonly balance: BalanceReport;
}

export interface BalanceOptions {
  /** Refuse an equation that does not balance (`unbalanced`). Default true. */
  readonly requireBalanced?: boolean;
}

/** The balance report, throwing `unbalanced` unless the caller opted out. */
export function balanceFor(
  eq: Equation,
  options: BalanceOptions | undefined,
  context?: Record<string, unknown>,
): BalanceReport {
  return options?.requireBalanced === false ? checkBalance(eq) : assertBalanced(eq, context);
}

const referenceCache = new Map<string, ReferenceMatch>();
const NOT_REFERENCE: ReferenceMatch = Object.freeze({ reference: false, assumed: false });

/** Whether a term is an element in its reference state (ΔfH° = 0 by definition). */
export function referenceMatch(term: Term): ReferenceMatch {
  if (term.species.kind !== 'formula') return NOT_REFERENCE;
  let match = referenceCache.get(term.id);
  if (match === undefined) {
    match = matchReferenceState(term.species, term.phase, term.modification);
    if (referenceCache.size > 20000) referenceCache.clear();
    referenceCache.set(term.id, match);
  }
  return match;
}

// Coefficients are shared frozen instances, so their negations can be shared too.
const negated = new WeakMap<Fraction, Fraction>();
function negate(f: Fraction): Fraction {
  let n = negated.get(f);
  if (n === undefined) {
    n = Object.freeze(f.neg());
    if (Object.isFrozen(f)) negated.set(f, n);
  }
  return n;
}

function evaluateSide(
  terms: readonly Term[],
  side: Side,
  lookup: FormationLookup,
  out: TermContribution[],
  missing: string[],
): void {
  for (const term of terms) {
    const nu = side === 'product' ? term.coefficient : negate(term.coefficient);
    const ref = referenceMatch(term);
    if (ref.reference) {
      out.push({
        side,
        term,
        nu,
        formationEnthalpy: 0,
        uncertainty: 0,
        uncertaintyBasis: null,
        contribution: 0,
        referenceState: true,
        assumedReferenceState: ref.assumed,
        data: null,
      });
      continue;
    }
    const found = lookup(term);
    if (found === undefined || found === null) {
      missing.push(term.id);
      continue;
    }
    const data = checkFormationValue(found, term.id);
    const u = data.uncertainty ?? null;
    out.push({
      side,
      term,
      nu,
      formationEnthalpy: data.value,
      uncertainty: u,
      uncertaintyBasis: u === null ? null : (data.uncertaintyBasis ?? 'as_stated'),
      contribution: scaleNumber(data.value, nu),
      referenceState: false,
      assumedReferenceState: false,
      data,
    });
  }
}

/**
 * Evaluates each term: reference elements are zero without asking the lookup; every other term
 * is looked up, and all terms without a value are reported together as `missing_data`.
 */
export function evaluateTerms(eq: Equation, lookup: FormationLookup): TermContribution[] {
  if (typeof lookup !== 'function')
    throw new ThermoError('invalid_input', 'lookup must be a function');
  const out: TermContribution[] = [];
  const missing: string[] = [];
  evaluateSide(eq.reactants, 'reactant', lookup, out, missing);
  evaluateSide(eq.products, 'product', lookup, out, missing);
  if (missing.length > 0) {
    throw new ThermoError(
      'missing_data',
      `no standard enthalpy of formation for ${missing.join(', ')}`,
      { missing },
    );
  }
  return out;
}

/**
 * Sums products and reactants separately and subtracts: the reverse reaction then gives exactly
 * the negated number (floating addition is not associative, subtraction is antisymmetric).
 */
export function combine(
  terms: readonly TermContribution[],
  u: uncertainty.QuadratureSum = new QuadratureSum(),
): Omit<ReactionEnthalpy, 'terms' | 'balance'> {
  let products = 0;
  let reactants = 0;
  for (const t of terms) {
    if (t.side === 'product') products += t.contribution;
    else reactants -= t.contribution;
    if (t.referenceState) u.addExact();
    else
      u.add(
        t.uncertainty === null ? null : scaleNumber(t.uncertainty, t.term.coefficient),
        t.uncertaintyBasis,
      );
  }
  return {
    deltaH: products - reactants,
    uncertainty: u.uncertainty,
    uncertaintyBasis: u.combinedBasis,
  };
}

/** Standard reaction enthalpy at 298.15 K by Hess's law from formation enthalpies. */
export function reactionEnthalpy(
  eq: Equation | string,
  lookup: FormationLookup,
  options?: BalanceOptions,
): ReactionEnthalpy {
  const equation = toEquation(eq);
  const balance = balanceFor(equation, options);
  const terms = evaluateTerms(equation, lookup);
  const c = combine(terms);
  // Built field by field: an object spread here cost more than the whole evaluation.
  return {
    deltaH: c.deltaH,
    uncertainty: c.uncertainty,
    uncertaintyBasis: c.uncertaintyBasis,
    terms,
    balance,
  };
}
