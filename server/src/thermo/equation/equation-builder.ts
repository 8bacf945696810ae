import type Fraction from 'fraction.js';
import { assertTerms, isChecked, markChecked } from './checked-equations';
import { ThermoError } from '../errors/thermo-error';
import type { Equation, Phase, Species, Term } from './equation-types';
import { isZero, sign } from '../rational/rational';

/** Everything of a term except its coefficient; the parser caches these per written token. */
export interface TermTemplate {
  readonly species: Species;
  readonly phase: Phase | null;
  readonly modification: string | null;
  readonly id: string;
  readonly unresolvedSolid: boolean;
}

export function speciesLabel(species: Species): string {
  if (species?.kind === 'formula' && typeof species.formula === 'string') return species.formula;
  if (species?.kind === 'key' && typeof species.key === 'string') return `[${species.key}]`;
  throw new ThermoError('invalid_input', 'expected a species (a formula or a registry key)');
}

/**
 * `H2O(l)`, `C(cr)`, `C(diamond)`, `[2-methylpropane](g)`, or just `H2O` without a phase. Our
 * canonical notation: a crystal modification's name alone stands for its crystal phase
 * (`CaCO3(calcite)`), a crystal with no modification named is plain `(cr)`; the input form
 * `(cr,diamond)` is read but never printed. A modification of another phase (rare) keeps
 * `(phase,name)`.
 */
export function speciesPhaseId(
  species: Species,
  phase: Phase | null,
  modification: string | null,
): string {
  if (phase !== null && typeof phase !== 'string')
    throw new ThermoError('invalid_input', 'phase must be text or null');
  if (modification !== null && typeof modification !== 'string') {
    throw new ThermoError('invalid_input', 'a modification label must be text or null');
  }
  const label = speciesLabel(species);
  if (phase === null) return label;
  if (modification === null) return `${label}(${phase})`;
  return phase === 'cr' && standsAlone(modification)
    ? `${label}(${modification})`
    : `${label}(${phase},${modification})`;
}

/** Words people write for a phase, with the label they mean: never read as a modification. */
export const PHASE_WORDS: Readonly<Record<string, Phase>> = {
  g: 'g',
  l: 'l',
  cr: 'cr',
  s: 's',
  am: 'am',
  aq: 'aq',
  gas: 'g',
  vap: 'g',
  vapor: 'g',
  vapour: 'g',
  liq: 'l',
  liquid: 'l',
  sol: 's',
  solid: 's',
  c: 'cr',
  crys: 'cr',
  cryst: 'cr',
  crystal: 'cr',
  amorph: 'am',
  amorphous: 'am',
  aqueous: 'aq',
  soln: 'aq',
};

/**
 * A modification label that can stand alone for its crystal, `(diamond)`: lower case, at least
 * three characters, not a word for a phase. Others (`I`, `β`) keep the long form `(cr,I)` so that
 * printed equations always read back the same.
 */
export function standsAlone(label: string): boolean {
  return (
    /^[a-z][a-z0-9' -]*[a-z0-9']$/.test(label) &&
    label.length >= 3 &&
    !label.includes('  ') &&
    !Object.prototype.hasOwnProperty.call(PHASE_WORDS, /^[a-z]*/.exec(label)![0])
  );
}

export function makeTemplate(
  species: Species,
  phase: Phase | null,
  modification: string | null,
): TermTemplate {
  if (phase === null && modification !== null) {
    throw new ThermoError(
      'invalid_input',
      'a modification label needs a phase, e.g. C(cr,diamond)',
    );
  }
  return Object.freeze({
    species,
    phase,
    modification,
    id: speciesPhaseId(species, phase, modification),
    unresolvedSolid: phase === 's',
  });
}

export function makeTerm(coefficient: Fraction, template: TermTemplate): Term {
  return {
    coefficient,
    species: template.species,
    phase: template.phase,
    modification: template.modification,
    id: template.id,
    unresolvedSolid: template.unresolvedSolid,
  };
}

export function withCoefficient(term: Term, coefficient: Fraction): Term {
  return makeTerm(coefficient, term);
}

/** True when some species-phase id occurs twice across both lists. */
function hasRepeats(reactants: readonly Term[], products: readonly Term[]): boolean {
  const nr = reactants.length;
  const total = nr + products.length;
  for (let i = 1; i < total; i++) {
    const id = (i < nr ? reactants[i] : products[i - nr])!.id;
    for (let j = 0; j < i; j++)
      if ((j < nr ? reactants[j] : products[j - nr])!.id === id) return true;
  }
  return false;
}

/**
 * The net equation of two term lists: a species-phase repeated on one side is merged, one on both
 * sides cancels to its net amount (on the side where it is left). Terms keep the order of their
 * first appearance on the side where they end up.
 */
