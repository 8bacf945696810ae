// Runs the local fakes of hosted services for the test runner: prints one `NAME=url` line per
// fake (the environment variable the app reads), then `ready`; stops on SIGINT/SIGTERM.
// FAKE_GITHUB_CALLBACK_URLS (comma-separated) pins the callback URLs the fake GitHub sends codes to.
import { startFakeDoi } from './doi-fake';
import { startFakeGithub } from './github-fake';
import { startFakeS3 } from './s3-fake';
import { startFakeSmtp } from './smtp-fake';

interface RunningFake {
  env: string;
  url: string;
  stop(): Promise<void>;
}

/** Every fake, each on a free loopback port. Add a fake here and its variable reaches the tests. */
async function startAll(): Promise<RunningFake[]> {
  const callbackUrls = (process.env.FAKE_GITHUB_CALLBACK_URLS ?? '').split(',').filter(Boolean);
  const github = await startFakeGithub({
    port: Number(process.env.FAKE_GITHUB_PORT ?? 0),
    callbackUrls: callbackUrls.length ? callbackUrls : undefined,
  });
  const smtp = await startFakeSmtp();
  const doi = await startFakeDoi();
  // The bucket the app's configuration names by default (S3_BUCKET).
  const s3 = await startFakeS3({ bucket: 'thalpos-documents' });
  return [
    { env: 'FAKE_GITHUB_URL', url: github.url, stop: () => github.stop() },
    { env: 'FAKE_SMTP_URL', url: smtp.url, stop: () => smtp.stop() },
    // The fake SMTP server's message listing (GET /messages), for tests that read what arrived.
    { env: 'FAKE_SMTP_API_URL', url: smtp.apiUrl, stop: async () => undefined },
    { env: 'FAKE_DOI_URL', url: doi.url, stop: () => doi.stop() },
    { env: 'FAKE_S3_URL', url: s3.url, stop: () => s3.stop() },
  ];
}

async function main(): Promise<void> {
  const fakes = await startAll();
  for (const fake of fakes) process.stdout.write(`${fake.env}=${fake.url}\n`);
  process.stdout.write('ready\n');
  const stop = () => void Promise.all(fakes.map((f) => f.stop())).then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

void main();
