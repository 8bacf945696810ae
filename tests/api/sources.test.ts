import request from 'supertest';
import { parseBibtex } from '../../server/src/modules/sources/citation';
import { FAKE_DOI_FAILING, FAKE_DOI_RECORDS } from '../../server/src/fakes/doi-fake';
import {
  SourceAnswer,
  SourceDetail,
  SourceList,
} from '../../server/src/modules/sources/sources-schemas';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

const DEMO_DOI = '10.5555/kestrel.demo.2025.002';

describe('sources', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  async function as(login: string): Promise<{ agent: Agent; xsrf: string }> {
    const agent = request.agent(t.app);
    return { agent, xsrf: await signIn(agent, login) };
  }
  const post = async (login: string, body: unknown) => {
    const { agent, xsrf } = await as(login);
    return agent
      .post('/api/v1/sources')
      .set('X-XSRF-TOKEN', xsrf)
      .send(body as object);
  };
  const audits = async (id: string) =>
    (
      await t.db.pool.query(
        `select action, actor_id from audit_log where entity_type = 'source' and entity_id = $1`,
        [id],
      )
    ).rows;

  describe('by DOI through the fake resolver', () => {
    it('creates the source from the resolver’s CSL-JSON, formats it, and audits it', async () => {
      const res = await post('demo-curator', { doi: `https://doi.org/${DEMO_DOI.toUpperCase()}` });
      expect(res.status).toBe(201);
      const body = SourceAnswer.strict().parse(res.body);
      expect(body.doi).toBe(DEMO_DOI);
      expect(body.citation).toBe(
        'Mensah, K., Nandakumar, P., & Brandt, H. (2025). Heat capacity of a recycled solvent blend ' +
          'between 300 K and 450 K (demo data). Kestrel Process Notes, 12(3), 41–57. ' +
          `https://doi.org/${DEMO_DOI}`,
      );
      expect(await audits(body.id)).toEqual([
        { action: 'source.created', actor_id: expect.any(Number) },
      ]);
      const detail = SourceDetail.strict().parse(
        (await request(t.app).get(`/api/v1/sources/${body.id}`).expect(200)).body,
      );
      expect(detail.csl.title).toBe(FAKE_DOI_RECORDS[DEMO_DOI]!.title);
    });

    it('returns the existing source with 200 for the same DOI in any spelling', async () => {
      const first = await post('demo-editor', { doi: DEMO_DOI });
      const again = await post('demo-admin', { doi: `doi:${DEMO_DOI.toUpperCase()}` });
      expect(again.status).toBe(200);
      expect(again.body.id).toBe(first.body.id);
    });

    it('dedupes a BibTeX entry whose DOI is already registered', async () => {
      const byDoi = await post('demo-curator', { doi: DEMO_DOI });
      const res = await post('demo-curator', {
        bibtex: `@article{x, title={Another title}, author={Doe, Jane}, year={2020}, doi={${DEMO_DOI.toUpperCase()}}}`,
      });
      expect(res.status).toBe(200);
      expect(res.body.id).toBe(byDoi.body.id);
    });

    it('answers an unknown DOI with 422 doi_not_found and a failing resolver with 502 doi_unreachable', async () => {
      const missing = await post('demo-curator', { doi: '10.5555/no.such.work' });
      expect(missing.status).toBe(422);
      expect(missing.body.error.code).toBe('doi_not_found');
      const failing = await post('demo-curator', { doi: FAKE_DOI_FAILING });
      expect(failing.status).toBe(502);
      expect(failing.body.error.code).toBe('doi_unreachable');
      const bad = await post('demo-curator', { doi: 'not-a-doi' });
      expect(bad.status).toBe(400);
      expect(bad.body.error.code).toBe('invalid_doi');
    });

    it('answers 502 doi_unreachable when the resolver does not answer at all', async () => {
      const down = await createTestApp({ DOI_BASE_URL: 'http://127.0.0.1:9' });
      try {
        const agent = request.agent(down.app);
        const xsrf = await signIn(agent, 'demo-curator');
        const res = await agent
          .post('/api/v1/sources')
          .set('X-XSRF-TOKEN', xsrf)
          .send({ doi: '10.5555/kestrel.demo.2025.001' });
        expect(res.status).toBe(502);
        expect(res.body.error.code).toBe('doi_unreachable');
      } finally {
        await down.close();
      }
    });
  });

  describe('BibTeX and RIS in and out', () => {
    const bibtex = `@article{brandt2024,
  author = {Brandt, Helga and Sørensen, Lena},
  title = {Enthalpy of solution of a demo salt (demo data)},
  journal = {Kestrel Process Notes},
  year = {2024},
  doi = {10.5555/kestrel.bib.1}
}`;

    it('keeps authors, title, year and DOI through BibTeX in and BibTeX out', async () => {
      const res = await post('demo-curator', { bibtex });
      expect(res.status).toBe(201);
      const bib = await request(t.app).get(`/api/v1/sources/${res.body.id}.bib`).expect(200);
      expect(bib.headers['content-type']).toMatch(/^application\/x-bibtex/);
      expect(bib.text).toMatch(/^@article\{brandt2024,/);
      // Written in plain ASCII (ø as \o{}), which every BibTeX reads; it reads back the same.
      expect(parseBibtex(bib.text)).toMatchObject({
        author: [
          { family: 'Brandt', given: 'Helga' },
          { family: 'Sørensen', given: 'Lena' },
        ],
        title: 'Enthalpy of solution of a demo salt (demo data)',
        issued: { 'date-parts': [[2024]] },
        DOI: '10.5555/kestrel.bib.1',
      });
    });

    it('keeps authors, title, year and DOI through RIS in and RIS out', async () => {
      const ris = [
        'TY  - JOUR',
        'AU  - Mensah, Kwame',
        'AU  - Nandakumar, Priya',
        'TI  - Vapour pressure of a demo solvent (demo data)',
        'PY  - 2023',
        'DO  - 10.5555/kestrel.ris.1',
        'ER  - ',
        '',
      ].join('\n');
      const res = await post('demo-editor', { ris });
      expect(res.status).toBe(201);
      expect(res.body.citation).toMatch(
        /^Mensah, K\., & Nandakumar, P\. \(2023\)\. Vapour pressure/,
      );
      const out = await request(t.app).get(`/api/v1/sources/${res.body.id}.ris`).expect(200);
      expect(out.text).toContain('AU  - Mensah, Kwame');
      expect(out.text).toContain('AU  - Nandakumar, Priya');
      expect(out.text).toContain('TI  - Vapour pressure of a demo solvent (demo data)');
      expect(out.text).toContain('PY  - 2023');
      expect(out.text).toContain('DO  - 10.5555/kestrel.ris.1');
      // And the RIS we write reads back as the same source (same DOI: the existing one).
      const again = await post('demo-editor', { ris: out.text });
      expect(again.status).toBe(200);
      expect(again.body.id).toBe(res.body.id);
    });

    it('exports a starter source as BibTeX', async () => {
      const { rows } = await t.db.pool.query(`select id from sources where key = 'codata-1989'`);
      const bib = await request(t.app).get(`/api/v1/sources/${rows[0].id}.bib`).expect(200);
      expect(bib.text).toMatch(/^@book\{Cox1989CODATA,/m);
      expect(bib.text).toMatch(
        /author = \{Cox, J\. D\. and Wagman, D\. D\. and Medvedev, V\. A\.\}/,
      );
    });

    it.each([
      [{ bibtex: '@article{x, title={' }, 400, 'invalid_bibtex'],
      [{ bibtex: 'just words' }, 400, 'invalid_bibtex'],
      [{ ris: 'not ris' }, 400, 'invalid_ris'],
      [{ bibtex: '@misc{k, year={2020}}' }, 422, 'missing_title'],
      [{ bibtex: '@misc{a, title={A}}\n@misc{b, title={B}}' }, 422, 'multiple_entries'],
      [{ csl: { title: 'T', author: 'not a list' } }, 400, 'validation_error'],
      [{ csl: { author: [{ family: 'Untitled' }] } }, 400, 'validation_error'],
      [{ bibtex: '@misc{a, title={A}}', doi: '10.5555/x' }, 400, 'validation_error'],
      [{}, 400, 'validation_error'],
    ])('refuses %j with %i %s and writes nothing', async (body, status, code) => {
      const before = (await t.db.pool.query('select count(*)::int n from sources')).rows[0].n;
      const res = await post('demo-curator', body);
      expect(res.status).toBe(status);
      expect(res.body.error.code).toBe(code);
      expect((await t.db.pool.query('select count(*)::int n from sources')).rows[0].n).toBe(before);
    });

    it('creates a source from CSL fields given by hand', async () => {
      const res = await post('demo-curator', {
        csl: {
          type: 'report',
          title: 'Plant trial notes (demo data)',
          author: [{ family: 'Reyes', given: 'Tomas' }],
          issued: { 'date-parts': [[2026]] },
        },
      });
      expect(res.status).toBe(201);
      expect(res.body.doi).toBeNull();
      expect(res.body.citation).toBe('Reyes, T. (2026). Plant trial notes (demo data).');
    });
  });

  it('dedupes concurrent posts of one DOI: one source, one audit row', async () => {
    const doi = '10.5555/kestrel.demo.2026.003';
    const agents = await Promise.all(['demo-curator', 'demo-editor', 'demo-admin'].map(as));
    const answers = await Promise.all(
      Array.from({ length: 12 }, (_, i) => {
        const { agent, xsrf } = agents[i % agents.length]!;
        return agent
          .post('/api/v1/sources')
          .set('X-XSRF-TOKEN', xsrf)
          .send(i % 2 ? { doi } : { csl: { title: `Copy ${i}`, DOI: doi.toUpperCase() } });
      }),
    );
    const ids = new Set(answers.map((a) => a.body.id));
    expect(ids.size).toBe(1);
    expect(answers.filter((a) => a.status === 201)).toHaveLength(1);
    expect(answers.every((a) => a.status === 201 || a.status === 200)).toBe(true);
    const rows = await t.db.pool.query('select count(*)::int n from sources where doi = $1', [doi]);
    expect(rows.rows[0].n).toBe(1);
    expect(await audits([...ids][0]!)).toHaveLength(1);
  });

  it('lets curators, editors and admins create; refuses readers (403) and anonymous callers (401)', async () => {
    const reader = await post('demo-reader', { csl: { title: 'Reader attempt' } });
    expect(reader.status).toBe(403);
    await request(t.app)
      .post('/api/v1/sources')
      .send({ csl: { title: 'x' } })
      .expect(401);
  });

  it('lists and searches sources for a picker, page by page, publicly', async () => {
    const all = SourceList.strict().parse(
      (await request(t.app).get('/api/v1/sources?limit=5')).body,
    );
    expect(all.items).toHaveLength(5);
    expect(all.total).toBeGreaterThan(5);
    const found = SourceList.parse((await request(t.app).get('/api/v1/sources?q=codata')).body);
    expect(found.items.map((s) => s.citation)).toEqual([
      expect.stringContaining('CODATA Key Values for Thermodynamics'),
    ]);
    const literal = await request(t.app).get('/api/v1/sources?q=%25%25').expect(200);
    expect(literal.body.items).toEqual([]);
    await request(t.app).get('/api/v1/sources?limit=1000').expect(400);
  });

  it('answers unknown and malformed ids with 404 and 400', async () => {
    expect((await request(t.app).get('/api/v1/sources/999999').expect(404)).body.error.code).toBe(
      'not_found',
    );
    await request(t.app).get('/api/v1/sources/999999.bib').expect(404);
    await request(t.app).get('/api/v1/sources/abc').expect(400);
  });
});
