import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { PROJECT_ROOT } from '../../server/src/config/paths';
import { UploadCreated, UploadPreview } from '../../server/src/modules/uploads/uploads-schemas';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

/** Figures are printed, never asserted: a busy machine makes them slower, not red. */
const print = (text: string) => process.stdout.write(`${text}\n`);
const SAMPLES = path.join(PROJECT_ROOT, 'imports/samples');
const sample = (name: string) => fs.readFileSync(path.join(SAMPLES, name));
const FORMATION_HEADER =
  'species,phase,modification,value,unit,uncertainty,uncertainty_basis,method,standard_pressure_pa,source,from_memory,notes';
const formationRow = (species: string, phase = 'g', value = '-100.0') =>
  `${species},${phase},,${value},kJ/mol,0.5,standard,combustion_calorimetry,100000,kpw-demo-bench-2026,no,demo data`;

describe('bulk upload of proposal items', () => {
  let t: TestApp;
  const agents: Record<string, { agent: Agent; xsrf: string }> = {};
  beforeAll(async () => {
    t = await createTestApp();
    for (const login of ['demo-reader', 'demo-curator', 'demo-editor', 'demo-admin']) {
      const agent = request.agent(t.app);
      agents[login] = { agent, xsrf: await signIn(agent, login) };
    }
  });
  afterAll(() => t.close());

  const upload = (
    file: Buffer | string,
    name: string,
    {
      dryRun = true,
      login = 'demo-curator',
      rationale,
    }: { dryRun?: boolean; login?: string; rationale?: string } = {},
  ) => {
    const { agent, xsrf } = agents[login]!;
    const req = agent.post(`/api/v1/proposals/uploads?dryRun=${dryRun}`).set('X-XSRF-TOKEN', xsrf);
    if (rationale !== undefined) req.field('rationale', rationale);
    return req.attach('file', Buffer.isBuffer(file) ? file : Buffer.from(file), name);
  };

  /** Rows of every table an upload could write, to prove a refused one wrote nothing. */
  const counts = async () =>
    (
      await t.db.pool.query(`select
        (select count(*)::int from proposals) as proposals,
        (select count(*)::int from proposal_items) as items,
        (select count(*)::int from revisions) as revisions,
        (select count(*)::int from species) as species,
        (select count(*)::int from species_phases) as phases,
        (select count(*)::int from audit_log) as audit`)
    ).rows[0];

  describe('dry run', () => {
    it('previews every row of a clean CSV with the item it becomes, and writes nothing', async () => {
      const before = await counts();
      const res = await upload(sample('kpw-demo-formation.csv'), 'kpw-demo-formation.csv').expect(
        200,
      );
      const p = UploadPreview.parse(res.body);
      expect(p).toMatchObject({ dryRun: true, ok: true, format: 'csv', rowCount: 5, itemCount: 5 });
      expect(p.layouts).toEqual(['formation']);
      expect(p.rows.map((r) => r.line)).toEqual([2, 3, 4, 5, 6]);
      expect(p.rows.every((r) => r.errors.length === 0)).toBe(true);
      // methanol(l) holds an accepted value: it is superseded; acetone(g) is a new phase.
      expect(p.rows[0]!.item).toMatchObject({
        kind: 'supersede_value',
        species: 'methanol',
        phase: 'l',
        quantity: 'formation_enthalpy',
        value: -239,
        unit: 'kJ/mol',
        uncertainty: 0.4,
        uncertaintyBasis: 'standard',
        standardPressure: '1 bar',
      });
      expect(p.rows[2]!.item).toMatchObject({ kind: 'add_value', species: 'acetone', phase: 'g' });
      expect(await counts()).toEqual(before);
    });

    it('explains each row error with its code and column, and writes nothing', async () => {
      const before = await counts();
      const res = await upload(sample('kpw-demo-formation-errors.csv'), 'errors.csv').expect(200);
      const p = UploadPreview.parse(res.body);
      expect(p.ok).toBe(false);
      expect(p.errorRowCount).toBe(6);
      const byLine = new Map(p.rows.map((r) => [r.line, r.errors]));
      expect(byLine.get(2)).toEqual([]);
      expect(byLine.get(3)).toEqual([
        expect.objectContaining({ code: 'invalid_value', column: 'uncertainty_basis' }),
      ]);
      expect(byLine.get(4)).toEqual([expect.objectContaining({ code: 'phase', column: 'phase' })]);
      expect(byLine.get(5)).toEqual([
        expect.objectContaining({
          code: 'unknown_species',
          column: 'species',
          message: expect.stringContaining('tolune'),
        }),
      ]);
      expect(byLine.get(6)).toEqual([
        expect.objectContaining({ code: 'unknown_source', column: 'source' }),
      ]);
      expect(byLine.get(7)).toEqual([
        expect.objectContaining({
          code: 'duplicate_row',
          message: expect.stringContaining('line 2'),
        }),
      ]);
      expect(byLine.get(8)).toEqual([
        expect.objectContaining({ code: 'reference_state', column: 'value' }),
      ]);
      expect(p.rows.find((r) => r.line === 3)!.item).toBeNull();
      expect(await counts()).toEqual(before);
    });

    it('reports the proposal checks on their rows: a bad formula, a taken key', async () => {
      const csv = [
        'key,name,formula,charge,synonyms,cas_rn,inchi,inchikey,smiles,notes',
        'kpw-demo-solvent-x,Demo solvent X,C2H6Qx,0,,,,,,demo data',
        'water,Water again,H2O,0,,,,,,demo data',
      ].join('\n');
      const p = UploadPreview.parse((await upload(csv, 'species.csv').expect(200)).body);
      expect(p.layouts).toEqual(['species']);
      expect(p.rows[0]!.errors).toEqual([
        expect.objectContaining({ code: 'formula', column: 'formula' }),
      ]);
      expect(p.rows[1]!.errors).toEqual([
        expect.objectContaining({ code: 'key_taken', column: 'key' }),
      ]);
    });

    it('warns of a likely duplicate species in the dry run, by its line, without blocking', async () => {
      const csv = [
        'key,name,formula,charge,synonyms,cas_rn,inchi,inchikey,smiles,notes',
        'kpw-demo-methane,Methane,CH4,0,,,,,,demo data',
      ].join('\n');
      const p = UploadPreview.parse((await upload(csv, 'species.csv').expect(200)).body);
      expect(p.ok).toBe(true);
      expect(p.warnings).toEqual([
        expect.objectContaining({ code: 'likely_duplicate', species: 'methane' }),
      ]);
      expect(p.warnings[0]!.message).toMatch(/^Line 2: /);
    });

    it('names a missing column as a problem of the file and still shows the rows', async () => {
      const header = FORMATION_HEADER.replace(',method', '');
      const row = formationRow('methanol', 'g').replace(',combustion_calorimetry', '');
      const p = UploadPreview.parse(
        (await upload(`${header}\n${row}\n`, 'f.csv').expect(200)).body,
      );
      expect(p.ok).toBe(false);
      expect(p.fileErrors).toEqual([
        expect.objectContaining({ line: 1, column: 'method', message: 'missing column method' }),
      ]);
      expect(p.rows).toHaveLength(1);
      expect(p.rows[0]!.cells['species']).toBe('methanol');
    });

    it('takes 20,000 rows and refuses 20,001 with too_many_rows', async () => {
      const rows = Array.from({ length: 20_001 }, (_, i) => formationRow(`kpw-demo-missing-${i}`));
      const fullLimit = [FORMATION_HEADER, ...rows.slice(0, 20_000)].join('\n');
      const started = performance.now();
      const ok = UploadPreview.parse((await upload(fullLimit, 'big.csv').expect(200)).body);
      print(`dry run of 20,000 rows: ${Math.round(performance.now() - started)} ms`);
      expect(ok.rowCount).toBe(20_000);
      expect(ok.errorRowCount).toBe(20_000);
      expect(ok.rows[19_999]!.errors[0]).toMatchObject({ code: 'unknown_species' });
      const res = await upload([FORMATION_HEADER, ...rows].join('\n'), 'big.csv').expect(422);
      expect(res.body.error.code).toBe('too_many_rows');
    }, 120_000);
  });

  describe('submit', () => {
    it('saves a clean CSV as one draft proposal holding every row', async () => {
      const before = await counts();
      const res = await upload(sample('kpw-demo-formation.csv'), 'kpw-demo-formation.csv', {
        dryRun: false,
        rationale: 'Demo bench campaign, solvents',
      }).expect(201);
      const created = UploadCreated.parse(res.body);
      expect(created).toMatchObject({ status: 'draft', itemCount: 5, rowCount: 5 });
      const after = await counts();
      expect(after.proposals).toBe(before.proposals + 1);
      expect(after.items).toBe(before.items + 5);
      expect(after.revisions).toBe(before.revisions);
      const { rows } = await t.db.pool.query(
        `select p.status, p.rationale, u.login from proposals p join users u on u.id = p.author_id where p.id = $1`,
        [created.id],
      );
      expect(rows[0]).toEqual({
        status: 'draft',
        rationale: 'Demo bench campaign, solvents',
        login: 'demo-curator',
      });
      const audit = await t.db.pool.query(
        `select action from audit_log where entity_type = 'proposal' and entity_id = $1`,
        [String(created.id)],
      );
      expect(audit.rows.map((r) => r.action)).toContain('proposal.created');
    });

    it('saves a clean XML file (a new species with its values) as one proposal', async () => {
      const before = await counts();
      const xml = sample('kpw-demo-methyl-formate.xml');
      const dry = UploadPreview.parse((await upload(xml, 'mf.xml').expect(200)).body);
      expect(dry).toMatchObject({ ok: true, format: 'xml', rowCount: 6, itemCount: 6 });
      expect(dry.rationale).toMatch(/^Methyl formate/);
      expect(dry.rows.map((r) => r.item?.['kind'])).toEqual([
        'add_species',
        'add_value',
        'add_value',
        'add_value',
        'add_value',
        'add_value',
      ]);
      expect(dry.rows[2]!.item?.['notes']).toContain('vaporization enthalpy & a correction');
      const created = UploadCreated.parse(
        (await upload(xml, 'mf.xml', { dryRun: false }).expect(201)).body,
      );
      expect(created.itemCount).toBe(6);
      const after = await counts();
      expect(after.proposals).toBe(before.proposals + 1);
      expect(after.items).toBe(before.items + 6);
      const { rows } = await t.db.pool.query(`select rationale from proposals where id = $1`, [
        created.id,
      ]);
      expect(rows[0].rationale).toMatch(/^Methyl formate/);
    });

    it('refuses a file with any row error with 422 and the rows at fault, writing nothing', async () => {
      const before = await counts();
      const res = await upload(sample('kpw-demo-formation-errors.csv'), 'errors.csv', {
        dryRun: false,
      }).expect(422);
      expect(res.body.error).toMatchObject({ code: 'invalid_rows', ok: false, rowCount: 7 });
      expect(res.body.error.message).toMatch(/6 of 7 rows have errors; nothing was saved/);
      expect(res.body.error.rows.map((r: { line: number }) => r.line)).toEqual([3, 4, 5, 6, 7, 8]);
      expect(await counts()).toEqual(before);
    });

    it('refuses a file whose header lacks a column, writing nothing', async () => {
      const before = await counts();
      const csv = `${FORMATION_HEADER.replace(',notes', '')}\n${formationRow('methanol', 'g').replace(/,demo data$/, '')}\n`;
      const res = await upload(csv, 'f.csv', { dryRun: false }).expect(422);
      expect(res.body.error.code).toBe('invalid_rows');
      expect(res.body.error.message).toContain('missing column notes');
      expect(await counts()).toEqual(before);
    });
  });

  describe('files that cannot be read', () => {
    it.each([
      ['an empty file', Buffer.alloc(0), 'empty_file', /empty/],
      [
        'Latin-1 text',
        Buffer.from(`${FORMATION_HEADER}\nm\xe9thanol,g\n`, 'latin1'),
        'not_utf8',
        /Line 2 is not valid UTF-8/,
      ],
      ['UTF-16 text', Buffer.from(`\ufeff${FORMATION_HEADER}`, 'utf16le'), 'not_utf8', /UTF-16/],
      ['binary data', Buffer.from([0x00, 0x01, 0x02, 0xff, 0x10, 0x00]), 'binary_file', /binary/],
      [
        'a spreadsheet workbook',
        Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00]),
        'binary_file',
        /workbook/,
      ],
      ['an unknown header', Buffer.from('a,b,c\n1,2,3\n'), 'unknown_layout', /matches none/],
      [
        'broken XML',
        Buffer.from('<proposal-upload><species key="x"></proposal-upload>'),
        'xml_syntax',
        /XML syntax/,
      ],
    ])('refuses %s with a clear 422, writing nothing', async (_what, bytes, code, message) => {
      const before = await counts();
      const res = await upload(bytes, 'upload.csv').expect(422);
      expect(res.body.error.code).toBe(code);
      expect(res.body.error.message).toMatch(message);
      const submitted = await upload(bytes, 'upload.csv', { dryRun: false }).expect(422);
      expect(submitted.body.error.code).toBe(code);
      expect(await counts()).toEqual(before);
    });

    it('refuses an XML entity bomb without expanding anything', async () => {
      const bomb = [
        '<?xml version="1.0"?>',
        '<!DOCTYPE proposal-upload [',
        '  <!ENTITY a "aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa">',
        ...Array.from(
          { length: 9 },
          (_, i) =>
            `  <!ENTITY ${'b'.repeat(i + 1)} "${`&${i === 0 ? 'a' : 'b'.repeat(i)};`.repeat(10)}">`,
        ),
        ']>',
        '<proposal-upload><rationale>&bbbbbbbbb;</rationale></proposal-upload>',
      ].join('\n');
      const before = await counts();
      const started = performance.now();
      const res = await upload(bomb, 'bomb.xml').expect(422);
      print(`entity bomb refused in ${(performance.now() - started).toFixed(1)} ms`);
      expect(res.body.error).toMatchObject({ code: 'xml_doctype', line: 2 });
      expect(res.body.error.message).toMatch(/entities are never expanded/);
      await upload(bomb, 'bomb.xml', { dryRun: false }).expect(422);
      expect(await counts()).toEqual(before);
    });

    it('refuses an external entity and reports undeclared references on their rows', async () => {
      const external =
        '<?xml version="1.0"?>\n<!DOCTYPE x [<!ENTITY e SYSTEM "file:///etc/passwd">]>\n<proposal-upload/>';
      expect((await upload(external, 'x.xml').expect(422)).body.error.code).toBe('xml_doctype');
      const undeclared =
        '<proposal-upload><formation-enthalpy species="methanol" phase="g" notes="&e;"/></proposal-upload>';
      const p = UploadPreview.parse((await upload(undeclared, 'x.xml').expect(200)).body);
      expect(p.rows[0]!.errors).toContainEqual(
        expect.objectContaining({ code: 'entity', column: 'notes' }),
      );
    });

    it('refuses a file over 10 MB with 413', async () => {
      const big = Buffer.alloc(10 * 1024 * 1024 + 1, 0x61);
      const res = await upload(big, 'big.csv').expect(413);
      expect(res.body.error.code).toBe('payload_too_large');
    });

    it('asks for a file when none is attached', async () => {
      const { agent, xsrf } = agents['demo-curator']!;
      const res = await agent
        .post('/api/v1/proposals/uploads')
        .set('X-XSRF-TOKEN', xsrf)
        .field('rationale', 'no file')
        .expect(400);
      expect(res.body.error.code).toBe('no_file');
    });
  });

  describe('who may upload', () => {
    const csv = sample('kpw-demo-formation.csv');
    it('refuses anonymous callers (401) and readers (403)', async () => {
      await request(t.app)
        .post('/api/v1/proposals/uploads')
        .attach('file', csv, 'f.csv')
        .expect(401);
      const res = await upload(csv, 'f.csv', { login: 'demo-reader' }).expect(403);
      expect(res.body.error.code).toBe('forbidden');
    });

    it.each(['demo-curator', 'demo-editor', 'demo-admin'])('lets %s upload', async (login) => {
      await upload(csv, 'f.csv', { login }).expect(200);
    });

    it('needs the CSRF header of a signed-in session', async () => {
      const { agent } = agents['demo-curator']!;
      const res = await agent
        .post('/api/v1/proposals/uploads')
        .attach('file', csv, 'f.csv')
        .expect(403);
      expect(res.body.error.code).toBe('csrf');
    });
  });
});
