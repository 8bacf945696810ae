import type { ProposalItemRow, ProposalRow, UserRow } from '../../../../schema';
import type { Database } from '../../db/client';
import { forbidden, notFound } from '../../lib/app-error';
import { SAFETY_CAUTION } from '../reactions/reaction-answer';
import type { ReactionsService } from '../reactions/reactions-service';
import {
  buildSnapshot,
  entryId,
  type ReleaseSnapshot,
  type SnapshotFormationValue,
  type SnapshotHeatCapacitySet,
  type SnapshotSpecies,
  type SnapshotTransition,
  type SnapshotTransitionEntry,
  type SpeciesPhaseEntry,
} from '../releases/release-snapshot';
import { hasRole } from '../users/roles';
import { impactReport } from '../watchlists/impact';
import { watchlistsRepository } from '../watchlists/watchlists-repository';
import type { ImpactItem } from '../watchlists/watchlists-schemas';
import { ACCEPTED, type SnapshotSource } from './derivation';
import { storedFormula } from './item-check';
import { heatModel } from './item-rules';
import type { ProposalItemInput } from './proposal-item-schemas';
import { proposalsRepository } from './proposals-repository';
import type { WatchlistImpactAnswer } from './proposals-schemas';

/**
 * The proposal as the detail shows it: drafts are their author's alone (others get 404), and
 * otherwise only its author and curators or above may read it (403).
 */
export async function findVisible(db: Database, actor: UserRow, id: number): Promise<ProposalRow> {
  const p = await proposalsRepository.find(db, id);
  if (!p || (p.status === 'draft' && p.authorId !== actor.id)) throw notFound(`Proposal ${id}`);
  if (p.authorId !== actor.id && !hasRole(actor.role, 'curator')) throw forbidden();
  return p;
}

type Formation = NonNullable<SpeciesPhaseEntry['formation']>;

/** The pinned row of an entry, without the numbers the snapshot parsed from it. */
const plainRow = ({
  joules: _j,
  uncertaintyJoules: _u,
  ...row
}: Formation): SnapshotFormationValue => row;

/** A transition as a row again (its numbers as text that parses back to the same numbers). */
const plainTransition = (t: SnapshotTransitionEntry): SnapshotTransition => ({
  revisionId: t.revisionId,
  speciesKey: t.from.species.key,
  fromPhase: t.from.phase,
  fromModification: t.from.modification,
  toPhase: t.to.phase,
  toModification: t.to.modification,
  temperature: String(t.temperature),
  deltaH: String(t.deltaH),
  source: t.source,
});

/** One accepted transition per species-phase and target phase, as the registry keeps them. */
const transitionKey = (t: SnapshotTransition) =>
  `${entryId(t.speciesKey, t.fromPhase, t.fromModification)}>${t.toPhase},${t.toModification ?? ''}`;

const dropRevision = (rows: Map<string, { revisionId: string }>, revisionId: string) => {
  for (const [k, row] of rows) if (row.revisionId === revisionId) rows.delete(k);
};

/**
 * The accepted values with a proposal's items applied, as approving it would: new species, new
 * and superseding ΔfH° values, heat-capacity sets and transitions in place of their targets,
 * retired ones gone.
 */
