import { spawn } from 'node:child_process';
import path from 'node:path';
import { PROJECT_ROOT } from '../../server/src/config/paths';
import { enqueueMail } from '../../server/src/modules/mail/outbox';
import { receivedMail, waitFor } from '../support/mail';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

// `npm start` without SMTP_URL: the server starts a fake SMTP server of its own on loopback,
// logs where its messages can be read, and its outbox worker delivers there.
describe('e-mail at start-up', () => {
  let db: TestDatabase;
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(() => db.drop());

  it('starts a loopback fake SMTP server when none is configured and delivers the outbox to it', async () => {
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      NODE_ENV: 'development',
      PORT: '0',
      LOG_LEVEL: 'info',
      FAKE_SMTP_PORT: '0',
      FAKE_SMTP_API_PORT: '0',
      DATABASE_URL: db.url,
      MIGRATION_DATABASE_URL: db.ownerUrl,
    };
    delete env.SMTP_URL;
    delete env.FAKE_SMTP_URL;
    const child = spawn(path.join(PROJECT_ROOT, 'node_modules/.bin/tsx'), ['server/src/main.ts'], {
      cwd: PROJECT_ROOT,
      env,
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    const exited = new Promise<number | null>((resolve) => child.on('exit', (c) => resolve(c)));
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
    try {
      await waitFor(() => /running at http/.test(output) || undefined);
      const line = output.split('\n').find((l) => l.includes('local fake SMTP server started'));
      const { smtp, messages } = JSON.parse(line!) as { smtp: string; messages: string };
      expect(new URL(smtp).hostname).toBe('127.0.0.1');
      expect(new URL(messages).hostname).toBe('127.0.0.1');

      const to = `startup-${process.pid}@kestrel.example`;
      await enqueueMail(db.db, [
        {
          to,
          subject: 'Hello from the outbox',
          text: 'Sent by the running server',
          eventKind: 'test',
        },
      ]);
      const apiUrl = messages.replace(/\/messages$/, '');
      const [mail] = await waitFor(async () => {
        const got = await receivedMail(apiUrl, to);
        return got.length > 0 && got;
      });
      expect(mail.subject).toBe('Hello from the outbox');
    } finally {
      child.kill('SIGTERM');
    }
    expect(await exited).toBe(0);
  }, 120_000);
});
