import { RELEASE_VERSION_PATTERN, type UserRow } from '../../../../schema';
import { pgErrorCode, type Database, type Tx } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { recordAudit } from '../audit/audit-repository';
import { usersRepository } from '../users/users-repository';
import { buildSnapshot, type ReleaseSnapshot } from './release-snapshot';
import { releasesRepository, type ReleaseCounts, type ReleaseListRow } from './releases-repository';
import { loadSnapshotInput } from './snapshot-input';

export const LATEST = 'latest';
/** How long "latest" may point at the previous release after another process publishes. */
const LATEST_TTL_MS = 5_000;

export const unknownRelease = (version: string) =>
  new AppError(404, 'unknown_release', `There is no published release ${JSON.stringify(version)}`, {
    release: version,
  });

export interface ReleaseManifest {
  release: ReleaseListRow;
  counts: ReleaseCounts;
}

type Actor = Pick<UserRow, 'id'>;

export function createReleasesService(db: Database, now: () => number = Date.now) {
  // Published releases never change, so what is read about them is kept for the process's life.
  const published = new Map<string, ReleaseListRow>();
  const snapshots = new Map<number, Promise<ReleaseSnapshot>>();
  const manifests = new Map<number, Promise<ReleaseCounts>>();
  let latest: { row: ReleaseListRow; until: number } | null = null;

  /** A published release by version or `latest`; drafts and unknown labels are 404 `unknown_release`. */
  async function resolve(version: string): Promise<ReleaseListRow> {
    if (version === LATEST) {
      if (latest && latest.until > now()) return latest.row;
      const row = await releasesRepository.findLatestPublished(db);
      if (!row) throw unknownRelease(version);
      latest = { row, until: now() + LATEST_TTL_MS };
      published.set(row.version, row);
      return row;
    }
    const cached = published.get(version);
    if (cached) return cached;
    if (!RELEASE_VERSION_PATTERN.test(version)) throw unknownRelease(version);
    const row = await releasesRepository.findByVersion(db, version);
    if (!row || row.status !== 'published') throw unknownRelease(version);
    published.set(version, row);
    return row;
  }

  function once<T>(
    cache: Map<number, Promise<T>>,
    id: number,
    build: () => Promise<T>,
  ): Promise<T> {
    let p = cache.get(id);
    if (!p) {
      p = build();
      cache.set(id, p);
      // A failed build (database down) is not kept: the next request tries again.
      p.catch(() => cache.delete(id));
    }
    return p;
  }

  async function createDraftIn(tx: Tx, actor: Actor, version: string, notes: string) {
    if (!RELEASE_VERSION_PATTERN.test(version)) {
      throw new AppError(400, 'invalid_version', 'A release version looks like 2026.1', {
        version,
      });
    }
    try {
      const row = await tx.transaction((sp) =>
        releasesRepository.insertDraft(sp, { version, notes, createdBy: actor.id }),
      );
      await recordAudit(tx, {
        actorId: actor.id,
        action: 'release.draft_created',
        entityType: 'release',
        entityId: row.id,
        after: { version, notes },
      });
      return row;
    } catch (err) {
      if (pgErrorCode(err) === '23505') {
        throw new AppError(409, 'version_taken', `Release ${version} already exists`, { version });
      }
      throw err;
    }
  }

  /**
   * Pins every accepted revision into the draft and freezes it, with its audit row, inside the
   * caller's transaction. The actor's role is re-read under a row lock: a role revoked a moment
   * ago cannot publish.
   */
  async function publishIn(tx: Tx, actor: Actor, version: string) {
    const user = await usersRepository.assertActorRoleLocked(tx, actor.id, 'editor');
    const release = await releasesRepository.lockByVersion(tx, version);
    if (!release) throw unknownRelease(version);
    if (release.status === 'published') {
      throw new AppError(409, 'already_published', `Release ${version} is already published`, {
        version,
      });
    }
    const pinned = await releasesRepository.pinAccepted(tx, release.id);
    if (pinned === 0) {
      throw new AppError(409, 'empty_release', `Release ${version} would pin no values`, {
        version,
      });
    }
    const row = await releasesRepository.markPublished(tx, release.id, user.id);
    await recordAudit(tx, {
      actorId: user.id,
      action: 'release.published',
      entityType: 'release',
      entityId: release.id,
      before: { status: release.status },
      after: { status: row.status, version, entries: pinned },
    });
    latest = null;
    return row;
  }

  return {
    resolve,

    list: () => releasesRepository.listPublished(db),

    async manifest(version: string): Promise<ReleaseManifest> {
      const release = await resolve(version);
      const counts = await once(manifests, release.id, () =>
        releasesRepository.counts(db, release.id),
      );
      return { release, counts };
    },

    /** The engine's index of a published release: built once, shared by every request. */
    async getSnapshot(version: string): Promise<ReleaseSnapshot> {
      const release = await resolve(version);
      return once(snapshots, release.id, async () =>
        buildSnapshot(await loadSnapshotInput(db, release)),
      );
    },

    loadSnapshotInput: async (version: string) => loadSnapshotInput(db, await resolve(version)),

    createDraftIn,
    publishIn,

    createDraft: (actor: Actor, version: string, notes = '') =>
      db.transaction((tx) => createDraftIn(tx, actor, version, notes)),

    publish: (actor: Actor, version: string) =>
      db.transaction((tx) => publishIn(tx, actor, version)),
  };
}

export type ReleasesService = ReturnType<typeof createReleasesService>;
