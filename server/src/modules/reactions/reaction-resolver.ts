import Fuse from 'fuse.js';
import {
  matchReferenceState,
  parseFormula,
  referenceStates,
  speciesPhaseId,
  type Equation,
  type FormulaSpecies,
  type Phase,
  type Term,
} from '../../thermo';
import { AppError } from '../../lib/app-error';
import {
  candidatesOf,
  entryId,
  type ReleaseSnapshot,
  type SnapshotPhase,
  type SnapshotSpecies,
  type SpeciesPhaseEntry,
} from '../releases/release-snapshot';

/**
 * Species resolution: each written term of an equation becomes one species-phase of the
 * release — by formula and phase, or by registry key; `s` read as `cr`; an unwritten phase or
 * modification filled in when the release holds exactly one candidate. Every such step is said
 * in plain words, for the answer's `assumptions`.
 */

export interface ResolvedTerm {
  /** The term with its phase and modification filled in: what is printed and computed. */
  readonly term: Term;
  /** The same term with a registry key replaced by the species' formula, for the balance. */
  readonly composition: Term;
  readonly species: SnapshotSpecies | null;
  /** null only for an element in its reference state that the release does not list. */
  readonly entry: SpeciesPhaseEntry | null;
  readonly referenceState: boolean;
}

export interface Resolution {
  readonly equation: Equation;
  /** The equation with every term's composition known (registry keys replaced by formulas). */
  readonly balanceEquation: Equation;
  readonly hasKeys: boolean;
  readonly byTerm: ReadonlyMap<Term, ResolvedTerm>;
  readonly assumptions: readonly string[];
}

export interface SpeciesSuggestion {
  /** The written term it is offered for. */
  readonly term: string;
  readonly species: string;
  readonly name: string;
  readonly formula: string;
}

export interface Candidate {
  readonly term: string;
  readonly species: string;
  readonly name: string;
  readonly formula: string;
  readonly phase: SnapshotPhase;
  readonly modification: string | null;
  /** How to write it so that it is unambiguous, e.g. `[2-methylpropane](g)`. */
  readonly write: string;
}

type Problem =
  | { kind: 'unknown'; term: string; query: string }
  | { kind: 'ambiguous'; candidates: Candidate[] }
  | { kind: 'missing'; term: string; species: string; available: string[] };

const compositions = new WeakMap<SnapshotSpecies, FormulaSpecies>();

/** The species' composition as the engine's formula species (charge from the registry row). */
function compositionOf(s: SnapshotSpecies): FormulaSpecies {
  let c = compositions.get(s);
  if (!c) {
    const parsed = parseFormula(s.formula);
    const charge = parsed.charge !== 0 ? parsed.charge : s.charge;
    const withCharge =
      charge === parsed.charge ? parsed : parseFormula(chargedText(s.formula, charge));
    c = Object.freeze({ kind: 'formula' as const, ...withCharge });
    compositions.set(s, c);
  }
  return c;
}

function chargedText(formula: string, charge: number): string {
  const n = Math.abs(charge);
  return `${formula}^${n === 1 ? '' : n}${charge > 0 ? '+' : '-'}`;
}

function withPhase(t: Term, phase: Phase | null, modification: string | null): Term {
  if (t.phase === phase && t.modification === modification) return t;
  return {
    coefficient: t.coefficient,
    species: t.species,
    phase,
    modification,
    id: speciesPhaseId(t.species, phase, modification),
    unresolvedSolid: phase === 's',
  };
}

function keyTerm(e: SpeciesPhaseEntry): string {
  return speciesPhaseId({ kind: 'key', key: e.species.key }, e.phase, e.modification);
}

function describeEntry(e: SpeciesPhaseEntry): string {
  return `${e.phase}${e.modification ? `, ${e.modification}` : ''}`;
}

