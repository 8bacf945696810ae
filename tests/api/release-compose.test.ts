import { sql } from 'drizzle-orm';
import request from 'supertest';
import { acceptFormationValueIn, retireRevisionIn } from '../../server/src/db/accepted-revisions';
import {
  DraftAnswer,
  DraftList,
  PublishStatus,
  StaleAnswer,
} from '../../server/src/modules/releases/release-drafts-schemas';
import { ReleaseManifest } from '../../server/src/modules/releases/releases-schemas';
import { ImpactAnswer } from '../../server/src/modules/watchlists/watchlists-schemas';
import { createReleasesService } from '../../server/src/modules/releases/releases-service';
import { receivedMail, sharedSmtpWorker, waitFor } from '../support/mail';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

describe('release composer', () => {
  let t: TestApp;
  let editor: Agent;
  let editorXsrf: string;
  let editor2: Agent;
  let editor2Xsrf: string;

  beforeAll(async () => {
    t = await createTestApp();
    editor = request.agent(t.app);
    editorXsrf = await signIn(editor, 'demo-editor');
    editor2 = request.agent(t.app);
    editor2Xsrf = await signIn(editor2, 'demo-editor-2');
  });
  afterAll(() => t.close());

  const one = async (text: string, params: unknown[] = []) =>
    (await t.db.pool.query(text, params)).rows[0];
  const rows = async (text: string, params: unknown[] = []) =>
    (await t.db.pool.query(text, params)).rows;

  const userId = async (login: string) =>
    (await one(`select id from users where login = $1`, [login])).id as number;
  const phaseId = async (key: string, phase: string) =>
    (
      await one(
        `select sp.id from species_phases sp join species s on s.id = sp.species_id
         where s.key = $1 and sp.phase = $2 and sp.modification is null`,
        [key, phase],
      )
    ).id as number;
  const acceptedId = async (key: string, phase: string) =>
    (
      await one(
        `select r.id from revisions r where r.species_phase_id = $1
         and r.quantity = 'formation_enthalpy' and r.status = 'accepted'`,
        [await phaseId(key, phase)],
      )
    ).id as number;
  const sourceId = async () => (await one(`select min(id) as id from sources`)).id as number;

  /** Accepts a new ΔfH° the way an approval does (the old accepted revision is superseded). */
  const accept = async (
    key: string,
    phase: string,
    value: string,
    extra: { uncertainty?: string; inputs?: number[] } = {},
  ) =>
    t.db.db.transaction(async (tx) =>
      acceptFormationValueIn(tx, {
        speciesPhaseId: await phaseId(key, phase),
        value,
        uncertainty: extra.uncertainty ?? '100',
        method: extra.inputs ? 'derived' : 'combustion_calorimetry',
        sourceId: await sourceId(),
        notes: 'test value',
        createdBy: await userId('demo-editor'),
        inputRevisionIds: extra.inputs,
        derivation: extra.inputs
          ? { equation: 'test', deltaH: '0', uncertainty: null, releaseVersion: 'test' }
          : undefined,
      }),
    );

  /** Leaves every change of a draft out, so a test starts from a known change set. */
  const excludeAll = async (version: string) => {
    const d = DraftAnswer.parse((await editor.get(`/api/v1/releases/${version}/changes`)).body);
    const ids = d.changes.filter((c) => c.included).map((c) => c.revisionId);
    if (ids.length === 0) return;
    await editor
      .patch(`/api/v1/releases/${version}`)
      .set('X-XSRF-TOKEN', editorXsrf)
      .send({ exclude: ids })
      .expect(200);
  };
  const create = (version: string, notes = '', agent = editor, xsrf = editorXsrf) =>
    agent.post('/api/v1/releases').set('X-XSRF-TOKEN', xsrf).send({ version, notes });
  const publish = (version: string, agent = editor, xsrf = editorXsrf) =>
    agent.post(`/api/v1/releases/${version}/publish`).set('X-XSRF-TOKEN', xsrf);
  const latest = async () =>
    (
      await one(`select version from releases where status = 'published'
      order by published_at desc, id desc limit 1`)
    ).version as string;

  describe('roles', () => {
    it.each(['demo-reader', 'demo-curator'])('refuses %s with 403', async (login) => {
      const agent = request.agent(t.app);
      const xsrf = await signIn(agent, login);
      const res = await agent
        .post('/api/v1/releases')
        .set('X-XSRF-TOKEN', xsrf)
        .send({ version: '2031.1' })
        .expect(403);
      expect(res.body.error.code).toBe('forbidden');
      await agent.get('/api/v1/releases/drafts').expect(403);
      await agent.post('/api/v1/releases/2026.1/publish').set('X-XSRF-TOKEN', xsrf).expect(403);
    });

    it('asks an anonymous caller to sign in', async () => {
      await request(t.app).get('/api/v1/releases/drafts').expect(401);
    });

    it('lets an admin compose', async () => {
      const admin = request.agent(t.app);
      const xsrf = await signIn(admin, 'demo-admin');
      await admin.get('/api/v1/releases/drafts').expect(200);
      await admin
        .post('/api/v1/releases')
        .set('X-XSRF-TOKEN', xsrf)
        .send({ version: '2031.9' })
        .expect(201);
    });

    it('re-checks the role under lock: a demoted editor cannot publish', async () => {
      const agent = request.agent(t.app);
      const xsrf = await signIn(agent, 'demo-editor-2');
      await create('2031.8', '', agent, xsrf).expect(201);
      const releases = createReleasesService(t.db.db);
      const curator = await userId('demo-curator');
      await expect(releases.publish({ id: curator }, '2031.8')).rejects.toMatchObject({
        status: 403,
        code: 'role_revoked',
      });
    });
  });

  describe('drafts', () => {
    it('creates a draft on the newest release; a taken label is 409, a bad one 400', async () => {
      const base = await latest();
      const res = await create('2030.1', 'Notes for 2030.1').expect(201);
      const d = DraftAnswer.parse(res.body);
      expect(d.release).toMatchObject({
        version: '2030.1',
        status: 'draft',
        base,
        stale: false,
        createdBy: { login: 'demo-editor' },
      });
      expect((await create('2030.1').expect(409)).body.error.code).toBe('version_taken');
      expect((await create(base).expect(409)).body.error.code).toBe('version_taken');
      expect((await create('2030.x').expect(400)).body.error.code).toBe('validation_error');
      const list = DraftList.parse((await editor.get('/api/v1/releases/drafts').expect(200)).body);
      expect(list.drafts.map((x) => x.version)).toContain('2030.1');
      // A draft is not a published release.
      await request(t.app).get('/api/v1/releases/2030.1').expect(404);
      const audit = await one(
        `select after from audit_log where action = 'release.draft_created' and after->>'version' = '2030.1'`,
      );
      expect(audit.after).toMatchObject({ base });
    });

    it('refuses to publish a draft that changes nothing (409 empty_release)', async () => {
      await excludeAll('2030.1');
      const res = await publish('2030.1').expect(409);
      expect(res.body.error.code).toBe('empty_release');
      expect((await one(`select status from releases where version = '2030.1'`)).status).toBe(
        'draft',
      );
    });

    it('lists added, changed and retired values with old, new and the difference; exclusions stick', async () => {
      const base = await latest();
      const waterOld = await acceptedId('water', 'l');
      const waterNew = await accept('water', 'l', '-285900', { uncertainty: '30' });
      const retired = await acceptedId('ammonia', 'g');
      await t.db.db.transaction((tx) => retireRevisionIn(tx, retired));
      // A phase with no value in the base release: added.
      const sp = await one(
        `insert into species_phases (species_id, phase)
         select id, 'aq' from species where key = 'methane' returning id`,
      );
      const added = await t.db.db.transaction(async (tx) =>
        acceptFormationValueIn(tx, {
          speciesPhaseId: sp.id,
          value: '-89000',
          method: 'estimated',
          sourceId: await sourceId(),
          createdBy: null,
        }),
      );

      const d = DraftAnswer.parse(
        (await editor.get('/api/v1/releases/2030.1/changes').expect(200)).body,
      );
      const water = d.changes.find((c) => c.revisionId === waterNew.id)!;
      expect(water).toMatchObject({
        change: 'changed',
        species: { key: 'water' },
        phase: 'l',
        old: { revisionId: waterOld },
        new: { revisionId: waterNew.id, value: -285900, uncertainty: 30 },
        included: true,
      });
      const oldWater = water.old!;
      expect(water.difference!.kJPerMol).toBeCloseTo((-285900 - oldWater.value!) / 1000, 9);
      if (oldWater.uncertainty != null) {
        expect(water.difference!.combinedUncertainties).toBeCloseTo(
          (-285900 - oldWater.value!) / Math.hypot(oldWater.uncertainty, 30),
          9,
        );
      }
      expect(d.changes.find((c) => c.revisionId === retired)).toMatchObject({
        change: 'retired',
        old: { revisionId: retired },
        new: null,
        difference: null,
      });
      expect(d.changes.find((c) => c.revisionId === added.id)).toMatchObject({
        change: 'added',
        old: null,
        phase: 'aq',
        included: true,
      });
      expect(d.counts.added + d.counts.changed + d.counts.retired).toBe(d.changes.length);

      const patched = DraftAnswer.parse(
        (
          await editor
            .patch('/api/v1/releases/2030.1')
            .set('X-XSRF-TOKEN', editorXsrf)
            .send({ exclude: [added.id], notes: 'Water revised; ammonia (g) withdrawn' })
            .expect(200)
        ).body,
      );
      expect(patched.release.notes).toBe('Water revised; ammonia (g) withdrawn');
      expect(patched.changes.find((c) => c.revisionId === added.id)!.included).toBe(false);
      // Take back the water change and the retirement (left out by excludeAll earlier).
      await editor
        .patch('/api/v1/releases/2030.1')
        .set('X-XSRF-TOKEN', editorXsrf)
        .send({ include: [waterNew.id, retired] })
        .expect(200);
      const bad = await editor
        .patch('/api/v1/releases/2030.1')
        .set('X-XSRF-TOKEN', editorXsrf)
        .send({ exclude: [999999] })
        .expect(422);
      expect(bad.body.error.code).toBe('not_a_change');

      // Publish: one transaction, the manifest back, latest moves.
      const baseCount = (
        await one(
          `select count(*)::int as n from release_entries e join releases r on r.id = e.release_id
           where r.version = $1`,
          [base],
        )
      ).n;
      const res = await publish('2030.1').expect(200);
      const m = ReleaseManifest.parse(res.body);
      expect(m).toMatchObject({ version: '2030.1', publishedBy: { login: 'demo-editor' } });
      expect(await latest()).toBe('2030.1');
      const l = await request(t.app).get('/api/v1/releases/latest').expect(200);
      expect(l.body.version).toBe('2030.1');

      const pinned = await rows(
        `select e.species_phase_id, e.quantity, e.revision_id from release_entries e
         join releases r on r.id = e.release_id where r.version = '2030.1'`,
      );
      // Other changes waiting in the base (e.g. the demo's unreleased one) were left out above.
      expect(pinned.length).toBe(baseCount - 1);
      const dupes = await rows(
        `select species_phase_id, quantity, count(*) from release_entries e
         join releases r on r.id = e.release_id where r.version = '2030.1'
         group by species_phase_id, quantity having count(*) > 1`,
      );
      expect(dupes).toEqual([]);
      const ids = new Set(pinned.map((p) => p.revision_id));
      expect(ids.has(waterNew.id)).toBe(true);
      expect(ids.has(waterOld)).toBe(false);
      expect(ids.has(retired)).toBe(false);
      expect(ids.has(added.id)).toBe(false);
      const audit = await one(
        `select actor_id, after from audit_log where action = 'release.published'
         and after->>'version' = '2030.1'`,
      );
      expect(audit).toMatchObject({
        actor_id: await userId('demo-editor'),
        after: { base, changes: 2 },
      });
      const status = PublishStatus.parse(
        (await editor.get('/api/v1/releases/2030.1/publish-status').expect(200)).body,
      );
      expect(status).toMatchObject({ phase: 'done', percent: 100, error: null });
      expect(status.steps.map((s) => s.phase)).toEqual([
        'waiting',
        'checking',
        'pinning',
        'freezing',
        'notifying',
        'done',
      ]);
    });

    it('keeps a published release frozen: raw SQL cannot change it', async () => {
      const rel = await one(`select id from releases where version = '2030.1'`);
      await expect(
        t.db.pool.query(`update releases set notes = 'x' where id = $1`, [rel.id]),
      ).rejects.toThrow(/published/);
      await expect(
        t.db.pool.query(`delete from release_entries where release_id = $1`, [rel.id]),
      ).rejects.toThrow(/published/);
      await expect(
        t.db.pool.query(`delete from release_exclusions where release_id = $1`, [rel.id]),
      ).rejects.toThrow(/published/);
    });

    it('answers 409 already_published to a second publish and to edits', async () => {
      expect((await publish('2030.1').expect(409)).body.error.code).toBe('already_published');
      const res = await editor
        .patch('/api/v1/releases/2030.1')
        .set('X-XSRF-TOKEN', editorXsrf)
        .send({ notes: 'late' })
        .expect(409);
      expect(res.body.error.code).toBe('already_published');
      expect((await publish('2099.7').expect(404)).body.error.code).toBe('unknown_draft');
    });
  });

  describe('races', () => {
    it('refuses a draft whose base is no longer the newest (409 stale_draft) until re-based', async () => {
      await create('2030.2').expect(201);
      await create('2030.3', '', editor2, editor2Xsrf).expect(201);
      await accept('methane', 'g', '-74870');
      await publish('2030.2').expect(200);
      const res = await publish('2030.3', editor2, editor2Xsrf).expect(409);
      expect(res.body.error).toMatchObject({
        code: 'stale_draft',
        latest: '2030.2',
        base: '2030.1',
      });
      const d = DraftAnswer.parse(
        (await editor2.get('/api/v1/releases/2030.3/changes').expect(200)).body,
      );
      expect(d.release.stale).toBe(true);
      await accept('methane', 'g', '-74873');
      const rebased = DraftAnswer.parse(
        (
          await editor2
            .patch('/api/v1/releases/2030.3')
            .set('X-XSRF-TOKEN', editor2Xsrf)
            .send({ rebase: true })
            .expect(200)
        ).body,
      );
      expect(rebased.release).toMatchObject({ base: '2030.2', stale: false });
      await publish('2030.3', editor2, editor2Xsrf).expect(200);
    });

    it('lets exactly one of 10 concurrent publishes of one draft win', async () => {
      await create('2030.4').expect(201);
      await accept('methane', 'g', '-74874');
      const all = await Promise.all(Array.from({ length: 10 }, () => publish('2030.4')));
      const statuses = all.map((r) => r.status).sort();
      expect(statuses.filter((s) => s === 200)).toHaveLength(1);
      expect(statuses.filter((s) => s === 409)).toHaveLength(9);
      for (const r of all.filter((x) => x.status === 409)) {
        expect(['already_published', 'publish_in_progress']).toContain(r.body.error.code);
      }
    });

    it('lets exactly one of 10 processes publishing one draft win (database lock)', async () => {
      await create('2030.5').expect(201);
      await accept('methane', 'g', '-74875');
      const actor = { id: await userId('demo-editor') };
      // Each service stands for another server instance: no shared memory, only the database.
      const results = await Promise.allSettled(
        Array.from({ length: 10 }, () => createReleasesService(t.db.db).publish(actor, '2030.5')),
      );
      expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
      for (const r of results.filter((x) => x.status === 'rejected')) {
        expect((r as PromiseRejectedResult).reason).toMatchObject({
          status: 409,
          code: 'already_published',
        });
      }
      const n = await one(
        `select count(*)::int as n from audit_log where action = 'release.published'
         and after->>'version' = '2030.5'`,
      );
      expect(n.n).toBe(1);
    });

    it('lets one of two editors publishing drafts on the same base at once win; the other is stale', async () => {
      await create('2030.6').expect(201);
      await create('2030.7', '', editor2, editor2Xsrf).expect(201);
      await accept('methane', 'g', '-74876');
      const [a, b] = await Promise.all([
        publish('2030.6'),
        publish('2030.7', editor2, editor2Xsrf),
      ]);
      expect([a.status, b.status].sort()).toEqual([200, 409]);
      expect((a.status === 409 ? a : b).body.error.code).toBe('stale_draft');
    });
    it('makes the release that published last the newest, whenever its transaction began', async () => {
      await create('2030.8').expect(201);
      await create('2030.9').expect(201);
      await accept('methane', 'g', '-74877');
      const actor = { id: await userId('demo-editor') };
      const releases = createReleasesService(t.db.db);
      await t.db.db.transaction(async (tx) => {
        await tx.execute(sql`select 1`); // the transaction (and its now()) starts here
        await releases.publish(actor, '2030.8'); // another connection publishes meanwhile
        const newest = await one(`select id from releases where version = '2030.8'`);
        await tx.execute(
          sql`update releases set base_release_id = ${newest.id} where version = '2030.9'`,
        );
        await accept('methane', 'g', '-74878');
        await releases.publishIn(tx, actor, '2030.9');
      });
      expect(await latest()).toBe('2030.9');
    });
  });

  describe('stale derived values', () => {
    let derivedId: number;
    let waterInput: number;

    beforeAll(async () => {
      // A derived value computed from water (l), published in a release of its own.
      await create('2032.1').expect(201);
      await excludeAll('2032.1');
      waterInput = await acceptedId('water', 'l');
      const derived = await accept('methanol', 'l', '-239100', { inputs: [waterInput] });
      derivedId = derived.id;
      await editor
        .patch('/api/v1/releases/2032.1')
        .set('X-XSRF-TOKEN', editorXsrf)
        .send({ include: [derivedId] })
        .expect(200);
      await publish('2032.1').expect(200);
    });

    it('lists a derived value whose input the draft replaces, and refuses to publish until acknowledged', async () => {
      await create('2032.2').expect(201);
      const newWater = await accept('water', 'l', '-285830', { uncertainty: '40' });
      const stale = StaleAnswer.parse(
        (await editor.get('/api/v1/releases/2032.2/stale').expect(200)).body,
      );
      expect(stale.stale).toEqual([
        expect.objectContaining({
          revisionId: derivedId,
          species: expect.objectContaining({ key: 'methanol' }),
          acknowledged: false,
          inputs: [expect.objectContaining({ revisionId: waterInput, replacedBy: newWater.id })],
        }),
      ]);
      const d = DraftAnswer.parse((await editor.get('/api/v1/releases/2032.2/changes')).body);
      expect(d.counts.staleUnacknowledged).toBe(1);

      const refused = await publish('2032.2').expect(409);
      expect(refused.body.error).toMatchObject({ code: 'stale_derived', revisionIds: [derivedId] });

      const wrong = await editor
        .post('/api/v1/releases/2032.2/acknowledgements')
        .set('X-XSRF-TOKEN', editorXsrf)
        .send({ revisionIds: [newWater.id] })
        .expect(422);
      expect(wrong.body.error.code).toBe('not_stale');

      const acked = StaleAnswer.parse(
        (
          await editor
            .post('/api/v1/releases/2032.2/acknowledgements')
            .set('X-XSRF-TOKEN', editorXsrf)
            .send({ revisionIds: [derivedId] })
            .expect(200)
        ).body,
      );
      expect(acked.stale[0]!.acknowledged).toBe(true);
      await publish('2032.2').expect(200);
      const audit = await one(
        `select after from audit_log where action = 'release.published' and after->>'version' = '2032.2'`,
      );
      expect(audit.after.acknowledgedStale).toEqual([derivedId]);
    });

    it('needs no acknowledgement when the draft includes the re-derivation', async () => {
      await create('2032.3').expect(201);
      const newWater = await accept('water', 'l', '-285831', { uncertainty: '40' });
      const stale = StaleAnswer.parse((await editor.get('/api/v1/releases/2032.3/stale')).body);
      expect(stale.stale.map((s) => s.revisionId)).toEqual([derivedId]);
      await accept('methanol', 'l', '-239090', { inputs: [newWater.id] });
      const after = StaleAnswer.parse((await editor.get('/api/v1/releases/2032.3/stale')).body);
      expect(after.stale).toEqual([]);
      await publish('2032.3').expect(200);
    });
  });

  describe('watchers', () => {
    it('mails each watcher the impact report, ΔrH in both releases, through the outbox and SMTP', async () => {
      // An address of this run only: the fake SMTP server is shared by every test file.
      const address = `tomas.${Date.now()}.${process.pid}@kestrel.example`;
      const reader = request.agent(t.app);
      const xsrf = await signIn(reader, 'demo-reader');
      // After signing in, which copies the e-mail address from the provider's profile.
      await t.db.pool.query(`update users set email = $1 where login = 'demo-reader'`, [address]);
      const equation = 'H2(g) + 1/2 O2(g) -> H2O(l)';
      await reader
        .post('/api/v1/me/watchlists')
        .set('X-XSRF-TOKEN', xsrf)
        .send({ name: 'Boiler feed', reactions: [{ equation }] })
        .expect(201);
      const base = (
        await one(`select version from releases where status = 'published'
                   order by published_at desc limit 1`)
      ).version as string;
      await create('2033.1').expect(201);
      // The elements' ΔfH° is zero by definition, so ΔrH is the new water value itself.
      await accept('water', 'l', '-285000', { uncertainty: '40' });
      const stale = StaleAnswer.parse((await editor.get('/api/v1/releases/2033.1/stale')).body);
      if (stale.stale.length > 0) {
        await editor
          .post('/api/v1/releases/2033.1/acknowledgements')
          .set('X-XSRF-TOKEN', editorXsrf)
          .send({ revisionIds: stale.stale.map((x) => x.revisionId) })
          .expect(200);
      }
      await publish('2033.1').expect(200);

      // Queued in the publish transaction, for the watcher's address.
      const queued = await rows(
        `select to_address, subject from outbox_messages
         where event_kind = 'release.published' and recipient_id = $1`,
        [await userId('demo-reader')],
      );
      expect(queued).toEqual([
        {
          to_address: address,
          subject: 'Release 2033.1 published — impact on your watchlist “Boiler feed”',
        },
      ]);

      // The same numbers the impact API reports for the two releases.
      const impact = ImpactAnswer.parse(
        (
          await reader
            .post(`/api/v1/releases/${base}/impact/2033.1`)
            .set('X-XSRF-TOKEN', xsrf)
            .send({ equations: [equation] })
            .expect(200)
        ).body,
      );
      const [item] = impact.results;
      if (!item || 'error' in item.from || 'error' in item.to || item.change === null)
        throw new Error(`impact report did not compute: ${JSON.stringify(item)}`);
      expect(item.to.deltaH).toBeCloseTo(-285.0, 6);
      expect(item.to.uncertainty).toBeCloseTo(0.04, 6);

      const { worker, apiUrl, close } = sharedSmtpWorker(t.db.db);
      try {
        while ((await worker.runOnce()).sent > 0);
        const [mail] = await waitFor(async () => {
          const got = await receivedMail(apiUrl, address);
          return got.length > 0 && got;
        });
        expect(mail!.subject).toBe(queued[0].subject);
        const fmt = (x: number) => `${x < 0 ? '−' : ''}${Math.abs(x).toFixed(2)}`;
        expect(mail!.text).toContain(`- ${equation} (at 298.15 K)`);
        expect(mail!.text).toContain(
          `  ${base}: ΔrH = ${fmt(item.from.deltaH)} ± ${item.from.uncertainty!.toFixed(2)}`,
        );
        expect(mail!.text).toContain('  2033.1: ΔrH = −285.00 ± 0.04');
        expect(mail!.text).toContain(`  change +${item.change.toFixed(2)} kJ/mol`);
        expect(mail!.text).toContain(`/releases/${base}/diff/2033.1`);
      } finally {
        close();
      }
    });
  });
});
