import { parse as parseCsv } from 'csv-parse/sync';
import { XMLParser } from 'fast-xml-parser';
import request from 'supertest';
import { unguardCsvText } from '../../server/src/lib/csv-text';
import { IMMUTABLE_CACHE } from '../../server/src/modules/releases/release-http-cache';
import { ReleaseDiff, ReleaseDiffRow } from '../../server/src/modules/releases/releases-schemas';
import { insertAcceptedSpecies, insertSource, publishAccepted } from '../support/releases';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * A new release made through the releases service from the newest seeded one (`base`): one ΔfH° changed
 * (to a demo source whose citation needs escaping), one retired, one species-phase added and
 * one heat-capacity set replaced. All numbers are invented demo data.
 */
const NEW = '2026.8';
const DEMO_CITATION =
  'Kestrel Process Works demo data: "bench" <calorimetry> & co\'s notes\r\nsecond line';
/** The added species' name begins as a spreadsheet formula would: CSV guards it, JSON does not. */
const ADDED_NAME = '=Kestrel demo oxide';

describe('release diffs', () => {
  let t: TestApp;
  const picked: Record<
    string,
    { id: number; key: string; phase: string; value?: string; u?: string }
  > = {};
  const created: Record<string, number> = {};
  let base = '';
  /** Accepted values the base release does not pin yet (the demo may keep one back). */
  let pending = 0;

  const one = async (text: string, params: unknown[] = []) =>
    (await t.db.pool.query(text, params)).rows[0];

  /** A pinned revision of the base release of the given quantity that no derived value depends on. */
  const pick = (quantity: string, offset: number) =>
    one(
      `select r.id, s.key, sp.phase::text as phase, trim_scale(r.value)::text as value,
              trim_scale(r.uncertainty)::text as u
       from release_entries e join releases rel on rel.id = e.release_id
       join revisions r on r.id = e.revision_id
       join species_phases sp on sp.id = e.species_phase_id join species s on s.id = sp.species_id
       where rel.version = $3 and e.quantity = $1 and r.status = 'accepted'
         and (r.uncertainty is not null or $1 = 'heat_capacity')
         and not exists (select 1 from revision_inputs i where i.input_revision_id = r.id)
         and not exists (select 1 from revision_inputs i where i.revision_id = r.id)
       order by s.key collate "C", sp.phase offset $2 limit 1`,
      [quantity, offset, base],
    );

  beforeAll(async () => {
    t = await createTestApp();
    base = (
      await one(`select version from releases where status = 'published'
                 order by published_at desc, id desc limit 1`)
    ).version;
    pending = (
      await one(
        `select count(*)::int as n from revisions r where r.status = 'accepted' and not exists (
           select 1 from release_entries e join releases rel on rel.id = e.release_id
           where rel.version = $1 and e.revision_id = r.id)`,
        [base],
      )
    ).n;
    picked.changed = await pick('formation_enthalpy', 0);
    picked.retired = await pick('formation_enthalpy', 1);
    picked.heat = await pick('heat_capacity', 0);
    const source = await insertSource(t, DEMO_CITATION);

    // Changed: new value = old + 3.125 u, new u = 0.75 u, so the combined uncertainty is
    // 1.25 u (3-4-5) and the change is exactly 2.5 combined uncertainties.
    await t.db.pool.query(`update revisions set status = 'superseded' where id = $1`, [
      picked.changed.id,
    ]);
    created.changed = (
      await one(
        `insert into revisions (species_phase_id, kind, quantity, value, uncertainty,
           uncertainty_basis, method, source_id, status, supersedes_id)
         select species_phase_id, kind, quantity, value + 3.125 * uncertainty, 0.75 * uncertainty,
                'standard', 'demo_recheck', $2, 'accepted', id
         from revisions where id = $1 returning id`,
        [picked.changed.id, source],
      )
    ).id;
    await t.db.pool.query(`update revisions set status = 'retired' where id = $1`, [
      picked.retired.id,
    ]);
    await t.db.pool.query(`update revisions set status = 'superseded' where id = $1`, [
      picked.heat.id,
    ]);
    created.heat = (
      await one(
        `insert into revisions (species_phase_id, kind, quantity, heat_capacity_form, method,
           source_id, status, supersedes_id)
         select species_phase_id, kind, quantity, heat_capacity_form, 'demo_refit', $2,
                'accepted', id
         from revisions where id = $1 returning id`,
        [picked.heat.id, source],
      )
    ).id;
    await t.db.pool.query(
      `insert into heat_capacity_ranges (revision_id, seq, t_min, t_max, coefficients)
       select $2, seq, t_min, t_max, coefficients from heat_capacity_ranges where revision_id = $1`,
      [picked.heat.id, created.heat],
    );
    created.added = await insertAcceptedSpecies(t, {
      key: 'kestrel-demo-oxide',
      name: ADDED_NAME,
      formula: 'KeO',
      method: 'demo_estimate',
      sourceId: source,
    });
    await publishAccepted(t, NEW, 'Demo second release');
  });
  afterAll(() => t.close());

  it('lists exactly the added, removed and changed entries, with differences and sources', async () => {
    const res = await request(t.app).get(`/api/v1/releases/${base}/diff/${NEW}`).expect(200);
    expect(res.headers['cache-control']).toBe(IMMUTABLE_CACHE);
    const diff = ReleaseDiff.parse(res.body);
    expect(diff).toMatchObject({
      from: base,
      to: NEW,
    });
    expect(diff.summary.added + diff.summary.changed).toBe(3 + pending);
    expect(diff.summary.removed).toBe(1);
    const u = Number(picked.changed.u);
    const row = (key: string, quantity: string) =>
      diff.rows.find((r) => r.speciesKey === key && r.quantity === quantity);

    const oldCitation = async (revision: number) =>
      (await one(
        `select so.citation, so.doi from revisions r join sources so on so.id = r.source_id where r.id = $1`,
        [revision],
      )) as { citation: string; doi: string | null };
    const changedSource = await oldCitation(picked.changed.id);
    const newValue = (
      await one(`select trim_scale(value)::text as v from revisions where id = $1`, [
        created.changed,
      ])
    ).v;
    expect(row(picked.changed.key, 'formation_enthalpy')).toMatchObject({
      change: 'changed',
      phase: picked.changed.phase,
      oldRevisionId: picked.changed.id,
      newRevisionId: created.changed,
      oldValue: picked.changed.value,
      newValue,
      oldUncertainty: picked.changed.u,
      newUncertainty: String(0.75 * u),
      newUncertaintyBasis: 'standard',
      differenceKjPerMol: String((3.125 * u) / 1000),
      combinedUncertaintyKjPerMol: String(Number(((1.25 * u) / 1000).toFixed(3))),
      differenceInUncertainties: '2.5',
      oldSourceCitation: changedSource.citation,
      oldSourceDoi: changedSource.doi,
      newSourceCitation: DEMO_CITATION,
      newSourceDoi: null,
    });
    expect(row(picked.retired.key, 'formation_enthalpy')).toMatchObject({
      change: 'removed',
      oldRevisionId: picked.retired.id,
      newRevisionId: null,
      oldValue: picked.retired.value,
      newValue: null,
      differenceKjPerMol: null,
      newSourceCitation: null,
    });
    expect(row('kestrel-demo-oxide', 'formation_enthalpy')).toMatchObject({
      change: 'added',
      speciesName: ADDED_NAME,
      formula: 'KeO',
      phase: 'cr',
      oldRevisionId: null,
      newRevisionId: created.added,
      newValue: '-123456.7',
      newUncertainty: '800',
      newUncertaintyBasis: 'expanded_k2',
      oldSourceCitation: null,
      newSourceCitation: DEMO_CITATION,
    });
    expect(row(picked.heat.key, 'heat_capacity')).toMatchObject({
      change: 'changed',
      oldRevisionId: picked.heat.id,
      newRevisionId: created.heat,
      oldValue: null,
      newValue: null,
      differenceKjPerMol: null,
      differenceInUncertainties: null,
      newSourceCitation: DEMO_CITATION,
    });
    expect(diff.rows).toHaveLength(4 + pending);
  });

  it('answers the reverse diff with added and removed swapped, and nothing between a release and itself', async () => {
    const back = ReleaseDiff.parse(
      (await request(t.app).get(`/api/v1/releases/${NEW}/diff/${base}`).expect(200)).body,
    );
    expect(back.summary.removed + back.summary.changed).toBe(3 + pending);
    expect(back.summary.added).toBe(1);
    expect(back.rows.find((r) => r.speciesKey === 'kestrel-demo-oxide')?.change).toBe('removed');
    const same = await request(t.app).get(`/api/v1/releases/${base}/diff/${base}`).expect(200);
    expect(same.body.rows).toEqual([]);
  });

  it('gives the same rows as CSV, by suffix or by ?format=csv, with a checksum ETag', async () => {
    const json = ReleaseDiff.parse(
      (await request(t.app).get(`/api/v1/releases/${base}/diff/${NEW}`).expect(200)).body,
    );
    const csv = await request(t.app).get(`/api/v1/releases/${base}/diff/${NEW}.csv`).expect(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.headers.etag).toMatch(/^"[0-9a-f]{64}"$/);
    const byQuery = await request(t.app)
      .get(`/api/v1/releases/${base}/diff/${NEW}?format=csv`)
      .expect(200);
    expect(byQuery.text).toBe(csv.text);
    await request(t.app)
      .get(`/api/v1/releases/${base}/diff/${NEW}.csv`)
      .set('If-None-Match', csv.headers.etag!)
      .expect(304);

    const keys = Object.keys(ReleaseDiffRow.shape);
    const raw = parseCsv(csv.text, { columns: true }) as Record<string, string>[];
    const snake = (k: string) => k.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
    expect(Object.keys(raw[0]!)).toEqual(keys.map(snake));
    const added = raw.find((r) => r.species_key === 'kestrel-demo-oxide');
    expect(added).toMatchObject({ species_name: `'${ADDED_NAME}`, new_value: '-123456.7' });
    // Text cells are read without the guard's apostrophe; numbers (a leading '-' is a sign) as sent.
    const numbers = new Set([
      'old_revision_id',
      'new_revision_id',
      'old_value',
      'new_value',
      'old_uncertainty',
      'new_uncertainty',
      'difference_kj_per_mol',
      'combined_uncertainty_kj_per_mol',
      'difference_in_uncertainties',
    ]);
    const parsed = raw.map((r) =>
      Object.fromEntries(
        Object.entries(r).map(([k, v]) => [k, numbers.has(k) ? v : unguardCsvText(v)]),
      ),
    );
    const asText = json.rows.map((r) =>
      Object.fromEntries(
        keys.map((k) => {
          const v = r[k as keyof typeof r];
          return [snake(k), v === null ? '' : String(v)];
        }),
      ),
    );
    expect(parsed).toEqual(asText);
  });

  it('answers 404 unknown_release when either side is unknown or a draft', async () => {
    const editor = (await one(`select id from users where login = 'demo-editor'`)).id;
    await t.db.pool.query(
      `insert into releases (version, notes, created_by) values ('2026.9', 'draft', $1)`,
      [editor],
    );
    for (const path of [`2099.1/diff/${base}`, `${base}/diff/2099.1.csv`, `${base}/diff/2026.9`]) {
      const res = await request(t.app).get(`/api/v1/releases/${path}`).expect(404);
      expect(res.body.error.code).toBe('unknown_release');
    }
  });

  it('diffs against latest with a short cache', async () => {
    const res = await request(t.app).get(`/api/v1/releases/${base}/diff/latest`).expect(200);
    expect(res.body.to).toBe(NEW);
    expect(res.headers['cache-control']).toBe('public, max-age=60');
  });

  it('exports the second release with the demo citation escaped in XML and read back intact', async () => {
    const xml = await request(t.app)
      .get(`/api/v1/releases/${NEW}/export.xml`)
      .buffer(true)
      .parse((res, done) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (c: string) => (text += c));
        res.on('end', () => done(null, text));
      })
      .expect(200);
    const text = xml.body as string;
    expect(text).toContain(
      '<citation>Kestrel Process Works demo data: &quot;bench&quot; &lt;calorimetry&gt; &amp; co&apos;s notes&#13;\nsecond line</citation>',
    );
    const doc = new XMLParser({
      parseTagValue: false,
      trimValues: false,
      htmlEntities: true,
    }).parse(text);
    const items = doc.releaseExport.formationEnthalpies.formationEnthalpy as {
      speciesKey: string;
      source: { citation: string };
    }[];
    expect(items.find((i) => i.speciesKey === 'kestrel-demo-oxide')?.source.citation).toBe(
      DEMO_CITATION,
    );
    const json = (await request(t.app).get(`/api/v1/releases/${NEW}/export.json`).expect(200)).body;
    expect(json.formationEnthalpies).toHaveLength(items.length);
  });
});
