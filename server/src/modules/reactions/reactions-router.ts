import { createHash } from 'node:crypto';
import express, { Router, type Request, type Response } from 'express';
import { AppError } from '../../lib/app-error';
import { validate } from '../../middleware/validate';
import { IMMUTABLE_CACHE, LATEST_CACHE } from '../releases/release-http-cache';
import { BatchBody, ReactionBody, ReactionQuery, type ReactionInput } from './reactions-schemas';
import {
  createReactionsService,
  type ReactionsService,
  type SnapshotSource,
} from './reactions-service';

/** One reaction: the contract's limit (413 above it), for the body and for a GET's URL. */
export const REACTION_BODY_LIMIT = '10kb';
const REACTION_URL_LIMIT = 10 * 1024;
/** Up to 10,000 reactions of ordinary length. */
export const BATCH_BODY_LIMIT = '2mb';

/** Public, anonymous (rate-limited with the rest of /api/v1) reaction-enthalpy routes. */
export function reactionsRouter(service: ReactionsService): Router {
  const router = Router();
  // The batch parser first: the parser that runs first wins.
  router.use('/reaction-enthalpy/batch', express.json({ limit: BATCH_BODY_LIMIT }));
  router.use('/reaction-enthalpy', express.json({ limit: REACTION_BODY_LIMIT }));

  const post = validate({ body: ReactionBody });
  router.post('/reaction-enthalpy', post, async (req, res) => {
    await answerOne(service, req, res, post.input(res).body);
  });

  const get = validate({ query: ReactionQuery });
  router.get(
    '/reaction-enthalpy',
    (req, _res, next) => {
      if (req.originalUrl.length > REACTION_URL_LIMIT) {
        throw new AppError(413, 'payload_too_large', 'The request is too large (over 10 kB)');
      }
      next();
    },
    get,
    async (req, res) => {
      await answerOne(service, req, res, get.input(res).query);
    },
  );

  const batch = validate({ body: BatchBody });
  router.post('/reaction-enthalpy/batch', batch, async (_req, res) => {
    const { release, ...input } = batch.input(res).body;
    const snap = await service.release(release);
    const answer = service.batch(snap, input);
    // Plain numbers and text only: skip the app's replacer, which costs much on 10,000 items.
    res.type('application/json').send(JSON.stringify(answer));
  });
  return router;
}

async function answerOne(
  service: ReactionsService,
  req: Request,
  res: Response,
  input: ReactionInput,
): Promise<void> {
  const snap = await service.release(input.release);
  const { release: _label, ...request } = input;
  res.setHeader('ETag', etag(snap.version, request));
  res.setHeader('Cache-Control', input.release === 'latest' ? LATEST_CACHE : IMMUTABLE_CACHE);
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  try {
    // Plain numbers and text only: the app's replacer (for exact fractions) is not needed.
    res.type('application/json').send(JSON.stringify(service.compute(snap, request)));
  } catch (err) {
    // Errors are not release data: the API's default (no-store) applies.
    res.removeHeader('ETag');
    res.setHeader('Cache-Control', 'no-store');
    throw err;
  }
}

/** Same release and same request → same answer, so the tag needs no computation. */
function etag(version: string, request: Omit<ReactionInput, 'release'>): string {
  const hash = createHash('sha1')
    .update(JSON.stringify([version, request.equation, request.temperatureK, request.unit]))
    .digest('base64url');
  return `W/"re1-${hash}"`;
}

/** Reaction enthalpy against published releases (mounted under /api/v1). */
export function createReactionsModule(deps: { snapshots: SnapshotSource }) {
  const service = createReactionsService(deps.snapshots);
  return { router: reactionsRouter(service), service };
}
