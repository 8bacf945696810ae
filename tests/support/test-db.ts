import { randomBytes } from 'node:crypto';
import { Client } from 'pg';
import { connectDatabase, type DbHandle } from '../../server/src/db/client';

/**
 * Each test file gets its own database, cloned from the migrated and seeded template that the
 * test runner prepares (scripts/test.sh), so files can run in parallel without sharing rows.
 * The handle connects as the application's own role (least privilege, as in production);
 * `ownerUrl` reaches the same database as the schema owner, for migrations.
 */
export interface TestDatabase extends DbHandle {
  /** As the application role (`thalpos_app`). */
  url: string;
  /** As the schema owner (`postgres`). */
  ownerUrl: string;
  drop(): Promise<void>;
}

function env(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: run the tests through \`npm test\``);
  return value;
}

async function admin<T>(fn: (c: Client) => Promise<T>): Promise<T> {
  const client = new Client({ connectionString: env('TEST_ADMIN_DATABASE_URL') });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

const withDatabase = (base: string, name: string) => {
  const url = new URL(base);
  url.pathname = `/${name}`;
  return url.toString();
};

export async function createTestDatabase(): Promise<TestDatabase> {
  const template = new URL(env('TEMPLATE_DATABASE_URL'));
  const name = `thalpos_t_${randomBytes(5).toString('hex')}`;
  await admin((c) => c.query(`create database "${name}" template "${template.pathname.slice(1)}"`));
  const url = withDatabase(env('TEST_APP_DATABASE_URL'), name);
  const handle = connectDatabase(url);
  return {
    ...handle,
    url,
    ownerUrl: withDatabase(template.toString(), name),
    async drop() {
      await handle.pool.end();
      await admin((c) => c.query(`drop database if exists "${name}" with (force)`));
    },
  };
}
