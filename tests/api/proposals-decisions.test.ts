import { drizzle } from 'drizzle-orm/node-postgres';
import { Pool } from 'pg';
import * as schema from '../../schema';
import { createReleasesService } from '../../server/src/modules/releases/releases-service';
import { createProposalsService } from '../../server/src/modules/proposals/proposals-service';
import type { ProposalEvent } from '../../server/src/modules/proposals/proposal-events';
import { createTestApp, type TestApp } from '../support/test-app';
import { as, row, sourceId, submitted, valueItem, type Curator } from '../support/proposals';

describe('proposals: decisions under contention', () => {
  // Many HTTP round trips per test: a busy machine makes them slower, never red.
  jest.setTimeout(120_000);
  let t: TestApp;
  let curator: Curator, editor: Curator, editor2: Curator;
  let source: string;
  beforeAll(async () => {
    t = await createTestApp();
    [curator, editor, editor2] = await Promise.all(
      ['demo-curator', 'demo-editor', 'demo-editor-2'].map((l) => as(t, l)),
    );
    source = await sourceId(t);
  });
  afterAll(() => t.close());

  const idOf = async (login: string) =>
    (await row(t, 'select id from users where login = $1', [login])).id as number;

  it('refuses approving a proposal whose target was superseded since submission (409 stale, says which and by what)', async () => {
    const target = (
      await row(
        t,
        `select r.id from revisions r join species_phases sp on sp.id = r.species_phase_id
         join species s on s.id = sp.species_id
         where s.key = 'ethane' and r.status = 'accepted' and r.quantity = 'formation_enthalpy'`,
      )
    ).id as number;
    const item = (value: number) => valueItem(source, { species: 'ethane', value });
    const first = await submitted(curator, [item(-83.8)]);
    const second = await submitted(curator, [item(-84.68)]);
    const won = await editor
      .post(`/api/v1/proposals/${first}/decision`, { decision: 'approve', comment: 'ok' })
      .expect(200);
    const newer = won.body.createdRevisionIds[0];

    for (const decision of ['approve', 'reject']) {
      const res = await editor2
        .post(`/api/v1/proposals/${second}/decision`, { decision, comment: 'late' })
        .expect(409);
      expect(res.body.error.code).toBe('stale');
      expect(res.body.error.message).toContain(
        `revision ${target} of ethane (g) formation_enthalpy was superseded by revision ${newer}`,
      );
      expect(res.body.error.stale).toEqual([
        expect.objectContaining({
          revisionId: target,
          supersededBy: newer,
          reason: 'target_superseded',
        }),
      ]);
    }
    // Nothing was written by the refused decisions.
    expect((await row(t, 'select status from proposals where id = $1', [second])).status).toBe(
      'submitted',
    );
    // Sending it back lets the author submit again against the newer value.
    await editor2
      .post(`/api/v1/proposals/${second}/decision`, {
        decision: 'request_changes',
        comment: 'Compare with the new value',
      })
      .expect(200);
    await curator.post(`/api/v1/proposals/${second}/submit`).expect(200);
    const again = await editor2
      .post(`/api/v1/proposals/${second}/decision`, { decision: 'approve', comment: 'ok now' })
      .expect(200);
    const created = await row(t, 'select supersedes_id from revisions where id = $1', [
      again.body.createdRevisionIds[0],
    ]);
    expect(created.supersedes_id).toBe(newer);
  });

  it('re-checks the decider’s role under lock: a demoted editor is refused (403 role_revoked)', async () => {
    const id = await submitted(curator, [valueItem(source, { species: 'propane', value: -104.7 })]);
    const service = createProposalsService({
      db: t.db.db,
      releases: createReleasesService(t.db.db),
    });
    const editorId = await idOf('demo-editor-2');
    await t.db.pool.query(`update users set role = 'curator' where id = $1`, [editorId]);
    try {
      await expect(service.decide({ id: editorId }, id, 'approve', 'ok')).rejects.toMatchObject({
        status: 403,
        code: 'role_revoked',
      });
    } finally {
      await t.db.pool.query(`update users set role = 'editor' where id = $1`, [editorId]);
    }
  });

  it('decides each of 20 proposals exactly once under 100 concurrent decisions; audit rows equal decisions', async () => {
    const targets = (
      await t.db.pool.query(
        `select s.key, sp.phase, sp.modification, r.value from revisions r
         join species_phases sp on sp.id = r.species_phase_id join species s on s.id = sp.species_id
         where r.status = 'accepted' and r.quantity = 'formation_enthalpy' and r.value <> 0
           and s.key not in ('ethane', 'propane', 'methane')
         order by s.key, sp.phase limit 20`,
      )
    ).rows;
    expect(targets).toHaveLength(20);
    const ids: number[] = [];
    for (const tg of targets) {
      const phase = tg.modification ? `${tg.phase},${tg.modification}` : tg.phase;
      ids.push(
        await submitted(curator, [
          valueItem(source, {
            species: tg.key,
            phase,
            value: Number(tg.value) / 1000 + 0.1,
            unit: 'kJ/mol',
          }),
        ]),
      );
    }
    // A pool of its own, large and patient, so the contention is on the rows, not on connections.
    const pool = new Pool({ connectionString: t.db.url, max: 25 });
    const events: ProposalEvent[] = [];
    const service = createProposalsService({
      db: drizzle(pool, { schema, casing: 'snake_case' }),
      releases: createReleasesService(t.db.db),
      onEvent: async (_tx, e) => {
        events.push(e);
      },
    });
    const deciders = await Promise.all(['demo-editor', 'demo-editor-2', 'demo-admin'].map(idOf));
    const decisions = ['approve', 'reject', 'request_changes'] as const;
    try {
      const results = await Promise.allSettled(
        Array.from({ length: 100 }, (_, n) =>
          service.decide(
            { id: deciders[n % 3]! },
            ids[n % 20]!,
            decisions[(n * 7) % 3]!,
            `decision ${n}`,
          ),
        ),
      );
      const won = results.filter((r) => r.status === 'fulfilled');
      const lost = results.filter((r) => r.status === 'rejected');
      expect(won).toHaveLength(20);
      expect(lost.map((r) => (r as PromiseRejectedResult).reason.code)).toEqual(
        Array(80).fill('already_decided'),
      );
      const winners = won.map((r) => (r as PromiseFulfilledResult<{ id: number }>).value.id);
      expect(new Set(winners)).toEqual(new Set(ids));
    } finally {
      await pool.end();
    }
    const audits = await row(
      t,
      `select count(*)::int as n from audit_log where action = 'proposal.decided' and entity_id = any($1::text[])`,
      [ids.map(String)],
    );
    expect(audits.n).toBe(20);
    const comments = await row(
      t,
      `select count(*)::int as n, count(distinct proposal_id)::int as p from proposal_comments
       where decision is not null and proposal_id = any($1::int[])`,
      [ids],
    );
    expect(comments).toEqual({ n: 20, p: 20 });
    expect(events.filter((e) => e.type === 'decided')).toHaveLength(20);
    // Approvals left exactly one accepted value per species-phase (the unique index holds).
    const doubles = await row(
      t,
      `select count(*)::int as n from (select species_phase_id, quantity from revisions
       where status = 'accepted' group by 1, 2 having count(*) > 1) x`,
    );
    expect(doubles.n).toBe(0);
  });
});
