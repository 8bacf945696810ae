import { sql } from 'drizzle-orm';
import request from 'supertest';
import { acceptFormationValueIn, retireRevisionIn } from '../../server/src/db/accepted-revisions';
import {
  DraftAnswer,
  DraftList,
  PublishStatus,
} from '../../server/src/modules/releases/release-drafts-schemas';
import { ReleaseManifest } from '../../server/src/modules/releases/releases-schemas';
import { createReleasesService } from '../../server/src/modules/releases/releases-service';
import { releaseComposer, type ReleaseComposer } from '../support/release-composer';
import { createTestApp, signIn, type TestApp } from '../support/test-app';

describe('release composer', () => {
  let t: TestApp;
  let composer: ReleaseComposer;

  beforeAll(async () => {
    t = await createTestApp();
    composer = await releaseComposer(t);
  });
  afterAll(() => t.close());

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
      await composer.create('2031.8', '', agent, xsrf).expect(201);
      const releases = createReleasesService(t.db.db);
      const curator = await composer.userId('demo-curator');
      await expect(releases.publish({ id: curator }, '2031.8')).rejects.toMatchObject({
        status: 403,
        code: 'role_revoked',
      });
    });
  });

  describe('drafts', () => {
    it('creates a draft on the newest release; a taken label is 409, a bad one 400', async () => {
      const base = await composer.latest();
      const res = await composer.create('2030.1', 'Notes for 2030.1').expect(201);
      const d = DraftAnswer.parse(res.body);
      expect(d.release).toMatchObject({
        version: '2030.1',
        status: 'draft',
        base,
        stale: false,
        createdBy: { login: 'demo-editor' },
      });
      expect((await composer.create('2030.1').expect(409)).body.error.code).toBe('version_taken');
      expect((await composer.create(base).expect(409)).body.error.code).toBe('version_taken');
      expect((await composer.create('2030.x').expect(400)).body.error.code).toBe(
        'validation_error',
      );
      const list = DraftList.parse(
        (await composer.editor.get('/api/v1/releases/drafts').expect(200)).body,
      );
      expect(list.drafts.map((x) => x.version)).toContain('2030.1');
      // A draft is not a published release.
      await request(t.app).get('/api/v1/releases/2030.1').expect(404);
      const audit = await composer.one(
        `select after from audit_log where action = 'release.draft_created' and after->>'version' = '2030.1'`,
      );
      expect(audit.after).toMatchObject({ base });
    });

    it('refuses to publish a draft that changes nothing (409 empty_release)', async () => {
      await composer.excludeAll('2030.1');
      const res = await composer.publish('2030.1').expect(409);
      expect(res.body.error.code).toBe('empty_release');
      expect(
        (await composer.one(`select status from releases where version = '2030.1'`)).status,
      ).toBe('draft');
    });

    it('lists added, changed and retired values with old, new and the difference; exclusions stick', async () => {
      const base = await composer.latest();
      const waterOld = await composer.acceptedId('water', 'l');
      const waterNew = await composer.accept('water', 'l', '-285900', { uncertainty: '30' });
      const retired = await composer.acceptedId('ammonia', 'g');
      await t.db.db.transaction((tx) => retireRevisionIn(tx, retired));
      // A phase with no value in the base release: added.
      const sp = await composer.one(
        `insert into species_phases (species_id, phase)
         select id, 'aq' from species where key = 'methane' returning id`,
      );
      const added = await t.db.db.transaction(async (tx) =>
        acceptFormationValueIn(tx, {
          speciesPhaseId: sp.id,
          value: '-89000',
          method: 'estimated',
          sourceId: await composer.sourceId(),
          createdBy: null,
        }),
      );

      const d = DraftAnswer.parse(
        (await composer.editor.get('/api/v1/releases/2030.1/changes').expect(200)).body,
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
          await composer.editor
            .patch('/api/v1/releases/2030.1')
            .set('X-XSRF-TOKEN', composer.editorXsrf)
            .send({ exclude: [added.id], notes: 'Water revised; ammonia (g) withdrawn' })
            .expect(200)
        ).body,
      );
      expect(patched.release.notes).toBe('Water revised; ammonia (g) withdrawn');
      expect(patched.changes.find((c) => c.revisionId === added.id)!.included).toBe(false);
      // Take back the water change and the retirement (left out by excludeAll earlier).
      await composer.editor
        .patch('/api/v1/releases/2030.1')
        .set('X-XSRF-TOKEN', composer.editorXsrf)
        .send({ include: [waterNew.id, retired] })
        .expect(200);
      const bad = await composer.editor
        .patch('/api/v1/releases/2030.1')
        .set('X-XSRF-TOKEN', composer.editorXsrf)
        .send({ exclude: [999999] })
        .expect(422);
      expect(bad.body.error.code).toBe('not_a_change');

      // Publish: one transaction, the manifest back, latest moves.
      const baseCount = (
        await composer.one(
          `select count(*)::int as n from release_entries e join releases r on r.id = e.release_id
           where r.version = $1`,
          [base],
        )
      ).n;
      const res = await composer.publish('2030.1').expect(200);
      const m = ReleaseManifest.parse(res.body);
      expect(m).toMatchObject({ version: '2030.1', publishedBy: { login: 'demo-editor' } });
      expect(await composer.latest()).toBe('2030.1');
      const l = await request(t.app).get('/api/v1/releases/latest').expect(200);
      expect(l.body.version).toBe('2030.1');

      const pinned = await composer.rows(
        `select e.species_phase_id, e.quantity, e.revision_id from release_entries e
         join releases r on r.id = e.release_id where r.version = '2030.1'`,
      );
      // Other changes waiting in the base (e.g. the demo's unreleased one) were left out above.
      expect(pinned.length).toBe(baseCount - 1);
      const dupes = await composer.rows(
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
      const audit = await composer.one(
        `select actor_id, after from audit_log where action = 'release.published'
         and after->>'version' = '2030.1'`,
      );
      expect(audit).toMatchObject({
        actor_id: await composer.userId('demo-editor'),
        after: { base, changes: 2 },
      });
      const status = PublishStatus.parse(
        (await composer.editor.get('/api/v1/releases/2030.1/publish-status').expect(200)).body,
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
      const rel = await composer.one(`select id from releases where version = '2030.1'`);
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
      expect((await composer.publish('2030.1').expect(409)).body.error.code).toBe(
        'already_published',
      );
      const res = await composer.editor
        .patch('/api/v1/releases/2030.1')
        .set('X-XSRF-TOKEN', composer.editorXsrf)
        .send({ notes: 'late' })
        .expect(409);
      expect(res.body.error.code).toBe('already_published');
      expect((await composer.publish('2099.7').expect(404)).body.error.code).toBe('unknown_draft');
    });
  });

  describe('races', () => {
    it('refuses a draft whose base is no longer the newest (409 stale_draft) until re-based', async () => {
      await composer.create('2030.2').expect(201);
      await composer.create('2030.3', '', composer.editor2, composer.editor2Xsrf).expect(201);
      await composer.accept('methane', 'g', '-74870');
      await composer.publish('2030.2').expect(200);
      const res = await composer
        .publish('2030.3', composer.editor2, composer.editor2Xsrf)
        .expect(409);
      expect(res.body.error).toMatchObject({
        code: 'stale_draft',
        latest: '2030.2',
        base: '2030.1',
      });
      const d = DraftAnswer.parse(
        (await composer.editor2.get('/api/v1/releases/2030.3/changes').expect(200)).body,
      );
      expect(d.release.stale).toBe(true);
      await composer.accept('methane', 'g', '-74873');
      const rebased = DraftAnswer.parse(
        (
          await composer.editor2
            .patch('/api/v1/releases/2030.3')
            .set('X-XSRF-TOKEN', composer.editor2Xsrf)
            .send({ rebase: true })
            .expect(200)
        ).body,
      );
      expect(rebased.release).toMatchObject({ base: '2030.2', stale: false });
      await composer.publish('2030.3', composer.editor2, composer.editor2Xsrf).expect(200);
    });

    it('lets exactly one of 10 concurrent publishes of one draft win', async () => {
      await composer.create('2030.4').expect(201);
      await composer.accept('methane', 'g', '-74874');
      const all = await Promise.all(Array.from({ length: 10 }, () => composer.publish('2030.4')));
      const statuses = all.map((r) => r.status).sort();
      expect(statuses.filter((s) => s === 200)).toHaveLength(1);
      expect(statuses.filter((s) => s === 409)).toHaveLength(9);
      for (const r of all.filter((x) => x.status === 409)) {
        expect(['already_published', 'publish_in_progress']).toContain(r.body.error.code);
      }
    });

    it('lets exactly one of 10 processes publishing one draft win (database lock)', async () => {
      await composer.create('2030.5').expect(201);
      await composer.accept('methane', 'g', '-74875');
      const actor = { id: await composer.userId('demo-editor') };
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
      const n = await composer.one(
        `select count(*)::int as n from audit_log where action = 'release.published'
         and after->>'version' = '2030.5'`,
      );
      expect(n.n).toBe(1);
    });

    it('lets one of two editors publishing drafts on the same base at once win; the other is stale', async () => {
      await composer.create('2030.6').expect(201);
      await composer.create('2030.7', '', composer.editor2, composer.editor2Xsrf).expect(201);
      await composer.accept('methane', 'g', '-74876');
      const [a, b] = await Promise.all([
        composer.publish('2030.6'),
        composer.publish('2030.7', composer.editor2, composer.editor2Xsrf),
      ]);
      expect([a.status, b.status].sort()).toEqual([200, 409]);
      expect((a.status === 409 ? a : b).body.error.code).toBe('stale_draft');
    });
    it('makes the release that published last the newest, whenever its transaction began', async () => {
      await composer.create('2030.8').expect(201);
      await composer.create('2030.9').expect(201);
      await composer.accept('methane', 'g', '-74877');
      const actor = { id: await composer.userId('demo-editor') };
      const releases = createReleasesService(t.db.db);
      await t.db.db.transaction(async (tx) => {
        await tx.execute(sql`select 1`); // the transaction (and its now()) starts here
        await releases.publish(actor, '2030.8'); // another connection publishes meanwhile
        const newest = await composer.one(`select id from releases where version = '2030.8'`);
        await tx.execute(
          sql`update releases set base_release_id = ${newest.id} where version = '2030.9'`,
        );
        await composer.accept('methane', 'g', '-74878');
        await releases.publishIn(tx, actor, '2030.9');
      });
      expect(await composer.latest()).toBe('2030.9');
    });
  });
});
