import express, { Router, type RequestHandler } from 'express';
import type { Clock } from '../../adapters';
import type { Database } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { viaBearerToken } from '../../middleware/bearer-auth';
import { requireSignIn } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import {
  CreateTokenBody,
  TokenIdParams,
  toTokenView,
  type CreatedTokenAnswer,
  type TokenListAnswer,
} from './tokens-schemas';
import { createTokensService, type TokensService } from './tokens-service';

const BODY_LIMIT = '10kb';

/**
 * Tokens are managed from a signed-in browser session only: a token cannot mint, list or
 * revoke tokens, so a leaked one can neither multiply itself nor hide the others' use.
 */
const requireSession: RequestHandler = (_req, res, next) => {
  if (viaBearerToken(res)) {
    throw new AppError(
      403,
      'session_required',
      'API tokens are managed from a signed-in browser session, not with a token',
    );
  }
  next();
};

export function tokensRouter(tokens: TokensService): Router {
  const router = Router();
  router.use('/me/tokens', express.json({ limit: BODY_LIMIT }), requireSignIn, requireSession);

  router.get('/me/tokens', async (req, res) => {
    const rows = await tokens.list(req.user!.id);
    res.json({ tokens: rows.map(toTokenView) } satisfies TokenListAnswer);
  });

  const create = validate({ body: CreateTokenBody });
  router.post('/me/tokens', create, async (req, res) => {
    const { token, row } = await tokens.create(req.user!, create.input(res).body.name);
    res.status(201).json({ token, apiToken: toTokenView(row) } satisfies CreatedTokenAnswer);
  });

  const revoke = validate({ params: TokenIdParams });
  router.delete('/me/tokens/:id', revoke, async (req, res) => {
    await tokens.revoke(req.user!, revoke.input(res).params.id);
    res.status(204).end();
  });
  return router;
}

export interface TokensModuleDeps {
  db: Database;
  clock: Clock;
  hashKey: string;
}

/** Personal API tokens (`/api/v1/me/tokens`) and the verifier behind bearer authentication. */
export function createTokensModule(deps: TokensModuleDeps) {
  const service = createTokensService(deps);
  return { service, verifyToken: service.verify, router: tokensRouter(service) };
}