export function buildEquation(reactants: readonly Term[], products: readonly Term[]): Equation {
  assertTerms(reactants);
  assertTerms(products);
  return netEquation(reactants, products);
}

/** buildEquation for terms the engine made itself (no shape check). */
export function netEquation(reactants: readonly Term[], products: readonly Term[]): Equation {
  for (const t of reactants) assertPositive(t);
  for (const t of products) assertPositive(t);
  if (!hasRepeats(reactants, products)) {
    return checkSides({ reactants, products });
  }
  // Net stoichiometric number per species-phase: products positive, reactants negative.
  const net = new Map<string, { term: Term; nu: Fraction }>();
  const order: { side: 'r' | 'p'; id: string }[] = [];
  const seen = new Set<string>();
  const visit = (terms: readonly Term[], side: 'r' | 'p', s: number): void => {
    for (const t of terms) {
      const entry = net.get(t.id);
      const delta = s > 0 ? t.coefficient : t.coefficient.neg();
      if (entry === undefined) net.set(t.id, { term: t, nu: delta });
      else entry.nu = entry.nu.add(delta);
      const key = side + t.id;
      if (!seen.has(key)) {
        seen.add(key);
        order.push({ side, id: t.id });
      }
    }
  };
  visit(reactants, 'r', -1);
  visit(products, 'p', 1);
  const outR: Term[] = [];
  const outP: Term[] = [];
  for (const { side, id } of order) {
    const { term, nu } = net.get(id) as { term: Term; nu: Fraction };
    const s = sign(nu);
    if (s < 0 && side === 'r') outR.push(withCoefficient(term, nu.neg()));
    if (s > 0 && side === 'p') outP.push(withCoefficient(term, nu));
  }
  return checkSides({ reactants: outR, products: outP });
}

function assertPositive(t: Term): void {
  if (isZero(t.coefficient) || t.coefficient.s < 0n) {
    throw new ThermoError('invalid_input', `the coefficient of ${t.id} must be positive`, {
      species: t.id,
    });
  }
}

function checkSides(eq: Equation): Equation {
  if (eq.reactants.length === 0 || eq.products.length === 0) {
    const side = eq.reactants.length === 0 ? 'reactant' : 'product';
    throw new ThermoError(
      'invalid_input',
      `after merging repeated species the ${side} side is empty: the equation describes no net reaction`,
      { side },
    );
  }
  return markChecked(eq);
}

function assertEquation(eq: Equation): void {
  if (isChecked(eq)) return;
  if (eq === null || typeof eq !== 'object')
    throw new ThermoError('invalid_input', 'expected an equation');
  assertTerms(eq.reactants);
  assertTerms(eq.products);
}

/** The reverse reaction (ΔH changes sign). */
export function reverseEquation(eq: Equation): Equation {
  assertEquation(eq);
  return markChecked({ reactants: eq.products, products: eq.reactants });
}

/** Every coefficient multiplied by a positive rational k. */
export function scaleEquation(eq: Equation, k: Fraction): Equation {
  assertEquation(eq);
  if (k === null || typeof k !== 'object' || typeof k.n !== 'bigint' || sign(k) <= 0) {
    throw new ThermoError('invalid_input', 'the scale factor must be a positive fraction');
  }
  return markChecked({
    reactants: eq.reactants.map((t) => withCoefficient(t, t.coefficient.mul(k))),
    products: eq.products.map((t) => withCoefficient(t, t.coefficient.mul(k))),
  });
}

/** Signed stoichiometric numbers per species-phase id: products positive, reactants negative. */
export function stoichiometry(eq: Equation): Map<string, { term: Term; nu: Fraction }> {
  assertEquation(eq);
  const out = new Map<string, { term: Term; nu: Fraction }>();
  const add = (t: Term, nu: Fraction): void => {
    const prev = out.get(t.id);
    out.set(t.id, { term: prev?.term ?? t, nu: prev === undefined ? nu : prev.nu.add(nu) });
  };
  for (const t of eq.reactants) add(t, t.coefficient.neg());
  for (const t of eq.products) add(t, t.coefficient);
  for (const [id, v] of out) if (isZero(v.nu)) out.delete(id);
  return out;
}

/** Builds the net equation of signed amounts (positive → products). */
export function equationFromStoichiometry(
  entries: Iterable<{ term: Term; nu: Fraction }>,
): Equation {
  const reactants: Term[] = [];
  const products: Term[] = [];
  for (const { term, nu } of entries) {
    const s = sign(nu);
    if (s < 0) reactants.push(withCoefficient(term, nu.neg()));
    else if (s > 0) products.push(withCoefficient(term, nu));
  }
  return netEquation(reactants, products);
}
