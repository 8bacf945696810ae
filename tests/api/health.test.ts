import request from 'supertest';
import { createApp } from '../../server/src/app';
import { loadConfig } from '../../server/src/config/env';
import { connectDatabase, type DbHandle } from '../../server/src/db/client';
import { runMigrations } from '../../server/src/db/migrate';
import { createLogger } from '../../server/src/lib/logger';
import { createScratchCluster, type ScratchCluster } from '../support/pg-cluster';

// Stopping the database server must not disturb other suites, so this file has a cluster of its own.
describe('GET /api/health', () => {
  let cluster: ScratchCluster;
  let database: DbHandle;
  let app: ReturnType<typeof createApp>;

  beforeAll(async () => {
    cluster = await createScratchCluster();
    database = connectDatabase(cluster.url);
    await runMigrations(database.db);
    const config = loadConfig({ ...process.env, NODE_ENV: 'test', DATABASE_URL: cluster.url });
    app = createApp({ config, database, logger: createLogger('silent') });
  }, 60_000);

  afterAll(async () => {
    await database.pool.end();
    cluster.destroy();
  });

  it('reports ok while the database answers', async () => {
    const res = await request(app).get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok', db: 'ok' });
  });

  it('reports degraded with 503 while the database is down, and recovers by itself', async () => {
    cluster.stop();
    const down = await request(app).get('/api/health');
    expect(down.status).toBe(503);
    expect(down.body).toEqual({ status: 'degraded', db: 'down' });

    cluster.start();
    // The pool reconnects on its own; poll until it has (a busy machine only makes this slower).
    const deadline = Date.now() + 45_000;
    let status = 0;
    while (status !== 200 && Date.now() < deadline) {
      status = (await request(app).get('/api/health')).status;
      if (status !== 200) await new Promise((r) => setTimeout(r, 250));
    }
    expect(status).toBe(200);
  }, 60_000);
});
