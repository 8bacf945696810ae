// Runs the fake GitHub alone (used by the test runner): prints its URL, stops on SIGINT/SIGTERM.
import { startFakeGithub } from './github-fake';

async function main(): Promise<void> {
  const port = Number(process.env.FAKE_GITHUB_PORT ?? 0);
  const fake = await startFakeGithub(port);
  process.stdout.write(`${fake.url}\n`);
  const stop = () => void fake.stop().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

void main();
