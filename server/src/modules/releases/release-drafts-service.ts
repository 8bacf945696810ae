import type { ReleaseRow, UserRow } from '../../../../schema';
import type { Database, Tx } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { recordAudit } from '../audit/audit-repository';
import { usersRepository } from '../users/users-repository';
import {
  draftRepository,
  type ChangeRow,
  type ChangeSideRow,
  type StaleInputRow,
} from './draft-repository';
import type {
  ChangeSide,
  DraftAnswer,
  DraftChange,
  DraftView,
  PublishPhase,
  PublishStatus,
  StaleDerived,
  UpdateDraftInput,
} from './release-drafts-schemas';
import { releasesRepository } from './releases-repository';
import {
  alreadyPublished,
  unknownDraft,
  type PublishStep,
  type ReleasesService,
} from './releases-service';

type Actor = Pick<UserRow, 'id'>;

/** How far along a publish is at the start of each step (the bar the composer shows). */
const PERCENT: Record<PublishPhase, number> = {
  idle: 0,
  waiting: 5,
  checking: 20,
  pinning: 45,
  freezing: 75,
  notifying: 90,
  done: 100,
  failed: 100,
};
const MESSAGE: Record<PublishPhase, string> = {
  idle: 'Not being published',
  waiting: 'Waiting for other publishes to finish',
  checking: 'Checking the draft against the newest release',
  pinning: 'Pinning one revision per species-phase and quantity',
  freezing: 'Freezing the release',
  notifying: 'Queueing the watchers’ impact reports',
  done: 'Published',
  failed: 'Not published',
};

const num = (text: string | null) => (text === null ? null : Number(text));

function toSide(s: ChangeSideRow | null): ChangeSide | null {
  if (!s) return null;
  return {
    revisionId: s.revisionId,
    kind: s.kind,
    value: num(s.value),
    valueText: s.value,
    uncertainty: num(s.uncertainty),
    uncertaintyBasis: s.uncertaintyBasis,
    method: s.method,
    temperature: num(s.temperature),
    heatCapacityForm: s.heatCapacityForm,
    source: { id: s.sourceId, citation: s.citation, doi: s.doi },
  };
}

/** new − old in kJ/mol and in units of the root sum of squares of both stated uncertainties. */
export function changeDifference(
  old: ChangeSide | null,
  next: ChangeSide | null,
): DraftChange['difference'] {
  if (old?.value == null || next?.value == null) return null;
  const joules = next.value - old.value;
  const combined =
    old.uncertainty != null && next.uncertainty != null
      ? Math.hypot(old.uncertainty, next.uncertainty)
      : null;
  return {
    kJPerMol: joules / 1000,
    combinedUncertainties: combined ? joules / combined : null,
  };
}

export function toDraftChange(c: ChangeRow): DraftChange {
  const old = toSide(c.old);
  const next = toSide(c.new);
  return {
    change: c.change,
    revisionId: c.changeId,
    included: c.included,
    species: { key: c.speciesKey, name: c.speciesName, formula: c.speciesFormula },
    phase: c.phase,
    modification: c.modification,
    quantity: c.quantity,
    old,
    new: next,
    difference: changeDifference(old, next),
  };
}

/** Rows of one stale input each, grouped by derived value. */
export function toStaleDerived(rows: StaleInputRow[]): StaleDerived[] {
  const byId = new Map<number, StaleDerived>();
  for (const r of rows) {
    let d = byId.get(r.derivedId);
    if (!d) {
      d = {
        revisionId: r.derivedId,
        species: { key: r.speciesKey, name: r.speciesName, formula: r.speciesFormula },
        phase: r.phase,
        modification: r.modification,
        quantity: r.quantity,
        value: num(r.value),
        acknowledged: r.acknowledged,
        inputs: [],
      };
      byId.set(r.derivedId, d);
    }
    d.inputs.push({
      revisionId: r.inputId,
      speciesKey: r.inputSpeciesKey,
      phase: r.inputPhase,
      modification: r.inputModification,
      quantity: r.inputQuantity,
      replacedBy: r.replacedById,
    });
  }
  return [...byId.values()];
}

