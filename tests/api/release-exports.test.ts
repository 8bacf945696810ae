import { createHash } from 'node:crypto';
import Ajv2020 from 'ajv/dist/2020';
import { parse as parseCsv } from 'csv-parse/sync';
import { XMLParser } from 'fast-xml-parser';
import request from 'supertest';
import { createApp } from '../../server/src/app';
import { unguardCsvText } from '../../server/src/lib/csv-text';
import { createLogger } from '../../server/src/lib/logger';
import { IMMUTABLE_CACHE } from '../../server/src/modules/releases/release-http-cache';
import {
  ReleaseExport,
  ReleaseManifestWithExports,
} from '../../server/src/modules/releases/releases-schemas';
import { insertAcceptedSpecies, insertSource, publishAccepted } from '../support/releases';
import { createTestApp, type TestApp } from '../support/test-app';

/** The body of a download as bytes, whatever its content type. */
const bytes = (req: request.Test) =>
  req.buffer(true).parse((res, done) => {
    const parts: Buffer[] = [];
    res.on('data', (c: Buffer) => parts.push(c));
    res.on('end', () => done(null, Buffer.concat(parts)));
  });

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/** Every format read back to the CSV's flat rows: one per value and per heat-capacity range. */
type Flat = Record<string, string>;
const COEFFS = 8;

function flatFromItem(section: string, item: Record<string, unknown>, range?: Flat): Flat {
  const s = (v: unknown) => (v === null || v === undefined ? '' : String(v));
  const source = item.source as { citation: unknown; doi: unknown };
  const coefficients = (range?.coefficients as unknown as unknown[]) ?? [];
  const row: Flat = {
    section,
    species_key: s(item.speciesKey),
    species_name: s(item.speciesName),
    formula: s(item.formula),
    phase: s(item.phase),
    modification: s(item.modification),
    quantity:
      section === 'transition'
        ? `transition:${s(item.toPhase)}${item.toModification ? `,${s(item.toModification)}` : ''}`
        : section,
    value_j_per_mol: s(item.value),
    uncertainty_j_per_mol: s(item.uncertainty),
    uncertainty_basis: s(item.uncertaintyBasis),
    method: s(item.method),
    standard_pressure: s(item.standardPressure),
    temperature_k: s(item.temperature),
    to_phase: s(item.toPhase),
    to_modification: s(item.toModification),
    heat_capacity_form: s(item.form),
    range_index: s(range?.index),
    t_min_k: s(range?.tMin),
    t_max_k: s(range?.tMax),
  };
  for (let i = 0; i < COEFFS; i++) row[`c${i + 1}`] = s(coefficients[i]);
  return {
    ...row,
    revision_id: s(item.revisionId),
    source_citation: s(source.citation),
    source_doi: s(source.doi),
  };
}

/** CSV columns of numbers: a leading '-' is their sign. Every other column is guarded text. */
const NUMBER_COLUMNS = new Set([
  'value_j_per_mol',
  'uncertainty_j_per_mol',
  'temperature_k',
  'range_index',
  't_min_k',
  't_max_k',
  ...Array.from({ length: COEFFS }, (_, i) => `c${i + 1}`),
  'revision_id',
]);

/** The CSV's rows with the text a spreadsheet-formula guard prefixed given back, as JSON has it. */
const rowsFromCsv = (csv: Buffer): Flat[] =>
  (parseCsv(csv, { columns: true }) as Flat[]).map((row) =>
    Object.fromEntries(
      Object.entries(row).map(([k, v]) => [k, NUMBER_COLUMNS.has(k) ? v : unguardCsvText(v)]),
    ),
  );

const SECTIONS = [
  ['formation_enthalpy', 'formationEnthalpies', 'formationEnthalpy'],
  ['heat_capacity', 'heatCapacitySets', 'heatCapacitySet'],
  ['transition', 'transitions', 'transition'],
] as const;

