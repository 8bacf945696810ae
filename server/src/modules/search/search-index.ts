import Fuse, { type IFuseOptions } from 'fuse.js';
import { parseFormula } from '../../thermo';
import type { SearchDocument } from './search-repository';
import type { SearchResult } from './search-schemas';

const CAS = /^\d{2,7}-\d{2}-\d$/;
const INCHIKEY = /^[A-Z]{14}-[A-Z]{10}-[A-Z]$/i;

const FUSE_OPTIONS: IFuseOptions<SearchDocument> = {
  keys: [
    { name: 'name', weight: 3 },
    { name: 'synonyms', weight: 2 },
    { name: 'key', weight: 1 },
    { name: 'formula', weight: 1 },
    { name: 'casRn', weight: 1 },
    { name: 'inchiKey', weight: 1 },
  ],
  includeScore: true,
  ignoreLocation: true,
  threshold: 0.45,
  minMatchCharLength: 2,
};

/** Up to this many species, fuse.js scans them all; above it, a bigram filter picks candidates. */
const FULL_SCAN_LIMIT = 2_000;
/** Candidates handed to fuse.js after the bigram filter. */
const CANDIDATES = 200;

/** Letter pairs of a text, padded so first and last letters count too ("ab" → " a", "ab", "b "). */
function bigrams(text: string): Set<string> {
  const t = ` ${text.toLowerCase()} `;
  const out = new Set<string>();
  for (let i = 0; i < t.length - 1; i++) out.add(t.slice(i, i + 2));
  return out;
}

const searchableText = (d: SearchDocument) =>
  [d.name, d.key, d.formula, d.casRn ?? '', d.inchiKey ?? '', ...d.synonyms].join(' ');

/** Combined fuse scores above this are noise (a shared letter or two), not a near miss. */
const MAX_FUZZY_SCORE = 0.7;

/** The query as a formula in Hill order (`OH2` → `H2O`), or null when it does not read as one. */
export function asHillFormula(q: string): string | null {
  if (!/^[A-Z]/.test(q) || /\s/.test(q)) return null;
  try {
    return parseFormula(q).hill;
  } catch {
    return null;
  }
}

function toResult(d: SearchDocument, score: number, match: SearchResult['match']): SearchResult {
  return {
    key: d.key,
    name: d.name,
    formula: d.formula,
    charge: d.charge,
    casRn: d.casRn,
    inchiKey: d.inchiKey,
    phases: [...d.phases].sort().map((p) => {
      const [phase, modification] = p.split(',');
      return { phase: phase!, modification: modification ?? null };
    }),
    score,
    match,
  };
}

/**
 * Search over one release's species: exact identifier and formula hits first (score 0), then
 * fuse.js's typo-tolerant matches over names, synonyms, keys, formulas and identifiers.
 */
export class SpeciesSearchIndex {
  private readonly fuse: Fuse<SearchDocument>;
  private readonly byFormula = new Map<string, SearchDocument[]>();
  private readonly byCas = new Map<string, SearchDocument>();
  private readonly byInchiKey = new Map<string, SearchDocument>();
  /** Bigram → indexes of the documents holding it (large registries only). */
  private readonly postings = new Map<string, number[]>();
  private readonly hits: Uint16Array;

  constructor(readonly documents: readonly SearchDocument[]) {
    this.fuse = new Fuse(documents, FUSE_OPTIONS, Fuse.createIndex(FUSE_OPTIONS.keys!, documents));
    this.hits = new Uint16Array(documents.length > FULL_SCAN_LIMIT ? documents.length : 0);
    if (documents.length > FULL_SCAN_LIMIT) {
      documents.forEach((d, i) => {
        for (const b of bigrams(searchableText(d))) {
          const list = this.postings.get(b);
          if (list) list.push(i);
          else this.postings.set(b, [i]);
        }
      });
    }
    for (const d of documents) {
      const list = this.byFormula.get(d.formula);
      if (list) list.push(d);
      else this.byFormula.set(d.formula, [d]);
      if (d.casRn) this.byCas.set(d.casRn, d);
      if (d.inchiKey) this.byInchiKey.set(d.inchiKey, d);
    }
  }

  search(q: string, limit: number): { formula: string | null; results: SearchResult[] } {
    const query = q.trim();
    const formula = asHillFormula(query);
    const exact: SearchResult[] = [];
    if (CAS.test(query)) {
      const d = this.byCas.get(query);
      if (d) exact.push(toResult(d, 0, 'cas'));
    }
    if (INCHIKEY.test(query)) {
      const d = this.byInchiKey.get(query.toUpperCase());
      if (d) exact.push(toResult(d, 0, 'inchikey'));
    }
    if (formula !== null) {
      for (const d of this.byFormula.get(formula) ?? []) exact.push(toResult(d, 0, 'formula'));
    }
    const seen = new Set(exact.map((r) => r.key));
    const results = exact.slice(0, limit);
    if (results.length < limit) {
      for (const hit of this.fuzzy(query, limit + exact.length)) {
        if (results.length >= limit) break;
        if ((hit.score ?? 0) > MAX_FUZZY_SCORE) break;
        if (seen.has(hit.item.key)) continue;
        seen.add(hit.item.key);
        results.push(toResult(hit.item, Math.round((hit.score ?? 0) * 1000) / 1000, 'text'));
      }
    }
    return { formula, results };
  }

  /**
   * fuse.js over every document, or — for a large registry — over the documents sharing the most
   * letter pairs with the query. A typo (dropped, swapped or wrong letter) keeps most pairs, so
   * the species meant stays among the candidates while fuse.js scans a few hundred, not all.
   */
  private fuzzy(query: string, limit: number) {
    if (this.postings.size === 0) return this.fuse.search(query, { limit });
    const hits = this.hits;
    hits.fill(0);
    const touched: number[] = [];
    for (const b of bigrams(query)) {
      for (const i of this.postings.get(b) ?? []) {
        if (hits[i] === 0) touched.push(i);
        hits[i]++;
      }
    }
    touched.sort((a, b) => hits[b]! - hits[a]! || a - b);
    const candidates = touched.slice(0, CANDIDATES).map((i) => this.documents[i]!);
    return new Fuse(candidates, FUSE_OPTIONS).search(query, { limit });
  }
}
