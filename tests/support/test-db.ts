import { randomBytes } from 'node:crypto';
import { Client } from 'pg';
import { connectDatabase, type DbHandle } from '../../server/src/db/client';

/**
 * Each test file gets its own database, cloned from the migrated and seeded template that the
 * test runner prepares (scripts/test.sh), so files can run in parallel without sharing rows.
 */
export interface TestDatabase extends DbHandle {
  url: string;
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

export async function createTestDatabase(): Promise<TestDatabase> {
  const template = new URL(env('TEMPLATE_DATABASE_URL'));
  const name = `thalpos_t_${randomBytes(5).toString('hex')}`;
  await admin((c) => c.query(`create database "${name}" template "${template.pathname.slice(1)}"`));
  const url = new URL(template);
  url.pathname = `/${name}`;
  const handle = connectDatabase(url.toString());
  return {
    ...handle,
    url: url.toString(),
    async drop() {
      await handle.pool.end();
      await admin((c) => c.query(`drop database if exists "${name}" with (force)`));
    },
  };
}
