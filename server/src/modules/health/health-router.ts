import { Router } from 'express';
import type { Pool } from 'pg';

/** Mounted before the session store so it answers even while the database is down. */
export function healthRouter(pool: Pool): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    try {
      await pool.query('select 1');
      res.json({ status: 'ok', db: 'ok' });
    } catch {
      res.status(503).json({ status: 'degraded', db: 'down' });
    }
  });
  return router;
}

/** `GET /api/health`: liveness and database reachability (mounted under /api). */
export function createHealthModule({ pool }: { pool: Pool }) {
  return { router: healthRouter(pool) };
}
