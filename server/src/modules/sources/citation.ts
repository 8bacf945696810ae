/**
 * Citations through citation-js: parsing BibTeX, RIS and CSL-JSON, the one formatted citation
 * (CSL, the APA style bundled with plugin-csl), BibTeX and RIS export, and DOI look-ups through
 * a plugin of our own (the stock DOI plugin always calls the public resolver).
 */
import { Cite, plugins } from '@citation-js/core';
import '@citation-js/plugin-bibtex';
import '@citation-js/plugin-ris';
import '@citation-js/plugin-csl';
import { AppError } from '../../lib/app-error';

export type Csl = Record<string, unknown>;

const STYLE = { format: 'text', template: 'apa', lang: 'en-US' } as const;
const DOI_REQUEST = '@thalpos/doi-request';
/** The CSL-JSON media type a DOI resolver answers content negotiation with. */
export const CSL_MEDIA_TYPE = 'application/vnd.citationstyles.csl+json';
const DOI_TIMEOUT_MS = 10_000;
/** Metadata of one work is a few kilobytes; anything far bigger is not what we asked for. */
const DOI_MAX_BYTES = 1_000_000;

/** The DOI a person may paste (bare, `doi:`, or as a resolver link), lowercased; else null. */
export function normaliseDoi(text: string): string | null {
  const bare = text
    .trim()
    .replace(/^(?:https?:\/\/(?:dx\.)?doi\.org\/|doi:\s*)/i, '')
    .toLowerCase();
  // A "." or ".." segment is no real DOI's and would walk the resolver's paths.
  const walks = /(^|\/)\.{1,2}(\/|$)/.test(bare);
  return /^10\.[0-9]{4,9}\/\S+$/.test(bare) && !walks ? bare : null;
}

/** One plain-text citation in the bundled CSL style. */
export function formatCitation(csl: Csl): string {
  const text = new Cite(forCite(csl), { forceType: '@csl/object' }).format('bibliography', STYLE);
  return text.trim().replace(/\s+/g, ' ') || 'Untitled source';
}

export function toBibtex(csl: Csl): string {
  return new Cite(forCite(csl), { forceType: '@csl/object' }).format('bibtex');
}

export function toRis(csl: Csl): string {
  return new Cite(forCite(csl), { forceType: '@csl/object' }).format('ris');
}

export function parseBibtex(text: string): Csl {
  return oneEntry(text, '@bibtex/text', 'invalid_bibtex', 'BibTeX');
}

export function parseRis(text: string): Csl {
  return oneEntry(text, '@ris/file', 'invalid_ris', 'RIS');
}

/** CSL-JSON given by hand or by a script, normalised the same way as parsed input. */
export function parseCsl(csl: Csl): Csl {
  return oneEntry({ type: 'document', ...csl }, '@csl/object', 'invalid_csl', 'CSL-JSON');
}

/** Fetches CSL-JSON for a DOI from `${baseUrl}/${doi}` (content negotiation). */
export async function resolveDoi(doi: string, baseUrl: string): Promise<Csl> {
  registerDoiPlugin();
  const cite = await Cite.async({ doiRequest: doi, resolver: baseUrl }, { forceType: DOI_REQUEST });
  return checked(cite.data, 'doi_bad_metadata', 'DOI metadata', 502);
}

function oneEntry(input: unknown, type: string, code: string, what: string): Csl {
  let data: Csl[];
  try {
    // forceType: the input is only ever read as this format (never as a URL to fetch).
    data = new Cite(input, { forceType: type }).data;
  } catch (err) {
    const detail = err instanceof Error ? err.message.split('\n')[0] : '';
    throw new AppError(400, code, `The ${what} could not be read${detail ? `: ${detail}` : ''}`);
  }
  return checked(data, code, what, 400);
}

function checked(data: Csl[], code: string, what: string, status: number): Csl {
  if (data.length === 0) {
    throw new AppError(status, code, `The ${what} holds no entry`);
  }
  if (data.length > 1) {
    throw new AppError(
      422,
      'multiple_entries',
      `The ${what} holds ${data.length} entries; send one source at a time`,
    );
  }
  const csl = clean(data[0]!);
  if (typeof csl.title !== 'string' || csl.title.trim() === '') {
    throw new AppError(422, 'missing_title', `The ${what} has no title`);
  }
  return csl;
}

/** Drops citation-js's bookkeeping (its parse graph and made-up ids) before storing. */
function clean(item: Csl): Csl {
  const { _graph: _g, id, ...rest } = item;
  return typeof id === 'string' && !id.startsWith('temp_id_') ? { id, ...rest } : rest;
}

/** citation-js needs an id; stored items may lack one, and fields of ours are not CSL. */
function forCite(csl: Csl): Csl {
  return { id: 'source', ...csl };
}

let doiPluginRegistered = false;
function registerDoiPlugin(): void {
  if (doiPluginRegistered) return;
  plugins.add('@thalpos', {
    input: {
      [DOI_REQUEST]: {
        parseType: {
          dataType: 'SimpleObject',
          propertyConstraint: { props: ['doiRequest', 'resolver'] },
        },
        parseAsync: (r: { doiRequest: string; resolver: string }) =>
          fetchCsl(r.doiRequest, r.resolver),
      },
    },
  });
  doiPluginRegistered = true;
}

async function fetchCsl(doi: string, baseUrl: string): Promise<Csl> {
  const path = doi.split('/').map(encodeURIComponent).join('/');
  const url = `${baseUrl.replace(/\/+$/, '')}/${path}`;
  const unreachable = (why: string) =>
    new AppError(
      502,
      'doi_unreachable',
      `The DOI service could not be reached (${why}); try again later`,
    );
  let res: Response;
  try {
    res = await fetch(url, {
      headers: { Accept: CSL_MEDIA_TYPE },
      signal: AbortSignal.timeout(DOI_TIMEOUT_MS),
    });
  } catch (err) {
    throw unreachable(
      err instanceof Error && err.name === 'TimeoutError' ? 'timed out' : 'no connection',
    );
  }
  if (res.status === 404) {
    throw new AppError(422, 'doi_not_found', `No work is registered under the DOI ${doi}`);
  }
  if (!res.ok) throw unreachable(`it answered ${res.status}`);
  if (Number(res.headers.get('content-length') ?? 0) > DOI_MAX_BYTES) {
    await res.body?.cancel();
    throw unreachable('the answer was too large');
  }
  const body = await res.text();
  if (body.length > DOI_MAX_BYTES) throw unreachable('the answer was too large');
  let csl: unknown;
  try {
    csl = JSON.parse(body);
  } catch {
    throw new AppError(502, 'doi_bad_metadata', 'The DOI service did not answer with CSL-JSON');
  }
  if (!csl || typeof csl !== 'object' || Array.isArray(csl)) {
    throw new AppError(502, 'doi_bad_metadata', 'The DOI service did not answer with CSL-JSON');
  }
  return { type: 'document', ...(csl as Csl), DOI: doi };
}
