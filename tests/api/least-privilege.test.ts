import { Client } from 'pg';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

// The application connects as a role that owns nothing and holds only the rights it uses;
// audit_log refuses UPDATE, DELETE and TRUNCATE in the database itself.
describe('database privileges of the application role', () => {
  let db: TestDatabase;
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(() => db.drop());

  const sql = (text: string, params: unknown[] = []) => db.pool.query(text, params);
  const refused = async (text: string) => {
    const err = await sql(text).then(
      () => null,
      (e: { code?: string; message: string }) => e,
    );
    expect(err).not.toBeNull();
    return err!;
  };

  it('is neither superuser nor owner of anything', async () => {
    const me = await sql(
      `select current_user as name, rolsuper, rolcreatedb, rolcreaterole
         from pg_roles where rolname = current_user`,
    );
    expect(me.rows[0]).toEqual({
      name: 'thalpos_app',
      rolsuper: false,
      rolcreatedb: false,
      rolcreaterole: false,
    });
    const owned = await sql(
      `select count(*)::int as n from pg_class c join pg_namespace n on n.oid = c.relnamespace
        where pg_get_userbyid(c.relowner) = current_user and n.nspname not like 'pg_%'`,
    );
    expect(owned.rows[0].n).toBe(0);
  });

  it('cannot change the schema', async () => {
    expect((await refused('create table intruder (id int)')).code).toBe('42501');
    expect((await refused('alter table users add column x int')).code).toBe('42501');
    expect((await refused('drop table session')).code).toBe('42501');
  });

  it('appends to audit_log but can neither update, delete nor truncate it', async () => {
    await sql(
      `insert into audit_log (actor_id, action, entity_type, entity_id) values (null, 'test.appended', 'test', '1')`,
    );
    const count = async () =>
      (await sql(`select count(*)::int as n from audit_log`)).rows[0].n as number;
    const before = await count();
    expect((await refused(`update audit_log set action = 'rewritten'`)).message).toMatch(
      /append-only/,
    );
    expect((await refused(`delete from audit_log`)).message).toMatch(/append-only/);
    await refused(`truncate audit_log`);
    expect(await count()).toBe(before);
    const rewritten = await sql(
      `select count(*)::int as n from audit_log where action = 'rewritten'`,
    );
    expect(rewritten.rows[0].n).toBe(0);
  });

  it('is granted tables that later migrations create (default privileges)', async () => {
    const owner = new Client({ connectionString: db.ownerUrl });
    await owner.connect();
    try {
      await owner.query(
        'create table later_feature (id integer primary key generated always as identity, note text)',
      );
      const owners = await owner.query(
        `select tableowner from pg_tables where tablename = 'later_feature'`,
      );
      expect(owners.rows[0].tableowner).toBe('postgres');
    } finally {
      await owner.end();
    }
    await sql(`insert into later_feature (note) values ('kestrel')`);
    expect((await sql('select note from later_feature')).rows).toEqual([{ note: 'kestrel' }]);
  });
});
