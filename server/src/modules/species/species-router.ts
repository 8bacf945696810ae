import { Router } from 'express';
import type { Database } from '../../db/client';
import { validate } from '../../middleware/validate';
import { sendReleaseAnswer } from '../releases/release-http-cache';
import { ReleaseParams } from '../releases/releases-schemas';
import type { ReleasesService } from '../releases/releases-service';
import { ReleaseSpeciesQuery, SpeciesParams } from './species-schemas';
import { createSpeciesService, type SpeciesService } from './species-service';

export function speciesRouter(service: SpeciesService): Router {
  const router = Router();

  const list = validate({ params: ReleaseParams, query: ReleaseSpeciesQuery });
  router.get('/releases/:version/species', list, async (req, res) => {
    const { params, query } = list.input(res);
    sendReleaseAnswer(req, res, await service.listInRelease(params.version, query), params.version);
  });

  const one = validate({ params: SpeciesParams });
  router.get('/species/:key', one, async (_req, res) => {
    // A species page gains values with every release: cacheable briefly, never for long.
    res.setHeader('Cache-Control', 'public, max-age=60');
    res.json(await service.page(one.input(res).params.key));
  });

  return router;
}

/** Species pages and the per-release species table. */
export function createSpeciesModule(deps: { db: Database; releases: ReleasesService }) {
  const service = createSpeciesService(deps.db, deps.releases);
  return { service, router: speciesRouter(service) };
}