export function overlaid(
  base: ReleaseSnapshot,
  proposalId: number,
  items: readonly ProposalItemRow[],
  /** Registry species the accepted values do not hold yet (no accepted value of their own). */
  registered: readonly SnapshotSpecies[] = [],
): ReleaseSnapshot {
  const species = new Map<string, SnapshotSpecies>(base.species);
  for (const s of registered) if (!species.has(s.key)) species.set(s.key, s);
  const values = new Map<string, SnapshotFormationValue>();
  const heat = new Map<string, SnapshotHeatCapacitySet>();
  const transitions = new Map<string, SnapshotTransition>();
  for (const [id, e] of base.entries) {
    if (e.formation) values.set(id, plainRow(e.formation));
    if (e.heatCapacity) heat.set(id, e.heatCapacity);
    for (const t of e.transitionsUp.map(plainTransition)) transitions.set(transitionKey(t), t);
  }

  for (const item of items) {
    const input = item.input as ProposalItemInput;
    if (input.kind === 'add_species') {
      species.set(input.key, {
        key: input.key,
        name: input.name,
        formula: storedFormula(input),
        charge: input.charge,
        synonyms: input.synonyms,
      });
      continue;
    }
    if (item.quantity === null || item.speciesKey === null || !item.phase) continue;
    if (item.targetRevisionId !== null) {
      const target = String(item.targetRevisionId);
      for (const rows of [values, heat, transitions]) dropRevision(rows, target);
    }
    if (input.kind === 'retire_value' || !species.has(item.speciesKey)) continue;
    const id = entryId(item.speciesKey, item.phase, item.modification);
    const revisionId = `proposal-${proposalId}#${item.seq}`;
    const source = { id: String(item.sourceId ?? ''), citation: '', doi: null };
    const at = { speciesKey: item.speciesKey, phase: item.phase, modification: item.modification };
    if ('quantity' in input && input.quantity === 'heat_capacity') {
      // Checked at submission; a set the engine refuses is left out, as approval would refuse it.
      const model = heatModel(input.form, input.ranges, () => {});
      if (model) heat.set(id, { revisionId, ...at, model, source });
      continue;
    }
    if (item.value === null) continue;
    if ('quantity' in input && input.quantity === 'transition') {
      const t: SnapshotTransition = {
        revisionId,
        speciesKey: item.speciesKey,
        fromPhase: item.phase,
        fromModification: item.modification,
        toPhase: input.toPhase,
        toModification: input.toModification ?? null,
        temperature: String(input.temperature),
        deltaH: item.value,
        source,
      };
      transitions.set(transitionKey(t), t);
      continue;
    }
    if (item.quantity !== 'formation_enthalpy') continue;
    const basis = 'uncertaintyBasis' in input ? (input.uncertaintyBasis ?? null) : null;
    values.set(id, {
      revisionId,
      ...at,
      value: item.value,
      uncertainty: item.uncertainty,
      uncertaintyBasis: item.uncertainty === null ? null : (basis ?? 'as_stated'),
      method: 'method' in input && input.method ? input.method : 'unspecified',
      standardPressure: 'standardPressure' in input ? input.standardPressure : '1 bar',
      source,
    });
  }
  return buildSnapshot({
    version: `proposal-${proposalId}`,
    publishedAt: null,
    species: [...species.values()],
    formationValues: [...values.values()],
    heatCapacitySets: [...heat.values()],
    transitions: [...transitions.values()],
  });
}

/** A reaction the proposal moves, or that only one side can compute. */
const isAffected = (r: ImpactItem) =>
  r.change !== null ? r.change !== 0 : 'error' in r.from !== 'error' in r.to;

/**
 * What approving the proposal would do to each of the caller's watchlists (no one else's):
 * ΔrH from the accepted values and with the proposal applied, through the reactions service's
 * batch like a release-to-release impact report.
 */
export async function watchlistImpact(
  db: Database,
  actor: UserRow,
  id: number,
  snapshots: SnapshotSource,
  reactions: ReactionsService,
): Promise<WatchlistImpactAnswer> {
  const p = await findVisible(db, actor, id);
  const lists = await watchlistsRepository.listOwn(db, actor.id);
  let after: ReleaseSnapshot | null = null;
  let before: ReleaseSnapshot | null = null;
  if (lists.length > 0) {
    before = await snapshots(ACCEPTED);
    const items = await proposalsRepository.itemsOf(db, p.id);
    const registered: SnapshotSpecies[] = [];
    for (const key of new Set(items.map((i) => i.speciesKey))) {
      if (key === null || before.species.has(key)) continue;
      const s = await proposalsRepository.speciesByKey(db, key);
      if (s) registered.push({ key, name: key, synonyms: [], ...s });
    }
    after = overlaid(before, p.id, items, registered);
  }
  return {
    proposalId: p.id,
    status: p.status,
    watchlists: lists.map((w) => {
      const report = impactReport(reactions, before!, after!, {
        reactions: w.reactions,
        unit: 'kJ/mol',
        watchlistId: w.id,
      });
      return {
        id: w.id,
        name: w.name,
        affected: report.results.filter(isAffected).length,
        report,
      };
    }),
    caution: SAFETY_CAUTION,
  };
}