/**
 * The editor's side of releases: drafts and their change sets, left-out changes, stale derived
 * values, and publishing as a job whose progress the composer polls. The publish itself is the
 * releases service's one transaction.
 */
export function createReleaseDraftsService(db: Database, releases: ReleasesService) {
  // Publish jobs of this process by version. Another instance's job shows up as "waiting" here
  // only through the database (the release turns published); the answer says so.
  const jobs = new Map<string, PublishStatus>();

  async function draftView(q: Database | Tx, row: ReleaseRow): Promise<DraftView> {
    const newest = await releasesRepository.findLatestPublished(q);
    const base = row.baseReleaseId ? await draftRepository.findById(q, row.baseReleaseId) : null;
    const creator = row.createdBy
      ? await usersRepository.findById(q as Database, row.createdBy)
      : null;
    return {
      version: row.version,
      status: 'draft',
      notes: row.notes,
      base: base?.version ?? null,
      stale: (newest?.id ?? null) !== row.baseReleaseId,
      latest: newest?.version ?? null,
      createdAt: row.createdAt.toISOString(),
      createdBy: creator ? { login: creator.login, name: creator.name } : null,
    };
  }

  /** The draft by version: 404 when there is none, 409 when it is already published. */
  async function findDraft(q: Database | Tx, version: string): Promise<ReleaseRow> {
    const row = await releasesRepository.findByVersion(q, version);
    if (!row) throw unknownDraft(version);
    if (row.status !== 'draft') throw alreadyPublished(version);
    return row;
  }

  async function answer(q: Database | Tx, row: ReleaseRow): Promise<DraftAnswer> {
    const changes = (await draftRepository.changes(q, row)).map(toDraftChange);
    const stale = toStaleDerived(await draftRepository.staleInputs(q, row));
    const count = (k: DraftChange['change']) => changes.filter((c) => c.change === k).length;
    return {
      release: await draftView(q, row),
      counts: {
        added: count('added'),
        changed: count('changed'),
        retired: count('retired'),
        included: changes.filter((c) => c.included).length,
        staleUnacknowledged: stale.filter((s) => !s.acknowledged).length,
      },
      changes,
    };
  }

  /** Locks the draft for a change by an editor whose role is re-read under lock. */
  async function lockForEdit(tx: Tx, actor: Actor, version: string) {
    const user = await usersRepository.assertActorRoleLocked(tx, actor.id, 'editor');
    const row = await releasesRepository.lockByVersion(tx, version);
    if (!row) throw unknownDraft(version);
    if (row.status !== 'draft') throw alreadyPublished(version);
    return { user, row };
  }

  function setJob(version: string, phase: PublishPhase, error: PublishStatus['error'] = null) {
    const prev = jobs.get(version);
    const steps = phase === 'waiting' || !prev ? [] : prev.steps;
    const at = new Date().toISOString();
    jobs.set(version, {
      version,
      phase,
      percent: PERCENT[phase],
      message: error?.message ?? MESSAGE[phase],
      error,
      steps: [...steps, { phase, percent: PERCENT[phase], at }],
    });
  }

  return {
    listDrafts: async (): Promise<DraftView[]> =>
      Promise.all((await draftRepository.listDrafts(db)).map((r) => draftView(db, r))),

    async create(actor: Actor, version: string, notes: string): Promise<DraftAnswer> {
      return db.transaction(async (tx) =>
        answer(tx, await releases.createDraftIn(tx, actor, version, notes)),
      );
    },

    changes: async (version: string) => answer(db, await findDraft(db, version)),

    /** Notes, left-out and taken-back changes, or a re-base, with one audit row. */
    update(actor: Actor, version: string, body: UpdateDraftInput): Promise<DraftAnswer> {
      return db.transaction(async (tx) => {
        const { user, row } = await lockForEdit(tx, actor, version);
        const named = [...(body.exclude ?? []), ...(body.include ?? [])];
        if (named.length > 0) {
          const known = new Set((await draftRepository.changes(tx, row)).map((c) => c.changeId));
          const unknown = named.filter((id) => !known.has(id));
          if (unknown.length > 0) {
            throw new AppError(
              422,
              'not_a_change',
              `Revision(s) ${unknown.join(', ')} are not changes of draft ${version}`,
              { revisionIds: unknown },
            );
          }
        }
        const before: Record<string, unknown> = {};
        const after: Record<string, unknown> = {};
        if (body.notes !== undefined && body.notes !== row.notes) {
          await draftRepository.setNotes(tx, row.id, body.notes);
          before.notes = row.notes;
          after.notes = body.notes;
        }
        if (body.exclude?.length) {
          await draftRepository.exclude(tx, row.id, body.exclude, user.id);
          after.excluded = body.exclude;
        }
        if (body.include?.length) {
          await draftRepository.include(tx, row.id, body.include);
          after.included = body.include;
        }
        if (body.rebase) {
          const newest = await releasesRepository.findLatestPublished(tx);
          await draftRepository.setBase(tx, row.id, newest?.id ?? null);
          before.baseReleaseId = row.baseReleaseId;
          after.base = newest?.version ?? null;
        }
        await recordAudit(tx, {
          actorId: user.id,
          action: 'release.draft_updated',
          entityType: 'release',
          entityId: row.id,
          before,
          after,
        });
        return answer(tx, (await draftRepository.findById(tx, row.id))!);
      });
    },

    async stale(version: string): Promise<StaleDerived[]> {
      return toStaleDerived(await draftRepository.staleInputs(db, await findDraft(db, version)));
    },

    acknowledge(actor: Actor, version: string, revisionIds: number[]): Promise<StaleDerived[]> {
      return db.transaction(async (tx) => {
        const { user, row } = await lockForEdit(tx, actor, version);
        const stale = new Set((await draftRepository.staleInputs(tx, row)).map((s) => s.derivedId));
        const unknown = revisionIds.filter((id) => !stale.has(id));
        if (unknown.length > 0) {
          throw new AppError(
            422,
            'not_stale',
            `Revision(s) ${unknown.join(', ')} are not stale derived values of draft ${version}`,
            { revisionIds: unknown },
          );
        }
        await draftRepository.acknowledge(tx, row.id, revisionIds, user.id);
        await recordAudit(tx, {
          actorId: user.id,
          action: 'release.stale_acknowledged',
          entityType: 'release',
          entityId: row.id,
          after: { version, revisionIds },
        });
        return toStaleDerived(await draftRepository.staleInputs(tx, row));
      });
    },

    /**
     * Runs the publish job: one transaction, its steps reported to `publishStatus`. A second
     * publish of the same draft while one runs in this process is refused at once (409); one
     * from another process waits for the lock and then finds the release published (409).
     */
    async publish(actor: Actor, version: string): Promise<ReleaseRow> {
      const running = jobs.get(version);
      if (running?.phase === 'done') throw alreadyPublished(version);
      if (running && running.phase !== 'failed') {
        throw new AppError(409, 'publish_in_progress', `Release ${version} is being published`, {
          version,
        });
      }
      setJob(version, 'waiting');
      try {
        const row = await releases.publish(actor, version, (step: PublishStep) =>
          setJob(version, step),
        );
        setJob(version, 'done');
        return row;
      } catch (err) {
        const e = err instanceof AppError ? err : null;
        setJob(version, 'failed', {
          code: e?.code ?? 'publish_failed',
          message: e?.message ?? 'The publish failed; nothing was changed. Try again.',
        });
        throw err;
      }
    },

    async publishStatus(version: string): Promise<PublishStatus> {
      const job = jobs.get(version);
      if (job) return job;
      const row = await releasesRepository.findByVersion(db, version);
      if (!row) throw unknownDraft(version);
      const phase: PublishPhase = row.status === 'published' ? 'done' : 'idle';
      return {
        version,
        phase,
        percent: PERCENT[phase],
        message: MESSAGE[phase],
        error: null,
        steps: [],
      };
    },
  };
}

export type ReleaseDraftsService = ReturnType<typeof createReleaseDraftsService>;
