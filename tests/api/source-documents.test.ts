import { createHash } from 'node:crypto';
import request from 'supertest';
import { createS3FileStore } from '../../server/src/adapters/file-store';
import { DocumentList, DocumentView } from '../../server/src/modules/sources/sources-schemas';
import { createTestApp, signIn, type Agent, type TestApp } from '../support/test-app';

// Sign-ins and 20 MB bodies take a while on a busy machine; nothing here is about speed.
jest.setTimeout(120_000);

const MB = 1024 * 1024;

/** A small but well-formed PDF (header, one page, cross-reference table, trailer). */
function pdfBytes(note: string, padTo = 0): Buffer {
  const head = `%PDF-1.4\n% ${note}\n1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n2 0 obj << /Type /Pages /Kids [] /Count 0 >> endobj\n`;
  const tail = 'xref\n0 3\ntrailer << /Size 3 /Root 1 0 R >>\nstartxref\n0\n%%EOF\n';
  const pad = Math.max(0, padTo - head.length - tail.length);
  return Buffer.concat([Buffer.from(head), Buffer.alloc(pad, 0x20), Buffer.from(tail)]);
}

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/** supertest reads a PDF answer as bytes. */
const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe('source documents', () => {
  let t: TestApp;
  let sourceId: string;
  const agents = new Map<string, { agent: Agent; xsrf: string }>();
  const as = async (login: string) => {
    if (!agents.has(login)) {
      const agent = request.agent(t.app);
      agents.set(login, { agent, xsrf: await signIn(agent, login) });
    }
    return agents.get(login)!;
  };
  const upload = async (login: string, bytes: Buffer, name = 'paper.pdf', id = sourceId) => {
    const { agent, xsrf } = await as(login);
    return agent
      .post(`/api/v1/sources/${id}/documents`)
      .set('X-XSRF-TOKEN', xsrf)
      .attach('file', bytes, { filename: name, contentType: 'application/pdf' });
  };
  const download = async (login: string, docId: string) =>
    (await as(login)).agent
      .get(`/api/v1/sources/${sourceId}/documents/${docId}`)
      .buffer(true)
      .parse(binary);
  const documentRows = async () =>
    (await t.db.pool.query('select count(*)::int n from source_documents')).rows[0].n as number;

  beforeAll(async () => {
    t = await createTestApp();
    const { agent, xsrf } = await as('demo-curator');
    const res = await agent
      .post('/api/v1/sources')
      .set('X-XSRF-TOKEN', xsrf)
      .send({ csl: { type: 'report', title: 'Calorimeter log (demo data)' } })
      .expect(201);
    sourceId = res.body.id;
  });
  afterAll(() => t.close());

  it('stores a PDF through the S3 API and gives the same bytes back, with its SHA-256 recorded', async () => {
    const bytes = pdfBytes('round trip');
    const res = await upload('demo-curator', bytes, 'calorimeter log.pdf');
    expect(res.status).toBe(201);
    const doc = DocumentView.strict().parse(res.body);
    expect(doc).toMatchObject({
      sourceId,
      fileName: 'calorimeter log.pdf',
      size: bytes.length,
      sha256: sha256(bytes),
      uploadedBy: { login: 'demo-curator' },
    });

    const { rows } = await t.db.pool.query(
      'select key, sha256, size from source_documents where id = $1',
      [doc.id],
    );
    expect(rows[0].sha256).toBe(sha256(bytes));
    // The bytes are in the S3 store under the recorded key, not in the database.
    const stored = await createS3FileStore(t.config.fileStore!).get(rows[0].key);
    const chunks: Buffer[] = [];
    for await (const chunk of stored) chunks.push(chunk as Buffer);
    expect(Buffer.concat(chunks).equals(bytes)).toBe(true);

    const got = await download('demo-curator', doc.id);
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('application/pdf');
    expect(got.headers['content-disposition']).toContain('calorimeter log.pdf');
    expect((got.body as Buffer).equals(bytes)).toBe(true);

    const audit = await t.db.pool.query(
      `select action from audit_log where entity_type = 'source' and entity_id = $1 and action = 'source.document_attached'`,
      [sourceId],
    );
    expect(audit.rowCount).toBeGreaterThanOrEqual(1);
  });

  it('accepts exactly 20 MB and refuses anything larger with 413 too_large, storing nothing', async () => {
    const atLimit = await upload('demo-editor', pdfBytes('at the limit', 20 * MB));
    expect(atLimit.status).toBe(201);
    expect(atLimit.body.size).toBe(20 * MB);
    const before = await documentRows();
    const over = await upload('demo-editor', pdfBytes('one byte over', 20 * MB + 1));
    expect(over.status).toBe(413);
    expect(over.body.error.code).toBe('too_large');
    expect(await documentRows()).toBe(before);
  });

  it('refuses a file that is not a PDF although it is named .pdf and sent as application/pdf (415 not_pdf)', async () => {
    const before = await documentRows();
    const png = Buffer.from('89504e470d0a1a0a0000000d49484452', 'hex');
    const res = await upload('demo-curator', png, 'scan.pdf');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('not_pdf');
    // A PDF header without its trailer (a cut-off file) is refused too.
    const cut = await upload('demo-curator', pdfBytes('cut').subarray(0, 40), 'cut.pdf');
    expect(cut.status).toBe(415);
    expect(await documentRows()).toBe(before);
  });

  it('answers a missing file with 400 file_required and an unknown source with 404', async () => {
    const { agent, xsrf } = await as('demo-curator');
    const none = await agent
      .post(`/api/v1/sources/${sourceId}/documents`)
      .set('X-XSRF-TOKEN', xsrf)
      .field('note', 'no file');
    expect(none.status).toBe(400);
    expect(none.body.error.code).toBe('file_required');
    const missing = await upload('demo-curator', pdfBytes('x'), 'x.pdf', '999999');
    expect(missing.status).toBe(404);
  });

  describe('who may upload, list and download', () => {
    let curatorsDoc: string;
    let editorsDoc: string;
    beforeAll(async () => {
      curatorsDoc = (await upload('demo-curator', pdfBytes('curator'))).body.id;
      editorsDoc = (await upload('demo-editor-2', pdfBytes('editor'))).body.id;
    });

    it('lets the uploader, editors and admins download; refuses other signed-in users (403) and anonymous callers (401)', async () => {
      for (const login of ['demo-curator', 'demo-editor', 'demo-editor-2', 'demo-admin']) {
        expect((await download(login, curatorsDoc)).status).toBe(200);
      }
      expect((await download('demo-reader', curatorsDoc)).status).toBe(403);
      // The curator is not the uploader of the editor's document.
      expect((await download('demo-curator', editorsDoc)).status).toBe(403);
      await request(t.app).get(`/api/v1/sources/${sourceId}/documents/${curatorsDoc}`).expect(401);
    });

    it('lists every document to editors and admins, only their own to an uploader, none to others', async () => {
      const { agent } = await as('demo-editor');
      const all = DocumentList.strict().parse(
        (await agent.get(`/api/v1/sources/${sourceId}/documents`).expect(200)).body,
      );
      expect(all.documents.map((d) => d.id)).toEqual(
        expect.arrayContaining([curatorsDoc, editorsDoc]),
      );
      const own = (
        await (await as('demo-curator')).agent.get(`/api/v1/sources/${sourceId}/documents`)
      ).body as DocumentList;
      expect(own.documents.map((d) => d.id)).toContain(curatorsDoc);
      expect(own.documents.every((d) => d.uploadedBy.login === 'demo-curator')).toBe(true);
      const reader = await (
        await as('demo-reader')
      ).agent.get(`/api/v1/sources/${sourceId}/documents`);
      expect(reader.status).toBe(403);
      await request(t.app).get(`/api/v1/sources/${sourceId}/documents`).expect(401);
    });

    it('refuses uploads by readers (403) and anonymous callers (401)', async () => {
      expect((await upload('demo-reader', pdfBytes('reader'))).status).toBe(403);
      await request(t.app)
        .post(`/api/v1/sources/${sourceId}/documents`)
        .attach('file', pdfBytes('anon'), 'a.pdf')
        .expect(401);
    });

    it('answers a document of another source with 404', async () => {
      const { agent } = await as('demo-admin');
      await agent.get(`/api/v1/sources/999999/documents/${curatorsDoc}`).expect(404);
    });
  });
});
