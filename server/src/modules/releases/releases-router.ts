import { Router } from 'express';
import { validate } from '../../middleware/validate';
import type { Database } from '../../db/client';
import { sendReleaseAnswer } from './release-http-cache';
import { EXPORT_FORMATS } from './release-export-writers';
import { exportUrl, releaseExportsRouter } from './release-exports-router';
import { createReleaseExportsService, type ReleaseExportsService } from './release-exports-service';
import {
  ReleaseParams,
  toReleaseManifest,
  toReleaseSummary,
  type ReleaseList,
  type ReleaseManifestWithExports,
} from './releases-schemas';
import { watcherMailsOnPublish } from './release-mail';
import { createReleasesService, type ReleasesService } from './releases-service';

export function releasesRouter(
  releases: ReleasesService,
  exportsService: ReleaseExportsService,
): Router {
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
    const digests = await exportsService.digests(release);
    const body: ReleaseManifestWithExports = {
      ...toReleaseManifest(release, counts),
      exports: Object.fromEntries(
        EXPORT_FORMATS.map((f) => [
          f,
          { ...digests[f], url: exportUrl(req.baseUrl, release.version, f) },
        ]),
      ) as ReleaseManifestWithExports['exports'],
    };
    sendReleaseAnswer(req, res, body, version);
  });

  router.use(releaseExportsRouter(releases, exportsService));
  return router;
}

/** Published releases: list, manifests, exports, diffs, and the snapshot every computation reads. */
export function createReleasesModule(deps: { db: Database; publicUrl?: string }) {
  // Watchers' impact e-mails go out (through the outbox) with every publish of this app.
  const onPublished = deps.publicUrl ? watcherMailsOnPublish(deps.publicUrl) : undefined;
  const service = createReleasesService(deps.db, Date.now, onPublished);
  const exportsService = createReleaseExportsService(deps.db, service);
  return { service, exportsService, router: releasesRouter(service, exportsService) };
}
