import { createHash } from 'node:crypto';
import { Client } from 'pg';
import request from 'supertest';
import { createApp } from '../../server/src/app';
import { createLogger } from '../../server/src/lib/logger';
import { createTestApp, type TestApp } from '../support/test-app';

const FORMATS = ['csv', 'json', 'xml'] as const;

const bytes = (req: request.Test) =>
  req.buffer(true).parse((res, done) => {
    const parts: Buffer[] = [];
    res.on('data', (c: Buffer) => parts.push(c));
    res.on('end', () => done(null, Buffer.concat(parts)));
  });

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/**
 * The exports of a published release are rendered in its publish transaction and stored: later
 * edits of what they quote (a source's citation, a species' name) never reach them.
 */
describe('release exports are frozen at publish', () => {
  let t: TestApp;
  let owner: Client;

  beforeAll(async () => {
    t = await createTestApp();
    owner = new Client({ connectionString: t.db.ownerUrl });
    await owner.connect();
  });
  afterAll(async () => {
    await owner.end();
    await t.close();
  });

  const download = async (app: TestApp['app'], format: string) => {
    const res = await bytes(request(app).get(`/api/v1/releases/2026.1/export.${format}`)).expect(
      200,
    );
    return { body: res.body as Buffer, etag: res.headers.etag as string };
  };

  it('keeps the same bytes and checksum after a citation and a species name are edited', async () => {
    const before = await Promise.all(FORMATS.map((f) => download(t.app, f)));
    const manifest = (await request(t.app).get('/api/v1/releases/2026.1').expect(200)).body;
    const csv = before[0]!.body.toString('utf8');
    const { rows } = await owner.query<{ source: number; species: number; name: string }>(`
      select r.source_id as source, s.id as species, s.name
      from release_entries e join releases rl on rl.id = e.release_id
      join revisions r on r.id = e.revision_id
      join species_phases sp on sp.id = e.species_phase_id join species s on s.id = sp.species_id
      where rl.version = '2026.1' and e.quantity = 'formation_enthalpy' limit 1`);
    const { source, species, name } = rows[0]!;
    expect(csv).toContain(name);

    // As the application's own role, the way a curator's edit reaches the database.
    const app = new Client({ connectionString: t.db.url });
    await app.connect();
    try {
      await app.query(`update sources set citation = citation || ' (reformatted)' where id = $1`, [
        source,
      ]);
      await app.query(`update species set name = name || ' (renamed)' where id = $1`, [species]);
    } finally {
      await app.end();
    }
    const renamed = await owner.query('select name from species where id = $1', [species]);
    expect(renamed.rows[0].name).toBe(`${name} (renamed)`);

    // The same app, and a second one with fresh process caches: the stored bytes, every time.
    const other = createApp({ config: t.config, database: t.db, logger: createLogger('silent') });
    for (const app of [t.app, other]) {
      const after = await Promise.all(FORMATS.map((f) => download(app, f)));
      FORMATS.forEach((format, i) => {
        expect(after[i]!.body.equals(before[i]!.body)).toBe(true);
        expect(after[i]!.etag).toBe(before[i]!.etag);
        expect(after[i]!.etag).toBe(`"${sha256(after[i]!.body)}"`);
        expect(after[i]!.body.toString('utf8')).not.toContain('(renamed)');
        expect(after[i]!.body.toString('utf8')).not.toContain('(reformatted)');
      });
      const again = (await request(app).get('/api/v1/releases/2026.1').expect(200)).body;
      expect(again.exports).toEqual(manifest.exports);
      for (const f of FORMATS) {
        expect(again.exports[f].sha256).toBe(sha256(before[FORMATS.indexOf(f)]!.body));
        expect(again.exports[f].bytes).toBe(before[FORMATS.indexOf(f)]!.body.length);
      }
    }
  });

  it('stores each release’s three exports with their checksums, refusing any change (raw SQL)', async () => {
    const { rows } = await owner.query<{ format: string; ok: boolean }>(`
      select x.format, x.sha256 = encode(sha256(x.content), 'hex') and x.bytes = length(x.content) as ok
      from release_exports x join releases r on r.id = x.release_id
      where r.version = '2026.1' order by x.format`);
    expect(rows).toEqual(FORMATS.map((format) => ({ format, ok: true })));
  });

  it('renders once, on first request, the exports of a release published before they were stored', async () => {
    const before = await Promise.all(FORMATS.map((f) => download(t.app, f)));
    // An older database: its release has no stored exports (the trigger is lifted for the set-up only).
    await owner.query('alter table release_exports disable trigger user');
    await owner.query(
      `delete from release_exports where release_id = (select id from releases where version = '2026.1')`,
    );
    await owner.query('alter table release_exports enable trigger user');
    const instance = () =>
      createApp({ config: t.config, database: t.db, logger: createLogger('silent') });
    // Two instances asking at once: one renders under the lock, the other reads what it stored.
    const [fromA, fromB] = await Promise.all([
      download(instance(), 'csv'),
      download(instance(), 'xml'),
    ]);
    expect(fromA.etag).toBe(`"${sha256(fromA.body)}"`);
    expect(fromB.etag).toBe(`"${sha256(fromB.body)}"`);
    const stored = await owner.query(
      `select count(*)::int as n from release_exports
       where release_id = (select id from releases where version = '2026.1')`,
    );
    expect(stored.rows[0].n).toBe(3);
    // Rendered from today's rows (the edits of the first test included), then frozen as well.
    expect(fromA.body.toString('utf8')).toContain('(renamed)');
    expect(before[0]!.body.toString('utf8')).not.toContain('(renamed)');
  });
});
