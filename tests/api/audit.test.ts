import request from 'supertest';
import { AuditPage } from '../../server/src/modules/audit/audit-schemas';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

describe('audit log API', () => {
  let t: TestApp;
  const ids: Record<string, number> = {};
  beforeAll(async () => {
    t = await createTestApp();
    for (const login of ['demo-admin', 'demo-editor', 'demo-curator']) {
      ids[login] = (
        await t.db.pool.query('select id from users where login = $1', [login])
      ).rows[0].id;
    }
    // A small history of our own, in three days of March, with actions no seed writes.
    const rows: [string, string, string, string, string, object | null, object | null][] = [
      [
        'demo-admin',
        '2026-03-01T09:00:00Z',
        'test.role',
        'user',
        '7',
        { role: 'reader' },
        { role: 'curator' },
      ],
      [
        'demo-editor',
        '2026-03-01T10:00:00Z',
        'test.species',
        'species',
        'CH4',
        null,
        { name: 'methane' },
      ],
      [
        'demo-curator',
        '2026-03-02T11:00:00Z',
        'test.proposal',
        'proposal',
        '12',
        { status: 'draft' },
        { status: 'submitted' },
      ],
      [
        'demo-editor',
        '2026-03-03T12:00:00Z',
        'test.proposal',
        'proposal',
        '12',
        { status: 'submitted' },
        { status: 'approved' },
      ],
      ['demo-admin', '2026-03-03T13:00:00Z', 'test.session', 'session', 'abc', null, null],
    ];
    for (const [login, at, action, type, id, before, after] of rows) {
      await t.db.pool.query(
        'insert into audit_log (actor_id, at, action, entity_type, entity_id, before, after) values ($1, $2, $3, $4, $5, $6, $7)',
        [
          ids[login],
          at,
          action,
          type,
          id,
          before && JSON.stringify(before),
          after && JSON.stringify(after),
        ],
      );
    }
  });
  afterAll(() => t.close());

  async function as(login: string): Promise<Agent> {
    const agent = request.agent(t.app);
    await signIn(agent, login);
    return agent;
  }
  const ours = { from: '2026-03-01T00:00:00Z', to: '2026-03-31T23:59:59Z' };
  const get = async (agent: Agent, query: Record<string, string>, status = 200) => {
    const res = await agent.get('/api/v1/audit').query(query).expect(status);
    if (status === 200) AuditPage.strict().parse(res.body);
    return res.body;
  };

  it('refuses anonymous callers (401), readers and curators (403)', async () => {
    await request(t.app).get('/api/v1/audit').expect(401);
    for (const login of ['demo-reader', 'demo-curator']) {
      const body = await get(await as(login), {}, 403);
      expect(body.error.code).toBe('forbidden');
    }
  });

  it('shows an admin every entry, newest first, with who acted and before and after', async () => {
    const body = await get(await as('demo-admin'), ours);
    expect(body.scope).toBe('all');
    expect(body.entityTypes).toEqual(expect.arrayContaining(['proposal', 'session', 'user']));
    expect(body.total).toBe(5);
    expect(body.entries.map((e: { action: string }) => e.action)).toEqual([
      'test.session',
      'test.proposal',
      'test.proposal',
      'test.species',
      'test.role',
    ]);
    expect(body.entries[4]).toEqual({
      id: expect.any(Number),
      at: '2026-03-01T09:00:00.000Z',
      actor: { id: ids['demo-admin'], login: 'demo-admin', name: 'Lena Sørensen' },
      action: 'test.role',
      entityType: 'user',
      entityId: '7',
      before: { role: 'reader' },
      after: { role: 'curator' },
    });
  });

  it('filters by who, what, entity and time, and pages', async () => {
    const admin = await as('demo-admin');
    const actions = async (q: Record<string, string>) =>
      (await get(admin, { ...ours, ...q })).entries.map((e: { action: string; at: string }) => [
        e.action,
        e.at.slice(0, 13),
      ]);
    expect(await actions({ actor: 'DEMO-EDITOR' })).toEqual([
      ['test.proposal', '2026-03-03T12'],
      ['test.species', '2026-03-01T10'],
    ]);
    expect(await actions({ action: 'test.proposal' })).toHaveLength(2);
    expect(await actions({ entityType: 'proposal', entityId: '12' })).toHaveLength(2);
    expect(await actions({ entityType: 'species', entityId: 'CH4' })).toEqual([
      ['test.species', '2026-03-01T10'],
    ]);
    expect(await actions({ from: '2026-03-02T00:00:00Z', to: '2026-03-03T12:00:00Z' })).toEqual([
      ['test.proposal', '2026-03-03T12'],
      ['test.proposal', '2026-03-02T11'],
    ]);
    const page2 = await get(admin, { ...ours, page: '2', pageSize: '2' });
    expect(page2).toEqual(expect.objectContaining({ page: 2, pageSize: 2, total: 5 }));
    expect(page2.entries.map((e: { action: string }) => e.action)).toEqual([
      'test.proposal',
      'test.species',
    ]);
    expect((await get(admin, { ...ours, page: '9' })).entries).toEqual([]);
  });

  it('shows an editor the audit of curated data only, read-only', async () => {
    const editor = await as('demo-editor');
    const body = await get(editor, ours);
    expect(body.scope).toBe('curated');
    expect(body.entityTypes).toEqual([
      'species',
      'phase',
      'source',
      'revision',
      'proposal',
      'release',
      'dataset',
    ]);
    expect(body.entries.map((e: { entityType: string }) => e.entityType).sort()).toEqual([
      'proposal',
      'proposal',
      'species',
    ]);
    // Without a time filter, still no user or session rows (the seed writes user rows).
    const all = await get(editor, { pageSize: '200' });
    expect(all.entries.every((e: { entityType: string }) => e.entityType !== 'user')).toBe(true);
    for (const entityType of ['user', 'session']) {
      const refused = await get(editor, { entityType }, 403);
      expect(refused.error.message).toContain('curated data only');
    }
    // No writes exist on this route at all.
    await editor
      .post('/api/v1/audit')
      .send({})
      .expect((res) => {
        expect([403, 404]).toContain(res.status);
      });
  });

  it.each([
    [{ from: '2026-03-03T00:00:00Z', to: '2026-03-01T00:00:00Z' }],
    [{ from: 'yesterday' }],
    [{ pageSize: '500' }],
    [{ page: '0' }],
    [{ page: '1.5' }],
    [{ colour: 'blue' }],
    [{ actor: '' }],
  ])('answers a bad query %j with 400 validation_error', async (query) => {
    const body = await get(await as('demo-admin'), query as Record<string, string>, 400);
    expect(body.error.code).toBe('validation_error');
  });
});
