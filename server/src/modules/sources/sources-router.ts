import express, { Router, type RequestHandler } from 'express';
import multer from 'multer';
import type { FileStore } from '../../adapters/file-store';
import type { Database } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { requireRole, requireSignIn } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import type { DocumentRow } from './sources-repository';
import {
  CreateSourceBody,
  DocumentParams,
  SourceListQuery,
  SourceParams,
  type DocumentList,
  type DocumentView,
  type SourceAnswer,
  type SourceDetail,
  type SourceList,
} from './sources-schemas';
import {
  createSourceDocumentsService,
  MAX_DOCUMENT_BYTES,
  type SourceDocumentsService,
} from './source-documents-service';
import { createSourcesService, type SourcesService } from './sources-service';
import type { SourceRow } from '../../../../schema';

/** BibTeX, RIS or CSL-JSON of one work: a few kilobytes; the limit bounds abuse. */
const BODY_LIMIT = '256kb';

const toAnswer = (s: SourceRow): SourceAnswer => ({
  id: String(s.id),
  citation: s.citation,
  doi: s.doi,
});

const toDocumentView = (d: DocumentRow): DocumentView => ({
  id: String(d.id),
  sourceId: String(d.sourceId),
  fileName: d.fileName,
  size: d.size,
  sha256: d.sha256,
  uploadedAt: d.uploadedAt.toISOString(),
  uploadedBy: { login: d.uploaderLogin, name: d.uploaderName },
});

/** One PDF in the `file` field, read into memory and never past the limit. */
function pdfUpload(): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_DOCUMENT_BYTES, files: 1, fields: 4, parts: 5 },
  }).single('file');
  return (req, res, next) =>
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
        return next(new AppError(413, 'too_large', 'Documents may be at most 20 MB'));
      }
      const message =
        err instanceof multer.MulterError ? err.message : 'The upload could not be read';
      next(new AppError(400, 'bad_upload', `${message}; send one PDF in the form field "file"`));
    });
}

export function sourcesRouter(sources: SourcesService, documents: SourceDocumentsService): Router {
  const router = Router();
  router.use('/sources', express.json({ limit: BODY_LIMIT }));

  const create = validate({ body: CreateSourceBody });
  router.post('/sources', requireRole('curator'), create, async (req, res) => {
    const { source, created } = await sources.create(req.user!, create.input(res).body);
    res.status(created ? 201 : 200).json(toAnswer(source) satisfies SourceAnswer);
  });

  const list = validate({ query: SourceListQuery });
  router.get('/sources', list, async (_req, res) => {
    const { q, limit, offset } = list.input(res).query;
    const page = await sources.list(q, limit, offset);
    res.json({ items: page.items.map(toAnswer), total: page.total } satisfies SourceList);
  });

  const one = validate({ params: SourceParams });
  router.get('/sources/:id.bib', one, async (_req, res) => {
    const { id } = one.input(res).params;
    const text = await sources.exportAs(id, 'bibtex');
    // attachment() first: it would set a type from the file name's extension.
    res.attachment(`source-${id}.bib`).type('application/x-bibtex; charset=utf-8').send(text);
  });
  router.get('/sources/:id.ris', one, async (_req, res) => {
    const { id } = one.input(res).params;
    const text = await sources.exportAs(id, 'ris');
    res
      .attachment(`source-${id}.ris`)
      .type('application/x-research-info-systems; charset=utf-8')
      .send(text);
  });
  router.get('/sources/:id', one, async (_req, res) => {
    const row = await sources.get(one.input(res).params.id);
    const body: SourceDetail = {
      ...toAnswer(row),
      csl: row.csl,
      createdAt: row.createdAt.toISOString(),
    };
    res.json(body);
  });

  router.post(
    '/sources/:id/documents',
    requireRole('curator'),
    one,
    pdfUpload(),
    async (req, res) => {
      if (!req.file) {
        throw new AppError(400, 'file_required', 'Send one PDF in the form field "file"');
      }
      const doc = await documents.upload(req.user!, one.input(res).params.id, req.file);
      res.status(201).json(toDocumentView(doc) satisfies DocumentView);
    },
  );

  router.get('/sources/:id/documents', requireSignIn, one, async (req, res) => {
    const docs = await documents.list(req.user!, one.input(res).params.id);
    res.json({ documents: docs.map(toDocumentView) } satisfies DocumentList);
  });

  const oneDoc = validate({ params: DocumentParams });
  router.get('/sources/:id/documents/:docId', requireSignIn, oneDoc, async (req, res) => {
    const { id, docId } = oneDoc.input(res).params;
    const { doc, body } = await documents.download(req.user!, id, docId);
    res.attachment(doc.fileName).type('application/pdf').setHeader('Content-Length', doc.size);
    body.on('error', (err) => res.destroy(err));
    body.pipe(res);
  });

  return router;
}

export interface SourcesModuleDeps {
  db: Database;
  /** Where DOIs are resolved; null refuses look-ups by DOI. */
  doiBaseUrl: string | null;
  files: FileStore;
}

/** Sources: citations in (BibTeX, RIS, DOI, CSL) and out (CSL text, BibTeX, RIS), documents. */
export function createSourcesModule({ db, doiBaseUrl, files }: SourcesModuleDeps) {
  const service = createSourcesService({ db, doiBaseUrl });
  const documents = createSourceDocumentsService(db, files);
  return { service, documents, router: sourcesRouter(service, documents) };
}
