import { sql } from 'drizzle-orm';
import { bigint, index, integer, pgEnum, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { users } from './users';

/** pending → sent, or pending → failed once the worker has used up its attempts. */
export const OUTBOX_STATUSES = ['pending', 'sent', 'failed'] as const;
export type OutboxStatus = (typeof OUTBOX_STATUSES)[number];
export const outboxStatus = pgEnum('outbox_status', OUTBOX_STATUSES);

/**
 * Outgoing e-mail, written in the same transaction as the event it tells about, so an event
 * and its message commit (or roll back) together; the outbox worker delivers it later and
 * keeps it through SMTP outages.
 */
export const outboxMessages = pgTable(
  'outbox_messages',
  {
    id: bigint({ mode: 'number' }).primaryKey().generatedAlwaysAsIdentity(),
    toAddress: text().notNull(),
    /** The user the message is for, when it is for one (null for plain addresses). */
    recipientId: integer().references(() => users.id),
    subject: text().notNull(),
    text: text().notNull(),
    html: text(),
    /** What caused it, e.g. `proposal.submitted`. */
    eventKind: text().notNull(),
    status: outboxStatus().notNull().default('pending'),
    attempts: integer().notNull().default(0),
    nextAttemptAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    lastError: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp({ withTimezone: true }),
  },
  (t) => [
    // The worker's one query: due pending messages, oldest due first.
    index('outbox_messages_due_idx')
      .on(t.nextAttemptAt, t.id)
      .where(sql`${t.status} = 'pending'`),
    index('outbox_messages_recipient_idx').on(t.recipientId),
  ],
);

export type OutboxMessageRow = typeof outboxMessages.$inferSelect;
