/**
 * The application as `main.ts` builds it, plus one bare JSON route in front of it, on one port:
 * the benchmark's two endpoints share the same process and the same run. Sends its port to the
 * parent process. Started by reaction-bench.ts; needs DATABASE_URL.
 */
import type { AddressInfo } from 'node:net';
import express from 'express';
import { createApp } from '../../../app';
import { loadConfig } from '../../../config/env';
import { connectDatabase } from '../../../db/client';
import { createLogger } from '../../../lib/logger';

const config = loadConfig({
  ...process.env,
  NODE_ENV: 'production',
  // The limiter still runs on every request; only its ceiling is out of the way.
  API_RATE_LIMIT: '1000000000',
  SESSION_SECRET: 'benchmark-only-secret-0123456789abcdef',
  TOKEN_HASH_KEY: 'benchmark-only-token-key-0123456789abcdef',
  FAKE_GITHUB_URL: 'http://127.0.0.1:9',
  FAKE_SIGN_IN: '1',
});
const logger = createLogger('silent');
const database = connectDatabase(config.databaseUrl, logger);
const app = createApp({ config, database, logger, fakeGithubUrl: 'http://127.0.0.1:9' });

const server = express();
server.disable('x-powered-by');
server.get('/bare', (_req, res) => {
  res.json({ status: 'ok', deltaH: -890.3 });
});
server.use(app);

const listener = server.listen(0, '127.0.0.1', () => {
  process.send?.({ port: (listener.address() as AddressInfo).port });
});
// The benchmark is done: leave at once (open keep-alive sockets would hold the process).
process.on('disconnect', () => {
  listener.close();
  void database.pool.end().finally(() => process.exit(0));
});
