import express, { Router } from 'express';
import type { Database } from '../../db/client';
import { requireRole, requireSignIn } from '../../middleware/require-role';
import { IdParams, validate } from '../../middleware/validate';
import type { ReleaseSnapshot } from '../releases/release-snapshot';
import type { ProposalEventSink } from './proposal-events';
import {
  CheckItemsBody,
  CommentBody,
  CreateProposalBody,
  DecisionBody,
  ProposalListQuery,
  RederiveBody,
  ReviseProposalBody,
  type CheckAnswer,
  type CommentAnswer,
  type CreateAnswer,
  type ProposalDetail,
  type ProposalList,
  type RederiveAnswer,
  type TransitionAnswer,
  type WatchlistImpactAnswer,
} from './proposals-schemas';
import { createProposalsService, type ProposalsService } from './proposals-service';

/** A proposal of 20,000 items (the bulk-upload limit) fits; anything larger is refused early. */
const BODY_LIMIT = '12mb';

export function proposalsRouter(service: ProposalsService): Router {
  const router = Router();
  router.use(['/proposals', '/revisions'], express.json({ limit: BODY_LIMIT }));

  const check = validate({ body: CheckItemsBody });
  router.post('/proposals/check', requireRole('curator'), check, async (_req, res) => {
    res.json((await service.check(check.input(res).body.items)) satisfies CheckAnswer);
  });

  const create = validate({ body: CreateProposalBody });
  router.post('/proposals', requireRole('curator'), create, async (req, res) => {
    const answer = await service.create(req.user!, create.input(res).body);
    res.status(201).json(answer satisfies CreateAnswer);
  });

  const list = validate({ query: ProposalListQuery });
  router.get('/proposals', requireRole('curator'), list, async (req, res) => {
    res.json((await service.list(req.user!, list.input(res).query)) satisfies ProposalList);
  });

  const one = validate({ params: IdParams });
  router.get('/proposals/:id', requireSignIn, one, async (req, res) => {
    const detail = await service.detail(req.user!, one.input(res).params.id);
    res.json(detail satisfies ProposalDetail);
  });

  router.get('/proposals/:id/watchlist-impact', requireSignIn, one, async (req, res) => {
    const answer = await service.watchlistImpact(req.user!, one.input(res).params.id);
    res.json(answer satisfies WatchlistImpactAnswer);
  });

  const revise = validate({ params: IdParams, body: ReviseProposalBody });
  const reviseHandler: express.RequestHandler = async (req, res) => {
    const { params, body } = revise.input(res);
    res.json((await service.revise(req.user!, params.id, body)) satisfies TransitionAnswer);
  };
  router.put('/proposals/:id', requireRole('curator'), revise, reviseHandler);
  router.patch('/proposals/:id', requireRole('curator'), revise, reviseHandler);

  router.post('/proposals/:id/submit', requireRole('curator'), one, async (req, res) => {
    res.json(
      (await service.submit(req.user!, one.input(res).params.id)) satisfies TransitionAnswer,
    );
  });

  router.post('/proposals/:id/withdraw', requireSignIn, one, async (req, res) => {
    const answer = await service.withdraw(req.user!, one.input(res).params.id);
    res.json(answer satisfies TransitionAnswer);
  });

  const comment = validate({ params: IdParams, body: CommentBody });
  router.post('/proposals/:id/comments', requireSignIn, comment, async (req, res) => {
    const { params, body } = comment.input(res);
    const answer = await service.comment(req.user!, params.id, body.body);
    res.status(201).json(answer satisfies CommentAnswer);
  });

  const decide = validate({ params: IdParams, body: DecisionBody });
  router.post(
    '/proposals/:id/decision',
    requireSignIn,
    decide,
    requireRole('editor', {
      onRefused: (_req, res, actor) => {
        const { params, body } = decide.input(res);
        return service.recordRefusedDecision(actor, params.id, body.decision, 'forbidden');
      },
    }),
    async (req, res) => {
      const { params, body } = decide.input(res);
      const answer = await service.decide(req.user!, params.id, body.decision, body.comment);
      res.json(answer satisfies TransitionAnswer);
    },
  );

  const rederive = validate({ params: IdParams, body: RederiveBody });
  router.post('/revisions/:id/rederive', requireRole('curator'), rederive, async (req, res) => {
    const { params, body } = rederive.input(res);
    const answer = await service.rederive(req.user!, params.id, body);
    res.status(201).json(answer satisfies RederiveAnswer);
  });

  return router;
}

export interface ProposalsModuleDeps {
  db: Database;
  releases: { getSnapshot(version: string): Promise<ReleaseSnapshot> };
  /** Called inside each event's transaction (e.g. to write an outbox row). */
  onEvent?: ProposalEventSink;
}

/** Curation: proposals, review and decisions (mounted under /api/v1). */
export function createProposalsModule(deps: ProposalsModuleDeps) {
  const service = createProposalsService(deps);
  return { service, router: proposalsRouter(service) };
}
