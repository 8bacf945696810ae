import type { ProposalRow } from '../../../../schema';
import type { Tx } from '../../db/client';
import type { Decision, ProposalStatus } from './proposals-schemas';

/** Who acted, as a notifier addresses and names them. */
export interface EventUser {
  id: number;
  login: string;
  name: string;
  email: string | null;
}

interface EventBase {
  proposalId: number;
  actorId: number;
  actor: EventUser;
  /** The proposal's author (the proposer). */
  author: EventUser;
  /** First line of the rationale, for a subject line. */
  title: string;
  /** Everyone who has commented on or decided the proposal so far, author and actor excluded. */
  participants: EventUser[];
  /** When it happened (the transaction's clock). */
  at: Date;
}

/**
 * What the proposals service tells the outside world, inside the transaction of the change:
 * a sink that writes an outbox row lands or rolls back with the change itself.
 * - `submitted`: to the editors (the sink looks them up in the same transaction).
 * - `withdrawn`: the author withdrew it.
 * - `decided`: approve / reject / request_changes with its comment, to the author and participants.
 * - `commented`: a comment in the thread, to the author and participants (not the commenter).
 */
export type ProposalEvent =
  | (EventBase & { type: 'submitted'; status: ProposalStatus; itemCount: number })
  | (EventBase & { type: 'withdrawn'; status: ProposalStatus })
  | (EventBase & {
      type: 'decided';
      decision: Decision;
      status: ProposalStatus;
      comment: string;
      commentId: number;
      createdRevisionIds: number[];
    })
  | (EventBase & { type: 'commented'; commentId: number; body: string });

export type ProposalEventType = ProposalEvent['type'];

/** Called inside the event's transaction; throwing rolls the change back. */
export type ProposalEventSink = (tx: Tx, event: ProposalEvent) => Promise<void>;

export const ignoreProposalEvents: ProposalEventSink = async () => {};

type BaseKey = 'proposalId' | 'actorId' | 'actor' | 'author' | 'title' | 'participants' | 'at';
/** An event without what `emit` fills in. */
export type EventDetails = ProposalEvent extends infer E
  ? E extends ProposalEvent
    ? Omit<E, BaseKey>
    : never
  : never;

/** What every event of a proposal carries; `emit` adds it to the event's own details. */
export function eventBase(
  p: ProposalRow,
  actor: EventUser,
  author: EventUser,
  participants: EventUser[],
) {
  return {
    proposalId: p.id,
    actorId: actor.id,
    actor,
    author,
    title: p.rationale.split('\n', 1)[0]!.slice(0, 200),
    participants: participants.filter((u) => u.id !== author.id && u.id !== actor.id),
    at: new Date(),
  };
}
