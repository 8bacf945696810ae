import request from 'supertest';
import { IMMUTABLE_CACHE } from '../../server/src/modules/releases/release-http-cache';
import { ReleaseList, ReleaseManifest } from '../../server/src/modules/releases/releases-schemas';
import { acceptFormationValueIn } from '../../server/src/db/accepted-revisions';
import { createReleasesService } from '../../server/src/modules/releases/releases-service';
import { createTestApp, type TestApp } from '../support/test-app';

describe('releases', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const one = async (text: string, params: unknown[] = []) =>
    (await t.db.pool.query(text, params)).rows[0];

  it('lists the published starter release, published by the system account', async () => {
    const res = await request(t.app).get('/api/v1/releases').expect(200);
    const body = ReleaseList.parse(res.body);
    const starter = body.releases.find((r) => r.version === '2026.1');
    expect(starter).toMatchObject({
      status: 'published',
      publishedBy: { login: 'thalpos-system' },
    });
    expect(Date.parse(starter!.publishedAt)).not.toBeNaN();
  });

  it('answers a manifest whose counts agree with the rows the release pins', async () => {
    const res = await request(t.app).get('/api/v1/releases/2026.1').expect(200);
    const m = ReleaseManifest.parse(res.body);
    const expected = await one(`
      select count(distinct sp.species_id)::int as species,
             count(distinct e.species_phase_id)::int as "speciesPhases",
             (count(*) filter (where e.quantity = 'formation_enthalpy'))::int as "formationEnthalpies",
             (count(*) filter (where e.quantity = 'heat_capacity'))::int as "heatCapacitySets",
             (count(*) filter (where e.quantity like 'transition:%'))::int as transitions,
             count(distinct r.source_id)::int as sources
      from release_entries e
      join releases rel on rel.id = e.release_id
      join species_phases sp on sp.id = e.species_phase_id
      join revisions r on r.id = e.revision_id
      where rel.version = '2026.1'`);
    expect(m.counts).toEqual(expected);
    expect(m.counts.speciesPhases).toBeGreaterThanOrEqual(80);
    expect(m.notes).not.toBe('');
  });

  it('gives a named release a strong ETag and a year-long cache; If-None-Match answers 304', async () => {
    const res = await request(t.app).get('/api/v1/releases/2026.1').expect(200);
    expect(res.headers['cache-control']).toBe(IMMUTABLE_CACHE);
    expect(res.headers.etag).toMatch(/^"[\w-]+"$/);
    await request(t.app)
      .get('/api/v1/releases/2026.1')
      .set('If-None-Match', res.headers.etag)
      .expect(304);
  });

  it('resolves latest to the newest published release, cached only briefly', async () => {
    const named = await request(t.app).get('/api/v1/releases/2026.1').expect(200);
    const latest = await request(t.app).get('/api/v1/releases/latest').expect(200);
    expect(latest.body).toEqual(named.body);
    expect(latest.headers['cache-control']).toMatch(/max-age=60$/);
  });

  it.each(['2099.1', 'not-a-version', '2026.1%27--', 'LATEST'])(
    'answers 404 unknown_release for %s',
    async (version) => {
      const res = await request(t.app).get(`/api/v1/releases/${version}`).expect(404);
      expect(res.body.error).toMatchObject({ code: 'unknown_release' });
      expect(res.headers['cache-control']).toBe('no-store');
    },
  );

  describe('publish service', () => {
    const editorId = async () =>
      (await one(`select id from users where login = 'demo-editor'`)).id as number;

    it('keeps a draft hidden, then publishes it in one transaction with its audit row', async () => {
      const releases = createReleasesService(t.db.db);
      const actor = { id: await editorId() };
      await releases.createDraft(actor, '2029.2', 'Second pass');
      await request(t.app).get('/api/v1/releases/2029.2').expect(404);
      // A release must change something: one value accepted since the newest release.
      await t.db.db.transaction(async (tx) =>
        acceptFormationValueIn(tx, {
          speciesPhaseId: (
            await one(`select sp.id from species_phases sp join species s on s.id = sp.species_id
              where s.key = 'methane' and sp.phase = 'g'`)
          ).id,
          value: '-74870',
          method: 'evaluated',
          sourceId: (await one(`select min(id) as id from sources`)).id,
          createdBy: actor.id,
        }),
      );

      const published = await releases.publish(actor, '2029.2');
      expect(published.status).toBe('published');
      const pins = await one(`
        select count(*)::int as n from release_entries e join releases r on r.id = e.release_id
        where r.version = '2029.2'`);
      const accepted = await one(
        `select count(*)::int as n from revisions where status = 'accepted'`,
      );
      expect(pins.n).toBe(accepted.n);
      const audit = await one(
        `select actor_id, after from audit_log where action = 'release.published' and entity_id = $1`,
        [String(published.id)],
      );
      expect(audit).toMatchObject({ actor_id: actor.id, after: { version: '2029.2' } });

      const res = await request(t.app).get('/api/v1/releases/2029.2').expect(200);
      expect(res.body.publishedBy.login).toBe('demo-editor');
      expect((await createReleasesService(t.db.db).resolve('latest')).version).toBe('2029.2');
    });

    it('refuses publishing twice, a reused label, and an actor without the editor role', async () => {
      const releases = createReleasesService(t.db.db);
      const actor = { id: await editorId() };
      await expect(releases.publish(actor, '2029.2')).rejects.toMatchObject({
        status: 409,
        code: 'already_published',
      });
      await expect(releases.createDraft(actor, '2026.1')).rejects.toMatchObject({
        code: 'version_taken',
      });
      const reader = (await one(`select id from users where login = 'demo-reader'`)).id;
      await releases.createDraft(actor, '2029.3');
      await expect(releases.publish({ id: reader }, '2029.3')).rejects.toMatchObject({
        status: 403,
        code: 'role_revoked',
      });
      const still = await one(`select status from releases where version = '2029.3'`);
      expect(still.status).toBe('draft');
    });
  });

  describe('snapshots', () => {
    it('builds a release snapshot once and shares it; its rows agree with the manifest', async () => {
      const releases = createReleasesService(t.db.db);
      const a = await releases.getSnapshot('2026.1');
      const b = await releases.getSnapshot('2026.1');
      expect(b).toBe(a);
      const m = ReleaseManifest.parse(
        (await request(t.app).get('/api/v1/releases/2026.1').expect(200)).body,
      );
      expect(a.counts).toEqual({
        species: m.counts.species,
        speciesPhases: expect.any(Number),
        formationValues: m.counts.formationEnthalpies,
        heatCapacitySets: m.counts.heatCapacitySets,
        transitions: m.counts.transitions,
      });
      const water = await one(`
        select r.value from revisions r join species_phases sp on sp.id = r.species_phase_id
        join species s on s.id = sp.species_id
        where s.key = 'water' and sp.phase = 'l' and r.quantity = 'formation_enthalpy'`);
      expect(a.entries.get('water|l|')?.formation?.value).toBe(water.value);
      const heat = [...a.entries.values()].find((e) => e.heatCapacity)?.heatCapacity;
      expect(heat?.model.kind).toMatch(/^(nasa7|shomate)$/);
    });
  });
});