/** An element in its reference state: ΔfH° = 0 by definition, whatever the release holds. */
function resolveReference(
  snap: ReleaseSnapshot,
  t: Term,
  phase: Phase | null,
  notes: string[],
): ResolvedTerm | null {
  if (t.species.kind !== 'formula') return null;
  const match = matchReferenceState(t.species, phase, t.modification);
  if (!match.reference) return null;
  const symbol = Object.keys(t.species.elements)[0]!;
  const ref = referenceStates[symbol]!;
  // A written alias (orthorhombic) becomes the convention's own label (rhombic).
  const filled = withPhase(t, phase ?? ref.phase, ref.modification);
  if (match.assumed && filled.id !== t.id) {
    notes.push(`${t.id} read as ${filled.id}, the reference state of ${symbol}`);
  }
  let species: SnapshotSpecies | null = null;
  let entry: SpeciesPhaseEntry | null = null;
  for (const s of snap.speciesByFormula.get(t.species.hill) ?? []) {
    const e =
      snap.entries.get(entryId(s.key, filled.phase!, filled.modification)) ??
      snap.entries.get(entryId(s.key, filled.phase!, null));
    if (e) {
      species = s;
      entry = e;
      break;
    }
  }
  return { term: filled, composition: filled, species, entry, referenceState: true };
}

function resolveTerm(
  snap: ReleaseSnapshot,
  written: Term,
  notes: string[],
): ResolvedTerm | Problem {
  let phase = written.phase;
  if (phase === 's') {
    phase = 'cr';
    notes.push(`${written.id}: phase s (solid) read as cr (crystalline)`);
  }
  const reference = resolveReference(snap, written, phase, notes);
  if (reference) return reference;

  let list: readonly SnapshotSpecies[];
  if (written.species.kind === 'key') {
    const s = snap.species.get(written.species.key);
    if (!s) return { kind: 'unknown', term: written.id, query: written.species.key };
    list = [s];
  } else {
    list = snap.speciesByFormula.get(written.species.hill) ?? [];
    if (list.length === 0)
      return { kind: 'unknown', term: written.id, query: written.species.formula };
  }

  const wantPhase = phase as SnapshotPhase | null;
  let cands = list.flatMap((s) =>
    candidatesOf(snap, s.key, wantPhase, written.modification).filter((e) => e.formation),
  );
  // A written phase without a modification means the plain phase when the release holds it.
  if (wantPhase !== null && written.modification === null && cands.length > 1) {
    const plain = cands.filter((e) => e.modification === null);
    if (plain.length === 1) cands = plain;
  }
  if (cands.length === 0) {
    const available = list.flatMap((s) =>
      (snap.phasesByKey.get(s.key) ?? []).filter((e) => e.formation).map(keyTerm),
    );
    return {
      kind: 'missing',
      term: written.id,
      species: list.map((s) => s.key).join(', '),
      available,
    };
  }
  if (cands.length > 1) {
    return {
      kind: 'ambiguous',
      candidates: cands.map((e) => ({
        term: written.id,
        species: e.species.key,
        name: e.species.name,
        formula: e.species.formula,
        phase: e.phase,
        modification: e.modification,
        // One species in several phases: its formula with a phase is enough; isomers need keys.
        write:
          list.length === 1 ? speciesPhaseId(written.species, e.phase, e.modification) : keyTerm(e),
      })),
    };
  }

  const e = cands[0]!;
  const label = written.species.kind === 'key' ? `[${written.species.key}]` : written.id;
  if (list.length > 1) {
    notes.push(
      `${label} read as ${e.species.name} [${e.species.key}], the only species of formula ${written.species.kind === 'formula' ? written.species.formula : e.species.formula} with a value in phase ${describeEntry(e)} in release ${snap.version}`,
    );
  }
  if (wantPhase === null) {
    notes.push(
      `${label}: phase ${describeEntry(e)} assumed, the only one release ${snap.version} holds`,
    );
  } else if (written.modification === null && e.modification !== null) {
    notes.push(
      `${label}: modification ${e.modification} assumed, the only one release ${snap.version} holds in phase ${e.phase}`,
    );
  }
  const term = withPhase(written, e.phase, e.modification);
  const composition =
    written.species.kind === 'key' ? { ...term, species: compositionOf(e.species) } : term;
  return { term, composition, species: e.species, entry: e, referenceState: false };
}

