import {
  combustionEquation,
  exactCounts,
  fractionText,
  isThermoError,
  parseEquation,
  parseFormula,
  parseTerm,
  printEquation,
  reactionEnthalpy,
  referenceStates,
  type Equation,
  type FormationValue,
  type Term,
} from '../../thermo';
import { entryId, type ReleaseSnapshot } from '../releases/release-snapshot';

/**
 * Pure pieces of the review: what approving an item does to a few reactions of its species, and
 * how far the proposed value lies from the one it replaces. Every number goes through the engine.
 */

export interface ImpactSpecies {
  key: string;
  formula: string;
  charge: number;
  phase: string;
  modification: string | null;
}

export interface ReactionImpact {
  label: 'formation' | 'combustion';
  equation: string;
  before: number | null;
  after: number | null;
  unit: 'kJ/mol';
}

const phaseText = (phase: string, mod: string | null) => (mod ? `${phase},${mod}` : phase);

/** The formation reaction from the elements in their reference states; null for ions and elements. */
export function formationEquation(s: ImpactSpecies): Equation | null {
  if (s.charge !== 0) return null;
  const parsed = parseFormula(s.formula);
  const counts = exactCounts(parsed);
  const symbols = Object.keys(counts);
  const reactants: string[] = [];
  for (const symbol of symbols) {
    const ref = referenceStates[symbol];
    if (!ref) return null;
    const coefficient = counts[symbol]!.div(ref.atoms);
    reactants.push(
      `${fractionText(coefficient)} ${ref.formula}(${phaseText(ref.phase, ref.modification)})`,
    );
  }
  try {
    return parseEquation(
      `${reactants.join(' + ')} -> ${s.formula}(${phaseText(s.phase, s.modification)})`,
    );
  } catch (err) {
    // An element in its reference state is formed from itself: no net reaction to show.
    if (isThermoError(err) && err.code === 'invalid_input') return null;
    throw err;
  }
}

/** ΔfH° of a term as the snapshot holds it (by formula and phase; the first species that has it). */
export function snapshotValue(snap: ReleaseSnapshot, t: Term): FormationValue | undefined {
  if (t.species.kind !== 'formula') return undefined;
  for (const s of snap.speciesByFormula.get(t.species.hill) ?? []) {
    const e = snap.entries.get(entryId(s.key, t.phase ?? 'g', t.modification));
    if (e?.formation)
      return { value: e.formation.joules, uncertainty: e.formation.uncertaintyJoules };
  }
  return undefined;
}

/**
 * ΔrH° in kJ/mol of the species' formation and (for neutral C/H/O/N/S species) combustion to
 * liquid water, with the current value (`before`, null when there is none) and the proposed one.
 */
export function reactionImpacts(
  snap: ReleaseSnapshot,
  s: ImpactSpecies,
  before: number | null,
  after: number | null,
): ReactionImpact[] {
  const out: ReactionImpact[] = [];
  let fuel: Term;
  try {
    fuel = parseTerm(`${s.formula}(${phaseText(s.phase, s.modification)})`);
  } catch {
    return out;
  }
  const compute = (eq: Equation, value: number | null) => {
    if (value === null) return null;
    try {
      const r = reactionEnthalpy(eq, (t) =>
        t.id === fuel.id ? { value } : snapshotValue(snap, t),
      );
      return r.deltaH / 1000;
    } catch (err) {
      if (isThermoError(err)) return null;
      throw err;
    }
  };
  const candidates: [ReactionImpact['label'], () => Equation | null][] = [
    ['formation', () => formationEquation(s)],
    ['combustion', () => (s.charge === 0 ? combustionEquation(fuel, 'l') : null)],
  ];
  for (const [label, build] of candidates) {
    let eq: Equation | null;
    try {
      eq = build();
    } catch (err) {
      if (isThermoError(err)) continue;
      throw err;
    }
    if (!eq) continue;
    out.push({
      label,
      equation: printEquation(eq),
      before: compute(eq, before),
      after: compute(eq, after),
      unit: 'kJ/mol',
    });
  }
  return out;
}

/** Proposed minus current in kJ/mol, and in units of the combined (root-sum-square) uncertainty. */
export function compare(
  proposed: { value: number; uncertainty: number | null },
  current: { value: number; uncertainty: number | null },
) {
  const difference = (proposed.value - current.value) / 1000;
  const combined =
    proposed.uncertainty === null || current.uncertainty === null
      ? null
      : Math.hypot(proposed.uncertainty, current.uncertainty) / 1000;
  const ratio = combined ? Math.abs(difference) / combined : null;
  return {
    differenceKJPerMol: difference,
    combinedUncertaintyKJPerMol: combined,
    differenceInUncertainties: ratio,
    flagged: ratio !== null ? ratio > 2 : false,
  };
}
