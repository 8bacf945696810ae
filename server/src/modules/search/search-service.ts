import type { Database } from '../../db/client';
import type { ReleasesService } from '../releases/releases-service';
import { SpeciesSearchIndex } from './search-index';
import { searchRepository } from './search-repository';
import type { SearchAnswer, SearchQuery } from './search-schemas';

export function createSearchService(db: Database, releases: ReleasesService) {
  // One index per published release: its species never change, so the index is built once.
  const indexes = new Map<number, Promise<SpeciesSearchIndex>>();

  function indexFor(releaseId: number): Promise<SpeciesSearchIndex> {
    let p = indexes.get(releaseId);
    if (!p) {
      p = searchRepository.documents(db, releaseId).then((docs) => new SpeciesSearchIndex(docs));
      indexes.set(releaseId, p);
      p.catch(() => indexes.delete(releaseId));
    }
    return p;
  }

  return {
    async search(q: SearchQuery): Promise<SearchAnswer> {
      const release = await releases.resolve(q.release);
      const index = await indexFor(release.id);
      const { formula, results } = index.search(q.q, q.limit);
      return { release: release.version, query: q.q, formula, results };
    },
  };
}

export type SearchService = ReturnType<typeof createSearchService>;
