import type Fraction from 'fraction.js';
import { markChecked } from '../equation/checked-equations';
import { ThermoError } from '../errors/thermo-error';
import { withCoefficient } from '../equation/equation-builder';
import { toEquation } from '../equation/equation-input';
import type { Equation, Term } from '../equation/equation-types';
import { printEquation } from '../equation/equation-printer';
import { exactCounts } from '../formula/formula-parser';
import { hillOrder } from '../formula/hill-formula';
import { nullSpace } from '../rational/rational-matrix';
import { frac, toSmallestIntegers, ZERO } from '../rational/rational';

/**
 * Balances the equation's species with the smallest positive integer coefficients: the one
 * direction of the null space of the composition matrix (elements and charge × terms). Fails
 * with `unbalanced` when no positive combination exists, and `not_unique` when the species admit
 * more than one independent reaction.
 */
export function autoBalance(input: Equation | string): Equation {
  const eq = toEquation(input);
  const terms = [...eq.reactants, ...eq.products];
  const keys = terms.filter((t) => t.species.kind === 'key').map((t) => t.id);
  if (keys.length > 0) {
    throw new ThermoError(
      'invalid_input',
      `cannot balance terms of unknown composition: ${keys.join(', ')}`,
      {
        unknownComposition: keys,
      },
    );
  }
  const nr = eq.reactants.length;
  const symbols = new Set<string>();
  let charged = false;
  for (const t of terms) {
    if (t.species.kind !== 'formula') continue;
    for (const symbol in t.species.elements) symbols.add(symbol);
    if (t.species.charge !== 0) charged = true;
  }
  const rows = hillOrder(symbols).map((symbol) =>
    terms.map((t, j) => {
      const n = t.species.kind === 'formula' ? (exactCounts(t.species)[symbol] ?? ZERO) : ZERO;
      return j < nr ? n : n.neg();
    }),
  );
  if (charged) {
    rows.push(
      terms.map((t, j) =>
        frac(t.species.kind === 'formula' ? (j < nr ? 1 : -1) * t.species.charge : 0),
      ),
    );
  }
  const basis = nullSpace(rows, terms.length);
  if (basis.length === 0) {
    throw new ThermoError(
      'unbalanced',
      'no coefficients balance these species: they cannot form a reaction with each other',
      {
        reason: 'no_solution',
        species: terms.map((t) => t.id),
      },
    );
  }
  if (basis.length > 1) {
    const reactions = basis.map((v) => describeDirection(terms, v, nr));
    throw new ThermoError(
      'not_unique',
      `these species admit ${basis.length} independent reactions, so the coefficients are not determined; e.g. ${reactions.join('; ')}`,
      { reason: 'several_reactions', dimension: basis.length, reactions },
    );
  }
  const ints = toSmallestIntegers(basis[0] as Fraction[]);
  // Orient the direction to agree with as many written sides as possible.
  const agree = ints.filter((v) => v > 0n).length - ints.filter((v) => v < 0n).length;
  const positive = agree >= 0 ? ints : ints.map((v) => -v);
  const absent = terms.filter((_, j) => positive[j] === 0n).map((t) => t.id);
  if (absent.length > 0) {
    throw new ThermoError(
      'unbalanced',
      `cannot be balanced with ${absent.join(', ')} taking part`,
      {
        reason: 'species_not_involved',
        species: absent,
      },
    );
  }
  const wrongSide = terms.filter((_, j) => (positive[j] as bigint) < 0n).map((t) => t.id);
  if (wrongSide.length > 0) {
    throw new ThermoError(
      'unbalanced',
      `balances only with ${wrongSide.join(', ')} on the other side of the arrow`,
      {
        reason: 'wrong_side',
        species: wrongSide,
        balanced: describeDirection(terms, basis[0] as Fraction[], nr),
      },
    );
  }
  const rescaled = terms.map((t, j) => withCoefficient(t, frac(positive[j] as bigint)));
  return markChecked({ reactants: rescaled.slice(0, nr), products: rescaled.slice(nr) });
}

/** One null-space direction as a readable equation; column j < nr counts as written reactant. */
function describeDirection(terms: readonly Term[], v: readonly Fraction[], nr: number): string {
  const ints = toSmallestIntegers(v);
  const reactants: Term[] = [];
  const products: Term[] = [];
  ints.forEach((x, j) => {
    const asReactant = j < nr === x > 0n;
    if (x === 0n) return;
    const t = withCoefficient(terms[j] as Term, frac(x < 0n ? -x : x));
    (asReactant ? reactants : products).push(t);
  });
  if (reactants.length === 0 || products.length === 0) return '(no reaction)';
  return printEquation({ reactants, products });
}
