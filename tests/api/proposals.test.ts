import {
  CommentAnswer,
  CreateAnswer,
  ProposalDetail,
  ProposalList,
  TransitionAnswer,
} from '../../server/src/modules/proposals/proposals-schemas';
import { createTestApp, type TestApp } from '../support/test-app';
import { as, row, sourceId, submitted, valueItem, type Curator } from '../support/proposals';

describe('proposals: workflow and roles', () => {
  // Many HTTP round trips per test: a busy machine makes them slower, never red.
  jest.setTimeout(120_000);
  let t: TestApp;
  let reader: Curator, curator: Curator, editor: Curator, editor2: Curator, admin: Curator;
  let source: string;
  beforeAll(async () => {
    t = await createTestApp();
    [reader, curator, editor, editor2, admin] = await Promise.all(
      ['demo-reader', 'demo-curator', 'demo-editor', 'demo-editor-2', 'demo-admin'].map((l) =>
        as(t, l),
      ),
    );
    source = await sourceId(t);
  });
  afterAll(() => t.close());

  const audits = async (id: number) =>
    (
      await t.db.pool.query(
        `select action from audit_log where entity_type = 'proposal' and entity_id = $1 order by id`,
        [String(id)],
      )
    ).rows.map((r) => r.action);

  it('creates a draft (201 {id, status: draft}) with its audit row; readers may not propose', async () => {
    const res = await curator
      .post('/api/v1/proposals', { rationale: 'Newer value', items: [valueItem(source)] })
      .expect(201);
    const body = CreateAnswer.parse(res.body);
    expect(body).toMatchObject({ status: 'draft', warnings: [] });
    expect(await audits(body.id)).toEqual(['proposal.created']);
    // Stored exactly in J/mol.
    expect(
      await row(t, 'select value, uncertainty from proposal_items where proposal_id = $1', [
        body.id,
      ]),
    ).toEqual({
      value: '-74600',
      uncertainty: '300',
    });
    const refused = await reader
      .post('/api/v1/proposals', { rationale: 'x', items: [valueItem(source)] })
      .expect(403);
    expect(refused.body.error.code).toBe('forbidden');
    // Without the CSRF token a signed-in curator is refused too.
    await curator.agent.post('/api/v1/proposals').send({}).expect(403);
  });

  it('converts kcal/mol with the thermochemical calorie exactly', async () => {
    const res = await curator
      .post('/api/v1/proposals', {
        rationale: 'kcal',
        items: [valueItem(source, { value: -17.88, unit: 'kcal/mol', uncertainty: 0.1 })],
      })
      .expect(201);
    expect(
      await row(t, 'select value, uncertainty from proposal_items where proposal_id = $1', [
        res.body.id,
      ]),
    ).toEqual({
      value: '-74809.92',
      uncertainty: '418.4',
    });
  });

  it('lets editors and admins propose too', async () => {
    for (const who of [editor, admin]) {
      await who
        .post('/api/v1/proposals', { rationale: 'by ' + who.login, items: [valueItem(source)] })
        .expect(201);
    }
  });

  it('goes draft → submitted → changes_requested → revised → submitted → approved, audited and threaded', async () => {
    const created = await curator
      .post('/api/v1/proposals', {
        rationale: 'Ammonia, newer',
        items: [valueItem(source, { species: 'ammonia', value: -45.9, uncertainty: 0.4 })],
      })
      .expect(201);
    const id = created.body.id as number;
    // Only the author submits; others do not even see a draft.
    await editor.post(`/api/v1/proposals/${id}/submit`).expect(404);
    const sub = TransitionAnswer.parse(
      (await curator.post(`/api/v1/proposals/${id}/submit`).expect(200)).body,
    );
    expect(sub.status).toBe('submitted');
    await curator.post(`/api/v1/proposals/${id}/submit`).expect(409);
    // Drafts cannot be revised once submitted.
    await curator.put(`/api/v1/proposals/${id}`, { rationale: 'x' }).expect(409);

    const asked = await editor
      .post(`/api/v1/proposals/${id}/decision`, {
        decision: 'request_changes',
        comment: 'Cite the uncertainty basis',
      })
      .expect(200);
    expect(asked.body.status).toBe('changes_requested');
    const c = CommentAnswer.parse(
      (await curator.post(`/api/v1/proposals/${id}/comments`, { body: 'Basis added' }).expect(201))
        .body,
    );
    expect(c.comment.author.login).toBe('demo-curator');

    const revised = await curator
      .patch(`/api/v1/proposals/${id}`, {
        items: [
          valueItem(source, {
            species: 'ammonia',
            value: -45.94,
            uncertainty: 0.35,
            uncertaintyBasis: 'standard',
          }),
        ],
      })
      .expect(200);
    expect(revised.body.status).toBe('changes_requested');
    await curator.post(`/api/v1/proposals/${id}/submit`).expect(200);

    const target = await row(
      t,
      `select r.id from revisions r join species_phases sp on sp.id = r.species_phase_id
      join species s on s.id = sp.species_id where s.key = 'ammonia' and r.status = 'accepted'`,
    );
    const approved = TransitionAnswer.parse(
      (
        await editor2
          .post(`/api/v1/proposals/${id}/decision`, {
            decision: 'approve',
            comment: 'Agrees with CODATA',
          })
          .expect(200)
      ).body,
    );
    expect(approved.status).toBe('approved');
    expect(approved.createdRevisionIds).toHaveLength(1);
    const created2 = await row(
      t,
      'select status, value, supersedes_id from revisions where id = $1',
      [approved.createdRevisionIds[0]],
    );
    expect(created2).toEqual({ status: 'accepted', value: '-45940', supersedes_id: target.id });
    expect((await row(t, 'select status from revisions where id = $1', [target.id])).status).toBe(
      'superseded',
    );

    expect(await audits(id)).toEqual([
      'proposal.created',
      'proposal.submitted',
      'proposal.decided',
      'proposal.commented',
      'proposal.revised',
      'proposal.submitted',
      'proposal.decided',
    ]);
    const detail = ProposalDetail.parse(
      (await editor.get(`/api/v1/proposals/${id}`).expect(200)).body,
    );
    expect(detail.comments.map((x) => x.decision)).toEqual(['request_changes', null, 'approve']);
    expect(detail.items[0]!.createdRevisionId).toBe(approved.createdRevisionIds[0]);
    // Decided once: further decisions and withdrawals are refused.
    const again = await editor
      .post(`/api/v1/proposals/${id}/decision`, { decision: 'reject', comment: 'late' })
      .expect(409);
    expect(again.body.error.code).toBe('already_decided');
    await curator.post(`/api/v1/proposals/${id}/withdraw`).expect(409);
  });

  it('refuses deciding one’s own proposal (403 own_proposal) and curators deciding at all', async () => {
    const id = await submitted(editor, [valueItem(source, { species: 'ethane', value: -84.0 })]);
    const own = await editor
      .post(`/api/v1/proposals/${id}/decision`, { decision: 'approve', comment: 'mine' })
      .expect(403);
    expect(own.body.error.code).toBe('own_proposal');
    await curator
      .post(`/api/v1/proposals/${id}/decision`, { decision: 'approve', comment: 'no' })
      .expect(403);
    await reader
      .post(`/api/v1/proposals/${id}/decision`, { decision: 'approve', comment: 'no' })
      .expect(403);
    await admin
      .post(`/api/v1/proposals/${id}/decision`, {
        decision: 'reject',
        comment: 'Duplicate of another proposal',
      })
      .expect(200);
    expect((await row(t, 'select status from proposals where id = $1', [id])).status).toBe(
      'rejected',
    );
    // Each refusal is audited as its own action, without the change it asked for.
    const refused = await t.db.pool.query(
      `select u.login, a.after from audit_log a join users u on u.id = a.actor_id
        where a.action = 'proposal.decision_refused' and a.entity_id = $1 order by a.id`,
      [id],
    );
    expect(refused.rows).toEqual([
      { login: 'demo-editor', after: { decision: 'approve', code: 'own_proposal' } },
      { login: 'demo-curator', after: { decision: 'approve', code: 'forbidden' } },
      { login: 'demo-reader', after: { decision: 'approve', code: 'forbidden' } },
    ]);
  });

  it('lets only the author withdraw, from draft or submitted', async () => {
    const id = await submitted(curator, [valueItem(source, { species: 'propane', value: -104.7 })]);
    await editor.post(`/api/v1/proposals/${id}/withdraw`).expect(403);
    const res = await curator.post(`/api/v1/proposals/${id}/withdraw`).expect(200);
    expect(res.body.status).toBe('withdrawn');
    const late = await editor
      .post(`/api/v1/proposals/${id}/decision`, { decision: 'approve', comment: 'x' })
      .expect(409);
    expect(late.body.error.code).toBe('already_decided');
    expect(await audits(id)).toEqual([
      'proposal.created',
      'proposal.submitted',
      'proposal.withdrawn',
    ]);
  });

  it('hides drafts from deciders (404) and refuses comments by readers', async () => {
    const res = await curator
      .post('/api/v1/proposals', { rationale: 'draft', items: [valueItem(source)] })
      .expect(201);
    const d = await editor
      .post(`/api/v1/proposals/${res.body.id}/decision`, { decision: 'approve', comment: 'x' })
      .expect(404);
    expect(d.body.error.code).toBe('not_found');
    const id = await submitted(curator, [valueItem(source, { species: 'ethylene', value: 52.5 })]);
    await reader.post(`/api/v1/proposals/${id}/comments`, { body: 'hi' }).expect(403);
    await editor.post(`/api/v1/proposals/${id}/comments`, { body: 'Looking at it' }).expect(201);
  });

  it('lists the review queue: filter by status, sort, page; readers are refused', async () => {
    const res = await editor
      .get('/api/v1/proposals?status=submitted&sort=id&order=asc&limit=2')
      .expect(200);
    const list = ProposalList.parse(res.body);
    expect(list.proposals.every((p) => p.status === 'submitted')).toBe(true);
    expect(list.proposals.length).toBeLessThanOrEqual(2);
    expect(list.total).toBeGreaterThanOrEqual(list.proposals.length);
    const ids = list.proposals.map((p) => p.id);
    expect(ids).toEqual([...ids].sort((a, b) => a - b));
    // Drafts of others stay private.
    const all = ProposalList.parse(
      (await editor.get('/api/v1/proposals?limit=200').expect(200)).body,
    );
    expect(
      all.proposals.filter((p) => p.status === 'draft' && p.author.login !== 'demo-editor'),
    ).toEqual([]);
    await reader.get('/api/v1/proposals').expect(403);
    const bad = await editor.get('/api/v1/proposals?status=nonsense').expect(400);
    expect(bad.body.error.code).toBe('validation_error');
  });
});
