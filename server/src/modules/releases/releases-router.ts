import { Router } from 'express';
import { validate } from '../../middleware/validate';
import type { Database } from '../../db/client';
import { sendReleaseAnswer } from './release-http-cache';
import {
  ReleaseParams,
  toReleaseManifest,
  toReleaseSummary,
  type ReleaseList,
} from './releases-schemas';
import { createReleasesService, type ReleasesService } from './releases-service';

export function releasesRouter(releases: ReleasesService): Router {
  const router = Router();

  router.get('/releases', async (_req, res) => {
    const body: ReleaseList = { releases: (await releases.list()).map(toReleaseSummary) };
    res.setHeader('Cache-Control', 'public, max-age=60');
    res.json(body);
  });

  const one = validate({ params: ReleaseParams });
  router.get('/releases/:version', one, async (req, res) => {
    const { version } = one.input(res).params;
    const { release, counts } = await releases.manifest(version);
    sendReleaseAnswer(req, res, toReleaseManifest(release, counts), version);
  });

  return router;
}

/** Published releases: list, manifests, and the snapshot every computation reads. */
export function createReleasesModule(deps: { db: Database }) {
  const service = createReleasesService(deps.db);
  return { service, router: releasesRouter(service) };
}
