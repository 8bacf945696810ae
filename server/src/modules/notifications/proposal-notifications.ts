import type { Tx } from '../../db/client';
import { enqueueMail, type OutgoingMail } from '../mail/outbox';
import type { ProposalEvent, ProposalEventSink } from '../proposals/proposal-events';
import { notificationsRepository, type Recipient } from './notifications-repository';
import { proposalMail, type MailReason } from './proposal-mail';

/**
 * Who hears of an event, and why:
 * - submitted: every editor and admin;
 * - decided, commented: the author and the thread's participants;
 * - withdrawn: the thread's participants (reviewers who already spent time on it).
 * Never the one who acted; never users who turned e-mail off or have no address.
 */
export async function proposalRecipients(
  tx: Tx,
  event: ProposalEvent,
): Promise<{ recipient: Recipient; reason: MailReason }[]> {
  const exceptId = event.actorId;
  if (event.type === 'submitted') {
    const editors = await notificationsRepository.recipients(tx, {
      roles: ['editor', 'admin'],
      exceptId,
    });
    return editors.map((recipient) => ({ recipient, reason: 'editor' }));
  }
  const participants = event.participants.map((p) => p.id);
  const ids = event.type === 'withdrawn' ? participants : [event.author.id, ...participants];
  const found = await notificationsRepository.recipients(tx, { ids, exceptId });
  return found.map((recipient) => ({
    recipient,
    reason: recipient.id === event.author.id ? 'author' : 'participant',
  }));
}

/**
 * The proposals module's event sink: one outbox message per recipient, written in the event's
 * own transaction, so the change and its e-mail commit together. `publicUrl` is where links point.
 */
export function createProposalNotifier({ publicUrl }: { publicUrl: string }): ProposalEventSink {
  return async (tx, event) => {
    const messages: OutgoingMail[] = (await proposalRecipients(tx, event)).map(
      ({ recipient, reason }) => ({
        to: recipient.email,
        recipientId: recipient.id,
        eventKind: `proposal.${event.type}`,
        ...proposalMail(event, reason, publicUrl),
      }),
    );
    await enqueueMail(tx, messages);
  };
}
