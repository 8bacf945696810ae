import type { Database } from '../../db/client';
import { createReactionsService } from '../reactions/reactions-service';
import { createReleasesService, type ReleasesService } from '../releases/releases-service';
import { impactReport } from './impact';
import { watchlistsRepository } from './watchlists-repository';
import type { ImpactAnswer } from './watchlists-schemas';

export interface WatcherReport {
  owner: { id: number; login: string; name: string; email: string | null };
  watchlist: { id: number; name: string };
  report: ImpactAnswer;
}

/**
 * The impact report of every non-empty watchlist between the previous release and the one just
 * published, one per watchlist with its owner: what the publish e-mail (through the outbox)
 * sends each watcher. Reads only; the caller decides how and when to send.
 */
export async function watchlistImpactsForRelease(
  db: Database,
  previousVersion: string,
  newVersion: string,
  releases: ReleasesService = createReleasesService(db),
): Promise<WatcherReport[]> {
  const reactions = createReactionsService((v) => releases.getSnapshot(v));
  const [from, to] = await Promise.all([
    reactions.release(previousVersion),
    reactions.release(newVersion),
  ]);
  const rows = await watchlistsRepository.withOwners(db);
  return rows.map(({ watchlist, owner }) => ({
    owner,
    watchlist: { id: watchlist.id, name: watchlist.name },
    report: impactReport(reactions, from, to, {
      reactions: watchlist.reactions,
      unit: 'kJ/mol',
      watchlistId: watchlist.id,
    }),
  }));
}
