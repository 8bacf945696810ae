import { inArray } from 'drizzle-orm';
import { sources, type ProposalItemRow, type ProposalRow, type UserRow } from '../../../../schema';
import type { Database, Tx } from '../../db/client';
import { hasRole } from '../users/roles';
import type { SnapshotSource } from './derivation';
import { ACCEPTED } from './derivation';
import { storedFormula } from './item-check';
import { compare, reactionImpacts } from './proposal-impact';
import { proposalsRepository, type ListRow } from './proposals-repository';
import type {
  ItemWarning,
  ProposalDetail,
  ProposalItemView,
  ProposalSummary,
  RevisionRef,
} from './proposals-schemas';
import { registryRepository, type RevisionRefRow } from './registry-repository';

type Queryable = Database | Tx;

/** Review extras (comparison, reactions, history) are built for this many items; the rest list plainly. */
export const DETAILED_ITEMS = 200;

const num = (t: string | null) => (t === null ? null : Number(t));
const iso = (d: Date | null) => (d === null ? null : d.toISOString());
const user = (id: number, login: string, name: string) => ({ id, login, name });

export function toSummary(r: ListRow): ProposalSummary {
  return {
    id: r.id,
    status: r.status,
    rationale: r.rationale,
    author: user(r.authorId, r.authorLogin, r.authorName),
    decidedBy: r.decidedBy ? user(r.decidedBy, r.deciderLogin!, r.deciderName!) : null,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
    submittedAt: iso(r.submittedAt),
    decidedAt: iso(r.decidedAt),
    itemCount: r.itemCount,
    kinds: r.kinds as ProposalSummary['kinds'],
    species: r.speciesKeys,
    commentCount: r.commentCount,
    stale: r.stale,
  };
}

export function toRevisionRef(r: RevisionRefRow): RevisionRef {
  return {
    id: r.id,
    kind: r.kind,
    quantity: r.quantity,
    status: r.status,
    value: num(r.value),
    valueText: r.value,
    uncertainty: num(r.uncertainty),
    uncertaintyBasis: r.uncertaintyBasis,
    temperature: num(r.temperature),
    method: r.method,
    standardPressure: r.standardPressure,
    source: { id: r.sourceId, citation: r.citation, doi: r.doi },
    createdAt: r.createdAt.toISOString(),
    releases: r.releases,
    derived: r.derived,
  };
}

/** What the viewer may do now; the screens show only these actions. */
export function allowedActions(p: ProposalRow, viewer: UserRow): ProposalDetail['allowed'] {
  const own = p.authorId === viewer.id;
  const out: ProposalDetail['allowed'] = [];
  const open = p.status === 'draft' || p.status === 'changes_requested';
  if (own && open && hasRole(viewer.role, 'curator')) out.push('revise', 'submit');
  if (own && (open || p.status === 'submitted')) out.push('withdraw');
  if (own || hasRole(viewer.role, 'curator')) out.push('comment');
  if (!own && p.status === 'submitted' && hasRole(viewer.role, 'editor')) out.push('decide');
  return out;
}

/** The detail of one proposal for review: each item beside what it would replace. */
export async function buildDetail(
  db: Queryable,
  p: ProposalRow,
  summary: ProposalSummary,
  viewer: UserRow,
  snapshots: SnapshotSource,
  warnings: ItemWarning[],
): Promise<ProposalDetail> {
  const [items, comments] = await Promise.all([
    proposalsRepository.itemsOf(db, p.id),
    proposalsRepository.commentsOf(db, p.id),
  ]);
  const sourceIds = [
    ...new Set(items.map((i) => i.sourceId).filter((x): x is number => x !== null)),
  ];
  const sourceRows = sourceIds.length
    ? await db
        .select({ id: sources.id, citation: sources.citation, doi: sources.doi })
        .from(sources)
        .where(inArray(sources.id, sourceIds))
    : [];
  const sourceById = new Map(sourceRows.map((s) => [s.id, s]));
  const needsSnapshot = items
    .slice(0, DETAILED_ITEMS)
    .some((i) => i.quantity === 'formation_enthalpy' && i.value !== null);
  const snap = needsSnapshot ? await snapshots(ACCEPTED) : null;

  const views: ProposalItemView[] = [];
  for (const [n, item] of items.entries()) {
    const view = plainView(item, sourceById);
    if (n < DETAILED_ITEMS) await enrich(db, view, item, snap);
    views.push(view);
  }
  return {
    ...summary,
    items: views,
    comments: comments.map((c) => ({
      id: c.comment.id,
      author: user(c.comment.authorId, c.login, c.name),
      body: c.comment.body,
      decision: c.comment.decision,
      createdAt: c.comment.createdAt.toISOString(),
    })),
    warnings,
    allowed: allowedActions(p, viewer),
  };
}

