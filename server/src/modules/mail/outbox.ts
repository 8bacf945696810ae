import { outboxMessages } from '../../../../schema';
import type { Database, Tx } from '../../db/client';

/** A message to send once the caller's transaction commits. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string | null;
  /** What caused it, e.g. `proposal.submitted`. */
  eventKind: string;
  /** The user it is for, when it is for one. */
  recipientId?: number | null;
}

/**
 * Writes messages to the outbox inside the caller's transaction, so an event and the mail
 * about it commit or roll back together. The outbox worker delivers them afterwards.
 */
export async function enqueueMail(tx: Tx | Database, messages: OutgoingMail[]): Promise<number[]> {
  if (messages.length === 0) return [];
  const rows = await tx
    .insert(outboxMessages)
    .values(
      messages.map((m) => ({
        toAddress: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html ?? null,
        eventKind: m.eventKind,
        recipientId: m.recipientId ?? null,
      })),
    )
    .returning({ id: outboxMessages.id });
  return rows.map((r) => r.id);
}
