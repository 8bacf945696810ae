import request from 'supertest';
import { DraftAnswer, StaleAnswer } from '../../server/src/modules/releases/release-drafts-schemas';
import { ImpactAnswer } from '../../server/src/modules/watchlists/watchlists-schemas';
import { receivedMail, sharedSmtpWorker, waitFor } from '../support/mail';
import { releaseComposer, type ReleaseComposer } from '../support/release-composer';
import { createTestApp, signIn, type TestApp } from '../support/test-app';

// What publishing a release sets off beyond the release itself.
describe('release publish effects', () => {
  let t: TestApp;
  let composer: ReleaseComposer;

  beforeAll(async () => {
    t = await createTestApp();
    composer = await releaseComposer(t);
  });
  afterAll(() => t.close());

  describe('stale derived values', () => {
    let derivedId: number;
    let waterInput: number;

    beforeAll(async () => {
      // A derived value computed from water (l), published in a release of its own.
      await composer.create('2032.1').expect(201);
      await composer.excludeAll('2032.1');
      waterInput = await composer.acceptedId('water', 'l');
      const derived = await composer.accept('methanol', 'l', '-239100', { inputs: [waterInput] });
      derivedId = derived.id;
      await composer.editor
        .patch('/api/v1/releases/2032.1')
        .set('X-XSRF-TOKEN', composer.editorXsrf)
        .send({ include: [derivedId] })
        .expect(200);
      await composer.publish('2032.1').expect(200);
    });

    it('lists a derived value whose input the draft replaces, and refuses to publish until acknowledged', async () => {
      await composer.create('2032.2').expect(201);
      const newWater = await composer.accept('water', 'l', '-285830', { uncertainty: '40' });
      const stale = StaleAnswer.parse(
        (await composer.editor.get('/api/v1/releases/2032.2/stale').expect(200)).body,
      );
      expect(stale.stale).toEqual([
        expect.objectContaining({
          revisionId: derivedId,
          species: expect.objectContaining({ key: 'methanol' }),
          acknowledged: false,
          inputs: [expect.objectContaining({ revisionId: waterInput, replacedBy: newWater.id })],
        }),
      ]);
      const d = DraftAnswer.parse(
        (await composer.editor.get('/api/v1/releases/2032.2/changes')).body,
      );
      expect(d.counts.staleUnacknowledged).toBe(1);

      const refused = await composer.publish('2032.2').expect(409);
      expect(refused.body.error).toMatchObject({ code: 'stale_derived', revisionIds: [derivedId] });

      const wrong = await composer.editor
        .post('/api/v1/releases/2032.2/acknowledgements')
        .set('X-XSRF-TOKEN', composer.editorXsrf)
        .send({ revisionIds: [newWater.id] })
        .expect(422);
      expect(wrong.body.error.code).toBe('not_stale');

      const acked = StaleAnswer.parse(
        (
          await composer.editor
            .post('/api/v1/releases/2032.2/acknowledgements')
            .set('X-XSRF-TOKEN', composer.editorXsrf)
            .send({ revisionIds: [derivedId] })
            .expect(200)
        ).body,
      );
      expect(acked.stale[0]!.acknowledged).toBe(true);
      await composer.publish('2032.2').expect(200);
      const audit = await composer.one(
        `select after from audit_log where action = 'release.published' and after->>'version' = '2032.2'`,
      );
      expect(audit.after.acknowledgedStale).toEqual([derivedId]);
    });

    it('needs no acknowledgement when the draft includes the re-derivation', async () => {
      await composer.create('2032.3').expect(201);
      const newWater = await composer.accept('water', 'l', '-285831', { uncertainty: '40' });
      const stale = StaleAnswer.parse(
        (await composer.editor.get('/api/v1/releases/2032.3/stale')).body,
      );
      expect(stale.stale.map((s) => s.revisionId)).toEqual([derivedId]);
      await composer.accept('methanol', 'l', '-239090', { inputs: [newWater.id] });
      const after = StaleAnswer.parse(
        (await composer.editor.get('/api/v1/releases/2032.3/stale')).body,
      );
      expect(after.stale).toEqual([]);
      await composer.publish('2032.3').expect(200);
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
        await composer.one(`select version from releases where status = 'published'
                   order by published_at desc limit 1`)
      ).version as string;
      await composer.create('2033.1').expect(201);
      // The elements' ΔfH° is zero by definition, so ΔrH is the new water value itself.
      await composer.accept('water', 'l', '-285000', { uncertainty: '40' });
      const stale = StaleAnswer.parse(
        (await composer.editor.get('/api/v1/releases/2033.1/stale')).body,
      );
      if (stale.stale.length > 0) {
        await composer.editor
          .post('/api/v1/releases/2033.1/acknowledgements')
          .set('X-XSRF-TOKEN', composer.editorXsrf)
          .send({ revisionIds: stale.stale.map((x) => x.revisionId) })
          .expect(200);
      }
      await composer.publish('2033.1').expect(200);

      // Queued in the publish transaction, for the watcher's address.
      const queued = await composer.rows(
        `select to_address, subject from outbox_messages
         where event_kind = 'release.published' and recipient_id = $1`,
        [await composer.userId('demo-reader')],
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
