// Runs the fake GitHub alone (used by the test runner): prints its URL, stops on SIGINT/SIGTERM.
// FAKE_GITHUB_CALLBACK_URLS (comma-separated) pins the callback URLs it will send codes to.
import { startFakeGithub } from './github-fake';

async function main(): Promise<void> {
  const port = Number(process.env.FAKE_GITHUB_PORT ?? 0);
  const callbackUrls = (process.env.FAKE_GITHUB_CALLBACK_URLS ?? '').split(',').filter(Boolean);
  const fake = await startFakeGithub({
    port,
    callbackUrls: callbackUrls.length ? callbackUrls : undefined,
  });
  process.stdout.write(`${fake.url}\n`);
  const stop = () => void fake.stop().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

void main();
