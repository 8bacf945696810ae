import type { ItemDerivation } from '../../../../schema';
import type { Database, Tx } from '../../db/client';
import { AppError } from '../../lib/app-error';
import {
  deriveFormationEnthalpy,
  fractionText,
  hillFormula,
  isThermoError,
  parseEquation,
  parseFormula,
  printEquation,
  speciesPhaseId,
  type FormationValue,
  type FormulaSpecies,
  type Term,
  type UncertaintyBasis,
} from '../../thermo';
import { resolveEquation } from '../reactions/reaction-resolver';
import { buildSnapshot, type ReleaseSnapshot } from '../releases/release-snapshot';
import { releasesRepository } from '../releases/releases-repository';
import { loadAcceptedInput, loadSnapshotInput } from '../releases/snapshot-input';
import { decimalText } from './values-si';

type Queryable = Database | Tx;

/** `accepted`: the newest accepted values, released or waiting for the next release. */
export const ACCEPTED = 'accepted';

/** Finds the engine's index of a release (`2026.1`, `latest`) or of the accepted values. */
export type SnapshotSource = (release: string) => Promise<ReleaseSnapshot>;

/**
 * Snapshots for derivations and review: published releases through `published` (the releases
 * service's shared cache) or loaded directly; `accepted` is built from the current accepted
 * revisions each time (they change with every approval), once per source.
 */
export function snapshotSource(
  db: Queryable,
  published?: (version: string) => Promise<ReleaseSnapshot>,
): SnapshotSource {
  const cache = new Map<string, Promise<ReleaseSnapshot>>();
  return (release) => {
    let p = cache.get(release);
    if (!p) {
      p = release === ACCEPTED ? acceptedSnapshot(db) : publishedSnapshot(db, release, published);
      cache.set(release, p);
    }
    return p;
  };
}

async function publishedSnapshot(
  db: Queryable,
  version: string,
  published?: (version: string) => Promise<ReleaseSnapshot>,
): Promise<ReleaseSnapshot> {
  if (published) return published(version);
  const row =
    version === 'latest'
      ? await releasesRepository.findLatestPublished(db)
      : await releasesRepository.findByVersion(db, version);
  if (!row || row.status !== 'published') {
    throw new AppError(
      404,
      'unknown_release',
      `There is no published release ${JSON.stringify(version)}`,
    );
  }
  return buildSnapshot(await loadSnapshotInput(db, row));
}

/**
 * Every accepted quantity indexed as a release's rows are, so reactions away from 298.15 K go
 * through the heat-capacity data as they do against a release.
 */
async function acceptedSnapshot(db: Queryable): Promise<ReleaseSnapshot> {
  return buildSnapshot(await loadAcceptedInput(db, ACCEPTED));
}

/** The species a derivation is for: its stored formula, charge and the phase it is derived in. */
export interface DerivationTarget {
  key: string;
  formula: string;
  charge: number;
  phase: 'g' | 'l' | 'cr' | 'am' | 'aq';
  modification: string | null;
}

export interface DerivationInput {
  equation: string;
  /** J/mol. */
  deltaH: number;
  uncertainty: number | null;
  uncertaintyBasis: UncertaintyBasis | null;
  release: string;
}

/** The target's composition as a formula species (charge from the registry row). */
function compositionOf(t: DerivationTarget): FormulaSpecies {
  const parsed = parseFormula(t.formula);
  if (parsed.charge !== 0 || t.charge === 0) return { kind: 'formula', ...parsed };
  const n = Math.abs(t.charge);
  return {
    kind: 'formula',
    ...parseFormula(`${t.formula}^${n === 1 ? '' : n}${t.charge > 0 ? '+' : '-'}`),
  };
}

const isTargetTerm = (t: Term, target: DerivationTarget, hill: string): boolean => {
  const sameSpecies =
    t.species.kind === 'key'
      ? t.species.key === target.key
      : hillFormula(t.species.elements, t.species.charge) === hill;
  if (!sameSpecies) return false;
  const phaseOk =
    t.phase === null ||
    t.phase === target.phase ||
    (t.phase === 's' && (target.phase === 'cr' || target.phase === 'am'));
  return phaseOk && (t.modification === null || t.modification === target.modification);
};

