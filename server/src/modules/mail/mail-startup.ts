import { systemClock } from '../../adapters/clock';
import { createSmtpMailer } from '../../adapters/mailer';
import type { AppConfig } from '../../config/env';
import type { Database } from '../../db/client';
import type { Logger } from '../../lib/logger';
import { createOutboxWorker } from './outbox-worker';

export interface RunningMail {
  stop(): Promise<void>;
}

/**
 * Picks where mail goes and starts the outbox worker: the configured relay (SMTP_URL), else an
 * already running fake (FAKE_SMTP_URL), else — outside production — a fake SMTP server started
 * here on loopback whose messages a developer reads at its listing. In production without
 * SMTP_URL messages wait in the outbox until a relay is configured.
 */
export async function startMail(deps: {
  config: AppConfig;
  db: Database;
  logger: Logger;
}): Promise<RunningMail> {
  const { config, db, logger } = deps;
  let smtpUrl = config.mail.smtpUrl ?? config.mail.fakeSmtpUrl;
  let stopFake: (() => Promise<void>) | null = null;
  if (!smtpUrl && config.env !== 'production') {
    // Development code, loaded only when asked for: the production bundle does not contain it.
    const { startFakeSmtp } = await import('../../fakes/smtp-fake');
    const fake = await startFakeSmtp({
      port: config.mail.fakeSmtpPort,
      apiPort: config.mail.fakeSmtpApiPort,
    });
    smtpUrl = fake.url;
    stopFake = fake.stop;
    logger.info(
      { smtp: fake.url, messages: `${fake.apiUrl}/messages` },
      'local fake SMTP server started (loopback only); read sent e-mail at the messages URL',
    );
  }
  if (!smtpUrl) {
    logger.warn('SMTP_URL is not set: e-mail waits in the outbox until a relay is configured');
    return { stop: async () => undefined };
  }
  const mailer = createSmtpMailer({ url: smtpUrl, from: config.mail.from });
  const worker = createOutboxWorker({ db, mailer, clock: systemClock, logger });
  worker.start();
  return {
    async stop() {
      await worker.stop();
      mailer.close();
      await stopFake?.();
    },
  };
}