function flatFromDocument(doc: Record<string, unknown>): Flat[] {
  const out: Flat[] = [];
  for (const [section, list] of SECTIONS) {
    for (const item of doc[list] as Record<string, unknown>[]) {
      if (section !== 'heat_capacity') {
        out.push(flatFromItem(section, item));
        continue;
      }
      (item.ranges as Flat[]).forEach((r, i) =>
        out.push(flatFromItem(section, item, { ...r, index: String(i + 1) })),
      );
    }
  }
  return out;
}

/** XML back to the JSON document's shape: absent elements are null, `<c/>` a missing coefficient. */
function documentFromXml(xml: string): Record<string, unknown> {
  const parser = new XMLParser({
    ignoreAttributes: false,
    attributeNamePrefix: '@',
    parseTagValue: false,
    parseAttributeValue: false,
    trimValues: false,
    htmlEntities: true, // numeric character references such as &#13;
    isArray: (name) =>
      ['formationEnthalpy', 'heatCapacitySet', 'transition', 'range', 'c'].includes(name),
  });
  const root = parser.parse(xml).releaseExport;
  const fix = (item: Record<string, unknown>) => {
    const ranges = (item.ranges as { range?: Record<string, unknown>[] } | undefined)?.range;
    return {
      ...item,
      ...(ranges
        ? {
            ranges: ranges.map((r) => ({
              ...r,
              coefficients: ((r.coefficients as { c: unknown[] }).c ?? []).map((c) =>
                c === '' ? null : c,
              ),
            })),
          }
        : {}),
    };
  };
  const doc: Record<string, unknown> = {};
  for (const [, list, item] of SECTIONS) {
    const section = root[list] as Record<string, Record<string, unknown>[]> | '';
    doc[list] = section === '' ? [] : (section[item] ?? []).map(fix);
  }
  return { ...doc, version: root['@version'], publishedAt: root['@publishedAt'] };
}

