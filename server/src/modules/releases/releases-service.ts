import { RELEASE_VERSION_PATTERN, type ReleaseRow, type UserRow } from '../../../../schema';
import { pgErrorCode, type Database, type Tx } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { recordAudit } from '../audit/audit-repository';
import { usersRepository } from '../users/users-repository';
import { draftRepository } from './draft-repository';
import { renderExportsIn } from './release-export-store';
import { buildSnapshot, type ReleaseSnapshot } from './release-snapshot';
import { releasesRepository, type ReleaseCounts, type ReleaseListRow } from './releases-repository';
import { loadSnapshotInput } from './snapshot-input';

export const LATEST = 'latest';
/** How long "latest" may point at the previous release after another process publishes. */
const LATEST_TTL_MS = 5_000;

export const unknownDraft = (version: string) =>
  new AppError(404, 'unknown_draft', `There is no release or draft ${JSON.stringify(version)}`, {
    release: version,
  });

export const alreadyPublished = (version: string) =>
  new AppError(409, 'already_published', `Release ${version} is already published`, { version });

/** Steps of a publish, in order, as the progress of the publish job reports them. */
export type PublishStep = 'waiting' | 'checking' | 'pinning' | 'freezing' | 'notifying';

/** Runs in the publish transaction once the release is frozen (e.g. the watchers' e-mails). */
export type OnPublished = (tx: Tx, release: ReleaseRow) => Promise<void>;

export const unknownRelease = (version: string) =>
  new AppError(404, 'unknown_release', `There is no published release ${JSON.stringify(version)}`, {
    release: version,
  });

export interface ReleaseManifest {
  release: ReleaseListRow;
  counts: ReleaseCounts;
}

type Actor = Pick<UserRow, 'id'>;

export function createReleasesService(
  db: Database,
  now: () => number = Date.now,
  onPublished: OnPublished = async () => {},
) {
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

  /**
   * A draft based on the newest published release; the actor's role is re-read under lock.
   * Inside the caller's transaction, with its audit row.
   */
  async function createDraftIn(tx: Tx, actor: Actor, version: string, notes: string) {
    if (!RELEASE_VERSION_PATTERN.test(version)) {
      throw new AppError(400, 'invalid_version', 'A release version looks like 2026.1', {
        version,
      });
    }
    const user = await usersRepository.assertActorRoleLocked(tx, actor.id, 'editor');
    const base = await releasesRepository.findLatestPublished(tx);
    try {
      const row = await tx.transaction((sp) =>
        releasesRepository.insertDraft(sp, {
          version,
          notes,
          createdBy: user.id,
          baseReleaseId: base?.id ?? null,
        }),
      );
      await recordAudit(tx, {
        actorId: user.id,
        action: 'release.draft_created',
        entityType: 'release',
        entityId: row.id,
        after: { version, notes, base: base?.version ?? null },
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
   * Publishes a draft inside the caller's transaction: the base release's entries carried over,
   * the included changes applied (retirements removed), exactly one revision per species-phase
   * and quantity; then the release is frozen by the database's triggers and its export files are
   * rendered and stored. Publishes serialise on one advisory lock, so of two drafts on the same
   * base only the first can publish, and of two publishes of one draft only the first finds it
   * still a draft. The actor's role is re-read under a row lock: a role revoked a moment ago
   * cannot publish.
   */
  async function publishIn(
    tx: Tx,
    actor: Actor,
    version: string,
    report: (phase: PublishStep) => void = () => {},
  ) {
    report('waiting');
    const user = await usersRepository.assertActorRoleLocked(tx, actor.id, 'editor');
    await draftRepository.lockPublishing(tx);
    const release = await releasesRepository.lockByVersion(tx, version);
    if (!release) throw unknownDraft(version);
    if (release.status === 'published') throw alreadyPublished(version);
    report('checking');
    const newest = await releasesRepository.findLatestPublished(tx);
    if ((newest?.id ?? null) !== release.baseReleaseId) {
      const base = release.baseReleaseId
        ? (await draftRepository.findById(tx, release.baseReleaseId))?.version
        : null;
      throw new AppError(
        409,
        'stale_draft',
        `Release ${newest?.version} was published after draft ${version} was started from ${base ?? 'nothing'}: re-base the draft and check its changes again`,
        { version, base: base ?? null, latest: newest?.version ?? null },
      );
    }
    const stale = await draftRepository.staleInputs(tx, release);
    const unacknowledged = [
      ...new Set(stale.filter((s) => !s.acknowledged).map((s) => s.derivedId)),
    ];
    if (unacknowledged.length > 0) {
      throw new AppError(
        409,
        'stale_derived',
        `${unacknowledged.length} derived value(s) would be published stale: include their re-derivation or acknowledge them`,
        { version, revisionIds: unacknowledged },
      );
    }
    report('pinning');
    const pinned = await draftRepository.pinDraft(tx, release);
    if (pinned.changes === 0) {
      throw new AppError(409, 'empty_release', `Release ${version} would change nothing`, {
        version,
      });
    }
    report('freezing');
    const row = await releasesRepository.markPublished(tx, release.id, user.id);
    // Its export files are rendered now and stored frozen: later edits of a species name or a
    // source's citation never reach them.
    const exportFiles = await renderExportsIn(tx, row);
    await recordAudit(tx, {
      actorId: user.id,
      action: 'release.published',
      entityType: 'release',
      entityId: release.id,
      before: { status: release.status },
      after: {
        status: row.status,
        version,
        base: newest?.version ?? null,
        entries: pinned.entries,
        changes: pinned.changes,
        acknowledgedStale: [...new Set(stale.map((s) => s.derivedId))],
        exports: exportFiles,
      },
    });
    report('notifying');
    await onPublished(tx, row);
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

    async publish(actor: Actor, version: string, report?: (phase: PublishStep) => void) {
      const row = await db.transaction((tx) => publishIn(tx, actor, version, report));
      // Again after the commit: a request in between may have cached the previous newest.
      latest = null;
      return row;
    },
  };
}

export type ReleasesService = ReturnType<typeof createReleasesService>;