const fuses = new WeakMap<ReleaseSnapshot, Fuse<SnapshotSpecies>>();

function fuseOf(snap: ReleaseSnapshot): Fuse<SnapshotSpecies> {
  let f = fuses.get(snap);
  if (!f) {
    f = new Fuse([...snap.species.values()], {
      keys: ['key', 'name', 'formula', 'synonyms'],
      threshold: 0.4,
      ignoreLocation: true,
    });
    fuses.set(snap, f);
  }
  return f;
}

/** Near matches for a species the release does not hold (typos, other spellings). */
export function suggestSpecies(
  snap: ReleaseSnapshot,
  term: string,
  query: string,
  limit = 5,
): SpeciesSuggestion[] {
  return fuseOf(snap)
    .search(query, { limit })
    .map(({ item }) => ({ term, species: item.key, name: item.name, formula: item.formula }));
}

/**
 * Resolves every term, or throws the first kind of problem found, naming every term it affects.
 * `suggest: false` skips the fuzzy search for unknown species (a batch spends it on a few items).
 */
export function resolveEquation(snap: ReleaseSnapshot, eq: Equation, suggest = true): Resolution {
  const notes: string[] = [];
  const byTerm = new Map<Term, ResolvedTerm>();
  const problems: Problem[] = [];
  let hasKeys = false;
  const side = (terms: readonly Term[]) =>
    terms.map((t) => {
      const r = resolveTerm(snap, t, notes);
      if ('kind' in r) {
        problems.push(r);
        return t;
      }
      if (t.species.kind === 'key') hasKeys = true;
      byTerm.set(r.term, r);
      return r.term;
    });
  const reactants = side(eq.reactants);
  const products = side(eq.products);
  if (problems.length > 0) throw problemError(snap, problems, suggest);
  const composition = (t: Term) => byTerm.get(t)!.composition;
  return {
    equation: { reactants, products },
    balanceEquation: hasKeys
      ? { reactants: reactants.map(composition), products: products.map(composition) }
      : { reactants, products },
    hasKeys,
    byTerm,
    assumptions: notes,
  };
}

function problemError(snap: ReleaseSnapshot, problems: Problem[], suggest: boolean): AppError {
  const unknown = problems.filter((p) => p.kind === 'unknown');
  if (unknown.length > 0) {
    const suggestions = suggest
      ? unknown.flatMap((p) => suggestSpecies(snap, p.term, p.query))
      : [];
    const hint =
      suggestions.length > 0
        ? ` (did you mean ${[...new Set(suggestions.map((s) => s.name))].slice(0, 3).join(', ')}?)`
        : '';
    return new AppError(
      422,
      'unknown_species',
      `release ${snap.version} has no species ${unknown.map((p) => p.term).join(', ')}${hint}`,
      { missing: unknown.map((p) => p.term), suggestions },
    );
  }
  const ambiguous = problems.filter((p) => p.kind === 'ambiguous');
  if (ambiguous.length > 0) {
    const candidates = ambiguous.flatMap((p) => p.candidates);
    const terms = [...new Set(candidates.map((c) => c.term))];
    return new AppError(
      422,
      'ambiguous_species',
      `${terms.join(', ')} can mean more than one species-phase in release ${snap.version}: write one of ${candidates.map((c) => c.write).join(', ')}`,
      { candidates },
    );
  }
  const missing = problems.filter((p) => p.kind === 'missing');
  return new AppError(
    422,
    'missing_data',
    `release ${snap.version} holds no standard enthalpy of formation for ${missing
      .map((p) => `${p.term}${p.available.length ? ` (it holds ${p.available.join(', ')})` : ''}`)
      .join('; ')}`,
    {
      missing: missing.map((p) => p.term),
      species: missing.map((p) => p.species),
      needs: missing.map((p) => ({
        species: p.term,
        needs: 'standard enthalpy of formation',
        available: p.available,
      })),
    },
  );
}
