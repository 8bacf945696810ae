import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import type { Database } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { requireRole } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { checkItems, createDraftIn } from '../proposals/proposals-service';
import type { ReleaseSnapshot } from '../releases/release-snapshot';
import { UPLOAD_MAX_BYTES, UploadFields, UploadQuery } from './uploads-schemas';
import { createUploadsService, type ProposalsPort, type UploadsService } from './uploads-service';

const receive = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: UPLOAD_MAX_BYTES, files: 1, fields: 4, fieldSize: 20_000, parts: 6 },
}).single('file');

const MULTER_ERRORS: Record<string, [number, string, string]> = {
  LIMIT_FILE_SIZE: [
    413,
    'payload_too_large',
    'The file is larger than 10 MB; split it into several uploads.',
  ],
  LIMIT_FILE_COUNT: [400, 'too_many_files', 'Send one file per upload.'],
  LIMIT_UNEXPECTED_FILE: [400, 'too_many_files', 'Send one file, in the form field "file".'],
};

/** The multipart body, with every parser failure (limits, a torn body) as a clear 4xx. */
const fileBody: RequestHandler = (req, res, next) => {
  receive(req, res, (err: unknown) => {
    if (err === undefined || err === null) return next();
    const known = MULTER_ERRORS[(err as { code?: string }).code ?? ''];
    if (known !== undefined) return next(new AppError(known[0], known[1], known[2]));
    next(
      new AppError(400, 'bad_multipart', `The upload could not be read: ${(err as Error).message}`),
    );
  });
};

export function uploadsRouter(uploads: UploadsService): Router {
  const router = Router();
  const query = validate({ query: UploadQuery });
  router.post('/proposals/uploads', requireRole('curator'), query, fileBody, async (req, res) => {
    const { dryRun } = query.input(res).query;
    const fields = UploadFields.parse(req.body ?? {});
    if (req.file === undefined)
      throw new AppError(400, 'no_file', 'Attach a CSV or XML file in the form field "file".');
    const file = { bytes: req.file.buffer, name: req.file.originalname || 'upload' };
    if (dryRun) res.json(await uploads.preview(file));
    else res.status(201).json(await uploads.submit(req.user!, file, fields.rationale));
  });
  return router;
}

export interface UploadsModuleDeps {
  db: Database;
  /** Published snapshots (the releases service's cache), for the items' derivation checks. */
  releases: { getSnapshot(version: string): Promise<ReleaseSnapshot> };
}

/** Bulk upload of proposal items: dry run and submit (mounted under /api/v1). */
export function createUploadsModule({ db, releases }: UploadsModuleDeps) {
  const published = (v: string) => releases.getSnapshot(v);
  const proposals: ProposalsPort = {
    checkItems: (q, items) => checkItems(q, items, { published }),
    createDraftIn: (tx, actor, input) => createDraftIn(tx, actor, input, { published }),
  };
  const service = createUploadsService(db, proposals);
  return { service, router: uploadsRouter(service) };
}