/**
 * ΔfH° of `target` from a measured reaction enthalpy and the other species' values in the
 * chosen snapshot, through the engine (uncertainties combined in quadrature). Throws AppError
 * or ThermoError with a message a curator can act on.
 */
export function derive(
  snap: ReleaseSnapshot,
  target: DerivationTarget,
  input: DerivationInput,
): ItemDerivation & {
  joules: number;
  uncertaintyJoules: number | null;
  inputRevisionIds: number[];
} {
  const written = parseEquation(input.equation);
  const composition = compositionOf(target);
  const hill = hillFormula(composition.elements, composition.charge);
  const all = [...written.reactants, ...written.products];
  const matches = all.filter((t) => isTargetTerm(t, target, hill));
  if (matches.length !== 1) {
    throw new AppError(
      422,
      'target_not_in_equation',
      matches.length === 0
        ? `the equation has no term for ${target.key} in phase ${target.phase}`
        : `the equation names ${target.key} more than once`,
    );
  }
  const found = matches[0]!;
  const targetTerm: Term = {
    coefficient: found.coefficient,
    species: composition,
    phase: target.phase,
    modification: target.modification,
    id: speciesPhaseId(composition, target.phase, target.modification),
    unresolvedSolid: false,
  };
  const others = {
    reactants: written.reactants.filter((t) => t !== found),
    products: written.products.filter((t) => t !== found),
  };
  const resolution = resolveEquation(snap, others, false);
  const byId = new Map<string, FormationValue>();
  for (const r of resolution.byTerm.values()) {
    const f = r.entry?.formation;
    if (!f || r.referenceState) continue;
    byId.set(r.composition.id, {
      value: f.joules,
      uncertainty: f.uncertaintyJoules,
      uncertaintyBasis: f.uncertaintyBasis,
      revisionId: Number(f.revisionId),
      species: r.entry!.species.key,
      phase: r.entry!.phase + (r.entry!.modification ? `,${r.entry!.modification}` : ''),
    });
  }
  const onProducts = written.products.includes(found);
  const equation = {
    reactants: [...resolution.balanceEquation.reactants, ...(onProducts ? [] : [targetTerm])],
    products: [...resolution.balanceEquation.products, ...(onProducts ? [targetTerm] : [])],
  };
  const d = deriveFormationEnthalpy(
    equation,
    input.deltaH,
    input.uncertainty,
    targetTerm,
    (t) => byId.get(t.id),
    { measuredUncertaintyBasis: input.uncertaintyBasis ?? undefined },
  );
  const inputs = d.inputs
    .filter((c) => !c.referenceState && c.data)
    .map((c) => ({
      species: String(c.data!.species),
      phase: String(c.data!.phase),
      revisionId: Number(c.data!.revisionId),
      value: c.formationEnthalpy,
      uncertainty: c.uncertainty,
      coefficient: fractionText(c.nu),
    }));
  return {
    equation: printEquation(equation),
    deltaH: decimalText(input.deltaH),
    uncertainty: input.uncertainty === null ? null : decimalText(input.uncertainty),
    releaseVersion: snap.version,
    uncertaintyBasis: input.uncertaintyBasis,
    value: decimalText(roundJoules(d.value)),
    valueUncertainty: d.uncertainty === null ? null : decimalText(roundJoules(d.uncertainty)),
    valueUncertaintyBasis:
      d.uncertainty === null
        ? null
        : d.uncertaintyBasis === 'mixed'
          ? 'as_stated'
          : d.uncertaintyBasis,
    inputs: inputs.map(({ coefficient: _c, ...i }) => i),
    joules: d.value,
    uncertaintyJoules: d.uncertainty,
    inputRevisionIds: inputs.map((i) => i.revisionId),
  };
}

/** A derived value is computed in floating point: kept to 0.001 J/mol, far below any uncertainty. */
const roundJoules = (j: number) => Math.round(j * 1000) / 1000;

/** An engine or resolution failure as a curator reads it. */
export function derivationMessage(err: unknown): { code: string; message: string } | null {
  if (isThermoError(err)) return { code: err.code, message: err.message };
  if (err instanceof AppError) return { code: err.code, message: err.message };
  return null;
}
