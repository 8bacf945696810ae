import { systemClock } from '../../server/src/adapters/clock';
import { createSmtpMailer } from '../../server/src/adapters/mailer';
import type { Database } from '../../server/src/db/client';
import type { ReceivedMail } from '../../server/src/fakes/smtp-fake';
import { createLogger } from '../../server/src/lib/logger';
import { createOutboxWorker } from '../../server/src/modules/mail/outbox-worker';

/**
 * Waits until `check` returns a value other than undefined/false, polling; fails only when the
 * test's own timeout runs out, so a slow machine makes the test slower, never red.
 */
export async function waitFor<T>(
  check: () => Promise<T | undefined | false> | T | undefined | false,
  pollMs = 25,
): Promise<T> {
  for (;;) {
    const value = await check();
    if (value !== undefined && value !== false) return value;
    await new Promise((resolve) => setTimeout(resolve, pollMs));
  }
}

/** The shared fake SMTP server the test runner started (scripts/test.sh → fakes/main.ts). */
export function sharedFakeSmtp(): { url: string; apiUrl: string } {
  const url = process.env.FAKE_SMTP_URL;
  const apiUrl = process.env.FAKE_SMTP_API_URL;
  if (!url || !apiUrl)
    throw new Error('FAKE_SMTP_URL is not set: run the tests through `npm test`');
  return { url, apiUrl };
}

/**
 * The outbox worker of `db` sending through the shared fake SMTP server, for tests that follow a
 * message all the way to the inbox; `close` it when done.
 */
export function sharedSmtpWorker(db: Database) {
  const { url, apiUrl } = sharedFakeSmtp();
  const mailer = createSmtpMailer({ url, from: 'Thalpos <no-reply@thalpos.invalid>' });
  const worker = createOutboxWorker({
    db,
    mailer,
    clock: systemClock,
    logger: createLogger('silent'),
  });
  return { worker, apiUrl, close: () => mailer.close() };
}

/** Messages the fake SMTP server at `apiUrl` received, optionally only those to `address`. */
export async function receivedMail(apiUrl: string, address?: string): Promise<ReceivedMail[]> {
  const res = await fetch(`${apiUrl}/messages`);
  if (!res.ok) throw new Error(`fake SMTP listing answered ${res.status}`);
  const { messages } = (await res.json()) as { messages: ReceivedMail[] };
  return address ? messages.filter((m) => m.to.includes(address)) : messages;
}
