import type { SourceRow, UserRow } from '../../../../schema';
import type { Database } from '../../db/client';
import { AppError, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit-repository';
import { usersRepository } from '../users/users-repository';
import {
  formatCitation,
  normaliseDoi,
  parseBibtex,
  parseCsl,
  parseRis,
  resolveDoi,
  toBibtex,
  toRis,
  type Csl,
} from './citation';
import type { CreateSourceBody } from './sources-schemas';
import { sourcesRepository } from './sources-repository';

export interface SourcesServiceDeps {
  db: Database;
  /** Where DOIs are resolved (`${base}/${doi}`); null: look-ups by DOI are refused. */
  doiBaseUrl: string | null;
}

export interface CreatedSource {
  source: SourceRow;
  /** False when a source with the same DOI already existed and is returned instead. */
  created: boolean;
}

export function createSourcesService({ db, doiBaseUrl }: SourcesServiceDeps) {
  async function cslFrom(body: CreateSourceBody): Promise<Csl> {
    if (body.bibtex !== undefined) return parseBibtex(body.bibtex);
    if (body.ris !== undefined) return parseRis(body.ris);
    if (body.csl !== undefined) return parseCsl(body.csl);
    const doi = doiOf(body.doi!);
    if (!doiBaseUrl) {
      throw new AppError(503, 'doi_unreachable', 'No DOI service is configured on this server');
    }
    return resolveDoi(doi, doiBaseUrl);
  }

  async function get(id: number): Promise<SourceRow> {
    const row = await sourcesRepository.findById(db, id);
    if (!row) throw notFound(`Source ${id}`);
    return row;
  }

  return {
    /**
     * Creates a source from BibTeX, RIS, CSL-JSON or a DOI, or returns the existing source with
     * the same DOI. The insert, its audit row and the caller's role check share one transaction.
     */
    async create(actor: UserRow, body: CreateSourceBody): Promise<CreatedSource> {
      if (body.doi !== undefined) {
        const existing = await sourcesRepository.findByDoi(db, doiOf(body.doi));
        if (existing) return { source: existing, created: false };
      }
      const csl = await cslFrom(body);
      const doi = typeof csl.DOI === 'string' ? doiOf(csl.DOI) : null;
      if (doi) csl.DOI = doi;
      const citation = citationOf(csl);
      return db.transaction(async (tx) => {
        await usersRepository.assertActorRoleLocked(tx, actor.id, 'curator');
        const row = { csl, citation, doi, createdBy: actor.id };
        const inserted = await sourcesRepository.insertUnlessDoiTaken(tx, row);
        if (!inserted)
          return { source: (await sourcesRepository.findByDoi(tx, doi!))!, created: false };
        await recordAudit(tx, {
          actorId: actor.id,
          action: 'source.created',
          entityType: 'source',
          entityId: inserted.id,
          after: { citation, doi },
        });
        return { source: inserted, created: true };
      });
    },

    get,

    list: (q: string | undefined, limit: number, offset: number) =>
      sourcesRepository.list(db, q || undefined, limit, offset),

    /** BibTeX or RIS of a stored source, with the citation key the file will carry. */
    async exportAs(id: number, format: 'bibtex' | 'ris'): Promise<string> {
      const row = await get(id);
      const own = row.csl['citation-key'];
      const key = typeof own === 'string' ? own : (row.key ?? `source-${row.id}`);
      const csl = { ...row.csl, 'citation-key': key };
      return format === 'bibtex' ? toBibtex(csl) : toRis(csl);
    },
  };
}

export type SourcesService = ReturnType<typeof createSourcesService>;

function doiOf(text: string): string {
  const doi = normaliseDoi(text);
  if (!doi) {
    throw new AppError(
      400,
      'invalid_doi',
      `"${text.slice(0, 100)}" is not a DOI (10.prefix/suffix)`,
    );
  }
  return doi;
}

/** A CSL item citation-js cannot format (e.g. an author given as plain text) is refused. */
function citationOf(csl: Csl): string {
  try {
    return formatCitation(csl);
  } catch (err) {
    const detail = err instanceof Error ? `: ${err.message.split('\n')[0]}` : '';
    throw new AppError(422, 'invalid_csl', `The citation could not be formatted${detail}`);
  }
}
