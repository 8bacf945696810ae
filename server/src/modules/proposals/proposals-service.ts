import type { ProposalRow, UserRow } from '../../../../schema';
import type { Database, Tx } from '../../db/client';
import { AppError, forbidden, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit-repository';
import { createReactionsService } from '../reactions/reactions-service';
import type { ReleaseSnapshot } from '../releases/release-snapshot';
import { usersRepository } from '../users/users-repository';
import { snapshotSource, type SnapshotSource } from './derivation';
import { checkAndResolve } from './item-check';
import { applyItems, conflictOf, staleError, staleReasons } from './proposal-approval';
import { buildDetail, toSummary } from './proposal-detail';
import {
  eventBase,
  ignoreProposalEvents,
  type EventDetails,
  type ProposalEvent,
  type ProposalEventSink,
} from './proposal-events';
import { findVisible, watchlistImpact } from './proposal-watchlist-impact';
import { proposalsRepository } from './proposals-repository';
import type {
  CheckAnswer,
  CommentAnswer,
  CreateProposalBody,
  Decision,
  ProposalDetail,
  ProposalList,
  ProposalListQuery,
  ProposalStatus,
  TransitionAnswer,
} from './proposals-schemas';
import { createRederive } from './rederive';

/**
 * Curation: proposals from draft to decision. Every transition is one transaction that locks
 * the proposal row, re-checks the actor's role under lock, writes its audit row and hands its
 * event to the sink — all or nothing. `checkItems` and `createDraftIn` (for bulk upload) live in
 * proposal-drafts.ts and are re-exported here.
 */
import { createDraftIn, invalidItems } from './proposal-drafts';

export { checkItems, createDraftIn, type ItemCheckOptions } from './proposal-drafts';

type Actor = Pick<UserRow, 'id'>;
type Queryable = Database | Tx;

export interface ProposalsServiceDeps {
  db: Database;
  releases: { getSnapshot(version: string): Promise<ReleaseSnapshot> };
  onEvent?: ProposalEventSink;
}

/** Refusals of who the actor is, as opposed to the proposal's state. */
const REFUSALS = new Set(['own_proposal', 'forbidden', 'role_revoked']);
const FINAL: ProposalStatus[] = ['approved', 'rejected', 'withdrawn'];
const DECIDED_STATUS: Record<Decision, ProposalStatus> = {
  approve: 'approved',
  reject: 'rejected',
  request_changes: 'changes_requested',
};

export function createProposalsService({ db, releases, onEvent }: ProposalsServiceDeps) {
  const sink = onEvent ?? ignoreProposalEvents;
  const published = (v: string) => releases.getSnapshot(v);
  const snapshots = (q: Queryable): SnapshotSource => snapshotSource(q, published);
  const reactions = createReactionsService(published);

  /** Locks the proposal; drafts are their author's alone (others get 404). */
  async function lockVisible(tx: Tx, id: number, actor: Actor): Promise<ProposalRow> {
    const p = await proposalsRepository.lock(tx, id);
    if (!p || (p.status === 'draft' && p.authorId !== actor.id)) throw notFound(`Proposal ${id}`);
    return p;
  }

  const mustBeAuthor = (p: ProposalRow, actor: Actor, what: string) => {
    if (p.authorId !== actor.id) throw forbidden(`Only the author may ${what} this proposal`);
  };

  const wrongState = (p: ProposalRow, what: string) =>
    FINAL.includes(p.status)
      ? new AppError(409, 'already_decided', `Proposal ${p.id} is already ${p.status}`, {
          status: p.status,
        })
      : new AppError(409, 'invalid_transition', `A ${p.status} proposal cannot be ${what}`, {
          status: p.status,
        });

  async function emit(tx: Tx, p: ProposalRow, actor: Actor, event: EventDetails) {
    // One connection: the transaction's queries run one after another.
    const author = await proposalsRepository.userById(tx, p.authorId);
    const actorUser = await proposalsRepository.userById(tx, actor.id);
    const participants = await proposalsRepository.participants(tx, p.id);
    await sink(tx, { ...eventBase(p, actorUser, author, participants), ...event } as ProposalEvent);
  }

  const audit = (
    tx: Tx,
    actor: Actor,
    p: ProposalRow,
    action: string,
    before: unknown,
    after: unknown,
  ) =>
    recordAudit(tx, {
      actorId: actor.id,
      action,
      entityType: 'proposal',
      entityId: p.id,
      before,
      after,
    });

  const transition = (p: ProposalRow, extra: Partial<TransitionAnswer> = {}): TransitionAnswer => ({
    id: p.id,
    status: p.status,
    createdRevisionIds: [],
    warnings: [],
    ...extra,
  });

  const service = {
    async check(items: readonly unknown[]): Promise<CheckAnswer> {
      const r = await checkAndResolve(db, items, snapshots(db));
      return { ok: r.issues.length === 0, issues: r.issues, warnings: r.warnings };
    },

    create: (actor: Actor, input: CreateProposalBody) =>
      db.transaction((tx) => createDraftIn(tx, actor, input, { published })),

    /** PUT/PATCH: a draft or a proposal sent back for changes; items are checked again. */
    revise: (actor: Actor, id: number, input: { rationale?: string; items?: unknown[] }) =>
      db.transaction(async (tx) => {
        await usersRepository.assertActorRoleLocked(tx, actor.id, 'curator');
        const p = await lockVisible(tx, id, actor);
        mustBeAuthor(p, actor, 'revise');
        if (p.status !== 'draft' && p.status !== 'changes_requested')
          throw wrongState(p, 'revised');
        let warnings: TransitionAnswer['warnings'] = [];
        if (input.items) {
          const checked = await checkAndResolve(tx, input.items, snapshots(tx));
          if (checked.issues.length) throw invalidItems(checked.issues);
          await proposalsRepository.deleteItems(tx, id);
          await proposalsRepository.insertItems(tx, id, checked.items);
          warnings = checked.warnings;
        }
        const row = await proposalsRepository.update(tx, id, {
          rationale: input.rationale ?? p.rationale,
        });
        await audit(
          tx,
          actor,
          p,
          'proposal.revised',
          { rationale: p.rationale },
          {
            rationale: row.rationale,
            items: input.items?.length ?? null,
          },
        );
        return transition(row, { warnings });
      }),

    /** Submits for review; items are re-checked and their targets fixed now. */
    submit: (actor: Actor, id: number) =>
      db.transaction(async (tx) => {
        await usersRepository.assertActorRoleLocked(tx, actor.id, 'curator');
        const p = await lockVisible(tx, id, actor);
        mustBeAuthor(p, actor, 'submit');
        if (p.status !== 'draft' && p.status !== 'changes_requested')
          throw wrongState(p, 'submitted');
        const items = await proposalsRepository.itemsOf(tx, id);
        const checked = await checkAndResolve(
          tx,
          items.map((i) => i.input),
          snapshots(tx),
        );
        if (checked.issues.length) throw invalidItems(checked.issues);
        await proposalsRepository.deleteItems(tx, id);
        await proposalsRepository.insertItems(tx, id, checked.items);
        const row = await proposalsRepository.update(tx, id, {
          status: 'submitted',
          submittedAt: new Date(),
          decidedBy: null,
          decidedAt: null,
        });
        await audit(
          tx,
          actor,
          p,
          'proposal.submitted',
          { status: p.status },
          { status: row.status },
        );
        await emit(tx, row, actor, {
          type: 'submitted',
          status: row.status,
          itemCount: items.length,
        });
        return transition(row, { warnings: checked.warnings });
      }),

    withdraw: (actor: Actor, id: number) =>
      db.transaction(async (tx) => {
        const p = await lockVisible(tx, id, actor);
        mustBeAuthor(p, actor, 'withdraw');
        if (FINAL.includes(p.status)) throw wrongState(p, 'withdrawn');
        const row = await proposalsRepository.update(tx, id, { status: 'withdrawn' });
        await audit(
          tx,
          actor,
          p,
          'proposal.withdrawn',
          { status: p.status },
          { status: row.status },
        );
        await emit(tx, row, actor, { type: 'withdrawn', status: row.status });
        return transition(row);
      }),

    comment: (
      actor: Pick<UserRow, 'id' | 'login' | 'name'>,
      id: number,
      body: string,
    ): Promise<CommentAnswer> =>
      db.transaction(async (tx) => {
        const p = await lockVisible(tx, id, actor);
        if (p.authorId !== actor.id)
          await usersRepository.assertActorRoleLocked(tx, actor.id, 'curator');
        const c = await proposalsRepository.insertComment(tx, {
          proposalId: id,
          authorId: actor.id,
          body,
          decision: null,
        });
        await proposalsRepository.update(tx, id, {});
        await audit(tx, actor, p, 'proposal.commented', null, { commentId: c.id });
        await emit(tx, p, actor, { type: 'commented', commentId: c.id, body });
        return {
          comment: {
            id: c.id,
            author: { id: actor.id, login: actor.login, name: actor.name },
            body: c.body,
            decision: null,
            createdAt: c.createdAt.toISOString(),
          },
        };
      }),

    /**
     * approve / reject / request_changes by an editor who is not the author. Exactly one
     * decision wins: the proposal row is locked and its status checked under the lock. Approve
     * and reject are refused with 409 `stale` when a target was superseded since submission
     * (request_changes stays possible: it hands the proposal back to be revised).
     */
    async decide(
      actor: Actor,
      id: number,
      decision: Decision,
      comment: string,
    ): Promise<TransitionAnswer> {
      try {
        return await db.transaction(async (tx) => {
          await usersRepository.assertActorRoleLocked(tx, actor.id, 'editor');
          const p = await lockVisible(tx, id, actor);
          if (p.authorId === actor.id)
            throw new AppError(
              403,
              'own_proposal',
              'Nobody decides their own proposal: another editor must review it',
            );
          if (p.status !== 'submitted') {
            throw p.status === 'draft'
              ? new AppError(
                  409,
                  'not_submitted',
                  `Proposal ${id} is a draft: it has not been submitted`,
                )
              : new AppError(
                  409,
                  'already_decided',
                  `Proposal ${id} was already decided: it is ${p.status}`,
                  { status: p.status },
                );
          }
          const items = await proposalsRepository.itemsOf(tx, id);
          if (decision !== 'request_changes') {
            const reasons = await staleReasons(tx, items);
            if (reasons.length) throw staleError(reasons);
          }
          const created = decision === 'approve' ? await applyItems(tx, items, p.authorId) : [];
          const row = await proposalsRepository.update(tx, id, {
            status: DECIDED_STATUS[decision],
            decidedBy: actor.id,
            decidedAt: new Date(),
          });
          const c = await proposalsRepository.insertComment(tx, {
            proposalId: id,
            authorId: actor.id,
            body: comment,
            decision,
          });
          await audit(
            tx,
            actor,
            p,
            'proposal.decided',
            { status: p.status },
            {
              status: row.status,
              decision,
              commentId: c.id,
              createdRevisionIds: created,
            },
          );
          await emit(tx, row, actor, {
            type: 'decided',
            decision,
            status: row.status,
            comment,
            commentId: c.id,
            createdRevisionIds: created,
          });
          return transition(row, { createdRevisionIds: created });
        });
      } catch (err) {
        // Own proposal, or a role lost meanwhile: audited outside the rolled-back transaction.
        if (err instanceof AppError && REFUSALS.has(err.code))
          await service.recordRefusedDecision(actor, id, decision, err.code);
        throw conflictOf(err);
      }
    },

    /** A refused decision is audited as its own action, without the change it asked for. */
    async recordRefusedDecision(actor: Actor, id: number, decision: Decision, code: string) {
      await recordAudit(db, {
        actorId: actor.id,
        action: 'proposal.decision_refused',
        entityType: 'proposal',
        entityId: id,
        after: { decision, code },
      });
    },

    async list(actor: UserRow, q: ProposalListQuery): Promise<ProposalList> {
      const { rows, total } = await proposalsRepository.list(db, actor.id, q);
      return { proposals: rows.map(toSummary), total, offset: q.offset, limit: q.limit };
    },

    async detail(actor: UserRow, id: number): Promise<ProposalDetail> {
      const p = await findVisible(db, actor, id);
      const { rows } = await proposalsRepository.list(
        db,
        actor.id,
        { sort: 'id', order: 'asc', offset: 0, limit: 1 },
        [id],
      );
      const items = await proposalsRepository.itemsOf(db, id);
      const open =
        p.status === 'draft' || p.status === 'changes_requested' || p.status === 'submitted';
      // One snapshot source: the accepted values are indexed once per request.
      const snaps = snapshots(db);
      const warnings = open
        ? (
            await checkAndResolve(
              db,
              items.map((i) => i.input),
              snaps,
            )
          ).warnings
        : [];
      return buildDetail(db, p, toSummary(rows[0]!), actor, snaps, warnings);
    },
  };
  return {
    ...service,
    rederive: createRederive(db, (tx, actor, input) =>
      createDraftIn(tx, actor, input, { published }),
    ),
    /** The caller's watchlists before and with the proposal applied. */
    watchlistImpact: (actor: UserRow, id: number) =>
      watchlistImpact(db, actor, id, snapshots(db), reactions),
  };
}

export type ProposalsService = ReturnType<typeof createProposalsService>;