function plainView(
  item: ProposalItemRow,
  sourceById: Map<number, { id: number; citation: string; doi: string | null }>,
): ProposalItemView {
  const d = item.derivation;
  return {
    index: item.seq,
    kind: item.kind,
    input: item.input,
    species: item.speciesKey,
    phase: item.phase,
    modification: item.modification,
    quantity: item.quantity,
    value: num(item.value),
    uncertainty: num(item.uncertainty),
    source: item.sourceId === null ? null : (sourceById.get(item.sourceId) ?? null),
    target: null,
    targetRevisionId: item.targetRevisionId,
    comparison: null,
    otherValues: [],
    wouldStale: [],
    reactions: [],
    derivation: d
      ? {
          value: Number(d.value),
          uncertainty: num(d.valueUncertainty),
          equation: d.equation,
          release: d.releaseVersion,
          inputs: d.inputs,
        }
      : null,
    staleInputs: [],
    createdRevisionId: item.createdRevisionId,
  };
}

async function enrich(
  db: Queryable,
  view: ProposalItemView,
  item: ProposalItemRow,
  snap: Awaited<ReturnType<SnapshotSource>> | null,
): Promise<void> {
  if (item.speciesKey === null || item.phase === null || item.quantity === null) return;
  const history = await registryRepository.revisionsOf(
    db,
    item.speciesKey,
    item.phase,
    item.modification,
    item.quantity,
  );
  const target = history.find((r) => r.id === item.targetRevisionId);
  view.target = target ? toRevisionRef(target) : null;
  view.otherValues = history.filter((r) => r.id !== item.targetRevisionId).map(toRevisionRef);
  if (item.targetRevisionId !== null) {
    view.wouldStale = (await registryRepository.dependents(db, [item.targetRevisionId])).map(
      ({ inputRevisionId: _i, ...d }) => d,
    );
  }
  if (item.kind === 'derive_value') {
    view.staleInputs = (await registryRepository.staleOfInputs(db, item.inputRevisionIds)).map(
      ({ revisionId: _r, ...s }) => s,
    );
  }
  const proposed = num(item.value);
  if (proposed !== null && target?.value != null) {
    view.comparison = compare(
      { value: proposed, uncertainty: num(item.uncertainty) },
      { value: Number(target.value), uncertainty: num(target.uncertainty) },
    );
  }
  if (snap && item.quantity === 'formation_enthalpy' && proposed !== null) {
    const species = await speciesFormula(db, item);
    if (species) {
      view.reactions = reactionImpacts(
        snap,
        { key: item.speciesKey, phase: item.phase, modification: item.modification, ...species },
        target?.value != null ? Number(target.value) : null,
        proposed,
      );
    }
  }
}

/** The species' stored formula, or the one a new species of the same proposal will get. */
async function speciesFormula(db: Queryable, item: ProposalItemRow) {
  const existing = await proposalsRepository.speciesByKey(db, item.speciesKey!);
  if (existing) return existing;
  const added = await proposalsRepository.addedSpecies(db, item.proposalId, item.speciesKey!);
  return added ? { formula: storedFormula(added), charge: added.charge } : null;
}
