import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { Pool } from 'pg';
import * as schema from '../../../schema';
import type { Logger } from '../lib/logger';

export type Database = NodePgDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Database['transaction']>[0]>[0];

export interface DbHandle {
  pool: Pool;
  db: Database;
}

export function connectDatabase(url: string, logger?: Logger): DbHandle {
  const pool = new Pool({
    connectionString: url,
    max: 10,
    // Fail fast while the database is down so health checks and requests answer promptly.
    connectionTimeoutMillis: 2000,
    idleTimeoutMillis: 30_000,
  });
  // Idle clients error when the server goes away; without a listener that would crash the process.
  pool.on('error', (err) => logger?.warn({ err: err.message }, 'database connection lost'));
  return { pool, db: drizzle(pool, { schema, casing: 'snake_case' }) };
}

/** PostgreSQL's error code, which drizzle 0.45 wraps in `cause`. */
export function pgErrorCode(err: unknown): string | undefined {
  const e = err as { code?: string; cause?: { code?: string } } | null;
  return e?.cause?.code ?? e?.code;
}
