import { randomBytes } from 'node:crypto';
import { manualClock, systemClock, type Clock } from '../../server/src/adapters/clock';
import { createSmtpMailer, type Mailer } from '../../server/src/adapters/mailer';
import { startFakeSmtp, type FakeSmtp } from '../../server/src/fakes/smtp-fake';
import { createLogger } from '../../server/src/lib/logger';
import { enqueueMail } from '../../server/src/modules/mail/outbox';
import {
  createOutboxWorker,
  retryDelayMs,
  type OutboxWorkerOptions,
} from '../../server/src/modules/mail/outbox-worker';
import { receivedMail, sharedFakeSmtp, waitFor } from '../support/mail';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

const FROM = 'Thalpos <no-reply@thalpos.invalid>';
const logger = createLogger('silent');
const address = (tag: string) => `${tag}-${randomBytes(4).toString('hex')}@kestrel.example`;

describe('e-mail outbox', () => {
  let db: TestDatabase;
  const mailers: Mailer[] = [];
  const fakes: FakeSmtp[] = [];
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(async () => {
    mailers.forEach((m) => m.close());
    await Promise.all(fakes.map((f) => f.stop().catch(() => undefined)));
    await db.drop();
  });

  const mailerFor = (url: string) => {
    const mailer = createSmtpMailer({ url, from: FROM });
    mailers.push(mailer);
    return mailer;
  };
  const worker = (mailer: Mailer, clock: Clock, extra: Partial<OutboxWorkerOptions> = {}) =>
    createOutboxWorker({ db: db.db, mailer, clock, logger, ...extra });
  const row = async (id: number) =>
    (
      await db.pool.query(
        'select status, attempts, next_attempt_at, last_error, sent_at from outbox_messages where id = $1',
        [id],
      )
    ).rows[0];

  it('writes messages in the caller’s transaction: a rolled-back event leaves no mail', async () => {
    const to = address('rollback');
    await expect(
      db.db.transaction(async (tx) => {
        await enqueueMail(tx, [{ to, subject: 'Never', text: 'Never sent', eventKind: 'test' }]);
        throw new Error('the event failed');
      }),
    ).rejects.toThrow('the event failed');
    const none = await db.pool.query('select 1 from outbox_messages where to_address = $1', [to]);
    expect(none.rowCount).toBe(0);

    const [id] = await db.db.transaction((tx) =>
      enqueueMail(tx, [{ to, subject: 'Kept', text: 'Kept', eventKind: 'test' }]),
    );
    expect(await row(id)).toEqual(expect.objectContaining({ status: 'pending', attempts: 0 }));
  });

  it('delivers through SMTP: the fake server received subject, body and recipient', async () => {
    const { url, apiUrl } = sharedFakeSmtp();
    const to = address('delivery');
    const [id] = await enqueueMail(db.db, [
      {
        to,
        subject: 'Proposal 12 was submitted for review',
        text: 'Priya Nandakumar submitted proposal 12.\n',
        html: '<p>Priya Nandakumar submitted proposal 12.</p>',
        eventKind: 'proposal.submitted',
      },
    ]);
    const result = await worker(mailerFor(url), systemClock).runOnce();
    expect(result.sent).toBeGreaterThanOrEqual(1);

    const [mail] = await waitFor(async () => {
      const list = await receivedMail(apiUrl, to);
      return list.length > 0 && list;
    });
    expect(mail).toEqual(
      expect.objectContaining({
        from: 'no-reply@thalpos.invalid',
        to: [to],
        subject: 'Proposal 12 was submitted for review',
        text: 'Priya Nandakumar submitted proposal 12.\n',
        html: '<p>Priya Nandakumar submitted proposal 12.</p>',
      }),
    );
    expect(await row(id)).toEqual(
      expect.objectContaining({ status: 'sent', attempts: 1, last_error: null }),
    );
    expect((await row(id)).sent_at).toBeInstanceOf(Date);
  });

  it('keeps mail while the SMTP server is down and delivers it once it is back', async () => {
    let fake = await startFakeSmtp();
    fakes.push(fake);
    const port = Number(new URL(fake.url).port);
    const apiPort = Number(new URL(fake.apiUrl).port);
    await fake.stop();

    const to = address('outage');
    const [id] = await enqueueMail(db.db, [
      { to, subject: 'While down', text: 'Sent after the outage', eventKind: 'test' },
    ]);
    const running = worker(mailerFor(fake.url), systemClock, {
      pollMs: 20,
      baseDelayMs: 20,
      maxDelayMs: 100,
      maxAttempts: 1_000_000,
    });
    running.start();
    try {
      // At least one attempt failed while nothing listened.
      const failed = await waitFor(async () => {
        const r = await row(id);
        return r.attempts >= 1 && r.last_error ? r : undefined;
      });
      expect(failed.status).toBe('pending');
      expect(failed.last_error).toMatch(/ECONNREFUSED|connect/i);

      fake = await startFakeSmtp({ port, apiPort });
      fakes.push(fake);
      await waitFor(async () => (await row(id)).status === 'sent');
      const got = await receivedMail(fake.apiUrl, to);
      expect(got.map((m) => m.subject)).toEqual(['While down']);
    } finally {
      await running.stop();
    }
  });

  it('backs off exponentially up to a cap by the injected clock, then marks the message failed', async () => {
    const down = await startFakeSmtp();
    await down.stop();
    const clock = manualClock(new Date(Date.now() + 60_000));
    const w = worker(mailerFor(down.url), clock, {
      baseDelayMs: 1000,
      maxDelayMs: 3000,
      maxAttempts: 4,
    });
    const [id] = await enqueueMail(db.db, [
      { to: address('backoff'), subject: 'Backoff', text: 'x', eventKind: 'test' },
    ]);
    const mine = async () => {
      await w.runOnce();
      return row(id);
    };

    // Each attempt counts; the wait doubles (1 s, 2 s) and then stays at the 3 s cap.
    const expectedWaits = [1000, 2000, 3000];
    for (const [i, wait] of expectedWaits.entries()) {
      const r = await mine();
      expect(r).toEqual(expect.objectContaining({ status: 'pending', attempts: i + 1 }));
      expect(r.next_attempt_at.getTime() - clock.now().getTime()).toBe(wait);
      clock.advance(wait - 1);
      expect((await mine()).attempts).toBe(i + 1); // not due yet: left alone
      clock.advance(1);
    }
    const last = await mine();
    expect(last).toEqual(expect.objectContaining({ status: 'failed', attempts: 4 }));
    clock.advance(24 * 3600_000);
    expect(await mine()).toEqual(expect.objectContaining({ status: 'failed', attempts: 4 }));
  });

  it('computes the backoff without overflow for large attempt counts', () => {
    expect(retryDelayMs(1, 30_000, 3_600_000)).toBe(30_000);
    expect(retryDelayMs(3, 30_000, 3_600_000)).toBe(120_000);
    expect(retryDelayMs(5000, 30_000, 3_600_000)).toBe(3_600_000);
  });

  it('never sends a message twice when several workers run at once (FOR UPDATE SKIP LOCKED)', async () => {
    const { url, apiUrl } = sharedFakeSmtp();
    const to = Array.from({ length: 30 }, (_, i) => address(`race${i}`));
    await enqueueMail(
      db.db,
      to.map((t, i) => ({ to: t, subject: `Race ${i}`, text: 'x', eventKind: 'test' })),
    );
    const workers = [1, 2, 3].map(() => worker(mailerFor(url), systemClock, { batchSize: 4 }));
    let sent = 0;
    for (;;) {
      const rounds = await Promise.all(workers.map((w) => w.runOnce()));
      const n = rounds.reduce((s, r) => s + r.sent, 0);
      if (n === 0) break;
      sent += n;
    }
    expect(sent).toBe(30);
    const all = await receivedMail(apiUrl);
    for (const t of to) expect(all.filter((m) => m.to.includes(t))).toHaveLength(1);
  });
});
