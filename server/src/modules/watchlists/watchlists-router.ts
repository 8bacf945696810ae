import express, { Router } from 'express';
import type { Database } from '../../db/client';
import { requireSignIn } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import type { ReactionsService } from '../reactions/reactions-service';
import {
  ImpactBody,
  ImpactParams,
  toWatchlistSummary,
  toWatchlistView,
  WatchlistBody,
  WatchlistIdParams,
  type ImpactAnswer,
  type WatchlistAnswer,
  type WatchlistListAnswer,
} from './watchlists-schemas';
import { createWatchlistsService, type WatchlistsService } from './watchlists-service';

/** Up to 1,000 reactions of up to 2,000 characters each. */
const LIST_BODY_LIMIT = '2mb';

export function watchlistsRouter(watchlists: WatchlistsService): Router {
  const router = Router();
  router.use('/me/watchlists', express.json({ limit: LIST_BODY_LIMIT }), requireSignIn);
  router.use('/releases/:a/impact/:b', express.json({ limit: LIST_BODY_LIMIT }));

  router.get('/me/watchlists', async (req, res) => {
    const rows = await watchlists.list(req.user!);
    res.json({ watchlists: rows.map(toWatchlistSummary) } satisfies WatchlistListAnswer);
  });

  const create = validate({ body: WatchlistBody });
  router.post('/me/watchlists', create, async (req, res) => {
    const row = await watchlists.create(req.user!, create.input(res).body);
    res.status(201).json({ watchlist: toWatchlistView(row) } satisfies WatchlistAnswer);
  });

  const one = validate({ params: WatchlistIdParams });
  router.get('/me/watchlists/:id', one, async (req, res) => {
    const row = await watchlists.get(req.user!, one.input(res).params.id);
    res.json({ watchlist: toWatchlistView(row) } satisfies WatchlistAnswer);
  });

  const replace = validate({ params: WatchlistIdParams, body: WatchlistBody });
  router.put('/me/watchlists/:id', replace, async (req, res) => {
    const { params, body } = replace.input(res);
    const row = await watchlists.update(req.user!, params.id, body);
    res.json({ watchlist: toWatchlistView(row) } satisfies WatchlistAnswer);
  });

  router.delete('/me/watchlists/:id', one, async (req, res) => {
    await watchlists.remove(req.user!, one.input(res).params.id);
    res.status(204).end();
  });

  const impact = validate({ params: ImpactParams, body: ImpactBody });
  router.post('/releases/:a/impact/:b', impact, async (req, res) => {
    const { params, body } = impact.input(res);
    const answer = await watchlists.impact(req.user, { from: params.a, to: params.b, ...body });
    // Plain numbers and text only, as the batch answers.
    res.type('application/json').send(JSON.stringify(answer satisfies ImpactAnswer));
  });
  return router;
}

export interface WatchlistsModuleDeps {
  db: Database;
  reactions: ReactionsService;
}

/** Watchlists (`/api/v1/me/watchlists`) and impact reports between releases. */
export function createWatchlistsModule({ db, reactions }: WatchlistsModuleDeps) {
  const service = createWatchlistsService(db, reactions);
  return { service, router: watchlistsRouter(service) };
}