describe('release exports', () => {
  let t: TestApp;
  let manifest: ReleaseManifestWithExports;
  const files: Record<string, Buffer> = {};

  beforeAll(async () => {
    t = await createTestApp();
    manifest = ReleaseManifestWithExports.parse(
      (await request(t.app).get('/api/v1/releases/2026.1').expect(200)).body,
    );
    for (const f of ['csv', 'json', 'xml']) {
      files[f] = (await bytes(request(t.app).get(`/api/v1/releases/2026.1/export.${f}`))).body;
    }
  });
  afterAll(() => t.close());

  it.each(['csv', 'json', 'xml'] as const)(
    '%s: checksum, size and URL as the manifest states; cacheable for good, no cookie',
    async (format) => {
      const res = await bytes(request(t.app).get(`/api/v1/releases/2026.1/export.${format}`))
        .expect(200)
        .expect('Content-Type', new RegExp(`${format}; charset=utf-8`));
      const body = res.body as Buffer;
      const stated = manifest.exports[format];
      expect(stated.url).toBe(`/api/v1/releases/2026.1/export.${format}`);
      expect(sha256(body)).toBe(stated.sha256);
      expect(body.length).toBe(stated.bytes);
      expect(res.headers.etag).toBe(`"${stated.sha256}"`);
      expect(res.headers['cache-control']).toBe(IMMUTABLE_CACHE);
      expect(res.headers['set-cookie']).toBeUndefined();
      expect(res.headers['content-disposition']).toBe(
        `attachment; filename="thalpos-2026.1.${format}"`,
      );
      expect(res.headers['content-length']).toBe(String(stated.bytes));
      await request(t.app)
        .get(`/api/v1/releases/2026.1/export.${format}`)
        .set('If-None-Match', res.headers.etag!)
        .expect(304);
      const head = await request(t.app)
        .head(`/api/v1/releases/2026.1/export.${format}`)
        .expect(200);
      expect(head.headers).toMatchObject({
        'content-length': String(stated.bytes),
        etag: res.headers.etag,
        'cache-control': IMMUTABLE_CACHE,
      });
    },
  );

  it('gives the same bytes on every request and from another app instance (a fresh process cache)', async () => {
    const other = createApp({
      config: t.config,
      database: t.db,
      logger: createLogger('silent'),
    });
    for (const f of ['csv', 'json', 'xml']) {
      const again = (await bytes(request(t.app).get(`/api/v1/releases/2026.1/export.${f}`))).body;
      const elsewhere = (await bytes(request(other).get(`/api/v1/releases/2026.1/export.${f}`)))
        .body;
      expect(again.equals(files[f]!)).toBe(true);
      expect(elsewhere.equals(files[f]!)).toBe(true);
    }
    const otherManifest = await request(other).get('/api/v1/releases/2026.1').expect(200);
    expect(otherManifest.body.exports).toEqual(manifest.exports);
  });

  it('redirects latest to the current version, cached only briefly', async () => {
    const newest = (
      await t.db.pool.query(`select version from releases where status = 'published'
                             order by published_at desc, id desc limit 1`)
    ).rows[0].version;
    const res = await request(t.app).get('/api/v1/releases/latest/export.json').expect(302);
    expect(res.headers.location).toBe(`/api/v1/releases/${newest}/export.json`);
    expect(res.headers['cache-control']).toBe('public, max-age=60');
  });

  it('answers 404 unknown_release for an unknown release or a draft, 400 for another format', async () => {
    const editor = (await t.db.pool.query(`select id from users where login = 'demo-editor'`))
      .rows[0].id;
    await t.db.pool.query(
      `insert into releases (version, notes, created_by) values ('2026.9', 'draft', $1)`,
      [editor],
    );
    for (const v of ['2099.1', '2026.9']) {
      const res = await request(t.app).get(`/api/v1/releases/${v}/export.csv`).expect(404);
      expect(res.body.error.code).toBe('unknown_release');
      expect(res.headers['cache-control']).toBe('no-store');
    }
    const bad = await request(t.app).get('/api/v1/releases/2026.1/export.pdf').expect(400);
    expect(bad.body.error.code).toBe('validation_error');
  });

  it('validates the JSON export against the published JSON Schema', async () => {
    const res = await request(t.app).get('/api/v1/schemas/release-export.json').expect(200);
    expect(res.headers['content-type']).toMatch(/^application\/schema\+json/);
    const schema = JSON.parse(res.text);
    const validateExport = new Ajv2020({ allErrors: true, strict: false }).compile(schema);
    const doc = JSON.parse(files.json!.toString('utf8'));
    const valid = validateExport(doc);
    expect(validateExport.errors ?? []).toEqual([]);
    expect(valid).toBe(true);
    expect(ReleaseExport.parse(doc).release.version).toBe('2026.1');
    // The schema is strict: an unknown field fails it.
    expect(validateExport({ ...doc, extra: 1 })).toBe(false);
  });

  it('reads back to the same rows from CSV, JSON and XML, and those are the rows the release pins', async () => {
    const csvRows = rowsFromCsv(files.csv!);
    const jsonDoc = JSON.parse(files.json!.toString('utf8'));
    const xml = files.xml!.toString('utf8');
    expect(xml.startsWith('<?xml version="1.0" encoding="UTF-8"?>\n<releaseExport ')).toBe(true);
    const xmlDoc = documentFromXml(xml);

    expect(flatFromDocument(jsonDoc)).toEqual(csvRows);
    expect(flatFromDocument(xmlDoc)).toEqual(csvRows);
    expect(xmlDoc.version).toBe('2026.1');
    expect(xmlDoc.publishedAt).toBe(jsonDoc.release.publishedAt);

    const { rows } = await t.db.pool.query(`
      select e.quantity, count(hr.seq)::int as ranges
      from release_entries e join releases r on r.id = e.release_id
      left join heat_capacity_ranges hr on hr.revision_id = e.revision_id
      where r.version = '2026.1' group by e.species_phase_id, e.quantity`);
    const expectedRows = rows.reduce((n, r) => n + Math.max(1, r.ranges as number), 0);
    expect(csvRows).toHaveLength(expectedRows);
    expect(jsonDoc.formationEnthalpies).toHaveLength(manifest.counts.formationEnthalpies);
    expect(jsonDoc.heatCapacitySets).toHaveLength(manifest.counts.heatCapacitySets);
    expect(jsonDoc.transitions).toHaveLength(manifest.counts.transitions);

    const water = csvRows.find(
      (r) => r.species_key === 'water' && r.phase === 'l' && r.section === 'formation_enthalpy',
    );
    const stored = (
      await t.db.pool.query(`
        select trim_scale(r.value)::text as value from release_entries e
        join releases rel on rel.id = e.release_id join revisions r on r.id = e.revision_id
        join species_phases sp on sp.id = e.species_phase_id join species s on s.id = sp.species_id
        where rel.version = '2026.1' and s.key = 'water' and sp.phase = 'l'
          and e.quantity = 'formation_enthalpy'`)
    ).rows[0];
    expect(water?.value_j_per_mol).toBe(stored.value);
  });

  it('keeps a stable order: sections in turn, then species key byte by byte', async () => {
    const csvRows = parseCsv(files.csv!, { columns: true }) as Flat[];
    const order = ['formation_enthalpy', 'heat_capacity', 'transition'];
    const keys = csvRows.map((r) => `${order.indexOf(r.section!)}|${r.species_key}`);
    const sorted = [...keys].sort((a, b) => Buffer.compare(Buffer.from(a), Buffer.from(b)));
    expect(keys).toEqual(sorted);
  });

  it('guards CSV text cells that would run as spreadsheet formulas; JSON and XML keep the text', async () => {
    // Demo data: a species, method and citation that a spreadsheet would take for formulas.
    const name = '=HYPERLINK("https://example.invalid","Kestrel demo oxide")';
    const citation = '@Kestrel Process Works demo note';
    await insertAcceptedSpecies(t, {
      key: 'kestrel-formula-oxide',
      name,
      formula: 'KeO2',
      method: '-demo_estimate',
      sourceId: await insertSource(t, citation),
    });
    await publishAccepted(t, '2026.7', 'Demo formula-guard release');
    const got: Record<string, Buffer> = {};
    for (const f of ['csv', 'json', 'xml']) {
      got[f] = (await bytes(request(t.app).get(`/api/v1/releases/2026.7/export.${f}`))).body;
    }

    const raw = (parseCsv(got.csv!, { columns: true }) as Flat[]).find(
      (r) => r.species_key === 'kestrel-formula-oxide',
    );
    expect(raw).toMatchObject({
      species_name: `'${name}`,
      method: "'-demo_estimate",
      source_citation: `'${citation}`,
      value_j_per_mol: '-123456.7',
      uncertainty_j_per_mol: '800',
    });
    // Negative numbers elsewhere in the release keep their sign unguarded.
    expect(got.csv!.toString('utf8')).toMatch(/,-\d/);
    expect(got.csv!.toString('utf8')).not.toMatch(/,'-\d/);

    const jsonDoc = JSON.parse(got.json!.toString('utf8'));
    const item = (jsonDoc.formationEnthalpies as Record<string, unknown>[]).find(
      (i) => i.speciesKey === 'kestrel-formula-oxide',
    );
    expect(item).toMatchObject({
      speciesName: name,
      method: '-demo_estimate',
      source: { citation },
    });
    const csvRows = rowsFromCsv(got.csv!);
    expect(flatFromDocument(jsonDoc)).toEqual(csvRows);
    expect(flatFromDocument(documentFromXml(got.xml!.toString('utf8')))).toEqual(csvRows);
  });
});
