import express, { Router } from 'express';
import { requireRole } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import {
  AcknowledgeBody,
  CreateReleaseBody,
  UpdateDraftBody,
  type DraftAnswer,
  type DraftList,
  type PublishStatus,
  type StaleAnswer,
} from './release-drafts-schemas';
import type { Database } from '../../db/client';
import { createReleaseDraftsService, type ReleaseDraftsService } from './release-drafts-service';
import { ReleaseParams, toReleaseManifest, type ReleaseManifest } from './releases-schemas';
import type { ReleasesService } from './releases-service';

/** Exclusion lists name revision ids; 20,000 of them stay well under this. */
const BODY_LIMIT = '512kb';

/**
 * The release composer, editors and admins only. Mounted before the public release routes so
 * that `/releases/drafts` is not read as a version.
 */
export function releaseDraftsRouter(drafts: ReleaseDraftsService, releases: ReleasesService) {
  const router = Router();
  const editor = requireRole('editor');
  router.use('/releases', express.json({ limit: BODY_LIMIT }));

  router.get('/releases/drafts', editor, async (_req, res) => {
    res.json({ drafts: await drafts.listDrafts() } satisfies DraftList);
  });

  const create = validate({ body: CreateReleaseBody });
  router.post('/releases', editor, create, async (req, res) => {
    const { version, notes } = create.input(res).body;
    res.status(201).json((await drafts.create(req.user!, version, notes)) satisfies DraftAnswer);
  });

  const one = validate({ params: ReleaseParams });
  router.get('/releases/:version/changes', editor, one, async (_req, res) => {
    res.json((await drafts.changes(one.input(res).params.version)) satisfies DraftAnswer);
  });

  const update = validate({ params: ReleaseParams, body: UpdateDraftBody });
  router.patch('/releases/:version', editor, update, async (req, res) => {
    const { params, body } = update.input(res);
    res.json((await drafts.update(req.user!, params.version, body)) satisfies DraftAnswer);
  });

  router.get('/releases/:version/stale', editor, one, async (_req, res) => {
    const { version } = one.input(res).params;
    res.json({ release: version, stale: await drafts.stale(version) } satisfies StaleAnswer);
  });

  const acknowledge = validate({ params: ReleaseParams, body: AcknowledgeBody });
  router.post('/releases/:version/acknowledgements', editor, acknowledge, async (req, res) => {
    const { params, body } = acknowledge.input(res);
    const stale = await drafts.acknowledge(req.user!, params.version, body.revisionIds);
    res.json({ release: params.version, stale } satisfies StaleAnswer);
  });

  router.post('/releases/:version/publish', editor, one, async (req, res) => {
    const { version } = one.input(res).params;
    await drafts.publish(req.user!, version);
    const { release, counts } = await releases.manifest(version);
    res.json(toReleaseManifest(release, counts) satisfies ReleaseManifest);
  });

  router.get('/releases/:version/publish-status', editor, one, async (_req, res) => {
    res.json((await drafts.publishStatus(one.input(res).params.version)) satisfies PublishStatus);
  });

  return router;
}

/** The release composer: drafts, their changes, stale derived values, and the publish job. */
export function createReleaseDraftsModule(deps: { db: Database; releases: ReleasesService }) {
  const service = createReleaseDraftsService(deps.db, deps.releases);
  return { service, router: releaseDraftsRouter(service, deps.releases) };
}
