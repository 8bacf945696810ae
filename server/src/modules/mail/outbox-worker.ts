import { and, asc, eq, inArray, lte, sql } from 'drizzle-orm';
import { outboxMessages, type OutboxMessageRow } from '../../../../schema';
import type { Clock } from '../../adapters/clock';
import type { Mailer } from '../../adapters/mailer';
import type { Database } from '../../db/client';
import type { Logger } from '../../lib/logger';

export interface OutboxWorkerOptions {
  db: Database;
  mailer: Mailer;
  clock: Clock;
  logger: Logger;
  /** How often to look for due messages. */
  pollMs?: number;
  /** Messages claimed per round. */
  batchSize?: number;
  /** After this many failed attempts a message is marked failed and left alone. */
  maxAttempts?: number;
  /** Wait after the first failure; doubles after each further one up to `maxDelayMs`. */
  baseDelayMs?: number;
  maxDelayMs?: number;
  /** How long a claimed message is hidden from other workers while it is being sent. */
  leaseMs?: number;
}

export const OUTBOX_DEFAULTS = {
  pollMs: 2_000,
  batchSize: 20,
  maxAttempts: 10,
  baseDelayMs: 30_000,
  maxDelayMs: 60 * 60_000,
  leaseMs: 5 * 60_000,
} as const;

/** Exponential backoff after the n-th failed attempt (n ≥ 1), capped. */
export function retryDelayMs(attempts: number, baseDelayMs: number, maxDelayMs: number): number {
  return Math.min(maxDelayMs, baseDelayMs * 2 ** Math.max(0, attempts - 1));
}

export interface RoundResult {
  sent: number;
  retried: number;
  failed: number;
}

/**
 * Delivers the outbox. Each round claims due messages with `FOR UPDATE SKIP LOCKED` (so several
 * workers never take the same message), counts the attempt and moves the message's next attempt
 * a lease ahead, commits, then sends outside any transaction. A message whose send fails waits
 * with exponential backoff; a worker that dies mid-send leaves it to be retried after the lease.
 * Nothing is deleted: sent and failed messages stay for inspection.
 */
export function createOutboxWorker(options: OutboxWorkerOptions) {
  const o = { ...OUTBOX_DEFAULTS, ...options };
  const { db, mailer, clock, logger } = o;
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<unknown> | null = null;
  let stopped = true;

  async function claim(): Promise<OutboxMessageRow[]> {
    const now = clock.now();
    return db.transaction(async (tx) => {
      const due = await tx
        .select({ id: outboxMessages.id })
        .from(outboxMessages)
        .where(and(eq(outboxMessages.status, 'pending'), lte(outboxMessages.nextAttemptAt, now)))
        .orderBy(asc(outboxMessages.nextAttemptAt), asc(outboxMessages.id))
        .limit(o.batchSize)
        .for('update', { skipLocked: true });
      if (due.length === 0) return [];
      return tx
        .update(outboxMessages)
        .set({
          attempts: sql`${outboxMessages.attempts} + 1`,
          nextAttemptAt: new Date(now.getTime() + o.leaseMs),
        })
        .where(
          inArray(
            outboxMessages.id,
            due.map((d) => d.id),
          ),
        )
        .returning();
    });
  }

  async function deliver(message: OutboxMessageRow, result: RoundResult): Promise<void> {
    try {
      await mailer.send({
        to: message.toAddress,
        subject: message.subject,
        text: message.text,
        html: message.html,
      });
      await db
        .update(outboxMessages)
        .set({ status: 'sent', sentAt: clock.now(), lastError: null })
        .where(eq(outboxMessages.id, message.id));
      result.sent += 1;
    } catch (err) {
      const lastError = err instanceof Error ? err.message : String(err);
      const giveUp = message.attempts >= o.maxAttempts;
      const delay = retryDelayMs(message.attempts, o.baseDelayMs, o.maxDelayMs);
      await db
        .update(outboxMessages)
        .set({
          status: giveUp ? 'failed' : 'pending',
          lastError: lastError.slice(0, 2000),
          nextAttemptAt: new Date(clock.now().getTime() + delay),
        })
        .where(eq(outboxMessages.id, message.id));
      if (giveUp) result.failed += 1;
      else result.retried += 1;
      logger[giveUp ? 'error' : 'warn'](
        { outboxId: message.id, attempts: message.attempts, err: lastError },
        giveUp ? 'e-mail given up after its last attempt' : 'e-mail not sent; will retry',
      );
    }
  }

  /** One round: claim what is due and try each once. */
  async function runOnce(): Promise<RoundResult> {
    const result: RoundResult = { sent: 0, retried: 0, failed: 0 };
    for (const message of await claim()) await deliver(message, result);
    return result;
  }

  function schedule(): void {
    if (stopped) return;
    timer = setTimeout(() => {
      running = runOnce()
        .catch((err: unknown) =>
          logger.warn({ err: err instanceof Error ? err.message : err }, 'outbox round failed'),
        )
        .finally(() => {
          running = null;
          schedule();
        });
    }, o.pollMs);
  }

  return {
    runOnce,
    start(): void {
      if (!stopped) return;
      stopped = false;
      schedule();
    },
    /** Stops polling and waits for the round in progress to finish. */
    async stop(): Promise<void> {
      stopped = true;
      if (timer) clearTimeout(timer);
      await running;
    },
  };
}

export type OutboxWorker = ReturnType<typeof createOutboxWorker>;
