import { Client } from 'pg';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

/**
 * Published releases are frozen by the database itself: these statements are raw SQL sent as the
 * application's own database user (the test database's URL), not through the app's services.
 */
describe('immutability of published releases (raw SQL)', () => {
  let db: TestDatabase;
  let sql: Client;
  let pinned: { revisionId: number; releaseId: number; speciesPhaseId: number; quantity: string };
  let pinnedHeat: number;

  beforeAll(async () => {
    db = await createTestDatabase();
    sql = new Client({ connectionString: db.url });
    await sql.connect();
    const { rows } = await sql.query(`
      select e.revision_id as "revisionId", e.release_id as "releaseId",
             e.species_phase_id as "speciesPhaseId", e.quantity
      from release_entries e join releases r on r.id = e.release_id
      where r.version = '2026.1' and e.quantity = 'formation_enthalpy' limit 1`);
    pinned = rows[0];
    const heat = await sql.query(`
      select e.revision_id from release_entries e join releases r on r.id = e.release_id
      where r.version = '2026.1' and e.quantity = 'heat_capacity' limit 1`);
    pinnedHeat = heat.rows[0].revision_id;
  });
  afterAll(async () => {
    await sql.end();
    await db.drop();
  });

  /** Runs a statement in a transaction that is always rolled back; returns its error, if any. */
  async function attempt(statement: string, params: unknown[] = []): Promise<Error | null> {
    await sql.query('begin');
    try {
      await sql.query(statement, params);
      return null;
    } catch (err) {
      return err as Error;
    } finally {
      await sql.query('rollback');
    }
  }

  it('runs as the application user of the tests, not a separate administrator', async () => {
    const { rows } = await sql.query('select current_user');
    expect(rows[0].current_user).toBe(decodeURIComponent(new URL(db.url).username));
  });

  it.each([
    ['update the release', `update releases set notes = 'changed' where version = '2026.1'`],
    [
      'unpublish the release',
      `update releases set status = 'draft', published_at = null, published_by = null where version = '2026.1'`,
    ],
    ['delete the release', `delete from releases where version = '2026.1'`],
  ])('refuses to %s', async (_what, statement) => {
    const err = await attempt(statement);
    expect(err?.message).toMatch(/release 2026\.1 is published/);
  });

  it('refuses to change, delete or add entries of a published release', async () => {
    const upd = await attempt(
      'update release_entries set quantity = quantity where release_id = $1',
      [pinned.releaseId],
    );
    expect(upd?.message).toMatch(/entries of a published release/);
    const del = await attempt('delete from release_entries where release_id = $1', [
      pinned.releaseId,
    ]);
    expect(del?.message).toMatch(/entries of a published release/);
    const ins = await attempt(
      `insert into release_entries (release_id, species_phase_id, quantity, revision_id)
       select $1, species_phase_id, quantity, id from revisions
       where id not in (select revision_id from release_entries where release_id = $1) limit 1`,
      [pinned.releaseId],
    );
    // Either refused by the trigger or nothing to add: both leave the release unchanged.
    if (ins) expect(ins.message).toMatch(/published release/);
  });

  it.each([
    ['value', `update revisions set value = value + 1 where id = $1`],
    [
      'uncertainty',
      `update revisions set uncertainty = 1, uncertainty_basis = 'standard' where id = $1`,
    ],
    [
      'source',
      `with s as (insert into sources (csl, citation) values ('{}', 'another') returning id)
       update revisions set source_id = (select id from s) where id = $1`,
    ],
    ['notes', `update revisions set notes = 'edited in place' where id = $1`],
    ['method', `update revisions set method = 'estimated' where id = $1`],
  ])('refuses to change the %s of a pinned revision', async (_what, statement) => {
    const err = await attempt(statement, [pinned.revisionId]);
    expect(err?.message).toMatch(/pinned by a published release/);
  });

  it('refuses to delete a pinned revision or change its heat-capacity ranges', async () => {
    const del = await attempt('delete from revisions where id = $1', [pinned.revisionId]);
    expect(del?.message).toMatch(/pinned by a published release/);
    const ranges = await attempt(
      'update heat_capacity_ranges set t_max = t_max + 1 where revision_id = $1',
      [pinnedHeat],
    );
    expect(ranges?.message).toMatch(/heat_capacity_ranges of a revision pinned/);
    const delRanges = await attempt('delete from heat_capacity_ranges where revision_id = $1', [
      pinnedHeat,
    ]);
    expect(delRanges?.message).toMatch(/pinned by a published release/);
  });

  it('refuses to change, delete or add the stored exports of a published release', async () => {
    const upd = await attempt(
      `update release_exports set content = 'x'::bytea, bytes = 1 where release_id = $1`,
      [pinned.releaseId],
    );
    expect(upd?.message).toMatch(/exports of a published release cannot be changed/);
    const del = await attempt('delete from release_exports where release_id = $1', [
      pinned.releaseId,
    ]);
    expect(del?.message).toMatch(/exports of a published release cannot be changed/);
    const draft = await attempt(
      `with d as (insert into releases (version) values ('2099.1') returning id)
       insert into release_exports (release_id, format, sha256, bytes, content)
       select id, 'csv', repeat('0', 64), 1, 'x'::bytea from d`,
    );
    expect(draft?.message).toMatch(/only for a published release/);
  });

  it.each(['releases', 'release_entries', 'revisions', 'heat_capacity_ranges', 'release_exports'])(
    'refuses TRUNCATE of %s',
    async (table) => {
      // The least-privilege role may hold no TRUNCATE at all; a role that does meets the trigger.
      const err = await attempt(`truncate ${table} cascade`);
      expect(err?.message).toMatch(/cannot be truncated|permission denied/);
    },
  );

  it('still lets the status of a pinned revision move on (superseded), leaving its value', async () => {
    const err = await attempt(
      `update revisions set status = 'superseded', status_changed_at = now() where id = $1`,
      [pinned.revisionId],
    );
    expect(err).toBeNull();
  });

  it('leaves drafts and unpinned revisions editable until they are published', async () => {
    await sql.query('begin');
    try {
      const draft = await sql.query(
        `insert into releases (version, notes) values ('2026.9', 'draft') returning id`,
      );
      const id = draft.rows[0].id;
      await sql.query(
        `insert into release_entries (release_id, species_phase_id, quantity, revision_id)
         values ($1, $2, $3, $4)`,
        [id, pinned.speciesPhaseId, pinned.quantity, pinned.revisionId],
      );
      await sql.query(`update releases set notes = 'edited' where id = $1`, [id]);
      const gone = await sql.query('delete from release_entries where release_id = $1', [id]);
      expect(gone.rowCount).toBe(1);
      const rev = await sql.query(
        `insert into revisions (species_phase_id, kind, quantity, value, method, source_id, status)
         select species_phase_id, kind, quantity, value, method, source_id, 'proposed'
         from revisions where id = $1 returning id`,
        [pinned.revisionId],
      );
      const upd = await sql.query(`update revisions set value = -1 where id = $1`, [
        rev.rows[0].id,
      ]);
      expect(upd.rowCount).toBe(1);
    } finally {
      await sql.query('rollback');
    }
  });
});
