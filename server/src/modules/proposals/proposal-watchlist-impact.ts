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
  type SnapshotSpecies,
  type SpeciesPhaseEntry,
} from '../releases/release-snapshot';
import { hasRole } from '../users/roles';
import { impactReport } from '../watchlists/impact';
import { watchlistsRepository } from '../watchlists/watchlists-repository';
import type { ImpactItem } from '../watchlists/watchlists-schemas';
import { ACCEPTED, type SnapshotSource } from './derivation';
import { storedFormula } from './item-check';
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

/**
 * The accepted values with a proposal's ΔfH° items applied, as approving it would: new species,
 * new and superseding values in place of their targets, retired values gone. Heat capacities and
 * transitions are not overlaid (the accepted index holds none).
 */
export function overlaid(
  base: ReleaseSnapshot,
  proposalId: number,
  items: readonly ProposalItemRow[],
  /** Registry species the accepted values do not hold yet (no accepted ΔfH° of their own). */
  registered: readonly SnapshotSpecies[] = [],
): ReleaseSnapshot {
  const species = new Map<string, SnapshotSpecies>(base.species);
  for (const s of registered) if (!species.has(s.key)) species.set(s.key, s);
  const values = new Map<string, SnapshotFormationValue>();
  for (const [id, e] of base.entries) if (e.formation) values.set(id, plainRow(e.formation));

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
    if (item.quantity !== 'formation_enthalpy' || item.speciesKey === null || !item.phase) continue;
    if (item.targetRevisionId !== null) {
      const target = String(item.targetRevisionId);
      for (const [id, v] of values) if (v.revisionId === target) values.delete(id);
    }
    if (input.kind === 'retire_value' || item.value === null || !species.has(item.speciesKey))
      continue;
    const basis = 'uncertaintyBasis' in input ? (input.uncertaintyBasis ?? null) : null;
    values.set(entryId(item.speciesKey, item.phase, item.modification), {
      revisionId: `proposal-${proposalId}#${item.seq}`,
      speciesKey: item.speciesKey,
      phase: item.phase,
      modification: item.modification,
      value: item.value,
      uncertainty: item.uncertainty,
      uncertaintyBasis: item.uncertainty === null ? null : (basis ?? 'as_stated'),
      method: 'method' in input && input.method ? input.method : 'unspecified',
      standardPressure: 'standardPressure' in input ? input.standardPressure : '1 bar',
      source: { id: String(item.sourceId ?? ''), citation: '', doi: null },
    });
  }
  return buildSnapshot({
    version: `proposal-${proposalId}`,
    publishedAt: null,
    species: [...species.values()],
    formationValues: [...values.values()],
    heatCapacitySets: [],
    transitions: [],
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
