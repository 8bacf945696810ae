import { seedDemoData } from '../../server/src/db/seed-demo';
import { REVIEW_DEMO_SOURCE_KEY } from '../../server/src/db/seed-demo-proposals';
import { createTestApp, type TestApp } from '../support/test-app';
import { row } from '../support/proposals';

describe('proposals: demo scenario', () => {
  jest.setTimeout(120_000);
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const snapshot = async () => ({
    proposals: (await row(t, 'select count(*)::int as n from proposals')).n,
    comments: (await row(t, 'select count(*)::int as n from proposal_comments')).n,
    revisions: (await row(t, 'select count(*)::int as n from revisions')).n,
    audit: (await row(t, 'select count(*)::int as n from audit_log')).n,
  });

  it('holds proposals of the demo team in every state, citing a source labelled as demo data', async () => {
    const states = await t.db.pool.query(
      `select p.status, count(*)::int as n from proposals p join users u on u.id = p.author_id
       where u.login = 'demo-curator' and p.rationale like 'Demo data — not a real measurement%'
       group by 1 order by 1`,
    );
    expect(Object.fromEntries(states.rows.map((r) => [r.status, r.n]))).toEqual({
      draft: 1,
      submitted: 1,
      changes_requested: 1,
      rejected: 1,
      approved: 1,
    });
    const thread = await row(
      t,
      `select count(*)::int as n from proposal_comments c join proposals p on p.id = c.proposal_id
       where p.status = 'changes_requested' and p.rationale like 'Demo data%'`,
    );
    expect(thread.n).toBeGreaterThanOrEqual(2);
    const source = await row(t, 'select citation from sources where key = $1', [
      REVIEW_DEMO_SOURCE_KEY,
    ]);
    expect(source.citation).toContain('Demo data — not a real measurement');
    // One accepted revision that no published release pins yet.
    const waiting = await row(
      t,
      `select count(*)::int as n from revisions r join sources s on s.id = r.source_id
       where s.key = $1 and r.status = 'accepted'
         and not exists (select 1 from release_entries e where e.revision_id = r.id)`,
      [REVIEW_DEMO_SOURCE_KEY],
    );
    expect(waiting.n).toBe(1);
  });

  it('adds nothing when run again, even twice at once', async () => {
    const before = await snapshot();
    await Promise.all([seedDemoData(t.db.db), seedDemoData(t.db.db)]);
    await seedDemoData(t.db.db);
    expect(await snapshot()).toEqual(before);
  });
});
