import type { UserRow, WatchedReaction } from '../../../../schema';
import { pgErrorCode, type Database, type Tx } from '../../db/client';
import { AppError, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit-repository';
import type { ReactionsService } from '../reactions/reactions-service';
import type { ReactionUnitName } from '../reactions/reactions-schemas';
import { impactReport } from './impact';
import { watchlistsRepository } from './watchlists-repository';
import type { ImpactAnswer } from './watchlists-schemas';

/** Watchlists one user may keep. */
export const MAX_WATCHLISTS = 100;

export interface WatchlistInput {
  name: string;
  reactions: WatchedReaction[];
}

export interface ImpactRequestInput {
  from: string;
  to: string;
  unit: ReactionUnitName;
  temperatureK?: number;
  equations?: string[];
  watchlistId?: number;
}

const nameTaken = (name: string) =>
  new AppError(409, 'name_taken', `You already have a watchlist named ${JSON.stringify(name)}`, {
    name,
  });

/** Names are unique per owner: the constraint is the check, so two saves at once cannot both win. */
async function uniqueName<T>(tx: Tx, name: string, write: (sp: Tx) => Promise<T>): Promise<T> {
  try {
    return await tx.transaction(write);
  } catch (err) {
    if (pgErrorCode(err) === '23505') throw nameTaken(name);
    throw err;
  }
}

const watchlistNotFound = (id: number) => notFound(`Watchlist ${id}`);

export function createWatchlistsService(db: Database, reactions: ReactionsService) {
  return {
    list: (owner: UserRow) => watchlistsRepository.listOwn(db, owner.id),

    async get(owner: UserRow, id: number) {
      const row = await watchlistsRepository.findOwn(db, owner.id, id);
      if (!row) throw watchlistNotFound(id);
      return row;
    },

    create(owner: UserRow, input: WatchlistInput) {
      return db.transaction(async (tx) => {
        if ((await watchlistsRepository.countOwn(tx, owner.id)) >= MAX_WATCHLISTS) {
          throw new AppError(409, 'watchlist_limit', `You can keep ${MAX_WATCHLISTS} watchlists`);
        }
        const row = await uniqueName(tx, input.name, (sp) =>
          watchlistsRepository.insert(sp, { ownerId: owner.id, ...input }),
        );
        await recordAudit(tx, {
          actorId: owner.id,
          action: 'watchlist.created',
          entityType: 'watchlist',
          entityId: row.id,
          after: { name: row.name, reactions: row.reactions.length },
        });
        return row;
      });
    },

    update(owner: UserRow, id: number, input: WatchlistInput) {
      return db.transaction(async (tx) => {
        const before = await watchlistsRepository.findOwnForUpdate(tx, owner.id, id);
        if (!before) throw watchlistNotFound(id);
        const row = await uniqueName(tx, input.name, (sp) =>
          watchlistsRepository.update(sp, id, input),
        );
        await recordAudit(tx, {
          actorId: owner.id,
          action: 'watchlist.updated',
          entityType: 'watchlist',
          entityId: id,
          before: { name: before.name, reactions: before.reactions },
          after: { name: row.name, reactions: row.reactions },
        });
        return row;
      });
    },

    remove(owner: UserRow, id: number): Promise<void> {
      return db.transaction(async (tx) => {
        const before = await watchlistsRepository.findOwnForUpdate(tx, owner.id, id);
        if (!before) throw watchlistNotFound(id);
        await watchlistsRepository.delete(tx, id);
        await recordAudit(tx, {
          actorId: owner.id,
          action: 'watchlist.deleted',
          entityType: 'watchlist',
          entityId: id,
          before: { name: before.name, reactions: before.reactions },
        });
      });
    },

    /**
     * The impact report between two published releases, for the given equations or for one of
     * the caller's own watchlists (anyone else's is 404; a watchlist needs a signed-in caller).
     */
    async impact(caller: UserRow | undefined, req: ImpactRequestInput): Promise<ImpactAnswer> {
      let list: WatchedReaction[] = (req.equations ?? []).map((equation) => ({ equation }));
      if (req.watchlistId !== undefined) {
        if (!caller) throw new AppError(401, 'unauthenticated', 'Sign in to use a watchlist');
        const row = await watchlistsRepository.findOwn(db, caller.id, req.watchlistId);
        if (!row) throw watchlistNotFound(req.watchlistId);
        list = row.reactions;
      }
      const [from, to] = await Promise.all([
        reactions.release(req.from),
        reactions.release(req.to),
      ]);
      return impactReport(reactions, from, to, {
        reactions: list,
        temperatureK: req.temperatureK,
        unit: req.unit,
        watchlistId: req.watchlistId ?? null,
      });
    },
  };
}

export type WatchlistsService = ReturnType<typeof createWatchlistsService>;
