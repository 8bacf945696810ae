import request from 'supertest';
import { DEMO_RELEASE, ensureDemoRelease } from '../../server/src/db/demo-release';
import { createTestApp, type TestApp } from '../support/test-app';

describe('demo release', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const one = async (text: string, params: unknown[] = []) =>
    (await t.db.pool.query(text, params)).rows[0];

  it('publishes 2026.2 from accepted demo values, keeping one back for the next release', async () => {
    const first = await ensureDemoRelease(t.db.db);
    expect(first).toMatchObject({ published: true, release: DEMO_RELEASE });
    expect(first.changes).toBeGreaterThanOrEqual(2);

    const m = await request(t.app).get(`/api/v1/releases/${DEMO_RELEASE}`).expect(200);
    expect(m.body.publishedBy.login).toBe('demo-editor');
    expect(m.body.notes).toMatch(/demo/i);
    const latest = await request(t.app).get('/api/v1/releases/latest').expect(200);
    expect(latest.body.version).toBe(DEMO_RELEASE);

    // Values changed or added against 2026.1, each from a source labelled as demo data.
    const changed = await t.db.pool.query(
      `select so.citation from release_entries n
       join releases rn on rn.id = n.release_id and rn.version = $1
       join revisions r on r.id = n.revision_id join sources so on so.id = r.source_id
       where not exists (
         select 1 from release_entries o join releases ro on ro.id = o.release_id
         where ro.version = '2026.1' and o.revision_id = n.revision_id)`,
      [DEMO_RELEASE],
    );
    expect(changed.rows.length).toBe(first.changes);
    for (const row of changed.rows) expect(row.citation).toMatch(/demo/i);

    // One accepted value awaits the next release.
    const waiting = await t.db.pool.query(
      `select r.id from revisions r where r.status = 'accepted' and not exists (
         select 1 from release_entries e join releases rel on rel.id = e.release_id
         where rel.version = $1 and e.revision_id = r.id)`,
      [DEMO_RELEASE],
    );
    expect(waiting.rows.map((r) => r.id)).toEqual([first.keptBack]);
  });

  it('does nothing the second time', async () => {
    const before = await one(`select count(*)::int as n from revisions`);
    expect(await ensureDemoRelease(t.db.db)).toEqual({ published: false, release: DEMO_RELEASE });
    expect((await one(`select count(*)::int as n from revisions`)).n).toBe(before.n);
  });
});
