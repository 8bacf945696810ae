import { Router } from 'express';
import type { Database } from '../../db/client';
import { validate } from '../../middleware/validate';
import { sendReleaseAnswer } from '../releases/release-http-cache';
import type { ReleasesService } from '../releases/releases-service';
import { SearchQuery } from './search-schemas';
import { createSearchService, type SearchService } from './search-service';

export function searchRouter(service: SearchService): Router {
  const router = Router();
  const search = validate({ query: SearchQuery });
  router.get('/search', search, async (req, res) => {
    const { query } = search.input(res);
    sendReleaseAnswer(req, res, await service.search(query), query.release);
  });
  return router;
}

/** Typo-tolerant species search within a published release. */
export function createSearchModule(deps: { db: Database; releases: ReleasesService }) {
  const service = createSearchService(deps.db, deps.releases);
  return { service, router: searchRouter(service) };
}
