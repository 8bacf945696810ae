import { z } from 'zod';

export const SearchQuery = z
  .object({
    q: z.string().trim().min(1).max(100),
    release: z.string().min(1).max(64).default('latest'),
    limit: z.coerce.number().int().min(1).max(50).default(10),
  })
  .strict();
export type SearchQuery = z.infer<typeof SearchQuery>;

export const SEARCH_MATCHES = ['formula', 'cas', 'inchikey', 'text'] as const;

export const SearchResult = z.object({
  key: z.string(),
  name: z.string(),
  formula: z.string(),
  charge: z.number().int(),
  casRn: z.string().nullable(),
  inchiKey: z.string().nullable(),
  phases: z.array(z.object({ phase: z.string(), modification: z.string().nullable() })),
  /** 0 is an exact match; up to 1 for the loosest fuzzy match. */
  score: z.number(),
  /** What matched: the formula (in any order of elements), CAS RN, InChIKey, or names and text. */
  match: z.enum(SEARCH_MATCHES),
});
export type SearchResult = z.infer<typeof SearchResult>;

export const SearchAnswer = z.object({
  release: z.string(),
  query: z.string(),
  /** The query read as a formula, in Hill order, when it is one. */
  formula: z.string().nullable(),
  results: z.array(SearchResult),
});
export type SearchAnswer = z.infer<typeof SearchAnswer>;
